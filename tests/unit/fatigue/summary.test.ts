import { describe, expect, it } from "vitest";
import { fatigueSummary, rainflow, totalCycleCount } from "@/lib/fatigue";
import { ASTM_EXAMPLE } from "./fixtures";

describe("fatigue summary", () => {
  it("reports the example, read as MPa × 10, on category 71", () => {
    // Ranges 30, 40, 60, 80, 90 MPa with counts 0.5, 1.5, 0.5, 1, 0.5 (the standard's table × 10).
    // Category 71 (EN 1993-1-9, from memory): Δσ_D = 52.313, Δσ_L = 28.735 MPa.
    // 30 MPa, m = 5: N = 10⁸ × (28.735/30)⁵ = 80.62×10⁶ → 0.5/N = 0.0062×10⁻⁶
    // 40 MPa, m = 5: N = 19.131×10⁶ → 1.5/N = 0.0784×10⁻⁶
    // 60 MPa, m = 3: N = 2×10⁶ × (71/60)³ = 3.3140×10⁶ → 0.5/N = 0.1509×10⁻⁶
    // 80 MPa: N = 2×10⁶ × 0.8875³ = 1.3981×10⁶ → 1/N = 0.7153×10⁻⁶
    // 90 MPa: N = 2×10⁶ × (71/90)³ = 0.98192×10⁶ → 0.5/N = 0.5092×10⁻⁶
    // D = 1.4600×10⁻⁶; cycles counted 0.5 + 1.5 + 0.5 + 1 + 0.5 = 4.
    const summary = fatigueSummary(rainflow(ASTM_EXAMPLE.map((value) => 10 * value)), 71, 10);
    expect(summary.cycles).toEqual([
      { range: 30, count: 0.5 },
      { range: 40, count: 1.5 },
      { range: 60, count: 0.5 },
      { range: 80, count: 1 },
      { range: 90, count: 0.5 },
    ]);
    expect(summary.damage).toBeCloseTo(1.46e-6, 9);
    expect(summary.category).toBe(71);
    expect(summary.cyclesCounted).toBe(4);
  });

  it("computes damage from the cycles, not from the bins", () => {
    // A 29 MPa range is above the category-71 cut-off (28.735 MPa) and does damage; binned to a
    // 50 MPa upper edge it would count far more. The summary must report the former.
    const cycles = [{ range: 29, mean: 0, count: 1 }];
    const summary = fatigueSummary(cycles, 71, 50);
    expect(summary.cycles).toEqual([{ range: 50, count: 1 }]);
    // 29 MPa, m = 5: N = 10⁸ × (28.735/29)⁵ = 10⁸ × 0.9552 = 95.5×10⁶ → D = 1.047×10⁻⁸.
    expect(summary.damage).toBeCloseTo(1.047e-8, 11);
  });

  it("counts half cycles as half in the total", () => {
    expect(totalCycleCount([{ count: 0.5 }, { count: 1 }, { count: 0.5 }])).toBe(2);
  });
});
