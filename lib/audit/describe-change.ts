import { quantityScale } from "@/lib/limits/display-scale";
import { CALIBRATION_FACTOR_LABEL, WIRE_GAUGE_FACTOR_UNIT, inputName, inputUnit } from "@/lib/gauges/labels";

/** One changed field of an audit entry, in words: "Gauge factor: 2.08 → 2.09". */
export type FieldChange = { field: string; from: string; to: string };

type Json = Record<string, unknown>;

/** A field's name in words and how its stored value reads (SI units, as stored). */
type FieldWording = { name: string; show?: (value: unknown, context: Json) => string };

const number = (value: unknown) => (typeof value === "number" ? value.toLocaleString("en-US", { maximumFractionDigits: 6 }) : String(value));
const withUnit = (unit: string) => (value: unknown) => `${number(value)} ${unit}`;

const LIMIT_LEVEL_ORDER = ["watch", "warning", "critical"];
/** A bound as it was typed (not rounded: the audit keeps what was set), in its unit. */
function limitValue(quantity: string, value: unknown): string {
  if (typeof value !== "number") return "—";
  const scale = quantityScale(quantity);
  return `${number(Math.round(scale.toDisplay(value) * 1e6) / 1e6)} ${scale.unit}`.trim();
}

/** "stress warning: above 150 MPa, below −20 MPa, dead band 10 MPa, 2 readings in a row". */
function limitText(limit: Json): string {
  const quantity = String(limit.quantity);
  const parts = [
    limit.upper != null ? `above ${limitValue(quantity, limit.upper)}` : null,
    limit.lower != null ? `below ${limitValue(quantity, limit.lower)}` : null,
    limit.hysteresis ? `dead band ${limitValue(quantity, limit.hysteresis)}` : null,
    limit.persistence && limit.persistence !== 1 ? `${number(limit.persistence)} readings in a row` : null,
  ].filter(Boolean);
  return `${quantity} ${String(limit.level)}: ${parts.join(", ")}`;
}

function limitsText(value: unknown): string {
  if (!Array.isArray(value) || value.length === 0) return "none";
  const sorted = [...(value as Json[])].sort(
    (a, b) => String(a.quantity).localeCompare(String(b.quantity)) || LIMIT_LEVEL_ORDER.indexOf(String(a.level)) - LIMIT_LEVEL_ORDER.indexOf(String(b.level)),
  );
  return sorted.map(limitText).join("; ");
}

function thermalText(value: unknown): string {
  const thermal = (value ?? {}) as Json;
  if (thermal.method === "polynomial" && Array.isArray(thermal.coefficients)) {
    return `thermal-output polynomial ${thermal.coefficients.map((a, i) => `A${i} = ${number(a)}`).join(", ")} (µε, T in °C)`;
  }
  if (thermal.method === "cte") return `expansion coefficient ${thermal.gaugeCte == null ? "default" : `${number(thermal.gaugeCte)} µε/°C`}`;
  return "none";
}

/** "dynamic, 100 Hz, summaries every 10 min, range bins 1 MPa, trigger above 40 MPa (2 s before, 5 s after)", or "static". */
function samplingText(value: unknown): string {
  const sampling = (value ?? {}) as Json;
  if (sampling.mode !== "dynamic") return "static (readings one at a time)";
  const trigger = (sampling.trigger ?? null) as Json | null;
  const bounds = trigger
    ? [trigger.above != null ? `above ${number(trigger.above)} MPa` : null, trigger.below != null ? `below ${number(trigger.below)} MPa` : null].filter(Boolean).join(" or ")
    : "";
  const window = trigger ? ` (${number(trigger.preSeconds ?? 2)} s before, ${number(trigger.postSeconds ?? 5)} s after)` : "";
  return [
    `dynamic, ${number(sampling.rateHz)} Hz`,
    `summaries every ${number(sampling.summaryMinutes ?? 10)} min`,
    `range bins ${number(sampling.rangeBin ?? 1)} MPa`,
    bounds ? `trigger ${bounds}${window}` : "no trigger",
  ].join(", ");
}

const BRIDGE_WORDS: Record<string, string> = {
  quarter: "quarter bridge",
  "half-bending": "half bridge, bending",
  "half-poisson": "half bridge, Poisson",
  "full-bending": "full bridge, bending",
  "full-poisson": "full bridge, bending with Poisson gauges",
  "full-axial-poisson": "full bridge, axial with Poisson gauges",
};

const rawValue = (value: unknown, context: Json) => `${number(value)} ${inputUnit(String(context.input ?? ""))}`.trim();

/** A shunt check's outputs are in the gauge's input unit at the time, recorded beside them. */
const shuntOutput = (value: unknown, context: Json) => `${number(value)} ${inputUnit(String(context["shuntCheck.unit"] ?? ""))}`.trim();

