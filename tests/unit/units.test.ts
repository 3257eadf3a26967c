import { describe, expect, it } from "vitest";
import {
  celsiusIntervalToFahrenheit,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  formatForDisplay,
  formatInUnit,
  formatMicrostrain,
  ksiToMpa,
  mpaToKsi,
  perCelsiusToPerFahrenheit,
  stressIn,
  temperatureIn,
} from "@/lib/units";

const close = (actual: number, expected: number) => expect(Math.abs(actual - expected)).toBeLessThan(1e-9 * Math.max(1, Math.abs(expected)));

describe("display units", () => {
  it("converts ksi and MPa with the exact factor", () => {
    // NIST SP 811, Appendix B: 1 psi = 6.894 757 E+03 Pa, so 1 ksi = 6.894 757 MPa
    close(ksiToMpa(1), 6.894757293168361);
    // AISC: 50 ksi ≈ 345 MPa (from memory)
    expect(Math.round(ksiToMpa(50))).toBe(345);
    close(mpaToKsi(ksiToMpa(36)), 36);
  });

  it("converts temperatures at the fixed points", () => {
    // water freezes at 0 °C = 32 °F and boils at 100 °C = 212 °F; −40 is the same on both scales
    expect(celsiusToFahrenheit(0)).toBe(32);
    expect(celsiusToFahrenheit(100)).toBe(212);
    expect(celsiusToFahrenheit(-40)).toBe(-40);
    expect(fahrenheitToCelsius(212)).toBe(100);
  });

  it("converts temperature intervals and expansion coefficients without the offset", () => {
    expect(celsiusIntervalToFahrenheit(20)).toBe(36);
    // AISC Manual: steel 6.5×10⁻⁶/°F = 11.7×10⁻⁶/°C (from memory)
    close(perCelsiusToPerFahrenheit(11.7), 6.5);
  });

  it("picks the user's display unit", () => {
    close(stressIn("ksi", 344.7378646584), 50);
    expect(stressIn("MPa", 12)).toBe(12);
    expect(temperatureIn("°F", 20)).toBe(68);
    expect(temperatureIn("°C", 20)).toBe(20);
  });

  it("formats microstrain with grouping and the unit", () => {
    expect(formatMicrostrain(1234.4)).toBe("1,234 µε");
    expect(formatMicrostrain(-5.25, 1)).toBe("-5.3 µε");
  });

  it("rounds a value as its unit is read and names the unit", () => {
    expect(formatInUnit(123.4567, "MPa")).toBe("123.5 MPa");
    expect(formatInUnit(2004.4, "µε")).toBe("2,004 µε");
    expect(formatInUnit(14.24, "°C")).toBe("14.2 °C");
    expect(formatInUnit(-0.04, "MPa")).toBe("0.0 MPa");
    // SI Brochure (9th ed., 5.4.3): no space before the degree sign of a plane angle.
    expect(formatInUnit(12.34, "°")).toBe("12.3°");
  });

  it("shows a stored SI value in the person's units", () => {
    expect(formatForDisplay("si", "stress", 123.4567)).toBe("123.5 MPa");
    // NIST SP 811, Appendix B: 1 ksi = 6.894 757 MPa, so 123.4567 MPa = 17.906 ksi.
    expect(formatForDisplay("us", "stress", 123.4567)).toBe("17.91 ksi");
    // °F = °C × 9/5 + 32 (NIST SP 811, Appendix B, temperature).
    expect(formatForDisplay("us", "temperature", 14.2)).toBe("57.6 °F");
    expect(formatForDisplay("us", "strain", 2004.4)).toBe("2,004 µε");
  });

  it("shows a dash, never NaN, for a missing value", () => {
    expect(formatInUnit(Number.NaN, "MPa")).toBe("—");
    expect(formatInUnit(null, "ksi")).toBe("—");
    expect(formatInUnit(undefined, "µε")).toBe("—");
    expect(formatInUnit(Number.POSITIVE_INFINITY, "°F")).toBe("—");
  });
});

describe("share of yield", () => {
  it("reads a utilisation as a whole percentage and never prints Infinity or NaN", async () => {
    const { formatShareOfYield } = await import("@/lib/units");
    // |σ| / yield = 0.874 is 87 % (rounded to the whole percent).
    expect(formatShareOfYield(0.874)).toBe("87 % of yield");
    expect(formatShareOfYield(Infinity)).toBe("—");
    expect(formatShareOfYield(Number.NaN)).toBe("—");
    expect(formatShareOfYield(null)).toBe("—");
  });
});
