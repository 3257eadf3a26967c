"use server";

import { z } from "zod";
import { formAction } from "@/lib/actions/form-action";
import { createToken, revokeToken } from "@/lib/services/tokens";
import { email, structureCode, tokenName } from "@/lib/validation";

/** Token actions serve the admin page and the engineers' logger-token section of a structure page alike. */

export const createTokenAction = formAction(
  z.discriminatedUnion("kind", [
    z.object({ kind: z.literal("user"), email, name: tokenName }),
    z.object({ kind: z.literal("logger"), structure: structureCode, name: tokenName }),
  ]),
  async (input, user) => {
    const owner = input.kind === "user" ? { kind: "user" as const, email: input.email } : { kind: "logger" as const, structureCode: input.structure };
    const issued = await createToken(user, owner, input.name);
    return { message: "Token created. Copy it now: it is not shown again.", secret: issued.token };
  },
  "/",
);

export const revokeTokenAction = formAction(
  z.object({ tokenId: z.coerce.number().int().positive() }),
  async ({ tokenId }, user) => {
    await revokeToken(user, tokenId);
    return { message: "Token revoked." };
  },
  "/",
);

