import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createRainflowStream, mergeIntoCells, rainflow } from "@/lib/fatigue";
import { ASTM_EXAMPLE } from "../fatigue/fixtures";
import {
  addCycle,
  addRange,
  decodeHistogram,
  emptyHistogram,
  encodeHistogram,
  histogramCells,
  mergeHistograms,
  mergeSummaries,
  occupiedBins,
  rebinHistogram,
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

describe("cycle means in the histograms", () => {
  it("keep each cycle's mean, the mean of its two extremes, for the ASTM E1049-85 example cut across three bursts", () => {
    // ASTM E1049-85 (reapproved 2017), 5.4.4 example, worked by hand with the standard's cycle mean
    // (peak + valley) / 2: A–B (−2, 1) ½ of range 3 about −0.5; B–C (1, −3) ½ of 4 about −1;
    // E–F (−1, 3) 1 of 4 about 1; C–D (−3, 5) ½ of 8 about 1; D–G (5, −4) ½ of 9 about 0.5;
    // G–H (−4, 4) ½ of 8 about 0; H–I (4, −2) ½ of 6 about 1. Bins of 0.5 put every mean on a centre.
    const config = { rateHz: 1, summaryMinutes: 10, rangeBin: 0.5 };
    const bursts = [ASTM_EXAMPLE.slice(0, 3), ASTM_EXAMPLE.slice(3, 6), ASTM_EXAMPLE.slice(6)];
    let total = emptyHistogram(0.5);
    let residue: Parameters<typeof summarizeBlock>[3];
    let start = T0;
    for (const burst of bursts) {
      const block = summarizeBlock(burst, start, config, residue);
      for (const interval of block.intervals) total = mergeHistograms(total, interval.histogram);
      residue = block.residue;
      start += burst.length * 1000;
    }
    // The history ends: the residue closes as half cycles (5.4.4 step 6).
    createRainflowStream((from, to, count) => addCycle(total, from, to, count), residue).finish();
    // Those cycles, counted over the joined history in one go (rainflow.test.ts checks them step by step), in cells of 0.5.
    expect(histogramCells(total)).toEqual({ cells: mergeIntoCells(rainflow(ASTM_EXAMPLE), 0.5, 0.5), withoutMean: [] });
    expect(histogramCells(total).cells.map(({ mean }) => mean)).toEqual([-0.5, -1, 1, 1, 0, 1, 0.5]);
  });

  const cellsArb = fc.array(
    fc.tuple(fc.double({ min: -400, max: 400, noNaN: true }), fc.double({ min: -400, max: 400, noNaN: true }), fc.integer({ min: 1, max: 1000 })),
    { maxLength: 60 },
  );
  function cellsOf(width: number, cycles: readonly [number, number, number][]): RangeHistogram {
    const histogram = emptyHistogram(width);
    for (const [from, to, halves] of cycles) addCycle(histogram, from, to, halves / 2);
    return histogram;
  }

  it("merge associatively and in any order, means included (property)", () => {
    fc.assert(
      fc.property(cellsArb, cellsArb, cyclesArb, (a, b, c) => {
        const [ha, hb] = [cellsOf(2, a), cellsOf(2, b)];
        const hc = histogramOf(2, c);
        const left = histogramCells(mergeHistograms(mergeHistograms(ha, hb), hc));
        expect(histogramCells(mergeHistograms(ha, mergeHistograms(hb, hc)))).toEqual(left);
        expect(histogramCells(mergeHistograms(hc, mergeHistograms(hb, ha)))).toEqual(left);
        // Every cycle is in one cell or, when added without its mean, in "mean not recorded".
        const counted = [...left.cells, ...left.withoutMean].reduce((sum, cell) => sum + cell.count, 0);
        expect(counted).toBe([...a, ...b, ...c].reduce((sum, cycle) => sum + cycle.at(-1)! / 2, 0));
      }),
    );
  });

  it("come back unchanged from the encoding with means, negative mean bins too (property)", () => {
    fc.assert(
      fc.property(cellsArb, cyclesArb, fc.constantFrom(0.5, 1, 2.5), (withMeans, without, width) => {
        const histogram = mergeHistograms(cellsOf(width, withMeans), histogramOf(width, without));
        const decoded = decodeHistogram(encodeHistogram(histogram));
        expect(decoded.binWidth).toBe(width);
        expect(histogramCells(decoded)).toEqual(histogramCells(histogram));
        expect(occupiedBins(decoded)).toEqual(occupiedBins(histogram));
      }),
    );
  });

  it("read a histogram stored before means were kept, its cycles as mean not recorded", () => {
    // Format 1, written out by hand: the bin width 1 as a little-endian float64, then per occupied
    // bin the LEB128 gap in bin number and twice the count: bin 3 holds ½, bin 4 holds 1½, bin 200 holds 70.
    // LEB128 (DWARF 5, 7.6): 196 is [0xC4, 0x01] and 140 is [0x8C, 0x01], low seven bits first.
    const stored = new Uint8Array(8 + 8);
    new DataView(stored.buffer).setFloat64(0, 1, true);
    stored.set([3, 1, 1, 3, 0xc4, 0x01, 0x8c, 0x01], 8);
    const old = decodeHistogram(stored);
    expect(occupiedBins(old)).toEqual([
      { range: 3, count: 0.5 },
      { range: 4, count: 1.5 },
      { range: 200, count: 70 },
    ]);
    expect(histogramCells(old)).toEqual({ cells: [], withoutMean: occupiedBins(old) });
    // A late burst's cycles merged into it keep their means; the old ones stay unrecorded, also once stored again.
    const late = emptyHistogram(1);
    addCycle(late, 10, 14, 1);
    const merged = decodeHistogram(encodeHistogram(mergeHistograms(old, late)));
    expect(histogramCells(merged)).toEqual({
      cells: [{ range: 4, mean: 12, count: 1 }],
      withoutMean: [
        { range: 3, count: 0.5 },
        { range: 4, count: 1.5 },
        { range: 200, count: 70 },
      ],
    });
  });

  it("move to another bin width by range upper edge and mean centre", () => {
    const fine = emptyHistogram(1);
    addCycle(fine, -3, 4, 1); // range 7, mean 0.5 → mean bin 1 (a boundary goes up)
    addRange(fine, 2.5, 0.5); // range bin 3, mean unknown
    // In 5 MPa bins: range 7 → (5, 10] labelled 10; mean centre 1 → bin 0 (centre 0); range 3 → 5.
    expect(histogramCells(rebinHistogram(fine, 5))).toEqual({ cells: [{ range: 10, mean: 0, count: 1 }], withoutMean: [{ range: 5, count: 0.5 }] });
  });
});
