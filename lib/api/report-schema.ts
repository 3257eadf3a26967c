import { z } from "zod";
import { ALERT_KINDS, ALERT_LEVELS, GAUGE_STATUSES } from "@/db/schema";
import { CONDITION_STATES } from "@/lib/alerting/condition";
import { conditionSchema } from "./schemas";
import { PERIOD_LEVELS } from "@/lib/report/status";
import { loadTestResultsSchema } from "./load-test-schemas";

/** Response of GET /structures/{code}/report: the periodic structure report. Times are UTC ISO-8601. */

const extremes = <U extends string>(unit: U, what: string) =>
  z
    .object({ min: z.number(), max: z.number(), unit: z.literal(unit) })
    .nullable()
    .meta({ description: `Lowest and highest ${what} of the period, ${unit}, of the readings believed (see leftOut); null without such readings` });

const count = z.number().int();

const readingCounts = z.object({
  received: count,
  expected: count.meta({ description: "Whole expected intervals in the part of the period the gauge was installed and not retired (and not after now)" }),
  completeness: z
    .number()
    .nullable()
    .meta({ description: "received ÷ expected as a ratio (1 = 100 %), never above 1; null when nothing was expected" }),
  surplus: count.meta({
    description: "Readings received beyond those expected: more than a few mean the registered expected interval is longer than the logger's",
  }),
});

export const reportGaugeSchema = z.object({
  tag: z.string(),
  label: z.string().nullable(),
  member: z.string().nullable(),
  status: z.enum(GAUGE_STATUSES),
  expectedIntervalS: z.number().meta({ description: "Seconds between readings the logger should send" }),
  activeSpan: z
    .object({ from: z.string(), to: z.string() })
    .nullable()
    .meta({ description: "Part of the period in which the gauge was installed, not retired, and not in the future" }),
  readings: readingCounts,
  condition: conditionSchema.meta({ description: "The gauge's condition when the report is made" }),
  leftOut: z
    .object({
      readings: count,
      reason: z.string(),
    })
    .nullable()
    .meta({
      description:
        "Readings left out of the extremes and the utilisation peak because the sensor was in fault when they were taken (an open jump, flat-line or out-of-range alert) or they lie beyond the gauge's rated range; null when none",
    }),
  stress: extremes("MPa", "stress"),
  strain: extremes("µε", "stress-producing strain"),
  temperature: extremes("°C", "temperature"),
  utilisationPeak: z
    .discriminatedUnion("basis", [
      z.object({
        basis: z.literal("yield"),
        ratio: z.number().meta({ description: "max |σ| ÷ yield over the period (1 = at yield)" }),
        yield: z.number().meta({ description: "Yield stress, MPa" }),
      }),
      z.object({
        basis: z.literal("compressive-strength"),
        ratio: z
          .number()
          .nullable()
          .meta({ description: "Concrete: largest compressive stress ÷ f_ck over the period (1 = at f_ck); null when it was only in tension, which is not rated" }),
        compressiveStrength: z.number().meta({ description: "Characteristic compressive strength f_ck, MPa" }),
      }),
    ])
    .nullable()
    .meta({ description: "null when the gauge's material has neither a yield nor a compressive strength, or there were no readings" }),
  gaps: z.object({
    list: z
      .array(z.object({ start: z.string(), end: z.string(), hours: z.number() }))
      .meta({ description: "Runs of whole hours without readings (longer than the expected interval), oldest first, at most 10; start and end UTC" }),
    more: count.meta({ description: "Runs not listed" }),
    totalHours: z.number().meta({ description: "Hours in all runs, listed or not" }),
  }),
  fatigue: z
    .discriminatedUnion("status", [
      z.object({
        status: z.literal("assessed"),
        category: z.number().meta({ description: "Detail category Δσ_C, MPa at 2×10⁶ cycles" }),
        damage: z.number().meta({ description: "Palmgren–Miner sum of the period" }),
        cyclesCounted: z.number(),
        readingsUsed: count,
      }),
      z.object({ status: z.literal("not-assessed").meta({ description: "The gauge has no detail category" }) }),
    ])
    .meta({ description: "Fatigue damage of the period, as GET …/gauges/{tag}/fatigue computes it with the gauge's category" }),
  stressSeries: z
    .object({
      t: z.array(z.number()).meta({ description: "Start of each interval, epoch ms; intervals without readings are left out" }),
      min: z.array(z.number()),
      max: z.array(z.number()),
      mean: z.array(z.number()),
      bucketWidth: z.number().meta({ description: "Width of the intervals, ms" }),
    })
    .nullable()
    .meta({ description: "Stress over the period in MPa, min, max and mean per interval, as GET …/gauges/{tag}/series answers it; null when nothing was stored" }),
  stressLimitLines: z
    .array(z.object({ value: z.number().meta({ description: "MPa" }), level: z.enum(ALERT_LEVELS), text: z.string() }))
    .meta({ description: "The gauge's stress bounds, and its utilisation bounds at bound × yield stress, as lines across the stress chart" }),
  placement: z
    .object({ drawing: count, x: z.number(), y: z.number() })
    .nullable()
    .meta({ description: "Where the gauge sits on one of the structure's drawings: x across and y down, as fractions of the drawing's width and height" }),
});

export const reportDrawingSchema = z.object({
  id: count,
  title: z.string(),
  contentType: z.string(),
  width: z.number().nullable().meta({ description: "Pixels" }),
  height: z.number().nullable().meta({ description: "Pixels" }),
  url: z.string().meta({ description: "Where the image's bytes are served" }),
});

