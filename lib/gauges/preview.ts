import { flagWords, prepareGauge, rateStress, type StressRating } from "@/lib/mechanics";
import { gaugeInput, toGaugeConfig } from "./schema";

export type ConversionPreview =
  | { ok: true; indicatedStrain: number; strain: number; totalStrain: number | null; stress: number; rating: StressRating | null; flags: string[] }
  | { ok: false; message: string };

/** The form's fields in words, as the preview names what it still needs. */
const FIELD_WORDS: Record<string, string> = {
  kind: "kind of gauge",
  input: "logger output",
  bridge: "bridge arrangement",
  gaugeFactor: "gauge factor",
  loggerGaugeFactor: "gauge factor set in the logger",
  calibrationFactor: "calibration multiplier",
  polarity: "polarity",
  wiring: "quarter-bridge wiring",
  leadResistance: "lead resistance",
  gaugeResistance: "gauge resistance",
  thermal: "temperature compensation",
  "thermal.gaugeCte": "expansion coefficient",
  "thermal.coefficients": "thermal-output coefficients",
  "material.E": "Young's modulus E",
  "material.nu": "Poisson's ratio",
  "material.alpha": "material's expansion coefficient",
  "material.yield": "yield",
  "material.compressiveStrength": "compressive strength",
  initialStress: "initial stress",
  "zero.value": "zero reading",
  "zero.temperature": "temperature at zero",
  "zero.time": "time of the zero reading",
  ratedRange: "rated range",
  expectedInterval: "expected interval",
};

function valueAt(payload: unknown, path: readonly PropertyKey[]): unknown {
  return path.reduce<unknown>((value, key) => (value && typeof value === "object" ? (value as Record<PropertyKey, unknown>)[key] : undefined), payload);
}

/** "Type the zero reading to see a preview" for an empty field; the field's own problem otherwise. */
function problemInWords(payload: unknown, path: readonly PropertyKey[], message: string): string {
  const key = path.filter((part) => typeof part === "string").join(".");
  const words = FIELD_WORDS[key] ?? (key || "gauge");
  const value = valueAt(payload, path);
  if (value === undefined || value === null || value === "") return `Type the ${words} to see a preview.`;
  return `The ${words} needs fixing before a preview: ${message}`;
}

/**
 * What a sample raw reading would convert to with the gauge as entered, before any real data arrive.
 * The tag plays no part in a conversion, so a form without one yet still previews.
 */
export function previewConversion(payload: Record<string, unknown>, sampleValue: number, sampleTemperature: number | null): ConversionPreview {
  const withTag = { ...payload, tag: "preview" };
  const parsed = gaugeInput.safeParse(withTag);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    return { ok: false, message: problemInWords(withTag, issue.path, issue.message) };
  }
  const config = toGaugeConfig(parsed.data);
  const gauge = prepareGauge(config);
  if (!gauge.ok) return { ok: false, message: gauge.message };
  const result = gauge.convert(sampleValue, sampleTemperature);
  if (!result.ok) return { ok: false, message: result.message };
  return {
    ok: true,
    indicatedStrain: result.indicatedStrain,
    strain: result.strain,
    totalStrain: result.totalStrain,
    stress: result.stress,
    rating: rateStress(result.stress, config.material),
    flags: flagWords(result.flags),
  };
}
