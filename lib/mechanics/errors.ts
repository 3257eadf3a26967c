import { failure } from "./result";
import type { MaterialErrorCode } from "./materials";
import type { ThermalErrorCode } from "./thermal";

export type GaugeConfigErrorCode =
  | "unknown-kind"
  | "unknown-input"
  | "unknown-bridge"
  | "invalid-gauge-factor"
  | "invalid-logger-gauge-factor"
  | "invalid-calibration-factor"
  | "invalid-polarity"
  | "invalid-resistance"
  | "invalid-zero"
  | "invalid-initial-stress"
  | "invalid-rated-range"
  | "invalid-linear-limit-ratio"
  | ThermalErrorCode
  | MaterialErrorCode;

export type ReadingErrorCode =
  | "not-finite"
  | "temperature-required"
  | "non-positive-frequency"
  | "non-positive-frequency-squared"
  | "impossible-bridge-output";

/** Shared, frozen failures: refusing a reading allocates nothing. */
export const READING_FAILURES = {
  nonFiniteValue: failure("not-finite", "The reading's value is not a finite number; send the raw value as a number."),
  nonFiniteTemperature: failure(
    "not-finite",
    "The reading's temperature is not a finite number; send it in °C or leave it out.",
  ),
  notFinite: failure(
    "not-finite",
    "The reading converts to a strain or stress too large to be a number (it overflows); check the value's unit and the logger channel. Other readings of the batch are kept.",
  ),
  temperatureRequired: failure(
    "temperature-required",
    "This gauge's temperature compensation needs the temperature at each reading; send it in °C with the reading.",
  ),
  nonPositiveFrequency: failure(
    "non-positive-frequency",
    "A vibrating-wire frequency must be above 0 Hz; check the gauge, its cable and the logger channel.",
  ),
  nonPositiveFrequencySquared: failure(
    "non-positive-frequency-squared",
    "A vibrating-wire reading in f²/1000 must be above 0; check the gauge, its cable and the logger channel.",
  ),
  impossibleBridgeOutput: failure(
    "impossible-bridge-output",
    "No bridge of this arrangement can produce this output change; check the wiring, the bridge type and the zero reading.",
  ),
} as const;
