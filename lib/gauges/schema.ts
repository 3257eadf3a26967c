import { z } from "zod";
import {
  BRIDGES,
  FOIL_INPUTS,
  GAUGE_KINDS,
  VIBRATING_WIRE_INPUTS,
  QUARTER_BRIDGE_WIRINGS,
  prepareGauge,
  type GaugeConfigErrorCode,
} from "@/lib/mechanics";
import { DETAIL_CATEGORY_VALUES } from "@/lib/fatigue";
import { SUMMARY_MINUTES } from "@/lib/dynamic";
import { optionalText } from "@/lib/validation";

/** Gauge fields as the API contract names them, shared by the API and the gauge form. */

const number = z.number({ error: "Enter a number." }).refine(Number.isFinite, "Enter a finite number.");
const positive = number.refine((v) => v > 0, "Must be greater than zero.");
const optional = <T extends z.ZodType>(schema: T) => schema.nullish().transform((v) => v ?? null);

/**
 * What a practitioner would accept at registration; a value outside is a unit or a typing error,
 * answered on its field. Bounds from memory of handbook values, stated with each.
 */
export const PLAUSIBLE = {
  /** MPa: timber and polymers (about 1 000) to tungsten (about 400 000); steel is about 200 000. */
  modulus: { min: 1_000, max: 500_000 },
  /** Structural materials lie between about 0.1 (some concretes, cast iron) and 0.45 (lead, timber across the grain). */
  poisson: { min: 0.05, max: 0.49 },
  /** MPa: up to prestressing strand, about 1 860. */
  yield: { min: 1, max: 2_500 },
  /** MPa: EN 1992-1-1 classes run from C12/15 to C90/105; 150 leaves room for ultra-high-performance mixes. */
  compressiveStrength: { min: 5, max: 150 },
  /** Metallic foil and wire gauges: about 2.0 (constantan, Karma) to 3.6 (isoelastic alloy). */
  foilGaugeFactor: { min: 1, max: 5 },
  /** Vibrating-wire gauge constants are a fraction of a µε to a few µε per digit. */
  wireGaugeConstant: { min: 0.05, max: 20 },
  /** Ω: foil gauges are made at 60 to 5 000 Ω, most often 120, 350 or 1 000. */
  gaugeResistance: { min: 50, max: 10_000 },
  /** Ω in the gauge's arm: a few ohms per hundred metres of ordinary instrument cable. */
  leadResistance: { min: 0, max: 200 },
  /** V: bridge excitation of strain-gauge loggers is about 0.5 to 10 V (common practice); 25 V leaves room for unusual units. */
  excitationVoltage: { min: 0.1, max: 25 },
  /** Ω: calibration shunts are about 10 kΩ to 1 MΩ (common practice); a shunt near the gauge's own resistance would simulate tens of thousands of µε. */
  shuntResistance: { min: 1_000, max: 100_000_000 },
} as const;

const within = (range: { min: number; max: number }, what: string) =>
  number.refine((v) => v >= range.min && v <= range.max, `${what} lies between ${range.min.toLocaleString("en-US")} and ${range.max.toLocaleString("en-US")}.`);

export const gaugeTag = z
  .string({ error: "Give the gauge a tag." })
  .regex(/^[A-Za-z0-9_.-]{1,32}$/, "Use 1 to 32 letters, digits, '-', '_' or '.' (no spaces).");

export const isoTime = z.iso.datetime({ offset: true, error: "Use an ISO-8601 time with an offset or Z, e.g. 2026-05-01T08:30:00Z." });

export const materialInput = z.object({
  name: optionalText(100),
  E: within(PLAUSIBLE.modulus, "Young's modulus in MPa (steel about 200,000, concrete 25,000 to 45,000)").meta({ description: "Young's modulus, MPa" }),
  nu: within(PLAUSIBLE.poisson, "Poisson's ratio of structural materials"),
  alpha: number.refine((v) => Math.abs(v) < 100, "Expansion coefficient in µε/°C; structural materials lie well under 100."),
  yield: optional(within(PLAUSIBLE.yield, "The yield in MPa")).meta({ description: "Yield or proportional limit, MPa" }),
  // Optional in the output too: gauges stored before it was asked for, and every metal, have none.
  compressiveStrength: within(PLAUSIBLE.compressiveStrength, "The concrete's compressive strength in MPa").nullish().meta({
    description: "Concrete: characteristic cylinder strength f_ck (or specified f'c), MPa; utilisation is then compressive stress ÷ this, and tension is not rated",
  }),
}).refine((material) => material.yield === null || material.compressiveStrength == null, {
  message: "Give a yield (steel, aluminium) or a compressive strength (concrete), not both.",
  path: ["compressiveStrength"],
});

