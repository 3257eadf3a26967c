import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { prepareGauge } from "@/lib/mechanics";
import { converted, expectClose, prepared, vibratingWireGauge } from "./fixtures";

describe("vibrating-wire gauge", () => {
  // domain.md, vibrating-wire gauges: R = f²/1000, ε_app = G·B·(R − R₀).
  // 800 Hz → 640 digits, 810 Hz → 656.1 digits; 3.304 × 16.1 = 53.1944 µε
  it("converts a frequency through digits", () => {
    const gauge = prepared(vibratingWireGauge({ thermal: { method: "none" } }));
    expectClose(converted(gauge.convert(810)).strain, 53.1944, 1e-12);
  });

  it("converts digits directly, with the batch factor", () => {
    // 0.98 × 3.304 × (656.1 − 640) = 52.130512 µε
    const gauge = prepared(
      vibratingWireGauge({ input: "digits", batchFactor: 0.98, zero: { value: 640 }, thermal: { method: "none" } }),
    );
    expectClose(converted(gauge.convert(656.1)).strain, 52.130512, 1e-12);
  });

  it("gives the same strain for a frequency and its digits", () => {
    const hz = prepared(vibratingWireGauge({ thermal: { method: "none" } }));
    const digits = prepared(vibratingWireGauge({ input: "digits", zero: { value: 640 }, thermal: { method: "none" } }));
    fc.assert(
      fc.property(fc.double({ min: 400, max: 1200, noNaN: true }), (frequency) => {
        const fromDigits = converted(digits.convert((frequency * frequency) / 1000)).strain;
        expectClose(converted(hz.convert(frequency)).strain, fromDigits);
      }),
    );
  });

  it.each([0, -812.5])("refuses a frequency of %d Hz", (frequency) => {
    const result = prepared(vibratingWireGauge()).convert(frequency, 20);
    expect(result).toMatchObject({ ok: false, code: "non-positive-frequency" });
  });

  it.each([0, -3])("refuses %d digits", (digits) => {
    const result = prepared(vibratingWireGauge({ input: "digits", zero: { value: 640, temperature: 20 } })).convert(digits, 20);
    expect(result).toMatchObject({ ok: false, code: "non-positive-digits" });
  });

  it("refuses a zero reading at or below 0 Hz", () => {
    expect(prepareGauge(vibratingWireGauge({ zero: { value: 0, temperature: 20 } }))).toMatchObject({
      ok: false,
      code: "invalid-zero",
    });
  });

  it("refuses an input a vibrating wire does not have and a non-positive batch factor", () => {
    expect(prepareGauge(vibratingWireGauge({ input: "mV/V" }))).toMatchObject({ ok: false, code: "unknown-input" });
    expect(prepareGauge(vibratingWireGauge({ batchFactor: -1 }))).toMatchObject({ ok: false, code: "invalid-batch-factor" });
  });
});
