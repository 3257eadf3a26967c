import { addCycle, emptyHistogram, mergeHistograms, type RangeHistogram } from "./range-histogram";

/**
 * What is kept of one gauge's samples over one summary interval (stress in MPa). The spread is
 * kept as M2, the sum of squared deviations from the interval's mean, because two intervals'
 * M2 combine exactly in algebra (Chan, Golub and LeVeque's pairwise update) where sums of
 * squares of large stresses would lose the small fluctuations to rounding.
 */
export interface IntervalSummary {
  /** Epoch ms of the interval's start, a multiple of its length. */
  start: number;
  samples: number;
  min: number;
  max: number;
  mean: number;
  m2: number;
  /** Largest rainflow range closed in the interval (full or half cycle), MPa; 0 when none closed. */
  maxRange: number;
  /** Cycles closed in the interval, half cycles as 0.5. */
  cycles: number;
  histogram: RangeHistogram;
}

export function emptySummary(start: number, binWidth: number): IntervalSummary {
  return { start, samples: 0, min: Infinity, max: -Infinity, mean: 0, m2: 0, maxRange: 0, cycles: 0, histogram: emptyHistogram(binWidth) };
}

/** A rainflow cycle (or half cycle) between two extremes, closed in this interval. */
export function countCycle(summary: IntervalSummary, from: number, to: number, count: number): void {
  const range = addCycle(summary.histogram, from, to, count);
  summary.cycles += count;
  if (range > summary.maxRange) summary.maxRange = range;
}

/** RMS about the interval's mean, MPa. */
export function rmsOf(summary: Pick<IntervalSummary, "samples" | "m2">): number {
  return summary.samples === 0 ? 0 : Math.sqrt(summary.m2 / summary.samples);
}

/** Two summaries of the same interval (e.g. a stored one and a late burst's) as one. */
export function mergeSummaries(a: IntervalSummary, b: IntervalSummary): IntervalSummary {
  if (a.start !== b.start) throw new RangeError(`Summaries of different intervals (${a.start}, ${b.start}) cannot be merged.`);
  const samples = a.samples + b.samples;
  const delta = b.mean - a.mean;
  return {
    start: a.start,
    samples,
    min: Math.min(a.min, b.min),
    max: Math.max(a.max, b.max),
    mean: samples === 0 ? 0 : a.mean + (delta * b.samples) / samples,
    m2: samples === 0 ? 0 : a.m2 + b.m2 + (delta * delta * a.samples * b.samples) / samples,
    maxRange: Math.max(a.maxRange, b.maxRange),
    cycles: a.cycles + b.cycles,
    histogram: mergeHistograms(a.histogram, b.histogram),
  };
}
