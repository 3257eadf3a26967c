import { z } from "zod";
import type { PeriodRequest } from "@/lib/report/period";

const DAY_MS = 86_400_000;
/** A year and a day: enough for an annual report, short enough that the fatigue counts stay quick. */
export const MAX_REPORT_DAYS = 366;

const day = (name: string) =>
  z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}$/, `${name} is a day as YYYY-MM-DD, e.g. 2026-11-01.`)
    .refine((value) => !Number.isNaN(Date.parse(`${value}T00:00:00Z`)) && new Date(`${value}T00:00:00Z`).toISOString().startsWith(value), `${name} is not a calendar day.`);

/**
 * Query string of GET …/report and of the report page: a month, or a first and last day (days of
 * the structure's time zone, both included), or nothing for the previous calendar month at the structure.
 */
export const reportQuery = z
  .object({
    month: z
      .string()
      .regex(/^\d{4}-(0[1-9]|1[0-2])$/, "month is YYYY-MM, e.g. 2026-11.")
      .optional()
      .meta({ description: "A calendar month, YYYY-MM; its days in the structure's time zone. Default (no month, from or to): the previous month in the structure's time zone" }),
    from: day("from").optional().meta({ description: "First day included, YYYY-MM-DD (a day in the structure's time zone); with `to`, instead of `month`" }),
    to: day("to").optional().meta({ description: "Last day included, YYYY-MM-DD (a day in the structure's time zone)" }),
    format: z
      .enum(["json", "pdf"], { error: 'format is "json" or "pdf" (or send Accept: application/pdf).' })
      .optional()
      .meta({ description: "json (default), or pdf for the printable report as an attachment; Accept: application/pdf does the same" }),
  })
  .superRefine((query, context) => {
    if (query.month && (query.from || query.to)) {
      context.addIssue({ code: "custom", path: ["month"], message: "Give either month or from and to, not both." });
    } else if (Boolean(query.from) !== Boolean(query.to)) {
      context.addIssue({ code: "custom", path: [query.from ? "to" : "from"], message: "Give both from and to (the first and the last day)." });
    } else if (query.from && query.to) {
      const days = (Date.parse(query.to) - Date.parse(query.from)) / DAY_MS + 1;
      if (days < 1) context.addIssue({ code: "custom", path: ["from"], message: "from must not be after to." });
      else if (days > MAX_REPORT_DAYS) context.addIssue({ code: "custom", path: ["to"], message: `A report covers at most ${MAX_REPORT_DAYS} days.` });
    }
  })
  .transform(({ month, from, to, format }) => {
    let period: PeriodRequest | undefined;
    if (month) period = { month: { year: Number(month.slice(0, 4)), month: Number(month.slice(5)) } };
    else if (from && to) period = { firstDay: from, lastDay: to };
    return { period, format };
  });

export type ReportQuery = z.output<typeof reportQuery>;
