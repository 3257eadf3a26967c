import type { Failure } from "./result";
import { failure } from "./result";
import type { GaugeKind, ThermalCompensation } from "./gauge-config";

/**
 * Carbon-steel vibrating wire's expansion coefficient in µε/°C, the API's default for a new wire
 * gauge: a handbook value from memory (steel wire lies about 11–13 µε/°C). A gauge stores the
 * coefficient it was created with, so changing this default never re-converts a stored gauge.
 */
export const STEEL_WIRE_CTE = 12.2;

const MAX_THERMAL_OUTPUT_TERMS = 5;

/**
 * Every compensation method is a polynomial Q in the reading's temperature, ε_mech = ε_ind + Q(T),
 * so the per-reading path evaluates one polynomial whatever the method.
 */
export interface ThermalCompensator {
  readonly ok: true;
  readonly needsTemperature: boolean;
  /** Q's coefficients, constant term first. */
  readonly coefficients: Float64Array;
}

export type ThermalErrorCode = "invalid-thermal" | "zero-temperature-required";

/** Horner evaluation of Σ cᵢ·Tⁱ. */
export function evaluatePolynomial(coefficients: ArrayLike<number>, temperature: number): number {
  let value = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) value = value * temperature + (coefficients[i] ?? 0);
  return value;
}

/**
 * The correction slope for a gauge that compensates its own expansion α_gauge on a host that
 * expands α_host. Foil: ε_mech = ε_ind − (α_host − α_gauge)·ΔT. Vibrating wire:
 * ε_mech = ε_app + (α_wire − α_host)·ΔT. Both are (α_gauge − α_host)·ΔT, because either gauge
 * reads the host's total strain less its own free expansion.
 */
export function cteCorrectionSlope(gaugeCte: number, hostAlpha: number): number {
  return gaugeCte - hostAlpha;
}

/** ε_total = ε_mech + α_host·ΔT: the host's free thermal strain produces no stress. */
export function totalStrain(mechanicalStrain: number, hostAlpha: number, temperatureChange: number): number {
  return mechanicalStrain + hostAlpha * temperatureChange;
}

/** The API's defaults: a vibrating wire compensates with its steel wire's coefficient, foil not at all. */
export function thermalCompensationFor(kind: GaugeKind, thermal: ThermalCompensation | null | undefined): ThermalCompensation {
  if (kind !== "vibrating-wire") return thermal ?? { method: "none" };
  if (!thermal) return { method: "cte", gaugeCte: STEEL_WIRE_CTE };
  return thermal.method === "cte" && thermal.gaugeCte == null ? { method: "cte", gaugeCte: STEEL_WIRE_CTE } : thermal;
}

export function prepareThermalCompensation(
  thermal: ThermalCompensation,
  hostAlpha: number,
  zeroTemperature: number | null,
): ThermalCompensator | Failure<ThermalErrorCode> {
  if (thermal.method === "none") return { ok: true, needsTemperature: false, coefficients: new Float64Array(0) };
  if (thermal.method !== "polynomial" && thermal.method !== "cte") {
    return failure("invalid-thermal", "Unknown thermal compensation method; use none, polynomial or cte.");
  }
  if (zeroTemperature === null) {
    return failure(
      "zero-temperature-required",
      `The ${thermal.method} compensation needs the temperature of the zero reading; record it with the zero.`,
    );
  }
  return thermal.method === "polynomial"
    ? thermalOutputCompensator(thermal.coefficients, zeroTemperature)
    : cteCompensator(thermal.gaugeCte, hostAlpha, zeroTemperature);
}

/** ε_mech = ε_ind − (P(T) − P(T₀)): Q = −P + P(T₀). */
function thermalOutputCompensator(
  thermalOutput: readonly number[],
  zeroTemperature: number,
): ThermalCompensator | Failure<ThermalErrorCode> {
  if (
    !Array.isArray(thermalOutput) ||
    thermalOutput.length === 0 ||
    thermalOutput.length > MAX_THERMAL_OUTPUT_TERMS ||
    !thermalOutput.every(Number.isFinite)
  ) {
    return failure("invalid-thermal", "Thermal output needs one to five finite coefficients A0…A4 (µε, T in °C).");
  }
  const outputAtZero = evaluatePolynomial(thermalOutput, zeroTemperature);
  const coefficients = Float64Array.from(thermalOutput, (a, i) => (i === 0 ? outputAtZero - a : -a));
  return { ok: true, needsTemperature: true, coefficients };
}

/** Q = k·(T − T₀) with k the correction slope. */
function cteCompensator(
  gaugeCte: number | null | undefined,
  hostAlpha: number,
  zeroTemperature: number,
): ThermalCompensator | Failure<ThermalErrorCode> {
  if (typeof gaugeCte !== "number" || !Number.isFinite(gaugeCte)) {
    return failure("invalid-thermal", "The cte compensation needs the gauge's expansion coefficient gaugeCte in µε/°C.");
  }
  const slope = cteCorrectionSlope(gaugeCte, hostAlpha);
  return { ok: true, needsTemperature: true, coefficients: Float64Array.of(-slope * zeroTemperature, slope) };
}
