/**
 * Display conversions. The API and storage are SI (MPa, °C, µε); ksi and °F are a user preference
 * applied only when showing values.
 */

import type { StressRating } from "@/lib/mechanics/stress-rating";

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
/** Every unit a value is shown in: "°" is a plane angle (a rosette's principal direction). */
export type DisplayUnit = StressUnit | TemperatureUnit | "µε" | "°";

export function stressIn(unit: StressUnit, mpa: number): number {
  return unit === "ksi" ? mpaToKsi(mpa) : mpa;
}

export function temperatureIn(unit: TemperatureUnit, celsius: number): number {
  return unit === "°F" ? celsiusToFahrenheit(celsius) : celsius;
}

/**
 * Decimals each display unit is read to: whole µε is the resolution gauges are read to in the field;
 * 0.1 MPa and 0.01 ksi (0.07 MPa) are steps of about the same size; a tenth of a degree (common practice).
 */
const DISPLAY_DECIMALS: Readonly<Record<DisplayUnit, number>> = { MPa: 1, ksi: 2, "µε": 0, "°C": 1, "°F": 1, "°": 1 };

/** A plane angle's degree sign follows the number without a space (SI Brochure, 9th ed., 5.4.3). */
const unitSeparator = (unit: DisplayUnit) => (unit === "°" ? "" : " ");

function withUnit(value: number, fractionDigits: number, unit: DisplayUnit): string {
  // "negative": a small negative value rounded to zero reads 0.0, not -0.0.
  const number = value.toLocaleString("en-US", { minimumFractionDigits: fractionDigits, maximumFractionDigits: fractionDigits, signDisplay: "negative" });
  return `${number}${unitSeparator(unit)}${unit}`;
}

/** "1,234 µε": whole microstrain unless asked for more. */
export function formatMicrostrain(microstrain: number, fractionDigits = DISPLAY_DECIMALS["µε"]): string {
  return withUnit(microstrain, fractionDigits, "µε");
}

/** "123.5 MPa", "17.91 ksi", "2,004 µε", "14.2 °C": a value already in `unit`, rounded as that unit is read; a dash when there is none. */
export function formatInUnit(value: number | null | undefined, unit: DisplayUnit): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  return withUnit(value, DISPLAY_DECIMALS[unit], unit);
}

/** "87 % of yield" for a utilisation |σ| / yield of 0.87; a dash when unknown or not a finite number, never "Infinity %". */
export function formatShareOfYield(ratio: number | null | undefined): string {
  if (ratio === null || ratio === undefined || !Number.isFinite(ratio)) return "—";
  return `${Math.round(ratio * 100)} % of yield`;
}

/**
 * A stress rating in words: "87 % of yield", "42 % of f_ck in compression", or why concrete in
 * tension has no figure; a dash when the material states no strength.
 */
export function formatStressRating(rating: StressRating | null | undefined): string {
  if (!rating) return "—";
  if (rating.basis === "yield") return formatShareOfYield(rating.ratio);
  if (rating.ratio === null) return "not rated: concrete in tension cracks";
  return Number.isFinite(rating.ratio) ? `${Math.round(rating.ratio * 100)} % of f_ck in compression` : "—";
}

export type UnitSystem = "si" | "us";
export type DisplayQuantity = "stress" | "strain" | "temperature";

/** The units a person reads stresses and temperatures in; strain is µε in both systems. */
export function displayUnits(system: UnitSystem): { stress: StressUnit; temperature: TemperatureUnit } {
  return system === "us" ? { stress: "ksi", temperature: "°F" } : { stress: "MPa", temperature: "°C" };
}

/** A stored SI value (stress MPa, strain µε, temperature °C) in the person's units, with the unit. */
export function inDisplayUnits(system: UnitSystem, quantity: DisplayQuantity, value: number): { value: number; unit: StressUnit | TemperatureUnit | "µε" } {
  const units = displayUnits(system);
  if (quantity === "stress") return { value: stressIn(units.stress, value), unit: units.stress };
  if (quantity === "temperature") return { value: temperatureIn(units.temperature, value), unit: units.temperature };
  return { value, unit: "µε" };
}

/** "36.26 ksi" for a stored 250 MPa when the person reads US units: conversion and rounding in one. */
export function formatForDisplay(system: UnitSystem, quantity: DisplayQuantity, value: number): string {
  const shown = inDisplayUnits(system, quantity, value);
  return formatInUnit(shown.value, shown.unit);
}
