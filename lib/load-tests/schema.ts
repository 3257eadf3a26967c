import { z } from "zod";
import { gaugeTag, isoTime } from "@/lib/gauges/schema";
import { plainText } from "@/lib/validation";
import { MAX_PREDICTED_ROWS, parsePredictedTable, type PredictedStrain } from "./predicted-csv";

/** A diagnostic load test lasts minutes to hours; a week is room for a staged test without inviting a month of readings. */
export const MAX_WINDOW_DAYS = 7;
const DAY_MS = 86_400_000;

/** µε: ten times a steel member's yield strain (about 1 200 µε, from memory) is already a typing error. */
export const MAX_PREDICTED_MICROSTRAIN = 20_000;

export const predictedStrainValue = z
  .number({ error: "Give the predicted strain as a number of µε." })
  .refine(Number.isFinite, "Give a finite number of µε.")
  .refine((value) => value !== 0, "A predicted strain of 0 µε has no sign to measure in and no ratio; leave the gauge out instead.")
  .refine((value) => Math.abs(value) <= MAX_PREDICTED_MICROSTRAIN, `A predicted strain lies within ±${MAX_PREDICTED_MICROSTRAIN.toLocaleString("en-US")} µε.`)
  .meta({ description: "Predicted peak change of stress-producing strain under the load, µε, tension positive; not 0" });

export const predictedRow = z
  .object({ gauge: gaugeTag.meta({ description: "Gauge tag" }), predicted: predictedStrainValue })
  .meta({ id: "PredictedStrain" });

export const loadTestInput = z
  .object({
    title: plainText({ error: "Give the test a title." }).trim().min(1, "Give the test a title.").max(200, "Keep the title under 200 characters."),
    load: plainText({ error: "Describe the load." })
      .trim()
      .min(1, "Describe the load: vehicles, axle loads, positions, stops.")
      .max(4000, "Keep the description under 4000 characters.")
      .meta({ description: "What loaded the structure, where and when (e.g. two 32 t trucks side by side at midspan)" }),
    start: isoTime.meta({ description: "Start of the test window, ISO-8601 with Z or an offset; the baseline is the last value before it" }),
    end: isoTime.meta({ description: `End of the window, excluded; after start, at most ${MAX_WINDOW_DAYS} days later` }),
    predicted: z
      .array(predictedRow)
      .min(1, "Give the predicted strain of at least one gauge.")
      .max(MAX_PREDICTED_ROWS, `A load test takes at most ${MAX_PREDICTED_ROWS} gauges.`)
      .optional()
      .meta({ description: "Predicted peak strain per gauge; give this or `predictedCsv`" }),
    predictedCsv: z
      .string()
      .max(100_000, "Keep the table under 100 kB.")
      .optional()
      .meta({ description: "The same table as CSV text: a header naming `gauge` (or `tag`) and `predicted` (a unit in brackets allowed), or two columns without a header" }),
  })
  .superRefine((input, context) => {
    const start = Date.parse(input.start);
    const end = Date.parse(input.end);
    if (end <= start) context.addIssue({ code: "custom", path: ["end"], message: "The end of the window must be after its start." });
    else if (end - start > MAX_WINDOW_DAYS * DAY_MS) context.addIssue({ code: "custom", path: ["end"], message: `A test window lasts at most ${MAX_WINDOW_DAYS} days.` });
    if ((input.predicted === undefined) === (input.predictedCsv === undefined)) {
      context.addIssue({ code: "custom", path: ["predicted"], message: "Give the predicted strains either as `predicted` or as `predictedCsv`, one of the two." });
    }
    const seen = new Set<string>();
    input.predicted?.forEach((row, index) => {
      if (seen.has(row.gauge)) context.addIssue({ code: "custom", path: ["predicted", index, "gauge"], message: `Gauge ${row.gauge} is named twice.` });
      seen.add(row.gauge);
    });
  })
  .transform((input, context) => {
    let predicted: PredictedStrain[] = input.predicted ?? [];
    if (input.predictedCsv !== undefined) {
      const table = parsePredictedTable(input.predictedCsv);
      if (!table.ok) {
        for (const problem of table.problems) context.addIssue({ code: "custom", path: ["predictedCsv"], message: problem });
        return z.NEVER;
      }
      const outOfRange = table.rows.find((row) => Math.abs(row.predicted) > MAX_PREDICTED_MICROSTRAIN);
      if (outOfRange) {
        context.addIssue({ code: "custom", path: ["predictedCsv"], message: `Gauge ${outOfRange.gauge}: a predicted strain lies within ±${MAX_PREDICTED_MICROSTRAIN.toLocaleString("en-US")} µε.` });
        return z.NEVER;
      }
      predicted = table.rows;
    }
    return { title: input.title, load: input.load, start: Date.parse(input.start), end: Date.parse(input.end), predicted };
  })
  .meta({ id: "LoadTestInput" });

export type LoadTestInput = z.output<typeof loadTestInput>;
