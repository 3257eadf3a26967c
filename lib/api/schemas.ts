import { z } from "zod";
import { FILE_KINDS } from "@/db/schema";
import { IMAGE_TYPES, type ImageType } from "@/lib/storage/image-type";
import { CONDITION_STATES } from "@/lib/alerting/condition";
import { QUANTITIES, ROSETTE_LIMIT_QUANTITIES } from "@/lib/limits";

/** Response shapes of /api/v1, documented in the OpenAPI document. */

export const errorSchema = z
  .object({
    error: z.object({
      code: z.string().meta({ example: "validation_failed" }),
      message: z.string(),
      details: z.unknown().optional(),
    }),
  })
  .meta({ id: "Error" });

export const structureSchema = z
  .object({
    code: z.string(),
    name: z.string(),
    location: z.string().nullable(),
    timezone: z.string().meta({ description: "IANA time zone" }),
    description: z.string().nullable(),
    createdAt: z.string().meta({ description: "UTC, ISO-8601 with milliseconds" }),
  })
  .meta({ id: "Structure" });

export const gaugeSchema = z.record(z.string(), z.unknown()).meta({
  id: "Gauge",
  description: "The gauge: every field of the request, plus status, retiredAt, replaces, replacedBy, drawing (`{ id, x, y } | null`) and createdAt",
});

export const structureListSchema = z.object({ structures: z.array(structureSchema) }).meta({ id: "StructureList" });

export const conditionSchema = z
  .object({
    state: z.enum(CONDITION_STATES).meta({
      description:
        "The first that holds, in this order: critical, warning, watch (an open limit alert of that level), sensor-fault (an open sensor fault: its readings are not believed), no-data (no reading yet, or none for three expected intervals), within-limits, no-limits (readings arrive but the gauge has no limits to judge them by)",
    }),
    since: z.string().nullable().meta({ description: "Since when the state holds, UTC; null when it cannot be told" }),
    faults: z.array(z.string()).meta({ description: "Codes of the open sensor faults (jump, flat-line, out-of-range), oldest first" }),
    stale: z.boolean().meta({ description: "No reading for three expected intervals: the data are old whatever the state" }),
  })
  .meta({ id: "GaugeCondition" });

export const structureDetailSchema = structureSchema
  .extend({
    gauges: z
      .array(z.object({ condition: conditionSchema }).catchall(z.unknown()))
      .meta({ description: "The structure's gauges, each with every gauge field and its condition now" }),
    openAlerts: z.number().int(),
  })
  .meta({ id: "StructureDetail" });

export const fileSchema = z
  .object({
    id: z.number().int(),
    kind: z.enum(FILE_KINDS),
    title: z.string(),
    contentType: z.enum(Object.keys(IMAGE_TYPES) as [ImageType, ...ImageType[]]).meta({ description: "Detected from the content, not the name" }),
    bytes: z.number().int(),
    width: z.number().int().nullable().meta({ description: "Pixels" }),
    height: z.number().int().nullable().meta({ description: "Pixels" }),
    gauge: z.string().nullable().meta({ description: "Tag of the gauge a photo shows; null for drawings" }),
    url: z.string().meta({ description: "Where the bytes are served: /api/v1/files/{id}" }),
    createdAt: z.string().meta({ description: "UTC, ISO-8601 with milliseconds" }),
  })
  .meta({ id: "File" });

export const drawingListSchema = z.object({ drawings: z.array(fileSchema) }).meta({ id: "DrawingList" });
export const photoListSchema = z.object({ photos: z.array(fileSchema) }).meta({ id: "PhotoList" });

