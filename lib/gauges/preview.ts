import { flagWords, prepareGauge } from "@/lib/mechanics";
import { gaugeInput, toGaugeConfig } from "./schema";

export type ConversionPreview =
  | { ok: true; indicatedStrain: number; strain: number; totalStrain: number | null; stress: number; utilisation: number | null; flags: string[] }
  | { ok: false; message: string };

/** What a sample raw reading would convert to with the gauge as entered, before any real data arrive. */
export function previewConversion(payload: unknown, sampleValue: number, sampleTemperature: number | null): ConversionPreview {
  const parsed = gaugeInput.safeParse(payload);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    return { ok: false, message: `${issue.path.join(".") || "Gauge"}: ${issue.message}` };
  }
  const gauge = prepareGauge(toGaugeConfig(parsed.data));
  if (!gauge.ok) return { ok: false, message: gauge.message };
  const result = gauge.convert(sampleValue, sampleTemperature);
  if (!result.ok) return { ok: false, message: result.message };
  return {
    ok: true,
    indicatedStrain: result.indicatedStrain,
    strain: result.strain,
    totalStrain: result.totalStrain,
    stress: result.stress,
    utilisation: result.utilisation,
    flags: flagWords(result.flags),
  };
}