export const thermalInput = z.discriminatedUnion(
  "method",
  [
    z.object({ method: z.literal("none") }),
    z.object({
      method: z.literal("polynomial"),
      coefficients: z.array(number).min(1, "Give at least A0.").max(5, "Give at most five coefficients, A0 to A4."),
    }),
    z.object({ method: z.literal("cte"), gaugeCte: optional(number).meta({ description: "µε/°C" }) }),
  ],
  { error: "Choose the compensation method: none, polynomial or cte." },
);

export const zeroInput = z.object({
  value: number.meta({ description: "Raw reading in the gauge's input unit" }),
  temperature: optional(number).meta({ description: "°C" }),
  time: isoTime.optional(),
});

const INPUTS = [...FOIL_INPUTS, ...VIBRATING_WIRE_INPUTS] as const;

export const MAX_RATE_HZ = 5000;
/** Seconds of waveform an event keeps before and after its crossings, at most. */
export const MAX_EVENT_WINDOW_SECONDS = 60;

const windowSeconds = (fallback: number) =>
  number
    .refine((v) => v >= 0 && v <= MAX_EVENT_WINDOW_SECONDS, `Between 0 and ${MAX_EVENT_WINDOW_SECONDS} seconds.`)
    .default(fallback)
    .meta({ description: "s" });

export const triggerInput = z
  .object({
    above: optional(number).meta({ description: "MPa: a sample above starts an event" }),
    below: optional(number).meta({ description: "MPa: a sample below starts an event" }),
    preSeconds: windowSeconds(2),
    postSeconds: windowSeconds(5),
  })
  .refine((t) => t.above !== null || t.below !== null, { message: "Give the trigger a level above, below, or both.", path: ["above"] })
  .refine((t) => t.above === null || t.below === null || t.below < t.above, { message: "The level below must be under the level above.", path: ["below"] });

export const samplingInput = z
  .discriminatedUnion(
    "mode",
    [
      z.object({ mode: z.literal("static") }),
      z.object({
        mode: z.literal("dynamic"),
        rateHz: number
          .refine((v) => v >= 1 && v <= MAX_RATE_HZ, `A rate from 1 to ${MAX_RATE_HZ} Hz.`)
          .meta({ description: "Samples per second of every burst" }),
        summaryMinutes: z
          .literal(SUMMARY_MINUTES, { error: `Choose a summary interval that divides the hour: ${SUMMARY_MINUTES.join(", ")} minutes.` })
          .default(10)
          .meta({ description: "Minutes per summary interval, aligned to the hour" }),
        rangeBin: positive.default(1).meta({ description: "Width of the rainflow range bins, MPa" }),
        trigger: optional(triggerInput),
      }),
    ],
    { error: "Choose the sampling mode: static or dynamic." },
  )
  .default({ mode: "static" })
  .meta({ description: "Static: readings one at a time. Dynamic: bursts at a fixed rate, summarised on arrival" });

export type SamplingInput = z.output<typeof samplingInput>;

