import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { Flag, flagWords, prepareGauge, type GaugeConfig } from "@/lib/mechanics";
import { CHECK_STEEL, converted, expectClose, foilGauge, prepared, vibratingWireGauge } from "./fixtures";

/** One gauge of every input kind, with non-trivial zero readings and compensation. */
const EVERY_INPUT: readonly GaugeConfig[] = [
  foilGauge({ input: "microstrain", bridge: null, loggerGaugeFactor: 2.05, zero: { value: 312, temperature: 18 } }),
  foilGauge({
    zero: { value: 0.41, temperature: 18 },
    leadResistance: 1.2,
    gaugeResistance: 120,
    thermal: { method: "polynomial", coefficients: [-20, 1.8, -0.04] },
  }),
  foilGauge({ bridge: "full-axial-poisson", zero: { value: -0.2, temperature: 18 }, thermal: { method: "cte", gaugeCte: 10.8 } }),
  vibratingWireGauge({ zero: { value: 765.3, temperature: 18 } }),
  vibratingWireGauge({ input: "frequency-squared", zero: { value: 2710, temperature: 18 } }),
];

describe("every input kind", () => {
  it("gives zero strain and only the initial stress for a reading equal to the zero reading", () => {
    fc.assert(
      fc.property(fc.constantFrom(...EVERY_INPUT), fc.double({ min: -50, max: 50, noNaN: true }), (config, initialStress) => {
        const result = converted(prepared({ ...config, initialStress }).convert(config.zero.value, 18));
        expectClose(result.indicatedStrain, 0, 0, 0);
        expectClose(result.strain, 0, 0, 1e-12);
        expectClose(result.stress, initialStress, 0, 1e-12);
      }),
    );
  });

  // Physical invariants: a gauge wired the other way round reverses the strain it reports; for a
  // bridge it reverses the bridge output, so the relation sees the opposite change of output.
  it("with polarity −1 negates the strain of a logger, wire or bridge output at the zero temperature", () => {
    fc.assert(
      fc.property(fc.constantFrom(...EVERY_INPUT), fc.double({ min: 0.9, max: 1.1, noNaN: true }), (config, factor) => {
        const value = config.zero.value === 0 ? factor - 1 : config.zero.value * factor;
        const mirrored = config.input === "mV/V" ? 2 * config.zero.value - value : value;
        const forward = converted(prepared(config).convert(mirrored, 18));
        const reversed = converted(prepared({ ...config, polarity: -1 }).convert(value, 18));
        const sign = config.input === "mV/V" ? 1 : -1;
        expectClose(reversed.indicatedStrain, sign * forward.indicatedStrain, 0, 0);
        expectClose(reversed.strain, sign * forward.strain, 0, 1e-9);
      }),
    );
  });

  it.each([Number.NaN, Infinity, -Infinity])("refuses a reading of %d", (value) => {
    for (const config of EVERY_INPUT) {
      expect(prepared(config).convert(value, 18)).toMatchObject({ ok: false, code: "not-finite" });
    }
  });
});

describe("stress, utilisation and validity", () => {
  const microstrainOnSteel = (overrides: Partial<GaugeConfig> = {}) =>
    prepared(foilGauge({ input: "microstrain", bridge: null, material: CHECK_STEEL, ...overrides }));

  it("adds the initial (dead-load) stress and reports |σ|/yield", () => {
    // 500 µε × 200 000 MPa = 100 MPa, + 35 MPa dead load = 135 MPa; 135 / 355 = 0.3803
    const result = converted(microstrainOnSteel({ initialStress: 35 }).convert(500));
    expectClose(result.stress, 135);
    expectClose(result.utilisation!, 135 / 355);
    expect(result.flags).toBe(0);
  });

  it("flags a stress beyond yield as outside the linear range, and still returns it", () => {
    // −1800 µε → −360 MPa, beyond the 355 MPa yield
    const result = converted(microstrainOnSteel().convert(-1800));
    expectClose(result.stress, -360);
    expect(flagWords(result.flags)).toEqual(["outside-linear-range"]);
  });

  it("flags from a lower fraction of yield when the engineer asks for it", () => {
    const gauge = prepareGauge(foilGauge({ input: "microstrain", bridge: null }), { linearLimitRatio: 0.7 });
    if (!gauge.ok) throw new Error(gauge.message);
    // 0.7 × 355 = 248.5 MPa: 1200 µε → 240 MPa passes, 1300 µε → 260 MPa is flagged
    expect(converted(gauge.convert(1200)).flags).toBe(0);
    expect(converted(gauge.convert(1300)).flags).toBe(Flag.outsideLinearRange);
  });

  it("flags a gauge read past its rated range both as out of range and outside the linear range", () => {
    const result = converted(microstrainOnSteel({ ratedRange: 1000 }).convert(1001));
    expect(flagWords(result.flags)).toEqual(["outside-linear-range", "out-of-range"]);
  });

  it("does not flag or compute utilisation without a known yield", () => {
    const result = converted(microstrainOnSteel({ material: { E: 200_000, nu: 0.3, alpha: 12 } }).convert(5000));
    expect(result.utilisation).toBeNull();
    expect(result.flags).toBe(0);
  });

  it("reuses its success object, so callers copy what they keep", () => {
    const gauge = microstrainOnSteel();
    const first = gauge.convert(100);
    const second = gauge.convert(200);
    expect(second).toBe(first);
    expect(second).toMatchObject({ ok: true, strain: 200 });
  });
});

