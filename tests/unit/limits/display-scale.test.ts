import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { boundText, formatLimitValue, limitScale } from "@/lib/limits/display-scale";

describe("limit bounds in the person's units", () => {
  it("shows stress bounds in ksi for US units: 250 MPa = 36.259 ksi (NIST SP 811: 1 ksi = 6.894 757 MPa)", () => {
    const ksi = limitScale("MPa", "us");
    expect(ksi.unit).toBe("ksi");
    expect(boundText(250, ksi)).toBe("36.259");
    expect(formatLimitValue(250, ksi)).toBe("36.26 ksi");
    expect(limitScale("MPa", "si").unit).toBe("MPa");
  });

  it("shows utilisation as % of yield in both systems and stores the fraction", () => {
    for (const system of ["si", "us"] as const) {
      const percent = limitScale("fraction of yield", system);
      expect(boundText(0.8, percent)).toBe("80");
      expect(percent.fromDisplay(80)).toBe(0.8);
      expect(formatLimitValue(0.8123, percent)).toBe("81 % of yield");
    }
  });

  it("leaves strain in µε and rounds a peak to whole microstrain", () => {
    const strain = limitScale("µε", "us");
    expect(formatLimitValue(2598.2770717615213, strain)).toBe("2,598 µε");
  });

  it("converts a typed bound back to the stored unit (round trip, any unit)", () => {
    fc.assert(
      fc.property(fc.constantFrom("MPa", "µε", "fraction of yield"), fc.constantFrom("si" as const, "us" as const), fc.double({ min: -1e4, max: 1e4, noNaN: true }), (unit, system, stored) => {
        const scale = limitScale(unit, system);
        expect(Math.abs(scale.fromDisplay(scale.toDisplay(stored)) - stored)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(stored)));
      }),
    );
  });
});