export const gaugeFields = z.object({
  tag: gaugeTag,
  label: optionalText(200),
  member: optionalText(200),
  kind: z.enum(GAUGE_KINDS, { error: "Choose foil or vibrating-wire." }),
  input: z.enum(INPUTS, { error: `Choose the logger's output: ${INPUTS.join(", ")}.` }),
  bridge: optional(z.enum(BRIDGES, { error: `Choose the bridge: ${BRIDGES.join(", ")}.` })),
  gaugeFactor: positive.meta({ description: "Foil: gauge factor GF. Vibrating wire: the wire gauge factor, µε per unit of f²/1000" }),
  loggerGaugeFactor: optional(positive),
  calibrationFactor: optional(positive).meta({ description: "Vibrating wire: multiplier from the gauge's calibration record (default 1)" }),
  polarity: z.union([z.literal(1), z.literal(-1)], { error: "Polarity is 1 or -1." }).default(1),
  wiring: optional(z.enum(QUARTER_BRIDGE_WIRINGS, { error: "Choose the quarter bridge's wiring: 2-wire or 3-wire." })).meta({
    description: "Quarter bridge: 2-wire (both leads in the gauge's arm) or 3-wire (one); null when not recorded",
  }),
  leadResistance: optional(within(PLAUSIBLE.leadResistance, "The lead resistance in Ω")).meta({
    description: "Ω: with wiring given, the resistance of one lead; without it, the resistance in series with the gauge in its arm",
  }),
  gaugeResistance: optional(within(PLAUSIBLE.gaugeResistance, "The gauge resistance in Ω (usually 120, 350 or 1,000)")).meta({ description: "Ω" }),
  excitationVoltage: optional(within(PLAUSIBLE.excitationVoltage, "The bridge excitation in V")).meta({ description: "Bridge excitation, V; null when not recorded" }),
  thermal: optional(thermalInput),
  material: materialInput,
  initialStress: number.default(0).meta({ description: "MPa" }),
  zero: zeroInput,
  expectedInterval: optional(z.number().int("Whole seconds.").positive("Must be greater than zero.")).meta({
    description: "Seconds between readings, for stale-data detection",
  }),
  ratedRange: optional(positive).meta({ description: "µε either side of zero the gauge is rated for" }),
  detailCategory: optional(
    z.literal(DETAIL_CATEGORY_VALUES, { error: `Choose a detail category (${DETAIL_CATEGORY_VALUES.join(", ")} MPa), or null when not assessed.` }),
  ).meta({ description: "Fatigue detail category Δσ_C, MPa at 2×10⁶ cycles; null when not assessed" }),
  sampling: samplingInput,
});

export type GaugeFields = z.output<typeof gaugeFields>;

/** Which field a configuration problem found by the mechanics core belongs to. */
const FIELD_OF_PROBLEM: Partial<Record<GaugeConfigErrorCode, string>> = {
  "unknown-bridge": "bridge",
  "invalid-gauge-factor": "gaugeFactor",
  "invalid-logger-gauge-factor": "loggerGaugeFactor",
  "invalid-calibration-factor": "calibrationFactor",
  "invalid-resistance": "gaugeResistance",
  "invalid-zero": "zero.value",
  "zero-temperature-required": "zero.temperature",
  "invalid-thermal": "thermal",
  "invalid-material": "material",
  "invalid-rated-range": "ratedRange",
  "invalid-initial-stress": "initialStress",
};

function checkConsistency(gauge: GaugeFields, ctx: z.RefinementCtx) {
  const inputs: readonly string[] = gauge.kind === "foil" ? FOIL_INPUTS : VIBRATING_WIRE_INPUTS;
  if (!inputs.includes(gauge.input)) {
    ctx.addIssue({ code: "custom", path: ["input"], message: `A ${gauge.kind} gauge reads ${inputs.join(" or ")}.` });
    return;
  }
  if (gauge.kind === "foil" && gauge.input === "mV/V" && !gauge.bridge) {
    ctx.addIssue({ code: "custom", path: ["bridge"], message: "A gauge read in mV/V needs its bridge arrangement." });
    return;
  }
  if (gauge.wiring && gauge.bridge !== "quarter") {
    ctx.addIssue({ code: "custom", path: ["wiring"], message: "2-wire or 3-wire applies to a quarter bridge; leave it empty for other arrangements." });
    return;
  }
  if (gauge.kind === "vibrating-wire" && gauge.excitationVoltage !== null) {
    ctx.addIssue({ code: "custom", path: ["excitationVoltage"], message: "Vibrating-wire gauges have no bridge excitation; leave it empty." });
    return;
  }
  if (gauge.kind === "vibrating-wire" && gauge.bridge) {
    ctx.addIssue({ code: "custom", path: ["bridge"], message: "Vibrating-wire gauges have no bridge; leave it empty." });
    return;
  }
  for (const issue of gaugeFactorIssues(gauge)) ctx.addIssue({ code: "custom", ...issue });
  // The mechanics core has the last word on what it can convert.
  const prepared = prepareGauge(toGaugeConfig(gauge));
  if (!prepared.ok) {
    ctx.addIssue({ code: "custom", path: (FIELD_OF_PROBLEM[prepared.code] ?? "").split(".").filter(Boolean), message: prepared.message });
  }
}

