import type { Reading } from "../episode-machine";
import { isNewer } from "../time-order";
import { FAULT_BITS, type ConditionState, type Sample, type SensorFinding } from "./finding";
import { flatLineDetector, INITIAL_FLAT_LINE, type FlatLineState, type FlatLineThresholds, type FlatLineWork } from "./flat-line";
import { INITIAL_JUMP, jumpDetector, type JumpState, type JumpThresholds, type JumpWork } from "./jump";
import { INITIAL_SENSOR_RANGE, sensorRangeDetector, type SensorRangeThresholds, type SensorRangeWork } from "./sensor-range";

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

/** A sample taken in, with its verdict: `fault` for `evaluateReadings`, `faultBits` (FAULT_BITS) to store. */
export interface CheckedReading extends Reading {
  readonly faultBits: number;
}

/**
 * `readings` are the new samples in order with their verdicts, ready for `evaluateReadings`;
 * `earlierJumps` the times of readings of earlier batches (suspects the batch's first reading
 * judged) now found to be jumps: their stored verdict becomes `jump`.
 */
export interface Inspection {
  readonly state: SensorHealthState;
  readonly findings: SensorFinding[];
  readonly readings: CheckedReading[];
  readonly earlierJumps: number[];
}

/** The detectors' private copies of their stored states, changed in place over a batch. */
interface DetectorWork {
  readonly flatLine: FlatLineWork;
  readonly jump: JumpWork;
  readonly range: SensorRangeWork;
}

/**
 * Runs every configured detector over a batch. Late and repeated samples follow the same rule as
 * limit evaluation (`isNewer`) and are left out; to take a late sample in, replay the stored samples
 * from a saved state, sorted by time, through this function and then through `replay`.
 */
export function inspectReadings(thresholds: SensorHealthThresholds, state: SensorHealthState, samples: Iterable<Sample>): Inspection {
  const work: DetectorWork = {
    flatLine: flatLineDetector.begin(state.flatLine),
    jump: jumpDetector.begin(state.jump),
    range: sensorRangeDetector.begin(state.range),
  };
  const findings: SensorFinding[] = [];
  const readings: CheckedReading[] = [];
  const earlierJumps: number[] = [];
  // A local, stored once at the end: a time written to an object per sample would be boxed each time.
  let lastTime = state.lastTime;
  for (const sample of samples) {
    if (!isNewer(lastTime, sample.time)) continue;
    lastTime = sample.time;
    work.jump.confirmed = null;
    const faultBits = inspectSample(thresholds, work, sample, findings);
    if (work.jump.confirmed !== null) confirmJump(readings, work.jump.confirmed, earlierJumps);
    readings.push({ time: sample.time, value: sample.value, fault: faultBits !== 0, faultBits });
  }
  const detectors = { flatLine: flatLineDetector.end(work.flatLine), jump: jumpDetector.end(work.jump), range: sensorRangeDetector.end(work.range) };
  return { state: { ...state, lastTime, ...detectors }, findings, readings, earlierJumps };
}

/** The suspect at `time` was a jump: marked so in this batch, or listed when an earlier batch took it in. */
function confirmJump(readings: CheckedReading[], time: number, earlierJumps: number[]) {
  // Only readings outside the sensor's range can lie between a suspect and the reading that judges it.
  for (let index = readings.length - 1; index >= 0; index--) {
    const reading = readings[index]!;
    if (reading.time < time) break;
    if (reading.time === time) {
      readings[index] = { ...reading, faultBits: (reading.faultBits & ~FAULT_BITS.spike) | FAULT_BITS.jump };
      return;
    }
  }
  earlierJumps.push(time);
}

/** A raw value outside the sensor's range means nothing, so it is not fed to the other detectors. */
function inspectSample(thresholds: SensorHealthThresholds, work: DetectorWork, sample: Sample, findings: SensorFinding[]): number {
  if (thresholds.range !== undefined && sensorRangeDetector.advance(thresholds.range, work.range, sample, findings)) return FAULT_BITS["out-of-range"];
  const jumped = thresholds.jump !== undefined && jumpDetector.advance(thresholds.jump, work.jump, sample, findings);
  const flat = thresholds.flatLine !== undefined && flatLineDetector.advance(thresholds.flatLine, work.flatLine, sample, findings);
  return (jumped ? FAULT_BITS.spike : 0) | (flat ? FAULT_BITS["flat-line"] : 0);
}