export const shuntCheckSchema = z
  .object({
    id: z.number().int(),
    time: z.string().meta({ description: "When the shunt was applied, UTC" }),
    shuntResistance: z.number().meta({ description: "Ω across the gauge" }),
    measuredOutput: z.number().meta({ description: "Change of the logger's reading with the shunt applied, in `unit`" }),
    expectedOutput: z.number().meta({
      description: "What the bridge should show, in `unit`: the Wheatstone circuit with the shunted gauge arm at ΔR/R = −R_g²/((R_g + R_s)·(R_g + R_L)), from the gauge's configuration when the check was recorded",
    }),
    unit: z.string().meta({ description: "The gauge's input unit at the time: mV/V or microstrain" }),
    simulatedStrain: z.number().meta({ description: "µε the shunt simulates, as the gauge's conversion reads the expected output" }),
    differencePercent: z.number().meta({ description: "(measured − expected) ÷ expected, %" }),
    tolerancePercent: z.number().meta({ description: "Pass band, % of the expected output" }),
    passed: z.boolean().meta({ description: "Whether |difference| is within the tolerance" }),
    checkedBy: z.string().meta({ description: "Who recorded it" }),
    note: z.string().nullable(),
  })
  .meta({ id: "ShuntCheck" });

export const shuntCheckListSchema = z.object({ shuntChecks: z.array(shuntCheckSchema).meta({ description: "Newest first" }) }).meta({ id: "ShuntCheckList" });

export const gaugeFatigueSchema = z
  .object({
    cycles: z
      .array(z.object({ range: z.number().meta({ description: "Upper edge of the range bin, MPa" }), count: z.number() }))
      .meta({ description: "Rainflow histogram: occupied range bins ascending, half cycles counted as 0.5" }),
    damage: z.number().meta({ description: "Palmgren–Miner sum D over the period, from the exact (unbinned) ranges" }),
    category: z.number().meta({ description: "Detail category Δσ_C used, MPa at 2×10⁶ cycles" }),
    cyclesCounted: z.number().meta({ description: "Cycles counted, half cycles as 0.5" }),
    source: z.enum(["readings", "bursts"]).meta({
      description:
        "readings: rainflow over the stored static readings (sees daily and seasonal cycles only); bursts: the rainflow histograms stored from a dynamic gauge's bursts",
    }),
    equivalentRange: z.number().meta({
      description: "Damage-equivalent constant range Δσ_E = (Σ nᵢ·Δσᵢ³ / 2×10⁶)^(1/3), MPa: compare it with the detail category Δσ_C",
    }),
    damagePerDay: z
      .array(z.object({ day: z.string().meta({ description: "Day in the structure's time zone, YYYY-MM-DD" }), damage: z.number() }))
      .meta({ description: "Miner damage per day of the structure's time zone with data (bursts source; empty for readings)" }),
    samplesCounted: z.number().int().optional().meta({ description: "Bursts source: samples summarised over the period" }),
    from: z.string().meta({ description: "Start of the period, included (UTC)" }),
    to: z.string().meta({ description: "End of the period, excluded (UTC)" }),
    periodSeconds: z.number().meta({ description: "Seconds from `from` to `to`" }),
    firstReading: z.string().nullable().meta({ description: "First reading counted (UTC); null when none" }),
    lastReading: z.string().nullable().meta({ description: "Last reading counted (UTC); null when none" }),
    observedSeconds: z.number().meta({ description: "Seconds from the first to the last reading counted" }),
    coveredSeconds: z.number().meta({
      description:
        "Seconds covered by data: the sum of the intervals between readings counted, leaving out gaps longer than `longestCoveredIntervalSeconds`. The rate divides by it, so that an outage does not dilute the rate and overstate the life",
    }),
    gapsLeftOut: z.number().int().meta({ description: "Intervals without readings longer than `longestCoveredIntervalSeconds`, left out of `coveredSeconds`" }),
    gapSeconds: z.number().meta({ description: "Their total length, seconds" }),
    longestCoveredIntervalSeconds: z.number().meta({ description: "3 × the gauge's expected interval (600 s when it has none)" }),
    zeroEpochs: z.number().int().meta({
      description: "Histories counted one by one: rainflow restarts at each new zero reading, so the step a re-zero makes is never counted as a stress range",
    }),
    readingsUsed: z.number().int(),
    readingsOutsideLinearRange: z.number().int().meta({
      description:
        "Readings counted although flagged outside-linear-range: real stress, but the S-N approach assumes elastic stress ranges, so many of them make the estimate doubtful",
    }),
    readingsSkipped: z.number().int().meta({
      description: "Faulty readings left out: beyond the gauge's rated range, or found faulty by sensor health (jump or spike, flat line, raw value out of range, or held after a jump until an engineer resolves it)",
    }),
    rangeBinWidth: z.number().meta({ description: "Width of the range bins, MPa" }),
    damageRatePerYear: z.number().nullable().meta({ description: "Damage per Julian year over the time covered by data; null when no time is covered" }),
    yearsToDamageOne: z
      .number()
      .nullable()
      .meta({ description: "Years for that rate to reach D = 1; null when the rate is 0 (no damaging cycles) or unknown" }),
  })
  .meta({ id: "GaugeFatigue" });

