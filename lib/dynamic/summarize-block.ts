import { createRainflowStream, type RainflowResidue } from "@/lib/fatigue";
import { countCycle, emptySummary, type IntervalSummary } from "./interval-summary";

/** Interval lengths that divide the hour, so every interval starts on a whole hour's grid. */
export const SUMMARY_MINUTES = [1, 2, 3, 4, 5, 6, 10, 12, 15, 20, 30, 60] as const;

export interface SummaryConfig {
  rateHz: number;
  /** Interval length; a divisor of 60 so that intervals line up with the hour. */
  summaryMinutes: number;
  /** Range bin width, MPa. */
  rangeBin: number;
}

export interface BlockSummary {
  /** One per interval the block touches, in time order. */
  intervals: IntervalSummary[];
  /** The rainflow state after the block, to carry into the gauge's next block. */
  residue: RainflowResidue;
  /** Sample positions of the block's lowest and highest stress (the first when repeated). */
  minIndex: number;
  maxIndex: number;
}

const MINUTE_MS = 60_000;

/** Epoch ms of sample `index` of a block starting at `start`. */
export function sampleTime(start: number, rateHz: number, index: number): number {
  return start + (index * 1000) / rateHz;
}

/** First sample index at or after `time` ms; a hair of slack so that a sample exactly on a boundary opens the next interval. */
function firstIndexAtOrAfter(start: number, rateHz: number, time: number): number {
  return Math.max(0, Math.ceil(((time - start) * rateHz) / 1000 - 1e-9));
}

/**
 * Summarises one block of stress samples (MPa) at a fixed rate, from `start` epoch ms, into the
 * intervals it touches, and counts its rainflow cycles carrying on from `resume` (the residue of
 * the gauge's previous block, or none). A cycle belongs to the interval of the sample that closes
 * it. The residue is not counted here: it closes in a later block, as the joined signal would.
 * Each interval's sums are taken about its first sample, so the loop divides nothing and
 * allocates nothing per sample.
 */
export function summarizeBlock(stress: ArrayLike<number>, start: number, config: SummaryConfig, resume?: RainflowResidue): BlockSummary {
  const { rateHz, rangeBin } = config;
  const intervalMs = config.summaryMinutes * MINUTE_MS;
  const intervals: IntervalSummary[] = [];
  let current = emptySummary(0, rangeBin);
  const rainflow = createRainflowStream((from, to, count) => countCycle(current, from, to, count), resume);

  let minIndex = -1;
  let maxIndex = -1;
  let blockMin = Infinity;
  let blockMax = -Infinity;
  let index = 0;
  while (index < stress.length) {
    const intervalStart = Math.floor(sampleTime(start, rateHz, index) / intervalMs) * intervalMs;
    const end = Math.min(stress.length, firstIndexAtOrAfter(start, rateHz, intervalStart + intervalMs));
    current = emptySummary(intervalStart, rangeBin);
    const reference = stress[index]!;
    let sum = 0;
    let squares = 0;
    let low = Infinity;
    let high = -Infinity;
    for (let i = index; i < end; i++) {
      const value = stress[i]!;
      rainflow.push(value);
      const deviation = value - reference;
      sum += deviation;
      squares += deviation * deviation;
      if (value < low) low = value;
      if (value > high) high = value;
      if (value < blockMin) {
        blockMin = value;
        minIndex = i;
      }
      if (value > blockMax) {
        blockMax = value;
        maxIndex = i;
      }
    }
    const samples = end - index;
    current.samples = samples;
    current.min = low;
    current.max = high;
    current.mean = reference + sum / samples;
    current.m2 = Math.max(0, squares - (sum * sum) / samples);
    intervals.push(current);
    index = end;
  }
  return { intervals, residue: rainflow.residue(), minIndex, maxIndex };
}
