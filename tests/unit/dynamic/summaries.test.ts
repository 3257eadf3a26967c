import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createRainflowStream } from "@/lib/fatigue";
import {
  addRange,
  decodeHistogram,
  emptyHistogram,
  encodeHistogram,
  mergeHistograms,
  mergeSummaries,
  occupiedBins,
  rmsOf,
  summarizeBlock,
  type RangeHistogram,
} from "@/lib/dynamic";

const HOUR = 3_600_000;
const T0 = Date.UTC(2026, 2, 1);

function histogramOf(width: number, cycles: readonly [number, number][]): RangeHistogram {
  const histogram = emptyHistogram(width);
  for (const [range, halves] of cycles) addRange(histogram, range, halves / 2);
  return histogram;
}

const cyclesArb = fc.array(fc.tuple(fc.double({ min: 0.01, max: 400, noNaN: true }), fc.integer({ min: 1, max: 1000 })), { maxLength: 60 });

describe("range histograms", () => {
  it("merge associatively and in any order (property: counts are multiples of 0.5, exact in a double)", () => {
    fc.assert(
      fc.property(cyclesArb, cyclesArb, cyclesArb, (a, b, c) => {
        const [ha, hb, hc] = [a, b, c].map((cycles) => histogramOf(2, cycles)) as [RangeHistogram, RangeHistogram, RangeHistogram];
        const left = occupiedBins(mergeHistograms(mergeHistograms(ha, hb), hc));
        expect(occupiedBins(mergeHistograms(ha, mergeHistograms(hb, hc)))).toEqual(left);
        expect(occupiedBins(mergeHistograms(hc, mergeHistograms(hb, ha)))).toEqual(left);
        // Merging equals counting everything into one histogram.
        expect(occupiedBins(histogramOf(2, [...c, ...a, ...b]))).toEqual(left);
      }),
    );
  });

  it("come back unchanged from their compact encoding", () => {
    fc.assert(
      fc.property(cyclesArb, fc.constantFrom(0.5, 1, 2.5), (cycles, width) => {
        const histogram = histogramOf(width, cycles);
        const decoded = decodeHistogram(encodeHistogram(histogram));
        expect(decoded.binWidth).toBe(width);
        expect(occupiedBins(decoded)).toEqual(occupiedBins(histogram));
      }),
    );
  });

  it("refuse to add histograms of different bin widths", () => {
    expect(() => mergeHistograms(emptyHistogram(1), emptyHistogram(2))).toThrow(/bins of 1 and 2 MPa/);
  });
});

describe("interval summaries", () => {
  it("of a sine of amplitude A over n whole periods: n cycles of range 2A, RMS A/√2 about a zero mean (physics)", () => {
    // Physics: a sine of amplitude A swings 2A each period; its mean square over whole periods is
    // A²/2 (also exact for N ≥ 3 equally spaced samples per period). Started at a crest (cosine), so
    // sampling hits both extremes exactly.
    const amplitude = 37.5;
    const periods = 12;
    const perPeriod = 50;
    const values = Array.from({ length: periods * perPeriod + 1 }, (_, i) => amplitude * Math.cos((2 * Math.PI * i) / perPeriod));
    const block = summarizeBlock(values.slice(0, -1), T0, { rateHz: 100, summaryMinutes: 10, rangeBin: 1 });
    expect(block.intervals).toHaveLength(1);
    const [interval] = block.intervals;
    expect(interval!.mean).toBeCloseTo(0, 9);
    expect(rmsOf(interval!)).toBeCloseTo(amplitude / Math.SQRT2, 9);
    expect(interval!.max).toBeCloseTo(amplitude, 12);
    expect(interval!.min).toBeCloseTo(-amplitude, 12);
    // Counting the whole history, closed by its last crest: n cycles, every one of range 2A.
    const ranges: number[] = [];
    let total = 0;
    const stream = createRainflowStream((from, to, count) => {
      ranges.push(Math.abs(to - from));
      total += count;
    });
    values.forEach(stream.push);
    stream.finish();
    expect(total).toBe(periods);
    for (const range of ranges) expect(range).toBeCloseTo(2 * amplitude, 9);
  });

  it("split at the hour-aligned interval boundaries", () => {
    // 10-minute intervals aligned to the hour: a burst from 00:08 for 5 minutes at 1 Hz spans two.
    const start = T0 + 8 * 60_000;
    const block = summarizeBlock(new Array(300).fill(1), start, { rateHz: 1, summaryMinutes: 10, rangeBin: 1 });
    expect(block.intervals.map((i) => [i.start - T0, i.samples])).toEqual([
      [0, 120],
      [10 * 60_000, 180],
    ]);
  });

  it("merged from two blocks equal the summary of the joined block (Chan et al. pairwise update)", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -300, max: 300, noNaN: true }), { minLength: 2, maxLength: 400 }), fc.nat(), (values, cutSeed) => {
        const cut = 1 + (cutSeed % (values.length - 1));
        const config = { rateHz: 1000, summaryMinutes: 60, rangeBin: 5 };
        const whole = summarizeBlock(values, T0, config).intervals[0]!;
        const first = summarizeBlock(values.slice(0, cut), T0, config);
        const second = summarizeBlock(values.slice(cut), T0 + cut, config, first.residue).intervals[0]!;
        const merged = mergeSummaries(first.intervals[0]!, second);
        expect(merged.samples).toBe(whole.samples);
        expect(merged.min).toBe(whole.min);
        expect(merged.max).toBe(whole.max);
        expect(merged.cycles).toBe(whole.cycles);
        expect(occupiedBins(merged.histogram)).toEqual(occupiedBins(whole.histogram));
        expect(merged.mean).toBeCloseTo(whole.mean, 6);
        expect(Math.abs(rmsOf(merged) - rmsOf(whole))).toBeLessThan(1e-6 * (1 + rmsOf(whole)));
      }),
    );
  });

  it("refuse to merge different intervals", () => {
    const config = { rateHz: 1, summaryMinutes: 60, rangeBin: 1 };
    const a = summarizeBlock([1, 2], T0, config).intervals[0]!;
    const b = summarizeBlock([1, 2], T0 + HOUR, config).intervals[0]!;
    expect(() => mergeSummaries(a, b)).toThrow(/different intervals/);
  });
});
