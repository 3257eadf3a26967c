import { z } from "zod";
import { parseReadingTime } from "@/lib/ingest/reading-time";
import { DEFAULT_SERIES_POINTS, MAX_SERIES_POINTS, WEEK } from "@/lib/series";
import { parseWith } from "@/lib/validation";

/**
 * Request and response schemas of the readings endpoints. Readings inside the array are checked
 * one by one by the ingestion service (each refusal reported with its index), so the request
 * schema only fixes the envelope.
 */
export const ingestReadingsInput = z.object({
  readings: z
    .array(
      z.unknown().meta({
        description:
          'A reading: { "gauge": tag, "time": ISO-8601 with Z or an offset, "value": number (raw, in the gauge\'s input unit), "temperature"?: number (°C) }',
        example: { gauge: "G1", time: "2026-03-01T12:00:00Z", value: 0.0135, temperature: 14.2 },
      }),
      { error: 'Send "readings" as an array of readings.' },
    )
    .meta({ description: "At most 50 000 readings (and 10 MB) per request; more is a 413." }),
}).meta({ id: "ReadingsInput" });

/** What an ingestion request refused, each with where it sat in the request. */
export const rejectionList = (indexDescription: string) =>
  z.array(z.object({ index: z.number().int().meta({ description: indexDescription }), code: z.string(), message: z.string() }));

export const alertCountsSchema = z.object({ opened: z.number().int(), escalated: z.number().int(), cleared: z.number().int() });

export const ingestResultSchema = z
  .object({
    accepted: z.number().int().meta({ description: "Readings stored by this request" }),
    duplicates: z.number().int().meta({ description: "Readings whose (gauge, time) was already stored, or repeated in the request" }),
    rejected: rejectionList("Position in `readings`, or the CSV data row counted from 0"),
    alerts: alertCountsSchema,
  })
  .meta({ id: "IngestResult" });

const timezone = z.string().optional().meta({ description: "IANA zone for CSV times without an offset; default the structure's" });

export const timezoneQuerySchema = z.object({ timezone });

/** Query times are ISO-8601 with Z or an offset, like reading times. */
const queryTime = z.string().transform((text, context) => {
  const time = parseReadingTime(text, null);
  if (typeof time === "number") return time;
  context.addIssue({ code: "custom", message: time.message });
  return z.NEVER;
});

const integer = (min: number, max: number, fallback: number) =>
  z.coerce
    .number({ error: "Enter a whole number." })
    .int("Enter a whole number.")
    .min(min, `At least ${min}.`)
    .max(max, `At most ${max}.`)
    .default(fallback);

/** Without `from` and `to`, the last 7 days up to now; with one of them, 7 days from or up to it. */
export const timeRange = z
  .object({
    from: queryTime.optional().meta({ description: "ISO-8601 with Z or an offset; default 7 days before `to`" }),
    to: queryTime.optional().meta({ description: "ISO-8601 with Z or an offset, exclusive; default now (or 7 days after `from`)" }),
  })
  .transform(({ from, to }) => {
    if (from === undefined && to === undefined) to = Date.now();
    return { from: from ?? to! - WEEK, to: to ?? from! + WEEK };
  })
  .refine(({ from, to }) => from < to, { message: "`from` must come before `to`.", path: ["from"] })
  .refine(({ from }) => from >= 0, { message: "`from` must not be before 1970.", path: ["from"] });

export const SERIES_QUANTITIES = ["strain", "stress", "temperature", "residual"] as const;
export type SeriesQuantity = (typeof SERIES_QUANTITIES)[number];

export const seriesQuerySchema = z
  .object({
    points: integer(1, MAX_SERIES_POINTS, DEFAULT_SERIES_POINTS).meta({ description: "Most buckets to return (default 1000, max 5000)" }),
    quantity: z
      .enum(SERIES_QUANTITIES, { error: `Choose quantity ${SERIES_QUANTITIES.join(", ")}.` })
      .default("strain")
      .meta({
        description:
          "strain (µε, stress-producing), stress (MPa), temperature (°C) or residual (µε: measured − the gauge's thermal model; readings before a model have none); default strain",
      }),
  })
  .and(timeRange);

export const ROSETTE_QUANTITIES = ["sigma1", "sigma2", "vonMises", "tauMax", "theta"] as const;
export type RosetteQuantity = (typeof ROSETTE_QUANTITIES)[number];

export const rosetteSeriesQuerySchema = z
  .object({
    points: integer(1, MAX_SERIES_POINTS, DEFAULT_SERIES_POINTS).meta({ description: "Most buckets to return (default 1000, max 5000)" }),
    quantity: z
      .enum(ROSETTE_QUANTITIES, { error: `Choose quantity ${ROSETTE_QUANTITIES.join(", ")}.` })
      .default("vonMises")
      .meta({ description: "sigma1, sigma2, vonMises, tauMax (MPa) or theta (degrees, gauge a to sigma1); default vonMises" }),
  })
  .and(timeRange);

export const MAX_READINGS_PAGE = 10_000;

export const readingsQuerySchema = z
  .object({
    limit: integer(1, MAX_READINGS_PAGE, 1000).meta({ description: "Readings per page (default 1000, max 10 000); CSV ignores it" }),
    cursor: z.string().optional().meta({ description: "`nextCursor` of the previous page" }),
    header: z
      .enum(["names", "units"], { error: 'header is "names" or "units".' })
      .default("names")
      .meta({ description: "CSV only: `names` (default) for the contract's column names, `units` for spreadsheets: the same columns named with their units, e.g. `strain (µε)`, and after `time (UTC)` a `local time (<zone>)` column on the structure's clock" }),
  })
  .and(timeRange);

export const seriesSchema = z
  .object({
    quantity: z.enum(SERIES_QUANTITIES),
    unit: z.string(),
    from: z.string(),
    to: z.string(),
    bucketWidth: z.number().int().meta({ description: "Bucket width, ms" }),
    source: z.enum(["raw", "hourly", "daily"]).meta({ description: "What the buckets were built from" }),
    t: z.array(z.number()).meta({ description: "Bucket starts, epoch ms; empty buckets are left out" }),
    min: z.array(z.number()),
    max: z.array(z.number()),
    mean: z.array(z.number()),
    count: z.array(z.number()),
  })
  .meta({ id: "Series" });

export const readingsPageSchema = z
  .object({
    readings: z.array(
      z.object({
        time: z.string(),
        value: z.number(),
        temperature: z.number().nullable(),
        strain: z.number(),
        stress: z.number(),
        flags: z.array(z.string()).meta({
          description:
            "Words, each once: from the conversion `outside-linear-range` (stress near yield or strain past the gauge's rated range) and `out-of-range` (past the rated range); from sensor health `spike` (a lone reading far from both neighbours, set aside on its own; the newest reading stays a spike until the next one shows whether it was a jump), `jump` (a change of level that stayed), `after-jump` (held after an unresolved jump), `flat-line`, `out-of-range` (raw value outside the sensor's range). Readings with a sensor-health word are left out of limits, extremes, reports and fatigue.",
        }),
      }),
    ),
    nextCursor: z.string().optional(),
  })
  .meta({ id: "ReadingsPage" });

/** The query string of a request as an object validated by `schema` (400 naming the parameter otherwise). */
export function parseQuery<S extends z.ZodType>(request: Request, schema: S): z.output<S> {
  return parseWith(schema, Object.fromEntries(new URL(request.url).searchParams));
}
