import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { BRIDGES, MATERIALS, type GaugeConfig, type ThermalCompensation } from "@/lib/mechanics";
import { prepareInverseConversion } from "@/lib/demo/inverse-conversion";
import { converted, expectClose, foilGauge, prepared, vibratingWireGauge } from "../mechanics/fixtures";

const materials = fc.constantFrom(...Object.values(MATERIALS));
const zero = (value: fc.Arbitrary<number>) =>
  fc.record({ value, temperature: fc.double({ min: -10, max: 35, noNaN: true }) });

/** Thermal output coefficients A0…A4 of the size gauge makers publish (from memory). */
const polynomial = fc
  .tuple(
    fc.double({ min: -50, max: 50, noNaN: true }),
    fc.double({ min: -5, max: 5, noNaN: true }),
    fc.double({ min: -0.1, max: 0.1, noNaN: true }),
    fc.double({ min: -1e-3, max: 1e-3, noNaN: true }),
    fc.double({ min: -1e-5, max: 1e-5, noNaN: true }),
    fc.integer({ min: 1, max: 5 }),
  )
  .map(([a0, a1, a2, a3, a4, terms]): ThermalCompensation => ({ method: "polynomial", coefficients: [a0, a1, a2, a3, a4].slice(0, terms) }));
const cte = fc.double({ min: 8, max: 24, noNaN: true }).map((gaugeCte): ThermalCompensation => ({ method: "cte", gaugeCte }));
const foilThermal = fc.oneof(fc.constant<ThermalCompensation>({ method: "none" }), polynomial, cte);
const gaugeFactor = fc.double({ min: 1.8, max: 3.2, noNaN: true });
const polarity = fc.constantFrom<1 | -1>(1, -1);
const leads = fc.oneof(
  fc.constant({}),
  fc.record({ leadResistance: fc.double({ min: 0, max: 5, noNaN: true }), gaugeResistance: fc.constantFrom(120, 350, 1000) }),
);

const foilMillivolts = fc
  .tuple(fc.constantFrom(...BRIDGES), gaugeFactor, materials, foilThermal, polarity, leads, zero(fc.double({ min: -2, max: 2, noNaN: true })))
  .map(([bridge, gf, material, thermal, sign, lead, zeroReading]) =>
    foilGauge({ bridge, gaugeFactor: gf, material, thermal, polarity: sign, ...lead, zero: zeroReading }),
  );

const foilMicrostrain = fc
  .tuple(
    fc.constantFrom("quarter" as const, null),
    gaugeFactor,
    fc.option(gaugeFactor, { nil: null }),
    materials,
    foilThermal,
    polarity,
    leads,
    zero(fc.double({ min: -500, max: 500, noNaN: true })),
  )
  .map(([bridge, gf, loggerGaugeFactor, material, thermal, sign, lead, zeroReading]) =>
    foilGauge({ input: "microstrain", bridge, gaugeFactor: gf, loggerGaugeFactor, material, thermal, polarity: sign, ...lead, zero: zeroReading }),
  );

/**
 * Wires on steel or concrete with realistic constants: with either polarity, ±600 µε plus the
 * thermal correction stays above the slack wire (R = 0) of the lowest zero and wire gauge factor.
 */
const vibratingWire = fc
  .tuple(
    fc.constantFrom("Hz" as const, "frequency-squared" as const),
    // K of steel wires 115 to 185 mm long (4·L²·ρ·10⁹ / E) and calibration multipliers near 1
    fc.double({ min: 2, max: 5, noNaN: true }),
    fc.double({ min: 0.9, max: 1.1, noNaN: true }),
    fc.constantFrom(MATERIALS["structural-steel-eu"], MATERIALS["normal-weight-concrete-30"]),
    fc.option(fc.double({ min: 11, max: 13.5, noNaN: true }), { nil: undefined }),
    polarity,
    fc.double({ min: 750, max: 1100, noNaN: true }),
  )
  .map(([input, wireFactor, calibrationFactor, material, gaugeCte, sign, zeroFrequency]) =>
    vibratingWireGauge({
      input,
      gaugeFactor: wireFactor,
      calibrationFactor,
      material,
      thermal: gaugeCte === undefined ? null : { method: "cte", gaugeCte },
      polarity: sign,
      zero: { value: input === "Hz" ? zeroFrequency : (zeroFrequency * zeroFrequency) / 1000, temperature: 15 },
    }),
  );

const temperature = fc.double({ min: -30, max: 50, noNaN: true });

function expectRoundTrip(config: GaugeConfig, mechanicalStrain: number, at: number): void {
  const raw = prepareInverseConversion(config)(mechanicalStrain, at);
  expect(Math.abs(converted(prepared(config).convert(raw, at)).strain - mechanicalStrain)).toBeLessThanOrEqual(1e-6);
}

describe("inverse conversion", () => {
  // Physical invariant: the raw value built for a strain converts back to that strain.
  it("round-trips every bridge read in mV/V", () => {
    fc.assert(fc.property(foilMillivolts, fc.double({ min: -3000, max: 3000, noNaN: true }), temperature, expectRoundTrip), { numRuns: 500 });
  });

  it("round-trips foil gauges reported in logger microstrain", () => {
    fc.assert(fc.property(foilMicrostrain, fc.double({ min: -3000, max: 3000, noNaN: true }), temperature, expectRoundTrip), { numRuns: 300 });
  });

  it("round-trips vibrating wires read in Hz or f²/1000", () => {
    fc.assert(fc.property(vibratingWire, fc.double({ min: -600, max: 600, noNaN: true }), temperature, expectRoundTrip), { numRuns: 300 });
  });

  // Quarter bridge of the Dally & Riley circuit, gauge in R1: Vr = x/(4 + 2x) with x = GF·ε, so
  // 1001.001 µε at GF 2 (x = 0.002002) gives 0.5 mV/V above the zero reading, and the reverse with
  // the output leads swapped.
  it("gives the circuit's quarter-bridge output, reversed by polarity", () => {
    const config = foilGauge({ bridge: "quarter", zero: { value: 0.2, temperature: 20 } });
    expectClose(prepareInverseConversion(config)(1001.001001001001, 20), 0.7, 1e-12);
    expectClose(prepareInverseConversion({ ...config, polarity: -1 })(1001.001001001001, 20), -0.3, 1e-12);
  });

  // R = f²/1000 and ε = K·(R − R₀) (common practice): 353.25 µε at K = 3.5325 (150 mm steel wire)
  // is 100 above the 640 f²/1000 of an 800 Hz zero, and √(740 000) = 860.2325 Hz; at the zero temperature the
  // wire's thermal correction vanishes.
  it("gives the vibrating-wire frequency of a hand-worked strain", () => {
    expectClose(prepareInverseConversion(vibratingWireGauge())(353.25, 20), Math.sqrt(740_000), 1e-12);
    expectClose(prepareInverseConversion(vibratingWireGauge({ input: "frequency-squared", zero: { value: 640, temperature: 20 } }))(353.25, 20), 740, 1e-12);
  });

  it("refuses a strain that would slacken the wire, and a configuration the converter refuses", () => {
    expect(() => prepareInverseConversion(vibratingWireGauge())(-3000, 20)).toThrow(RangeError);
    expect(() => prepareInverseConversion(foilGauge({ gaugeFactor: -2 }))).toThrow(/invalid-gauge-factor/);
  });
});
