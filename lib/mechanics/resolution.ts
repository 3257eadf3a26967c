import { prepareGauge } from "./convert";
import type { GaugeConfig } from "./gauge-config";

/** Decimals of a number as its shortest form writes it: 0.0135 → 4, 250 → 0, 1e-7 → 7. */
export function writtenDecimals(value: number): number {
  if (!Number.isFinite(value)) return 0;
  const [mantissa, exponent] = String(Math.abs(value)).split("e");
  return Math.max(0, (mantissa!.split(".")[1] ?? "").length - Number(exponent ?? 0));
}

/** Decimals that show a change of `step` and no finer digit: 0.2 → 1, 0.05 → 2, 1 → 0, 2.5 → 0. */
export function decimalsForStep(step: number): number {
  if (!(step > 0) || !Number.isFinite(step)) return 0;
  return Math.max(0, Math.ceil(-Math.log10(step) - 1e-9));
}

export type DerivedDecimals = { strain: number; stress: number };

/**
 * How many decimals a gauge's strain (µε) and stress (MPa) carry: one step of its raw reading
 * (`rawStep`, the last decimal the logger writes) taken through the gauge's own conversion at its
 * zero reading. Digits past that come from the arithmetic, not from the measurement. Null when
 * the gauge's configuration cannot convert.
 */
export function derivedDecimals(config: GaugeConfig, rawStep: number): DerivedDecimals | null {
  const gauge = prepareGauge(config);
  if (!gauge.ok) return null;
  const temperature = config.zero.temperature ?? null;
  const atZero = gauge.convert(config.zero.value, temperature);
  if (!atZero.ok) return null;
  // The converter reuses its answer object: keep the numbers before converting again.
  const { strain, stress } = atZero;
  const stepped = gauge.convert(config.zero.value + rawStep, temperature);
  if (!stepped.ok) return null;
  return { strain: decimalsForStep(Math.abs(stepped.strain - strain)), stress: decimalsForStep(Math.abs(stepped.stress - stress)) };
}
