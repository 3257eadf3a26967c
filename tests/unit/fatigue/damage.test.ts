import { describe, expect, it } from "vitest";
import { SECONDS_PER_YEAR, damageRatePerYear, minerDamage, yearsToReachDamage } from "@/lib/fatigue";

// Palmgren–Miner rule D = Σ nᵢ/Nᵢ (Miner, 1945); S-N curve of EN 1993-1-9, from memory.

describe("Miner damage", () => {
  it("sums a constructed history on category 71 as computed by hand", () => {
    // Category 71: Δσ_D = 71 × 0.4^(1/3) = 52.313 MPa, Δσ_L = 52.313 × 0.05^(1/5) = 28.735 MPa.
    // 1000 cycles at 100 MPa (≥ Δσ_D, m = 3): N = 2×10⁶ × (71/100)³ = 2×10⁶ × 0.357911 = 715 822;
    //   n/N = 1000 / 715 822 = 0.0013970.
    // 10⁵ cycles at 40 MPa (between Δσ_L and Δσ_D, m = 5): N = 5×10⁶ × (52.313/40)⁵
    //   = 5×10⁶ × 1.30783⁵ = 5×10⁶ × 3.82612 = 19.1306×10⁶; n/N = 10⁵ / 19.1306×10⁶ = 0.0052272.
    // 10⁶ cycles at 20 MPa (below Δσ_L): no damage.
    // D = 0.0013970 + 0.0052272 = 0.0066242.
    const history = [
      { range: 100, count: 1000 },
      { range: 40, count: 1e5 },
      { range: 20, count: 1e6 },
    ];
    expect(minerDamage(history, 71)).toBeCloseTo(0.0066242, 6);
  });

  it("is zero for no cycles and adds up over parts of a history", () => {
    // Additivity is the point of the linear rule (Palmgren–Miner, common practice).
    expect(minerDamage([], 71)).toBe(0);
    const first = [{ range: 120, count: 10 }];
    const second = [{ range: 60, count: 0.5 }];
    expect(minerDamage([...first, ...second], 90)).toBeCloseTo(minerDamage(first, 90) + minerDamage(second, 90), 15);
  });

  it("counts a half cycle as half the damage of a full one", () => {
    // Half cycles enter Miner's sum with n = 0.5 (ASTM E1049 half cycles; common practice).
    // Category 36 at 72 MPa (m = 3): N = 2×10⁶ × (36/72)³ = 250 000; D = 0.5 / 250 000 = 2×10⁻⁶.
    expect(minerDamage([{ range: 72, count: 0.5 }], 36)).toBeCloseTo(2e-6, 15);
  });
});

describe("damage rate and life", () => {
  it("scales the period's damage to a year", () => {
    // Arithmetic: 0.01 over half a year is 0.02 a year; 0.001 over 30 days is 0.001 × 365.25 / 30.
    expect(damageRatePerYear(0.01, SECONDS_PER_YEAR / 2)).toBeCloseTo(0.02, 15);
    expect(damageRatePerYear(0.001, 30 * 86_400)).toBeCloseTo(0.0121750, 7);
    expect(() => damageRatePerYear(0.01, 0)).toThrow(RangeError);
  });

  it("gives the years a rate needs to reach the damage left", () => {
    // Arithmetic: 1 / 0.02 = 50 years; (1 − 0.5) / 0.02 = 25 years.
    expect(yearsToReachDamage(0.02)).toBeCloseTo(50, 12);
    expect(yearsToReachDamage(0.02, 1 - 0.5)).toBeCloseTo(25, 12);
    expect(yearsToReachDamage(0)).toBe(Infinity);
    expect(yearsToReachDamage(0.02, 0)).toBe(0);
    expect(() => yearsToReachDamage(-0.1)).toThrow(RangeError);
  });
});
