import { expect } from "vitest";
import { MATERIALS, prepareGauge, type ConversionResult, type GaugeConfig, type GaugeConverter } from "@/lib/mechanics";
import { wireGaugeFactor } from "@/lib/mechanics/vibrating-wire";

/** Structural steel with E = 200 GPa, ν = 0.3, α = 12 µε/°C (handbook values, from memory). */
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

/**
 * A 150 mm steel wire (ρ = 7850 kg/m³, E = 200 GPa, handbook values from memory): by the taut-string
 * relation f = (1/2L)·√(σ/ρ), K = 4·L²·ρ·10⁹ / E = 4 × 0.0225 × 7850 × 10⁹ / (200 × 10⁹) = 3.5325
 * µε per f²/1000.
 */
export const WIRE_150_MM = wireGaugeFactor(0.15, 7850, 200e9);

export function vibratingWireGauge(overrides: Partial<GaugeConfig> = {}): GaugeConfig {
  return {
    kind: "vibrating-wire",
    input: "Hz",
    gaugeFactor: WIRE_150_MM,
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
