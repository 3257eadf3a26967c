import { isFiniteNumber, isPositive } from "./checks";
import { READING_FAILURES, type GaugeConfigErrorCode, type ReadingErrorCode } from "./errors";
import type { GaugeConfig } from "./gauge-config";
import { prepareRawReader } from "./indicated-strain";
import { materialProblem } from "./materials";
import { failure, type Failure } from "./result";
import { uniaxialStress, utilisation } from "./stress";
import { evaluatePolynomial, prepareThermalCompensation, thermalCompensationFor, totalStrain } from "./thermal";
import { validityFlags } from "./validity";

export interface PrepareOptions {
  /**
   * Fraction of the yield beyond which |σ| is flagged `outside-linear-range` (default 1: at yield).
   * Lower it where residual stresses make the proportional limit fall below the yield.
   */
  linearLimitRatio?: number;
}

/** One converted reading. */
export interface Conversion {
  readonly ok: true;
  /** µε change the gauge saw since its zero reading, polarity applied, before temperature. */
  indicatedStrain: number;
  /** µε stress-producing (mechanical) strain. */
  strain: number;
  /** µε total strain ε_mech + α_host·ΔT; null without a reading and a zero temperature. */
  totalStrain: number | null;
  /** MPa, including the initial stress. */
  stress: number;
  /** |σ| / yield; null when the material's yield is unknown. */
  utilisation: number | null;
  /** Bitmask of `Flag`; `flagWords` turns it into the API's words. */
  flags: number;
}

export type ConversionResult = Readonly<Conversion> | Failure<ReadingErrorCode>;

export interface GaugeConverter {
  readonly ok: true;
  /** Whether every reading must carry a temperature. */
  readonly needsTemperature: boolean;
  /**
   * Converts one raw reading (gauge input unit; temperature in °C). To stay allocation-free the
   * success object is reused by the converter's next call: copy what you keep.
   */
  convert(value: number, temperature?: number | null): ConversionResult;
}

/** Validates a gauge's configuration once and returns the converter for its readings. */
export function prepareGauge(config: GaugeConfig, options: PrepareOptions = {}): GaugeConverter | Failure<GaugeConfigErrorCode> {
  const problem = materialProblem(config.material) ?? scalarProblem(config, options);
  if (problem) return problem;
  const reader = prepareRawReader(config);
  if (!reader.ok) return reader;
  const zeroTemperature = config.zero.temperature ?? null;
  const compensation = prepareThermalCompensation(
    thermalCompensationFor(config.kind, config.thermal),
    config.material.alpha,
    zeroTemperature,
  );
  if (!compensation.ok) return compensation;
  const { material } = config;
  const yieldStrength = material.yield ?? null;
  const linearLimitRatio = options.linearLimitRatio ?? 1;
  const output: Conversion = { ok: true, indicatedStrain: 0, strain: 0, totalStrain: null, stress: 0, utilisation: null, flags: 0 };
  const { toStrain, impossibleValue } = reader;
  const { needsTemperature, coefficients } = compensation;
  const initialStress = config.initialStress ?? 0;
  const linearStressLimit = yieldStrength === null ? Infinity : linearLimitRatio * yieldStrength;
  const ratedRange = config.ratedRange ?? Infinity;

  function convert(value: number, temperature?: number | null): ConversionResult {
    if (!Number.isFinite(value)) return READING_FAILURES.nonFiniteValue;
    const knownTemperature = temperature ?? null;
    if (knownTemperature === null) {
      if (needsTemperature) return READING_FAILURES.temperatureRequired;
    } else if (!Number.isFinite(knownTemperature)) {
      return READING_FAILURES.nonFiniteTemperature;
    }
    const indicated = toStrain(value);
    if (Number.isNaN(indicated)) return impossibleValue;
    const strain = knownTemperature === null ? indicated : indicated + evaluatePolynomial(coefficients, knownTemperature);
    const stress = uniaxialStress(material.E, strain, initialStress);
    // A huge but finite raw value (1e308) can overflow on the way; stored, it would poison every sum over it.
    if (!Number.isFinite(strain) || !Number.isFinite(stress)) return READING_FAILURES.notFinite;
    output.indicatedStrain = indicated;
    output.strain = strain;
    output.totalStrain =
      knownTemperature === null || zeroTemperature === null
        ? null
        : totalStrain(strain, material.alpha, knownTemperature - zeroTemperature);
    output.stress = stress;
    output.utilisation = utilisation(stress, yieldStrength);
    output.flags = validityFlags(stress, indicated, linearStressLimit, ratedRange);
    return output;
  }

  return { ok: true, needsTemperature, convert };
}

function scalarProblem(config: GaugeConfig, options: PrepareOptions): Failure<GaugeConfigErrorCode> | null {
  if (config.polarity != null && config.polarity !== 1 && config.polarity !== -1) {
    return failure("invalid-polarity", "Polarity is 1 or -1.");
  }
  if (config.zero?.temperature != null && !isFiniteNumber(config.zero.temperature)) {
    return failure("invalid-zero", "The zero reading's temperature, when given, must be a finite number in °C.");
  }
  if (config.initialStress != null && !isFiniteNumber(config.initialStress)) {
    return failure("invalid-initial-stress", "The initial stress, when given, must be a finite number in MPa.");
  }
  if (config.ratedRange != null && !isPositive(config.ratedRange)) {
    return failure("invalid-rated-range", "The rated range, when given, must be a positive strain in µε.");
  }
  if (options.linearLimitRatio !== undefined && !isPositive(options.linearLimitRatio)) {
    return failure("invalid-linear-limit-ratio", "The linear-limit ratio must be a positive fraction of the yield.");
  }
  return null;
}
