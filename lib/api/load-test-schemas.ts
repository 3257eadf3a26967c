import { z } from "zod";

/** Responses of /structures/{code}/load-tests. Times are UTC ISO-8601; strain µε, tension positive. */

export const LOAD_TEST_GAUGE_STATES = ["measured", "no-data", "no-baseline"] as const;
export const LOAD_TEST_DATA_STATES = ["complete", "partial", "none"] as const;

export const loadTestSummarySchema = z
  .object({
    id: z.number().int(),
    title: z.string(),
    load: z.string().meta({ description: "What loaded the structure" }),
    start: z.string(),
    end: z.string().meta({ description: "End of the window, excluded" }),
    gauges: z.number().int().meta({ description: "Gauges with a predicted strain" }),
    createdAt: z.string(),
    createdBy: z.string().meta({ description: "Who recorded the test" }),
  })
  .meta({ id: "LoadTestSummary" });

export const loadTestListSchema = z.object({ loadTests: z.array(loadTestSummarySchema).meta({ description: "Newest window first" }) }).meta({ id: "LoadTestList" });

export const loadTestGaugeSchema = z
  .object({
    gauge: z.string(),
    label: z.string().nullable(),
    member: z.string().nullable(),
    source: z.enum(["readings", "summaries"]).meta({
      description:
        "`readings`: the stored readings in the window; `summaries`: a dynamic gauge's interval summaries overlapping the window (their extremes, converted from stress by ε = (σ − σ₀)/E), so the peak is known to the interval",
    }),
    predicted: z.number().meta({ description: "Predicted peak strain, µε" }),
    direction: z.enum(["tension", "compression"]).meta({ description: "The sign of the prediction, in which the peak is sought" }),
    state: z.enum(LOAD_TEST_GAUGE_STATES).meta({
      description: "`measured`; `no-data`: no believed reading (or summary) in the window; `no-baseline`: nothing before the window to measure from",
    }),
    message: z.string().meta({ description: "The state in words" }),
    baseline: z
      .object({ time: z.string(), strain: z.number() })
      .nullable()
      .meta({ description: "Last reading (or summary mean) before the window start, µε: the value the load is measured from" }),
    measured: z.number().nullable().meta({ description: "Largest change from the baseline in the predicted sign, µε (0 when the gauge never moved that way); null unless measured" }),
    peakAt: z
      .object({ start: z.string(), end: z.string() })
      .nullable()
      .meta({ description: "Where the peak lies: a reading's instant (start = end) or a summary interval" }),
    against: z.number().nullable().meta({ description: "Largest change against the predicted sign, µε (0 when none)" }),
    ratio: z.number().nullable().meta({ description: "measured ÷ predicted; null unless measured" }),
    readings: z.number().int().meta({ description: "Readings (or summary intervals) in the window that were used" }),
  })
  .meta({ id: "LoadTestGauge" });

export const loadTestResultsSchema = loadTestSummarySchema
  .omit({ gauges: true })
  .extend({
    structure: z.string(),
    dataState: z.enum(LOAD_TEST_DATA_STATES).meta({ description: "Whether every gauge, some, or none had data to measure in the window" }),
    gauges: z.array(loadTestGaugeSchema).meta({ description: "By gauge tag" }),
    caution: z.string(),
  })
  .meta({ id: "LoadTestResults" });

export type LoadTestSummary = z.output<typeof loadTestSummarySchema>;
export type LoadTestGauge = z.output<typeof loadTestGaugeSchema>;
export type LoadTestResults = z.output<typeof loadTestResultsSchema>;

export const loadTestId = z.coerce.number({ error: "The load test id is a number." }).int("The load test id is a whole number.").positive("The load test id is positive.");