/** A foil gauge factor and a vibrating wire's gauge constant share a field but not a range. */
function gaugeFactorIssues(gauge: GaugeFields): { path: string[]; message: string }[] {
  const foil = gauge.kind === "foil";
  const range = foil ? PLAUSIBLE.foilGaugeFactor : PLAUSIBLE.wireGaugeConstant;
  const what = foil ? "A foil gauge factor (about 2 for constantan foil)" : "A vibrating wire's gauge constant in µε per digit";
  const outside = (value: number | null) => value !== null && (value < range.min || value > range.max);
  const message = `${what} lies between ${range.min} and ${range.max}; check the gauge's data sheet.`;
  return [
    ...(outside(gauge.gaugeFactor) ? [{ path: ["gaugeFactor"], message }] : []),
    ...(foil && outside(gauge.loggerGaugeFactor) ? [{ path: ["loggerGaugeFactor"], message }] : []),
  ];
}

/** The gauge as the mechanics core takes it. */
export function toGaugeConfig(gauge: GaugeFields) {
  return {
    kind: gauge.kind,
    input: gauge.input,
    bridge: gauge.bridge,
    gaugeFactor: gauge.gaugeFactor,
    loggerGaugeFactor: gauge.loggerGaugeFactor,
    calibrationFactor: gauge.calibrationFactor,
    polarity: gauge.polarity,
    wiring: gauge.wiring,
    leadResistance: gauge.leadResistance,
    gaugeResistance: gauge.gaugeResistance,
    thermal: gauge.thermal,
    material: gauge.material,
    initialStress: gauge.initialStress,
    zero: gauge.zero,
    ratedRange: gauge.ratedRange,
  };
}

export const gaugeInput = gaugeFields.superRefine(checkConsistency).meta({ id: "GaugeInput" });
export type GaugeInput = z.output<typeof gaugeInput>;

/** PATCH: any fields but the tag; the result is checked whole again after merging with what is stored. */
export const gaugePatch = gaugeFields.omit({ tag: true }).partial().extend({ reason: optionalText(500) }).meta({ id: "GaugePatch" });

export const zeroRequest = z.union([
  z.object({ fromReadings: z.number().int("A whole number of readings.").min(1).max(10_000), reason: optionalText(500) }),
  zeroInput.extend({ reason: optionalText(500) }),
]).meta({ id: "ZeroInput" });
export type ZeroRequest = z.output<typeof zeroRequest>;

/** 1 % of the expected output is the usual acceptance band of a shunt check (common practice). */
export const DEFAULT_SHUNT_TOLERANCE_PERCENT = 1;

export const shuntCheckInput = z
  .object({
    shuntResistance: within(PLAUSIBLE.shuntResistance, "The shunt resistance in Ω").meta({ description: "Ω of the resistor placed across the gauge" }),
    // A dead channel reading 0 is a real, failed check; beyond 100 000 (µε or mV/V) is a typing error.
    measuredOutput: number.refine((v) => Math.abs(v) <= 100_000, "The measured output change lies within ±100,000 of the gauge's input unit.").meta({
      description: "Change of the logger's reading when the shunt was applied, in the gauge's input unit (mV/V, or µε for a logger that reports microstrain)",
    }),
    tolerancePercent: number
      .refine((v) => v > 0 && v <= 50, "A tolerance above 0 and at most 50 % of the expected output.")
      .default(DEFAULT_SHUNT_TOLERANCE_PERCENT)
      .meta({ description: "Pass band, % of the expected output (default 1, common practice)" }),
    time: isoTime.optional().meta({ description: "When the shunt was applied; default now" }),
    note: optionalText(500),
  })
  .meta({ id: "ShuntCheckInput" });
export type ShuntCheckInput = z.output<typeof shuntCheckInput>;

export const rosetteInput = z.object({
  tag: gaugeTag,
  layout: z.enum(["rectangular", "delta"], { error: "Choose rectangular (0/45/90°) or delta (0/60/120°)." }),
  gauges: z.tuple([gaugeTag, gaugeTag, gaugeTag], { error: "Give three gauge tags: a, b and c." }),
}).meta({ id: "RosetteInput" });