const FIELDS: Record<string, FieldWording> = {
  tag: { name: "Tag" },
  label: { name: "Location" },
  member: { name: "Member" },
  kind: { name: "Kind", show: (value) => (value === "vibrating-wire" ? "vibrating wire" : String(value)) },
  input: { name: "Logger output", show: (value) => inputName(String(value)) },
  bridge: { name: "Bridge", show: (value) => BRIDGE_WORDS[String(value)] ?? String(value) },
  gaugeFactor: { name: "Gauge factor", show: (value, context) => (context.kind === "vibrating-wire" ? `${number(value)} ${WIRE_GAUGE_FACTOR_UNIT}` : number(value)) },
  loggerGaugeFactor: { name: "Gauge factor set in the logger" },
  calibrationFactor: { name: CALIBRATION_FACTOR_LABEL },
  polarity: { name: "Polarity", show: (value) => (value === -1 ? "reversed (−1)" : "normal (+1)") },
  wiring: { name: "Quarter-bridge wiring" },
  leadResistance: { name: "Lead resistance", show: withUnit("Ω") },
  gaugeResistance: { name: "Gauge resistance", show: withUnit("Ω") },
  excitationVoltage: { name: "Bridge excitation", show: withUnit("V") },
  thermal: { name: "Temperature compensation", show: thermalText },
  "material.name": { name: "Material" },
  "material.E": { name: "Young's modulus E", show: withUnit("MPa") },
  "material.nu": { name: "Poisson's ratio ν" },
  "material.alpha": { name: "Expansion coefficient α", show: withUnit("µε/°C") },
  "material.yield": { name: "Yield", show: withUnit("MPa") },
  "material.compressiveStrength": { name: "Compressive strength f_ck", show: withUnit("MPa") },
  initialStress: { name: "Initial stress", show: withUnit("MPa") },
  "zero.value": { name: "Zero reading", show: rawValue },
  "zero.temperature": { name: "Temperature at zero", show: withUnit("°C") },
  "zero.time": { name: "Zero read at" },
  expectedInterval: { name: "Expected interval", show: withUnit("s") },
  ratedRange: { name: "Rated range", show: (value) => `± ${number(value)} µε` },
  detailCategory: { name: "Fatigue detail category", show: (value) => `Δσ_C = ${number(value)} MPa` },
  limits: { name: "Limits", show: limitsText },
  sampling: { name: "Sampling", show: samplingText },
  "drawing.x": { name: "Position across the drawing", show: (value) => `${number(Math.round(Number(value) * 1000) / 10)} %` },
  "drawing.y": { name: "Position down the drawing", show: (value) => `${number(Math.round(Number(value) * 1000) / 10)} %` },
  "drawing.id": { name: "Drawing", show: (value) => `no. ${number(value)}` },
  status: { name: "Status" },
  reason: { name: "Why" },
  source: { name: "Zero taken from" },
  replaces: { name: "Replaces gauge" },
  replacedBy: { name: "Replaced by gauge" },
  "shuntCheck.unit": { name: "Shunt check read in", show: (value) => inputName(String(value)) },
  "shuntCheck.shuntResistance": { name: "Shunt resistance", show: withUnit("Ω") },
  "shuntCheck.measuredOutput": { name: "Measured output", show: shuntOutput },
  "shuntCheck.expectedOutput": { name: "Expected output", show: shuntOutput },
  "shuntCheck.tolerancePercent": { name: "Tolerance", show: withUnit("%") },
  "shuntCheck.result": { name: "Result" },
};

/** Objects whose fields change one by one; other objects (thermal, limits) read as one value. */
const NESTED = new Set(["material", "zero", "drawing", "shuntCheck"]);

function flatten(value: unknown): Json {
  if (!value || typeof value !== "object" || Array.isArray(value)) return {};
  const flat: Json = {};
  for (const [key, inner] of Object.entries(value as Json)) {
    if (NESTED.has(key) && inner && typeof inner === "object" && !Array.isArray(inner)) {
      for (const [innerKey, innerValue] of Object.entries(inner as Json)) flat[`${key}.${innerKey}`] = innerValue;
    } else {
      flat[key] = inner;
    }
  }
  return flat;
}

const isEmpty = (value: unknown) => value === null || value === undefined || value === "";

function show(key: string, value: unknown, context: Json): string {
  if (isEmpty(value)) return "—";
  const wording = FIELDS[key];
  if (wording?.show) return wording.show(value, context);
  if (typeof value === "object") return JSON.stringify(value);
  return number(value);
}

/** A field the wording table does not know still reads, as its own name split into words. */
function fieldName(key: string): string {
  return FIELDS[key]?.name ?? key.replace(/\./g, " ").replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase();
}

/**
 * Each field an audit entry changed, in words and units, in the order of the wording table.
 * A creation (no "before") lists what was set; the gauge's input gives a raw value its unit.
 */
export function describeChange(before: unknown, after: unknown): FieldChange[] {
  const old = flatten(before);
  const now = flatten(after);
  const context = { ...old, ...now };
  const order = Object.keys(FIELDS);
  const keys = [...new Set([...Object.keys(old), ...Object.keys(now)])].sort(
    (a, b) => (order.indexOf(a) + 1 || order.length + 1) - (order.indexOf(b) + 1 || order.length + 1),
  );
  return keys.flatMap((key) => {
    const from = show(key, old[key], { ...context, ...old });
    const to = show(key, now[key], context);
    return from === to ? [] : [{ field: fieldName(key), from, to }];
  });
}

const ACTION_WORDS: Record<string, string> = {
  "gauge.create": "registered",
  "gauge.update": "edited",
  "gauge.zero": "new zero",
  "gauge.retire": "retired",
  "gauge.replace": "replaced",
  "gauge.place": "placed on a drawing",
  "gauge.photo.upload": "photo added",
  "gauge.photo.delete": "photo removed",
  "gauge.shunt-check": "shunt check",
  "limits.replace": "limits saved",
  "rosette.create": "rosette grouped",
};

/** "edited", "limits saved": what an audit entry did, the machine name kept for anything else. */
export function actionInWords(action: string): string {
  return ACTION_WORDS[action] ?? action;
}
