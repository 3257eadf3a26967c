import type { Reading } from "../episode-machine";
import { isNewer } from "../time-order";
import type { ConditionState, DetectorStep, Sample, SensorFinding } from "./finding";
import { INITIAL_FLAT_LINE, stepFlatLine, type FlatLineState, type FlatLineThresholds } from "./flat-line";
import { INITIAL_JUMP, stepJump, type JumpState, type JumpThresholds } from "./jump";
import { INITIAL_SENSOR_RANGE, stepSensorRange, type SensorRangeThresholds } from "./sensor-range";

/** A detector whose thresholds are not given does not run (say, a gauge with no known range). */
export interface SensorHealthThresholds {
  readonly flatLine?: FlatLineThresholds;
  readonly jump?: JumpThresholds;
  readonly range?: SensorRangeThresholds;
}

/** Plain JSON, stored per gauge between ingestion batches like the episode state. */
export interface SensorHealthState {
  readonly lastTime: number | null;
  readonly flatLine: FlatLineState;
  readonly jump: JumpState;
  readonly range: ConditionState;
}

export function initialSensorHealthState(): SensorHealthState {
  return { lastTime: null, flatLine: INITIAL_FLAT_LINE, jump: INITIAL_JUMP, range: INITIAL_SENSOR_RANGE };
}

/** `readings` are the new samples in order with their fault flags, ready for `evaluateReadings`. */
export interface Inspection {
  readonly state: SensorHealthState;
  readonly findings: SensorFinding[];
  readonly readings: Reading[];
}

/**
 * Runs every configured detector over a batch. Late and repeated samples follow the same rule as
 * limit evaluation (`isNewer`) and are left out; to take a late sample in, replay the stored samples
 * from a saved state, sorted by time, through this function and then through `replay`.
 */
export function inspectReadings(thresholds: SensorHealthThresholds, state: SensorHealthState, samples: Iterable<Sample>): Inspection {
  let current = state;
  const findings: SensorFinding[] = [];
  const readings: Reading[] = [];
  for (const sample of samples) {
    if (!isNewer(current.lastTime, sample.time)) continue;
    const inspected = inspectSample(thresholds, { ...current, lastTime: sample.time }, sample);
    current = inspected.state;
    findings.push(...inspected.findings);
    readings.push({ time: sample.time, value: sample.value, fault: inspected.fault });
  }
  return { state: current, findings, readings };
}

interface SampleInspection {
  readonly state: SensorHealthState;
  readonly fault: boolean;
  readonly findings: SensorFinding[];
}

/** A raw value outside the sensor's range means nothing, so it is not fed to the other detectors. */
function inspectSample(thresholds: SensorHealthThresholds, state: SensorHealthState, sample: Sample): SampleInspection {
  const range = run(stepSensorRange, thresholds.range, state.range, sample);
  if (range.fault) return { state: { ...state, range: range.state }, fault: true, findings: findingsOf(range) };
  const jump = run(stepJump, thresholds.jump, state.jump, sample);
  const flatLine = run(stepFlatLine, thresholds.flatLine, state.flatLine, sample);
  return {
    state: { ...state, range: range.state, jump: jump.state, flatLine: flatLine.state },
    fault: jump.fault || flatLine.fault,
    findings: findingsOf(range, jump, flatLine),
  };
}

function run<Thresholds, State>(
  step: (thresholds: Thresholds, state: State, sample: Sample) => DetectorStep<State>,
  thresholds: Thresholds | undefined,
  state: State,
  sample: Sample,
): DetectorStep<State> {
  return thresholds === undefined ? { state, fault: false, finding: null } : step(thresholds, state, sample);
}

function findingsOf(...steps: DetectorStep<unknown>[]): SensorFinding[] {
  return steps.flatMap((step) => (step.finding ? [step.finding] : []));
}
