import { describe, expect, it } from "vitest";
import {
  celsiusIntervalToFahrenheit,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
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
});
