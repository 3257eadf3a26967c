import { describe, expect, it } from "vitest";
import { MATERIALS, concreteOfClass, peakRating, rateStress } from "@/lib/mechanics";
import { formatStressRating } from "@/lib/units";
import { CHECK_STEEL, converted, expectClose, foilGauge, prepared } from "./fixtures";

const concrete = concreteOfClass("C30/37");

describe("stress rating", () => {
  it("rates a metal as |σ| / yield in tension and compression alike (common practice)", () => {
    expect(rateStress(177.5, CHECK_STEEL)).toEqual({ basis: "yield", strength: 355, ratio: 0.5 });
    expect(rateStress(-177.5, CHECK_STEEL)).toEqual({ basis: "yield", strength: 355, ratio: 0.5 });
  });

  it("rates concrete as compressive stress / f_ck, reaching 1 at σ = −f_ck (EN 1992-1-1 §3.1.2 names f_ck)", () => {
    expect(rateStress(-12, concrete)).toEqual({ basis: "compressive-strength", strength: 30, ratio: 0.4 });
    expect(rateStress(-30, concrete)!.ratio).toBe(1);
    expect(formatStressRating(rateStress(-12, concrete))).toBe("40 % of f_ck in compression");
  });

  it("does not rate concrete in tension with a number: it cracks", () => {
    const rating = rateStress(1.5, concrete);
    expect(rating).toEqual({ basis: "compressive-strength", strength: 30, ratio: null });
    expect(formatStressRating(rating)).toBe("not rated: concrete in tension cracks");
  });

  it("has nothing to rate against when the material states no strength, as concrete stored before f_ck was asked for", () => {
    const { compressiveStrength: _, ...withoutStrength } = concrete;
    expect(rateStress(-12, withoutStrength)).toBeNull();
    expect(formatStressRating(null)).toBe("—");
  });

  it("takes the larger magnitude against a yield and the most compressive stress against f_ck", () => {
    expect(peakRating(-200, 100, CHECK_STEEL)!.ratio).toBeCloseTo(200 / 355, 12);
    expect(peakRating(-6, 2, concrete)!.ratio).toBeCloseTo(0.2, 12);
    expect(peakRating(0.5, 2, concrete)!.ratio).toBeNull();
  });

  it("rates a converted concrete reading: −300 µε on C30/37 is σ = E_cm·ε = −9.85 MPa, 32.8 % of f_ck (Hooke's law)", () => {
    // One quarter-bridge gauge, GF 2: Vr for ε = −300 µε from the Wheatstone relation, Vr = GF·ε / (4 + 2·GF·ε).
    const strain = -300e-6;
    const outputMvPerV = (1000 * (2 * strain)) / (4 + 2 * 2 * strain);
    const gauge = prepared(foilGauge({ material: concrete, zero: { value: 0, temperature: 20 } }));
    const reading = converted(gauge.convert(outputMvPerV, 20));
    expectClose(reading.strain, -300, 1e-9);
    const rating = rateStress(reading.stress, concrete)!;
    expectClose(reading.stress, -concrete.E * 300e-6, 1e-9);
    expectClose(rating.ratio!, (concrete.E * 300e-6) / 30, 1e-9);
    expect(Math.round(rating.ratio! * 1000) / 10).toBe(32.8);
  });

  it("leaves the existing metal presets rated against their yield", () => {
    expect(rateStress(100, MATERIALS["structural-steel-eu"])!.basis).toBe("yield");
  });
});
