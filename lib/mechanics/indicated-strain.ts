import { isFiniteNumber, isPositive } from "./checks";
import { bridgeFormula, gaugeArmLeadResistance, leadWireCorrection, loggerGaugeFactorCorrection, millivoltsPerVoltToRatio } from "./bridge";
import { READING_FAILURES, type GaugeConfigErrorCode, type ReadingErrorCode } from "./errors";
import type { GaugeConfig } from "./gauge-config";
import { failure, type Failure } from "./result";
import { MICRO } from "./stress";
import { apparentStrain, frequencySquaredFromHz } from "./vibrating-wire";

/**
 * Turns a raw reading into the gauge's strain change since its zero reading, in µε, polarity
 * applied, before temperature. NaN marks a value the input kind cannot produce.
 */
export interface RawReader {
  readonly ok: true;
  readonly toStrain: (value: number) => number;
  /** What to tell the sender when `toStrain` returns NaN. */
  readonly impossibleValue: Failure<ReadingErrorCode>;
}

type ConfigFailure = Failure<GaugeConfigErrorCode>;

export function prepareRawReader(config: GaugeConfig): RawReader | ConfigFailure {
  if (!isPositive(config.gaugeFactor)) {
    return failure("invalid-gauge-factor", "The gauge factor (or the wire gauge factor of a vibrating wire) must be a positive number.");
  }
  if (!isFiniteNumber(config.zero?.value)) {
    return failure("invalid-zero", "The zero reading needs a finite raw value in the gauge's input unit.");
  }
  switch (config.kind) {
    case "foil":
      return foilReader(config);
    case "vibrating-wire":
      return vibratingWireReader(config);
    default:
      return failure("unknown-kind", "Unknown gauge kind; use foil or vibrating-wire.");
  }
}

function foilReader(config: GaugeConfig): RawReader | ConfigFailure {
  const bridge = config.bridge == null ? undefined : bridgeFormula(config.bridge);
  if (config.bridge != null && !bridge) {
    return failure(
      "unknown-bridge",
      "Unknown bridge; use quarter, half-bending, half-poisson, full-bending, full-poisson or full-axial-poisson.",
    );
  }
  const lead = quarterBridgeLeadCorrection(config);
  if (typeof lead !== "number") return lead;
  const zero = config.zero.value;
  const polarity = config.polarity ?? 1;
  if (config.input === "microstrain") {
    const loggerGaugeFactor = config.loggerGaugeFactor ?? config.gaugeFactor;
    if (!isPositive(loggerGaugeFactor)) {
      return failure("invalid-logger-gauge-factor", "The logger's gauge factor, when given, must be a positive number.");
    }
    const scale = polarity * lead * loggerGaugeFactorCorrection(loggerGaugeFactor, config.gaugeFactor);
    return { ok: true, toStrain: (value) => scale * (value - zero), impossibleValue: READING_FAILURES.nonFiniteValue };
  }
  if (config.input !== "mV/V") return failure("unknown-input", "A foil gauge's input is microstrain or mV/V.");
  if (!bridge) return failure("unknown-bridge", "A foil gauge read in mV/V needs its bridge arrangement.");
  const { gaugeFactor } = config;
  const poisson = config.material.nu;
  const scale = lead / MICRO;
  // Swapped output leads reverse the bridge output itself; the non-linear relations then see the
  // output the circuit would give wired the standard way.
  return {
    ok: true,
    toStrain: (value) => scale * bridge(polarity * millivoltsPerVoltToRatio(value - zero), gaugeFactor, poisson),
    impossibleValue: READING_FAILURES.impossibleBridgeOutput,
  };
}

/** The API applies the lead correction to quarter bridges when both resistances are known; the wiring says how many leads are in the arm. */
function quarterBridgeLeadCorrection(config: GaugeConfig): number | ConfigFailure {
  const armResistance = gaugeArmLeadResistance(config);
  if (armResistance === null) return 1;
  if (!isFiniteNumber(armResistance) || armResistance < 0 || !isPositive(config.gaugeResistance)) {
    return failure("invalid-resistance", "Lead resistance must be 0 Ω or more and gauge resistance above 0 Ω.");
  }
  return leadWireCorrection(armResistance, config.gaugeResistance!);
}

function vibratingWireReader(config: GaugeConfig): RawReader | ConfigFailure {
  const calibrationFactor = config.calibrationFactor ?? 1;
  if (!isPositive(calibrationFactor)) {
    return failure("invalid-calibration-factor", "The calibration multiplier, when given, must be a positive number (1 if none).");
  }
  const fromHz = config.input === "Hz";
  if (!fromHz && config.input !== "frequency-squared") {
    return failure("unknown-input", "A vibrating-wire gauge's input is Hz or frequency-squared (f²/1000).");
  }
  if (!(config.zero.value > 0)) {
    return failure("invalid-zero", `The zero reading of a vibrating-wire gauge must be above 0 ${fromHz ? "Hz" : "f²/1000"}.`);
  }
  const toFrequencySquared = fromHz ? frequencySquaredFromHz : (frequencySquared: number) => frequencySquared;
  const zeroFrequencySquared = toFrequencySquared(config.zero.value);
  const { gaugeFactor } = config;
  const polarity = config.polarity ?? 1;
  return {
    ok: true,
    toStrain: (value) =>
      value > 0 ? polarity * apparentStrain(gaugeFactor, calibrationFactor, toFrequencySquared(value), zeroFrequencySquared) : Number.NaN,
    impossibleValue: fromHz ? READING_FAILURES.nonPositiveFrequency : READING_FAILURES.nonPositiveFrequencySquared,
  };
}
