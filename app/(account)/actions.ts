"use server";

import { z } from "zod";
import { publicFormAction } from "@/lib/actions/form-action";
import { LINK_LIFETIME_MS, LINK_PURPOSES } from "@/lib/auth/account-links";
import { requestPasswordReset, setPasswordWithLink } from "@/lib/services/accounts";
import { email, password } from "@/lib/validation";

/** The same answer whether or not the address has an account, so the form reveals nothing. */
const RESET_ANSWER =
  "If an active account uses that address, an e-mail with a link to choose a new password is on its way. " +
  `The link works once, within ${LINK_LIFETIME_MS["password-reset"] / 60_000} minutes.`;

export const requestPasswordResetAction = publicFormAction(z.object({ email }), async ({ email }) => {
  await requestPasswordReset(email);
  return { message: RESET_ANSWER };
});

export const setPasswordAction = publicFormAction(
  z.object({ token: z.string().min(1), purpose: z.enum(LINK_PURPOSES), password }),
  async ({ token, purpose, password }) => {
    await setPasswordWithLink(token, purpose, password);
    return { message: "Your password is saved. Sign in with it now." };
  },
);
