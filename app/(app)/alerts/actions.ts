"use server";

import { z } from "zod";
import { formAction } from "@/lib/actions/form-action";
import { handleAlert } from "@/lib/services/alerts";
import { FAULT_RESOLUTIONS, resolveSensorFault } from "@/lib/services/fault-resolution";
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

const resolution = z.object({
  alertId: z.coerce.number().int().positive(),
  resolution: z.enum(FAULT_RESOLUTIONS, { error: "Choose whether the step is real or the gauge needs a new zero." }),
  text: plainText().trim().min(1, "Write what was checked on site.").max(2000),
});

const RESOLVED = {
  "accept-step": "Step accepted as real; limits are checked again from the jump on.",
  "new-zero": "New zero recorded at the jump; limits are checked again from it on.",
} as const;

export const resolveFaultAction = formAction(
  resolution,
  async ({ alertId, resolution, text }, user) => {
    await resolveSensorFault(user, alertId, resolution, text);
    return { message: RESOLVED[resolution] };
  },
  "/alerts",
);
