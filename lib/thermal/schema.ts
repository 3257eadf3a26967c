import { z } from "zod";
import { isoTime } from "@/lib/gauges/schema";
import { MAX_AUTO_LAG_MINUTES } from "./model";

/** A lag beyond a week is no thermal inertia of a member any more; it would be a season fitted as a lag. */
export const MAX_LAG_MINUTES = 7 * 24 * 60;

const lagMinutes = z
  .number({ error: 'Give the lag as a whole number of minutes, or "auto".' })
  .int("Give the lag as a whole number of minutes.")
  .min(0, "The lag is 0 minutes or more: the member's temperature follows the air's, never leads it.")
  .max(MAX_LAG_MINUTES, `A lag is at most ${MAX_LAG_MINUTES} minutes (a week).`);

/** `PUT …/thermal-model` and the fit preview: the reference period and how to fit it. */
export const thermalModelInput = z
  .object({
    from: isoTime.meta({ description: "Start of the reference period, ISO-8601 with Z or an offset" }),
    to: isoTime.meta({ description: "End of the reference period (included)" }),
    lagMinutes: z
      .union([lagMinutes, z.literal("auto")], { error: 'Give the lag as a whole number of minutes, or "auto".' })
      .default(0)
      .meta({ description: 'Minutes the member\'s temperature lags the measured one (default 0), or "auto": the lag that fits best' }),
    maxLagMinutes: lagMinutes.optional().meta({
      description: `With "auto": how far back to search, minutes; default the lesser of ${MAX_AUTO_LAG_MINUTES} and half the period. Longer than the period is refused.`,
    }),
    drift: z.boolean({ error: "Give drift as true or false." }).default(false).meta({ description: "Fit a linear drift term in µε/day as well" }),
  })
  .superRefine((input, context) => {
    if (Date.parse(input.to) <= Date.parse(input.from)) context.addIssue({ code: "custom", path: ["to"], message: "The reference period must end after it starts." });
    if (input.maxLagMinutes !== undefined && input.lagMinutes !== "auto") {
      context.addIssue({ code: "custom", path: ["maxLagMinutes"], message: 'A search bound goes with lagMinutes "auto"; leave it out with a fixed lag.' });
    }
  })
  .transform((input) => ({ ...input, from: Date.parse(input.from), to: Date.parse(input.to) }))
  .meta({ id: "ThermalModelInput" });

export type ThermalModelInput = z.output<typeof thermalModelInput>;
