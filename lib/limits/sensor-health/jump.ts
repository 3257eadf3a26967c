import type { DetectorStep, Sample, SensorFinding } from "./finding";

/**
 * The largest change between two consecutive readings the structure can plausibly make, in the
 * limited quantity's units (µε or MPa); set by the engineer from the member and the reading rate.
 */
export interface JumpThresholds {
  readonly maxStep: number;
}

export interface JumpState {
  readonly previous: number | null;
}

export const INITIAL_JUMP: JumpState = { previous: null };

/**
 * Compared with the previous reading whatever it was: after a real offset (a gauge slipping on its
 * bond) the new level becomes the reference instead of every later reading counting as a jump. A
 * single spike therefore shows as two jumps, out and back, and both readings are set aside.
 */
export function stepJump(thresholds: JumpThresholds, state: JumpState, sample: Sample): DetectorStep<JumpState> {
  const change = state.previous === null ? 0 : sample.value - state.previous;
  const jumped = Math.abs(change) > thresholds.maxStep;
  return { state: { previous: sample.value }, fault: jumped, finding: jumped ? jumpFinding(thresholds, change, sample.time) : null };
}

function jumpFinding(thresholds: JumpThresholds, change: number, time: number): SensorFinding {
  return {
    kind: "sensor",
    code: "jump",
    event: "raised",
    time,
    message: `The value changed by ${change} from one reading to the next, more than the ${thresholds.maxStep} the structure can plausibly change; suspect the gauge, its bond or the logger channel before the structure.`,
  };
}
