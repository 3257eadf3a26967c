/**
 * Summary of a set of readings. The fields combine associatively and commutatively, so a roll-up
 * row can absorb late and out-of-order readings one at a time and still equal the summary of all
 * its readings taken at once; the mean is derived (sum / count) rather than stored for that reason.
 */
export interface Aggregate {
  readonly min: number;
  readonly max: number;
  readonly sum: number;
  readonly count: number;
}

/** The summary of no readings: merging it changes nothing. */
export const EMPTY_AGGREGATE: Aggregate = Object.freeze({ min: Infinity, max: -Infinity, sum: 0, count: 0 });

export function aggregateOf(value: number): Aggregate {
  return { min: value, max: value, sum: value, count: 1 };
}

export function mergeAggregate(a: Aggregate, b: Aggregate): Aggregate {
  return {
    min: Math.min(a.min, b.min),
    max: Math.max(a.max, b.max),
    sum: a.sum + b.sum,
    count: a.count + b.count,
  };
}
