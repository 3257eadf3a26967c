import { z } from "zod";
import { isoTime } from "@/lib/gauges/schema";

/** Period when the caller gives no `from`: the last 30 days, the fatigue page's first preset. */
export const DEFAULT_FATIGUE_PERIOD_MS = 30 * 86_400_000;

/** Query string of GET …/gauges/{tag}/fatigue; the period is [from, to). */
export const fatigueQuery = z
  .object({
    from: isoTime.optional().meta({ description: "Start of the period, included; default `to` − 30 days" }),
    to: isoTime.optional().meta({ description: "End of the period, excluded; default now" }),
    category: z.coerce
      .number({ error: "category is Δσ_C in MPa, a number such as 71." })
      .refine((value) => Number.isFinite(value) && value > 0, "category is Δσ_C in MPa and must be greater than zero.")
      .optional()
      .meta({ description: "Detail category Δσ_C, MPa at 2×10⁶ cycles; default the gauge's own" }),
    format: z
      .enum(["json", "csv"], { error: 'format is "json" or "csv" (or send Accept: text/csv).' })
      .optional()
      .meta({ description: "json (default), or csv for the rainflow matrix; Accept: text/csv does the same" }),
  })
  .transform(({ from, to, ...rest }) => {
    const end = to ? new Date(to) : new Date();
    return { ...rest, from: from ? new Date(from) : new Date(end.getTime() - DEFAULT_FATIGUE_PERIOD_MS), to: end };
  })
  .refine((query) => query.from < query.to, { message: "from must be earlier than to.", path: ["from"] });

export type FatigueQuery = z.output<typeof fatigueQuery>;