export const gaugeListSchema = z.object({ gauges: z.array(gaugeSchema) }).meta({ id: "GaugeList" });

export const rosetteSchema = z
  .object({ tag: z.string(), layout: z.enum(["rectangular", "delta"]), gauges: z.array(z.string()).length(3), createdAt: z.string() })
  .meta({ id: "Rosette" });
export const rosetteListSchema = z.object({ rosettes: z.array(rosetteSchema) }).meta({ id: "RosetteList" });

const limitOutput = z.object({
  quantity: z.enum(QUANTITIES),
  level: z.enum(["watch", "warning", "critical"]),
  upper: z.number().optional(),
  lower: z.number().optional(),
  hysteresis: z.number(),
  persistence: z.number().int(),
});
export const limitListSchema = z.object({ limits: z.array(limitOutput) }).meta({ id: "Limits" });
export const rosetteLimitListSchema = z
  .object({ limits: z.array(limitOutput.extend({ quantity: z.enum(ROSETTE_LIMIT_QUANTITIES) })) })
  .meta({ id: "RosetteLimits" });

export const backtestSchema = z
  .object({
    from: z.number().meta({ description: "epoch ms" }),
    to: z.number().meta({ description: "epoch ms" }),
    readingsChecked: z.number().int(),
    episodes: z.array(
      z.object({
        quantity: z.string(),
        level: z.string(),
        openedAt: z.number(),
        peak: z.number(),
        clearedAt: z.number().nullable().meta({ description: "null: still open at the end of the period" }),
      }),
    ),
  })
  .meta({ id: "Backtest" });

export const alertSchema = z
  .object({
    id: z.number().int(),
    structure: z.string(),
    gauge: z.string(),
    rosette: z.string().nullable().meta({ description: "For an alert on a rosette's sigma1, sigma2 or vonMises: its tag (gauge is then its gauge a)" }),
    kind: z.enum(["limit", "sensor"]),
    level: z.enum(["watch", "warning", "critical"]),
    quantity: z.string().nullable(),
    code: z.string().nullable().meta({ description: "Sensor alerts: stale, flat-line, jump or out-of-range" }),
    message: z.string().nullable(),
    openedAt: z.string(),
    bound: z.number().nullable(),
    peak: z.number().nullable().meta({ description: "The furthest value beyond the bound so far in the episode; keeps rising while the alert is open" }),
    peakAt: z.string().nullable().meta({ description: "When the episode reached its peak" }),
    openings: z.number().int().meta({ description: "How many times the episode opened: an alert back beyond within an hour of clearing continues the same episode" }),
    flappingSince: z.string().nullable().meta({ description: "Set once the alert has opened 3 times within an hour: its crossings are then e-mailed as one, with a summary when it settles" }),
    acknowledgedAt: z.string().nullable(),
    acknowledgedBy: z.string().nullable(),
    clearedAt: z.string().nullable(),
    comment: z.string().nullable(),
  })
  .meta({ id: "Alert" });
export const alertListSchema = z.object({
  alerts: z.array(alertSchema),
  total: z.number().int().meta({ description: "Alerts matching the filters in all, on every page" }),
  nextCursor: z.string().nullable().meta({ description: "Pass as `cursor` for the next page; null on the last page" }),
}).meta({ id: "AlertList" });