describe("configuration errors", () => {
  it.each<[string, Partial<GaugeConfig>, string]>([
    ["unknown kind", { kind: "optical" as GaugeConfig["kind"] }, "unknown-kind"],
    ["polarity 2", { polarity: 2 as 1 }, "invalid-polarity"],
    ["no modulus", { material: { E: -1, nu: 0.3, alpha: 12 } }, "invalid-material"],
    ["Poisson's ratio 0.6", { material: { E: 200_000, nu: 0.6, alpha: 12 } }, "invalid-material"],
    ["non-finite zero", { zero: { value: Number.NaN } }, "invalid-zero"],
    ["negative rated range", { ratedRange: -5 }, "invalid-rated-range"],
    ["negative gauge resistance", { leadResistance: 1, gaugeResistance: -120 }, "invalid-resistance"],
    ["non-finite initial stress", { initialStress: Infinity }, "invalid-initial-stress"],
  ])("refuses %s with a message saying what to fix", (_, overrides, code) => {
    const result = prepareGauge(foilGauge(overrides));
    expect(result).toMatchObject({ ok: false, code });
    expect(result.ok ? "" : result.message).toMatch(/\w+ \w+/);
  });
});

describe("a burst's stresses at one temperature", () => {
  it("gives Hooke's σ = E·ε for a microstrain logger: 100 µε on 200 GPa steel is 20 MPa, −50 µε −10 MPa", () => {
    // Hooke's law, uniaxial: 100 × 10⁻⁶ × 200 000 MPa = 20 MPa (any mechanics textbook).
    const gauge = prepared(foilGauge({ input: "microstrain", bridge: null, material: CHECK_STEEL }));
    const out = new Float64Array(3);
    expect(gauge.convertStresses(new Float32Array([0, 100, -50]), 20, out)).toBeNull();
    [0, 20, -10].forEach((expected, i) => expectClose(out[i]!, expected, 1e-12, 1e-12));
  });

  it("agrees exactly with converting each reading on its own, for every input kind", () => {
    fc.assert(
      fc.property(fc.constantFrom(...EVERY_INPUT), fc.double({ min: 0.95, max: 1.05, noNaN: true }), fc.double({ min: -10, max: 40, noNaN: true }), (config, factor, temperature) => {
        const gauge = prepared(config);
        const base = config.zero.value === 0 ? 0.01 : config.zero.value;
        const values = Float32Array.from({ length: 16 }, (_, i) => base * (factor + (i - 8) * 1e-3));
        const out = new Float64Array(values.length);
        expect(gauge.convertStresses(values, temperature, out)).toBeNull();
        values.forEach((value, i) => expect(out[i]).toBe(converted(gauge.convert(value, temperature)).stress));
      }),
    );
  });

  it("names the first sample that does not convert, with the reason a single reading gets", () => {
    const gauge = prepared(foilGauge({ input: "microstrain", bridge: null }));
    const out = new Float64Array(4);
    expect(gauge.convertStresses(new Float32Array([1, 2, Number.NaN, Infinity]), 20, out)).toMatchObject({ index: 2, failure: { code: "not-finite" } });
    const compensated = prepared(foilGauge({ input: "microstrain", bridge: null, thermal: { method: "cte", gaugeCte: 10.8 } }));
    expect(compensated.convertStresses(new Float32Array([1, 2]), null, out)).toMatchObject({ index: 0, failure: compensated.convert(1, null) });
    expect(compensated.convertStresses(new Float32Array(0), null, out)).toBeNull();
  });
});
