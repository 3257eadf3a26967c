import { conditionStep, type ConditionState, type DetectorStep, type Sample } from "./finding";

/** The raw range the sensor and logger channel can report, from the gauge's data sheet. */
export interface SensorRangeThresholds {
  readonly min: number;
  readonly max: number;
}

export const INITIAL_SENSOR_RANGE: ConditionState = { active: false };

/** Written so that a non-finite raw value also counts as outside the range. */
export function stepSensorRange(thresholds: SensorRangeThresholds, state: ConditionState, sample: Sample): DetectorStep<ConditionState> {
  const outside = !(sample.raw >= thresholds.min && sample.raw <= thresholds.max);
  const finding = conditionStep("out-of-range", state.active, outside, sample.time, {
    raised: () =>
      `The raw reading ${sample.raw} is outside the sensor's range of ${thresholds.min} to ${thresholds.max}; the gauge or its wiring has probably failed.`,
    resolved: "Raw readings are back within the sensor's range.",
  });
  return { state: { active: outside }, fault: outside, finding };
}
