import { describe, expect, it } from "vitest";
import { formatScientific } from "@/lib/fatigue";

describe("damage as engineers write it", () => {
  it("writes small values with a power of ten", () => {
    expect(formatScientific(3.2e-5)).toBe("3.2×10⁻⁵");
    expect(formatScientific(0.0015621)).toBe("1.6×10⁻³");
    // Rounding can carry into the next power: 9.96×10⁻⁴ → 1.0×10⁻³.
    expect(formatScientific(9.96e-4)).toBe("1.0×10⁻³");
  });

  it("writes values from 0.01 up in plain digits, and zero as 0", () => {
    expect(formatScientific(0.0913)).toBe("0.091");
    expect(formatScientific(1.5)).toBe("1.5");
    expect(formatScientific(0)).toBe("0");
  });
});
