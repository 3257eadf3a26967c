import { expect } from "vitest";
import { MATERIALS, prepareGauge, type ConversionResult, type GaugeConfig, type GaugeConverter } from "@/lib/mechanics";

/** Structural steel with E = 200 GPa, ν = 0.3, α = 12 µε/°C: the domain brief's check-value steel. */
export const CHECK_STEEL = { name: "check steel", E: 200_000, nu: 0.3, alpha: 12, yield: 355 };

export function foilGauge(overrides: Partial<GaugeConfig> = {}): GaugeConfig {
  return {
    kind: "foil",
    input: "mV/V",
    bridge: "quarter",
    gaugeFactor: 2,
    material: CHECK_STEEL,
    zero: { value: 0, temperature: 20 },
    ...overrides,
  };
}

export function vibratingWireGauge(overrides: Partial<GaugeConfig> = {}): GaugeConfig {
  return {
    kind: "vibrating-wire",
    input: "Hz",
    gaugeFactor: 3.304,
    material: MATERIALS["structural-steel-us"],
    zero: { value: 800, temperature: 20 },
    ...overrides,
  };
}

export function prepared(config: GaugeConfig): GaugeConverter {
  const gauge = prepareGauge(config);
  if (!gauge.ok) throw new Error(`expected a valid gauge, got ${gauge.code}: ${gauge.message}`);
  return gauge;
}

/** Copies the result: a converter reuses its success object on the next call. */
export function converted(result: ConversionResult) {
  if (!result.ok) throw new Error(`expected a conversion, got ${result.code}: ${result.message}`);
  return { ...result };
}

/** Absolute floor for values near zero, relative tolerance elsewhere. */
export function expectClose(actual: number, expected: number, relative = 1e-9, absolute = 1e-6): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(absolute + relative * Math.abs(expected));
}
