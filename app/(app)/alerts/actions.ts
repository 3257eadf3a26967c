"use server";

import { z } from "zod";
import { formAction } from "@/lib/actions/form-action";
import { handleAlert } from "@/lib/services/alerts";
import { plainText } from "@/lib/validation";

const handling = z.object({
  alertId: z.coerce.number().int().positive(),
  handling: z.enum(["acknowledged", "note", "cleared"]),
  text: plainText().trim().min(1, "Write what was checked or done.").max(2000),
});

const DONE = { acknowledged: "Alert acknowledged.", note: "Note added.", cleared: "Alert cleared." } as const;

export const handleAlertAction = formAction(
  handling,
  async ({ alertId, handling, text }, user) => {
    await handleAlert(user, alertId, handling, text);
    return { message: DONE[handling] };
  },
  "/alerts",
);
