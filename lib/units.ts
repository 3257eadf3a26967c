/**
 * Display conversions. The API and storage are SI (MPa, °C, µε); ksi and °F are a user preference
 * applied only when showing values.
 */

/** 1 psi = 6 894.757 293 168 Pa (NIST SP 811, Appendix B; exact from the international pound and inch). */
export const MPA_PER_KSI = 6.894757293168361;

export function mpaToKsi(mpa: number): number {
  return mpa / MPA_PER_KSI;
}

export function ksiToMpa(ksi: number): number {
  return ksi * MPA_PER_KSI;
}

export function celsiusToFahrenheit(celsius: number): number {
  return (celsius * 9) / 5 + 32;
}

export function fahrenheitToCelsius(fahrenheit: number): number {
  return ((fahrenheit - 32) * 5) / 9;
}

/** Temperature differences and expansion coefficients scale without the 32 °F offset. */
export function celsiusIntervalToFahrenheit(celsiusDifference: number): number {
  return (celsiusDifference * 9) / 5;
}

/** An expansion coefficient in µε/°C expressed per °F. */
export function perCelsiusToPerFahrenheit(perCelsius: number): number {
  return (perCelsius * 5) / 9;
}

export type StressUnit = "MPa" | "ksi";
export type TemperatureUnit = "°C" | "°F";

export function stressIn(unit: StressUnit, mpa: number): number {
  return unit === "ksi" ? mpaToKsi(mpa) : mpa;
}

export function temperatureIn(unit: TemperatureUnit, celsius: number): number {
  return unit === "°F" ? celsiusToFahrenheit(celsius) : celsius;
}

/** "1,234 µε": whole microstrain is the resolution gauges are read to in the field (common practice). */
export function formatMicrostrain(microstrain: number, fractionDigits = 0): string {
  return `${microstrain.toLocaleString("en-US", {
    minimumFractionDigits: fractionDigits,
    maximumFractionDigits: fractionDigits,
  })} µε`;
}

export type UnitSystem = "si" | "us";

/** The units a person reads stresses and temperatures in; strain is µε in both systems. */
export function displayUnits(system: UnitSystem): { stress: StressUnit; temperature: TemperatureUnit } {
  return system === "us" ? { stress: "ksi", temperature: "°F" } : { stress: "MPa", temperature: "°C" };
}

/** A stored SI value (stress MPa, strain µε, temperature °C) in the person's units, with the unit. */
export function inDisplayUnits(system: UnitSystem, quantity: "stress" | "strain" | "temperature", value: number): { value: number; unit: string } {
  const units = displayUnits(system);
  if (quantity === "stress") return { value: stressIn(units.stress, value), unit: units.stress };
  if (quantity === "temperature") return { value: temperatureIn(units.temperature, value), unit: units.temperature };
  return { value, unit: "µε" };
}
