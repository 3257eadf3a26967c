import { conditionFinding, messageNumber, stepOnce, type ConditionState, type Detector, type DetectorStep, type Sample, type SensorFinding } from "./finding";

/**
 * A live gauge always shows some noise; `readings` consecutive raw values whose range (max − min)
 * is at most `epsilon` suggest a dead, shorted or saturated channel. `epsilon` 0 means "identical
 * values". `readings` must be at least 2. Example only: 12 readings, epsilon of one logger count.
 */
export interface FlatLineThresholds {
  readonly readings: number;
  readonly epsilon: number;
  /** The raw unit, for the message ("mV/V", "Hz"). */
  readonly unit?: string;
}

export interface FlatLineState extends ConditionState {
  /** The last raw values, at most `readings` of them. */
  readonly recent: readonly number[];
}

export const INITIAL_FLAT_LINE: FlatLineState = { active: false, recent: [] };

export interface FlatLineWork {
  active: boolean;
  /** The last raw values, oldest first until there are `readings` of them; then a ring whose oldest value is at `oldest`. */
  readonly window: number[];
  oldest: number;
}

export const flatLineDetector: Detector<FlatLineThresholds, FlatLineState, FlatLineWork> = {
  begin: (state) => ({ active: state.active, window: [...state.recent], oldest: 0 }),
  advance: advanceFlatLine,
  end: ({ active, window, oldest }) => ({ active, recent: [...window.slice(oldest), ...window.slice(0, oldest)] }),
};

/** While the line stays flat its readings are faults: they say nothing about the structure. */
export function stepFlatLine(thresholds: FlatLineThresholds, state: FlatLineState, sample: Sample): DetectorStep<FlatLineState> {
  return stepOnce(flatLineDetector, thresholds, state, sample);
}

function advanceFlatLine(thresholds: FlatLineThresholds, work: FlatLineWork, sample: Sample, findings: SensorFinding[]): boolean {
  keepRaw(thresholds.readings, work, sample.raw);
  const range = work.window.length >= thresholds.readings ? rangeWithin(work.window, thresholds.epsilon) : null;
  const flat = range !== null;
  if (flat !== work.active) {
    const message = range === null ? "The raw readings vary again." : flatMessage(thresholds, range);
    findings.push(conditionFinding("flat-line", flat, sample.time, message));
  }
  work.active = flat;
  return flat;
}

/** A ring rather than shifting the window, which would move every value for every reading. */
function keepRaw(size: number, work: FlatLineWork, raw: number): void {
  // A stored window can be longer than `size` when the thresholds were lowered since; it is no ring yet.
  if (work.window.length > size) work.window.splice(0, work.window.length - size);
  if (work.window.length < size) {
    work.window.push(raw);
    return;
  }
  work.window[work.oldest] = raw;
  work.oldest = (work.oldest + 1) % size;
}

function flatMessage(thresholds: FlatLineThresholds, range: number): string {
  return `The last ${thresholds.readings} raw readings vary by only ${messageNumber(range, thresholds.unit)} (at most ${messageNumber(thresholds.epsilon, thresholds.unit)} is taken as flat); the gauge, its cable or the logger channel may be dead or saturated.`;
}

/**
 * max − min of the values if it is at most `epsilon`, else null. A live channel's noise usually
 * exceeds `epsilon` within the first few values, so the scan stops as soon as the range so far
 * does: it can only grow. Math.max/min make any NaN value give a NaN range, never flat.
 */
function rangeWithin(values: readonly number[], epsilon: number): number | null {
  let max = -Infinity;
  let min = Infinity;
  for (const value of values) {
    max = Math.max(max, value);
    min = Math.min(min, value);
    if (max - min > epsilon) return null;
  }
  const range = max - min;
  return range <= epsilon ? range : null;
}