export const reportAlertSchema = z.object({
  id: count,
  gauge: z.string(),
  kind: z.enum(ALERT_KINDS),
  level: z.enum(ALERT_LEVELS),
  quantity: z.string().nullable(),
  code: z.string().nullable(),
  message: z.string().nullable(),
  unit: z.string().nullable().meta({ description: "Unit of bound and peak: MPa, µε, or ratio (utilisation, 1 = at yield); null for sensor alerts" }),
  bound: z.number().nullable(),
  peak: z.number().nullable(),
  openedAt: z.string(),
  openedBeforePeriod: z.boolean().meta({ description: "Opened earlier and still open when the period began" }),
  clearedAt: z.string().nullable(),
  acknowledged: z.object({ at: z.string(), by: z.string().nullable(), comment: z.string().nullable() }).nullable(),
  events: z
    .array(
      z.object({
        type: z.string().meta({ description: "opened, escalated, cleared, acknowledged or note" }),
        at: z.string(),
        level: z.string().nullable(),
        by: z.string().nullable(),
        text: z.string().nullable(),
      }),
    )
    .meta({ description: "The alert's whole history up to when the report was made, oldest first" }),
});

export const reportShuntCheckSchema = z.object({
  gauge: z.string(),
  time: z.string(),
  expectedOutput: z.number().meta({ description: "Output the shunt should give, in unit" }),
  measuredOutput: z.number(),
  unit: z.string().meta({ description: "Unit of the outputs: the gauge's input (mV/V, µε, …)" }),
  differencePercent: z.number().meta({ description: "(measured − expected) ÷ expected, %" }),
  tolerancePercent: z.number(),
  passed: z.boolean(),
});

export const reportCertificateSchema = z.object({
  gauge: z.string().nullable(),
  logger: z.string().nullable(),
  number: z.string(),
  expiresOn: z.string().meta({ description: "Last day of validity, YYYY-MM-DD" }),
  expiredInPeriod: z.boolean().meta({ description: "true: expired by the period's end; false: expires within the reminder window after it" }),
});

export const reportThermalModelSchema = z.object({
  gauge: z.string(),
  slope: z.number().meta({ description: "µε/°C" }),
  lagMinutes: z.number(),
  r2: z.number(),
  residualStd: z.number().meta({ description: "σ of the fit's residuals, µε" }),
  residual: z
    .object({ min: z.number(), max: z.number(), unit: z.literal("µε") })
    .nullable()
    .meta({ description: "Lowest and highest thermal residual of the period's readings not found faulty; null when none has a residual" }),
});

export const structureReportSchema = z
  .object({
    structure: z.object({ code: z.string(), name: z.string(), location: z.string().nullable(), timezone: z.string() }),
    period: z.object({
      from: z.string().meta({ description: "Start, included: the structure's local midnight beginning the first day, as a UTC instant" }),
      to: z.string().meta({ description: "End, excluded: the structure's local midnight after the last day, as a UTC instant" }),
      firstDay: z.string().meta({ description: "First day included, YYYY-MM-DD in the structure's time zone" }),
      lastDay: z.string().meta({ description: "Last day included, YYYY-MM-DD in the structure's time zone" }),
      name: z.string().meta({ description: 'e.g. "November 2026"' }),
      key: z.string().meta({ description: '"2026-11" for a month, else "<first day>_<last day>"' }),
    }),
    generatedAt: z.string(),
    summary: z.object({
      level: z.enum(PERIOD_LEVELS).meta({ description: "Worst limit-alert level open in the period; all-clear; or no-data when no reading arrived" }),
      headline: z.string(),
      alerts: z
        .object({ watch: count, warning: count, critical: count, sensor: count })
        .meta({ description: "Alerts open at any time in the period, limit alerts by level, sensor alerts apart" }),
      readings: readingCounts,
      current: z
        .object({
          state: z.enum(CONDITION_STATES).meta({ description: "The worst condition of the structure's active gauges now" }),
          stale: z.boolean(),
          lastReadingAt: z.string().nullable(),
        })
        .meta({ description: "How the structure stands now, when the report is made" }),
    }),
    gauges: z.array(reportGaugeSchema).meta({ description: "Gauges installed at some time in the period, by tag" }),
    alerts: z.array(reportAlertSchema).meta({ description: "Alerts open at any time in the period, newest first" }),
    drawings: z.array(reportDrawingSchema).meta({ description: "The structure's drawings, oldest first; the gauges' placements point into them" }),
    loadTests: z.array(loadTestResultsSchema).meta({ description: "Load tests whose window overlaps the period, oldest first, with their results" }),
    shuntChecks: z.array(reportShuntCheckSchema).optional().meta({ description: "Shunt-calibration checks recorded in the period, oldest first" }),
    certificates: z
      .array(reportCertificateSchema)
      .optional()
      .meta({
        description: "Calibration certificates that expired in the period or expire within the reminder window (CERTIFICATE_REMINDER_DAYS, largest) after its last day, soonest first",
      }),
    thermalModels: z.array(reportThermalModelSchema).optional().meta({ description: "The thermal model in force of each gauge in the report that has one, by tag" }),
    cautions: z.array(z.string()),
  })
  .meta({ id: "StructureReport" });

export type StructureReport = z.output<typeof structureReportSchema>;
export type ReportGauge = z.output<typeof reportGaugeSchema>;
export type ReportAlert = z.output<typeof reportAlertSchema>;
export type ReportDrawing = z.output<typeof reportDrawingSchema>;
export type ReportShuntCheck = z.output<typeof reportShuntCheckSchema>;
export type ReportCertificate = z.output<typeof reportCertificateSchema>;
export type ReportThermalModel = z.output<typeof reportThermalModelSchema>;
