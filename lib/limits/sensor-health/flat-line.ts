import { conditionStep, type ConditionState, type DetectorStep, type Sample } from "./finding";

/**
 * A live gauge always shows some noise; `readings` consecutive raw values whose range (max − min)
 * is at most `epsilon` suggest a dead, shorted or saturated channel. `epsilon` 0 means "identical
 * values". `readings` must be at least 2. Example only: 12 readings, epsilon of one logger count.
 */
export interface FlatLineThresholds {
  readonly readings: number;
  readonly epsilon: number;
}

export interface FlatLineState extends ConditionState {
  /** The last raw values, at most `readings` of them. */
  readonly recent: readonly number[];
}

export const INITIAL_FLAT_LINE: FlatLineState = { active: false, recent: [] };

/** While the line stays flat its readings are faults: they say nothing about the structure. */
export function stepFlatLine(thresholds: FlatLineThresholds, state: FlatLineState, sample: Sample): DetectorStep<FlatLineState> {
  const recent = [...state.recent, sample.raw].slice(-thresholds.readings);
  const range = Math.max(...recent) - Math.min(...recent);
  const active = recent.length >= thresholds.readings && range <= thresholds.epsilon;
  const finding = conditionStep("flat-line", state.active, active, sample.time, {
    raised: () =>
      `The last ${thresholds.readings} raw readings vary by only ${range} (at most ${thresholds.epsilon} is taken as flat); the gauge, its cable or the logger channel may be dead or saturated.`,
    resolved: "The raw readings vary again.",
  });
  return { state: { active, recent }, fault: active, finding };
}
