import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { prepareGauge } from "@/lib/mechanics";
import { wireGaugeFactor } from "@/lib/mechanics/vibrating-wire";
import { converted, expectClose, prepared, vibratingWireGauge } from "./fixtures";

describe("vibrating-wire gauge", () => {
  // R = f²/1000 and ε_app = K·C·(R − R₀) (common practice), K of a 150 mm steel wire = 3.5325.
  // 800 Hz → 640, 810 Hz → 656.1 f²/1000; 3.5325 × 16.1 = 56.87325 µε
  it("converts a frequency through f²/1000", () => {
    const gauge = prepared(vibratingWireGauge({ thermal: { method: "none" } }));
    expectClose(converted(gauge.convert(810)).strain, 56.87325, 1e-12);
  });

  it("converts f²/1000 directly, with the calibration multiplier", () => {
    // 0.98 × 3.5325 × (656.1 − 640) = 55.735785 µε
    const gauge = prepared(
      vibratingWireGauge({ input: "frequency-squared", calibrationFactor: 0.98, zero: { value: 640 }, thermal: { method: "none" } }),
    );
    expectClose(converted(gauge.convert(656.1)).strain, 55.735785, 1e-12);
  });

  it("gives the same strain for a frequency and its square over 1000", () => {
    const hz = prepared(vibratingWireGauge({ thermal: { method: "none" } }));
    const squared = prepared(vibratingWireGauge({ input: "frequency-squared", zero: { value: 640 }, thermal: { method: "none" } }));
    fc.assert(
      fc.property(fc.double({ min: 400, max: 1200, noNaN: true }), (frequency) => {
        const fromSquare = converted(squared.convert((frequency * frequency) / 1000)).strain;
        expectClose(converted(hz.convert(frequency)).strain, fromSquare);
      }),
    );
  });

  it.each([0, -812.5])("refuses a frequency of %d Hz", (frequency) => {
    const result = prepared(vibratingWireGauge()).convert(frequency, 20);
    expect(result).toMatchObject({ ok: false, code: "non-positive-frequency" });
  });

  it.each([0, -3])("refuses %d f²/1000", (frequencySquared) => {
    const result = prepared(vibratingWireGauge({ input: "frequency-squared", zero: { value: 640, temperature: 20 } })).convert(frequencySquared, 20);
    expect(result).toMatchObject({ ok: false, code: "non-positive-frequency-squared" });
  });

  it("refuses a zero reading at or below 0 Hz", () => {
    expect(prepareGauge(vibratingWireGauge({ zero: { value: 0, temperature: 20 } }))).toMatchObject({
      ok: false,
      code: "invalid-zero",
    });
  });

  it("refuses an input a vibrating wire does not have and a non-positive calibration multiplier", () => {
    expect(prepareGauge(vibratingWireGauge({ input: "mV/V" }))).toMatchObject({ ok: false, code: "unknown-input" });
    expect(prepareGauge(vibratingWireGauge({ calibrationFactor: -1 }))).toMatchObject({ ok: false, code: "invalid-calibration-factor" });
  });
});

describe("wire gauge factor from taut-string physics", () => {
  // f = (1/2L)·√(σ/ρ) for a taut string (any physics text); steel ρ = 7850 kg/m³, E = 200 GPa
  // (handbook values, from memory). 150 mm: 4 × 0.15² × 7850 × 10⁹ / (200 × 10⁹) = 3.5325.
  it("gives 3.5325 µε per f²/1000 for 150 mm of steel wire", () => {
    expectClose(wireGaugeFactor(0.15, 7850, 200e9), 3.5325, 1e-12);
  });

  it("turns the frequency of a wire at any tension back into its strain σ/E", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 0.4, noNaN: true }),
        fc.double({ min: 100, max: 1500, noNaN: true }),
        (length, stressMpa) => {
          const frequency = Math.sqrt((stressMpa * 1e6) / 7850) / (2 * length);
          const microstrain = ((stressMpa * 1e6) / 200e9) * 1e6;
          expectClose((wireGaugeFactor(length, 7850, 200e9) * frequency * frequency) / 1000, microstrain, 1e-12);
        },
      ),
    );
  });
});
