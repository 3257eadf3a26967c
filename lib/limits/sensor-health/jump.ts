import { messageNumber, stepOnce, type Detector, type DetectorStep, type Sample, type SensorFinding } from "./finding";

/**
 * The largest change of stress-producing strain (µε) between two consecutive readings the structure
 * can plausibly make; set by the engineer from the member and the reading rate.
 */
export interface JumpThresholds {
  readonly maxStep: number;
}

export interface JumpState {
  readonly previous: number | null;
}

export const INITIAL_JUMP: JumpState = { previous: null };

export interface JumpWork {
  previous: number | null;
}

export const jumpDetector: Detector<JumpThresholds, JumpState, JumpWork> = {
  begin: ({ previous }) => ({ previous }),
  advance: advanceJump,
  end: ({ previous }) => ({ previous }),
};

export function stepJump(thresholds: JumpThresholds, state: JumpState, sample: Sample): DetectorStep<JumpState> {
  return stepOnce(jumpDetector, thresholds, state, sample);
}

/**
 * Compared with the previous reading whatever it was: after a real offset (a gauge slipping on its
 * bond) the new level becomes the reference instead of every later reading counting as a jump. A
 * single spike therefore shows as two jumps, out and back, and both readings are set aside.
 */
function advanceJump(thresholds: JumpThresholds, work: JumpWork, sample: Sample, findings: SensorFinding[]): boolean {
  const change = work.previous === null ? 0 : sample.value - work.previous;
  const jumped = Math.abs(change) > thresholds.maxStep;
  work.previous = sample.value;
  if (jumped) findings.push(jumpFinding(thresholds, change, sample.time));
  return jumped;
}

function jumpFinding(thresholds: JumpThresholds, change: number, time: number): SensorFinding {
  return {
    kind: "sensor",
    code: "jump",
    event: "raised",
    time,
    message: `The strain changed by ${messageNumber(Math.round(change), "µε")} from one reading to the next, more than the ${messageNumber(thresholds.maxStep, "µε")} the structure can plausibly change; suspect the gauge, its bond or the logger channel before the structure.`,
  };
}
