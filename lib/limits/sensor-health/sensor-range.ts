import { conditionFinding, messageNumber, stepOnce, type ConditionState, type Detector, type DetectorStep, type Sample, type SensorFinding } from "./finding";

/** The raw range the sensor and logger channel can report, from the gauge's data sheet. */
export interface SensorRangeThresholds {
  readonly min: number;
  readonly max: number;
  /** The raw unit, for the message ("mV/V", "Hz"). */
  readonly unit?: string;
}

export const INITIAL_SENSOR_RANGE: ConditionState = { active: false };

export interface SensorRangeWork {
  active: boolean;
}

export const sensorRangeDetector: Detector<SensorRangeThresholds, ConditionState, SensorRangeWork> = {
  begin: ({ active }) => ({ active }),
  advance: advanceSensorRange,
  end: ({ active }) => ({ active }),
};

export function stepSensorRange(thresholds: SensorRangeThresholds, state: ConditionState, sample: Sample): DetectorStep<ConditionState> {
  return stepOnce(sensorRangeDetector, thresholds, state, sample);
}

/** Written so that a non-finite raw value also counts as outside the range. */
function advanceSensorRange(thresholds: SensorRangeThresholds, work: SensorRangeWork, sample: Sample, findings: SensorFinding[]): boolean {
  const outside = !(sample.raw >= thresholds.min && sample.raw <= thresholds.max);
  if (outside !== work.active) {
    const message = outside ? outsideMessage(thresholds, sample.raw) : "Raw readings are back within the sensor's range.";
    findings.push(conditionFinding("out-of-range", outside, sample.time, message));
  }
  work.active = outside;
  return outside;
}

function outsideMessage(thresholds: SensorRangeThresholds, raw: number): string {
  return `The raw reading ${messageNumber(raw, thresholds.unit)} is outside the sensor's range of ${messageNumber(thresholds.min)} to ${messageNumber(thresholds.max, thresholds.unit)}; the gauge or its wiring has probably failed.`;
}
