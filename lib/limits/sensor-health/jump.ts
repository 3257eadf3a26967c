import { messageNumber, stepOnce, type Detector, type DetectorStep, type Sample, type SensorFinding } from "./finding";

/**
 * The largest change of stress-producing strain (µε) between two consecutive readings the structure
 * can plausibly make; set by the engineer from the member and the reading rate.
 */
export interface JumpThresholds {
  readonly maxStep: number;
}

/** A reading that moved more than the step from the one before it: a spike or a jump, as the next reading shows. */
export interface SuspectStep {
  readonly time: number;
  readonly change: number;
}

export interface JumpState {
  /** The level the next reading is compared with: the last reading believed. */
  readonly previous: number | null;
  readonly suspect: SuspectStep | null;
}

export const INITIAL_JUMP: JumpState = { previous: null, suspect: null };

export interface JumpWork {
  previous: number | null;
  suspect: SuspectStep | null;
  /** Set by the reading that shows the suspect was a jump: the suspect's time (null otherwise). */
  confirmed: number | null;
}

export const jumpDetector: Detector<JumpThresholds, JumpState, JumpWork> = {
  begin: ({ previous, suspect }) => ({ previous, suspect, confirmed: null }),
  advance: advanceJump,
  end: ({ previous, suspect }) => ({ previous, suspect }),
};

export function stepJump(thresholds: JumpThresholds, state: JumpState, sample: Sample): DetectorStep<JumpState> {
  return stepOnce(jumpDetector, thresholds, state, sample);
}

/**
 * One reading far from the last one believed is a suspect, a fault of its own, judged by the next
 * reading. Back near the level before it: the suspect was a lone spike, that one reading is set
 * aside and nothing else (a spike no structure makes pages nobody). Still away: it was a jump, a
 * change of level that may be a real step or the gauge's reference moving; the jump is found at the
 * suspect reading, and from there on the new level is the reference, so a lasting offset is one
 * jump rather than every later reading counting as one. Answers whether this reading is a suspect.
 */
function advanceJump(thresholds: JumpThresholds, work: JumpWork, sample: Sample, findings: SensorFinding[]): boolean {
  work.confirmed = null;
  const change = work.previous === null ? 0 : sample.value - work.previous;
  const beyond = Math.abs(change) > thresholds.maxStep;
  const suspect = work.suspect;
  if (suspect !== null) {
    work.suspect = null;
    work.previous = sample.value;
    if (beyond) {
      work.confirmed = suspect.time;
      findings.push(jumpFinding(thresholds, suspect.change, suspect.time));
    }
    return false;
  }
  if (beyond) {
    // The level before it stays the reference: the next reading is compared with that.
    work.suspect = { time: sample.time, change };
    return true;
  }
  work.previous = sample.value;
  return false;
}

function jumpFinding(thresholds: JumpThresholds, change: number, time: number): SensorFinding {
  return {
    kind: "sensor",
    code: "jump",
    event: "raised",
    time,
    message: `The strain changed by ${messageNumber(Math.round(change), "µε")} from one reading to the next and stayed there, more than the ${messageNumber(thresholds.maxStep, "µε")} the structure can plausibly change; suspect the gauge, its bond or the logger channel before the structure.`,
  };
}
