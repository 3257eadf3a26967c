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
  /**
   * Stress (MPa) of every raw value at one temperature into `out`, the same arithmetic as
   * `convert` without the strain, utilisation and flags a dynamic gauge's samples do not keep.
   * Answers null, or the first value that does not convert and why (what `convert` answers for it).
   */
  convertStresses(values: Float32Array, temperature: number | null, out: Float64Array): StressesFailure | null;
}

export interface StressesFailure {
  index: number;
  failure: Failure<ReadingErrorCode>;
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
    const unusable = temperatureFailure(knownTemperature);
    if (unusable) return unusable;
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

  function temperatureFailure(temperature: number | null): Failure<ReadingErrorCode> | null {
    if (temperature === null) return needsTemperature ? READING_FAILURES.temperatureRequired : null;
    return Number.isFinite(temperature) ? null : READING_FAILURES.nonFiniteTemperature;
  }

  // One loop over a typed array with the temperature's term worked out once: a 60 000-sample
  // burst through \`convert\` cost 38 ms of CPU per million samples in the HTTP bench's profile,
  // most of it the strain, utilisation and flags filled in per sample and never read.
  function convertStresses(values: Float32Array, temperature: number | null, out: Float64Array): StressesFailure | null {
    if (values.length === 0) return null;
    const unusable = temperatureFailure(temperature);
    if (unusable) return { index: 0, failure: Number.isFinite(values[0]!) ? unusable : READING_FAILURES.nonFiniteValue };
    const thermal = temperature === null ? null : evaluatePolynomial(coefficients, temperature);
    for (let i = 0; i < values.length; i++) {
      const value = values[i]!;
      if (!Number.isFinite(value)) return { index: i, failure: READING_FAILURES.nonFiniteValue };
      const indicated = toStrain(value);
      if (Number.isNaN(indicated)) return { index: i, failure: impossibleValue };
      const strain = thermal === null ? indicated : indicated + thermal;
      const stress = uniaxialStress(material.E, strain, initialStress);
      if (!Number.isFinite(strain) || !Number.isFinite(stress)) return { index: i, failure: READING_FAILURES.notFinite };
      out[i] = stress;
    }
    return null;
  }

  return { ok: true, needsTemperature, convert, convertStresses };
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
