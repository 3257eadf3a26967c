import { describe, expect, it } from "vitest";
import { DETAIL_CATEGORIES, cyclesToFailure, snCurveLimits } from "@/lib/fatigue";

// S-N curve shape of EN 1993-1-9, from memory: Δσ_C at 2×10⁶ cycles,
// m = 3 to Δσ_D at 5×10⁶, m = 5 to Δσ_L at 10⁸, no damage below Δσ_L.

function expectRelativelyClose(actual: number, expected: number, tolerance = 1e-9) {
  expect(Math.abs(actual / expected - 1)).toBeLessThan(tolerance);
}

const CATEGORIES = DETAIL_CATEGORIES.map(({ category }) => category);

describe("S-N curve by detail category", () => {
  it("lists the usual categories with plain descriptions", () => {
    // The usual detail categories of EN 1993-1-9, from memory.
    expect(CATEGORIES).toEqual([160, 140, 125, 112, 100, 90, 80, 71, 63, 56, 50, 45, 40, 36]);
    expect(DETAIL_CATEGORIES.find(({ category }) => category === 71)?.description).toBe("Detail category 71");
  });

  it.each(CATEGORIES)("category %i passes through its anchor points", (category) => {
    const { constantAmplitudeLimit, cutOffLimit } = snCurveLimits(category);
    expectRelativelyClose(cyclesToFailure(category, category), 2e6);
    expectRelativelyClose(cyclesToFailure(constantAmplitudeLimit, category), 5e6);
    expectRelativelyClose(cyclesToFailure(cutOffLimit, category), 1e8);
    expect(cyclesToFailure(cutOffLimit * 0.999, category)).toBe(Infinity);
  });

  it.each(CATEGORIES)("category %i has knees at 0.737·Δσ_C and 0.549·Δσ_D", (category) => {
    // EN 1993-1-9 (from memory); the ratios follow from the slopes: (2/5)^(1/3) = 0.737, (5/100)^(1/5) = 0.549.
    const { referenceRange, constantAmplitudeLimit, cutOffLimit } = snCurveLimits(category);
    expect(referenceRange).toBe(category);
    expect(constantAmplitudeLimit / category).toBeCloseTo(0.737, 3);
    expect(cutOffLimit / constantAmplitudeLimit).toBeCloseTo(0.549, 3);
  });

  it("gives the knee ranges of category 71 computed by hand", () => {
    // Δσ_D = 71 × 0.4^(1/3) = 71 × 0.736806 = 52.313 MPa; Δσ_L = 52.313 × 0.05^(1/5)
    // = 52.313 × 0.549280 = 28.735 MPa.
    const limits = snCurveLimits(71);
    expect(limits.constantAmplitudeLimit).toBeCloseTo(52.313, 3);
    expect(limits.cutOffLimit).toBeCloseTo(28.735, 3);
  });

  it("is continuous at Δσ_D and ends at 10⁸ cycles at Δσ_L", () => {
    // Continuity is how the standard defines Δσ_D (from memory): either side of the knee the two
    // slopes give nearly the same endurance. At Δσ_L the curve reaches 10⁸ and then stops.
    const { constantAmplitudeLimit, cutOffLimit } = snCurveLimits(80);
    const above = cyclesToFailure(constantAmplitudeLimit * (1 + 1e-9), 80);
    const below = cyclesToFailure(constantAmplitudeLimit * (1 - 1e-9), 80);
    expectRelativelyClose(below, above, 1e-7);
    expectRelativelyClose(cyclesToFailure(cutOffLimit * (1 + 1e-9), 80), 1e8, 1e-7);
  });

  it("follows slope 3 above Δσ_D and slope 5 between Δσ_D and Δσ_L", () => {
    // Doubling the range divides N by 2³ on the upper branch (common practice for m = 3):
    // category 90 at 180 MPa gives 2×10⁶ / 8 = 250 000 cycles.
    expectRelativelyClose(cyclesToFailure(180, 90), 250_000);
    // Category 100: Δσ_D = 73.68, Δσ_L = 40.47 MPa; 50 → 55 MPa divides N by 1.1⁵ = 1.61051.
    expectRelativelyClose(cyclesToFailure(50, 100) / cyclesToFailure(55, 100), 1.61051, 1e-6);
  });

  it("does no damage at a zero range and refuses nonsense", () => {
    expect(cyclesToFailure(0, 71)).toBe(Infinity);
    expect(() => cyclesToFailure(-1, 71)).toThrow(RangeError);
    expect(() => cyclesToFailure(Number.NaN, 71)).toThrow(RangeError);
    expect(() => cyclesToFailure(50, 0)).toThrow(RangeError);
    expect(() => snCurveLimits(Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });
});
