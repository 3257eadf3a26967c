import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createRainflowStream, rainflow, type RainflowResidue } from "@/lib/fatigue";
import { addRange, emptyHistogram, histogramCycles, occupiedBins, summarizeBlock, type RangeHistogram } from "@/lib/dynamic";

type Closed = [from: number, to: number, count: number];

/** Counts a history block by block, each block on a fresh stream resumed from the previous block's residue. */
function countInBlocks(blocks: readonly number[][]): Closed[] {
  const closed: Closed[] = [];
  let residue: RainflowResidue | undefined;
  for (const block of blocks) {
    const stream = createRainflowStream((from, to, count) => closed.push([from, to, count]), residue);
    block.forEach(stream.push);
    residue = stream.residue();
  }
  createRainflowStream((from, to, count) => closed.push([from, to, count]), residue).finish();
  return closed;
}

function cutAt(values: readonly number[], cuts: readonly number[]): number[][] {
  const points = [...new Set(cuts.map((c) => c % (values.length + 1)))].sort((a, b) => a - b);
  const blocks: number[][] = [];
  let from = 0;
  for (const point of [...points, values.length]) {
    blocks.push(values.slice(from, point));
    from = point;
  }
  return blocks;
}

const ASTM_E1049_EXAMPLE = [-2, 1, -3, 5, -1, 3, -4, 4, -2];

describe("rainflow carried across blocks", () => {
  it("gives the cycles of the joined signal however the signal is cut (property)", () => {
    // Invariant of ASTM E1049-85 5.4.4 counting: its result depends on the sequence of reversals
    // only, so resuming from the unmatched reversals must reproduce counting in one go.
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -500, max: 500 }), { maxLength: 300 }), fc.array(fc.nat(), { maxLength: 12 }), (values, cuts) => {
        const joined = rainflow(values).map(({ range, mean, count }) => [range, mean, count]);
        const blocked = countInBlocks(cutAt(values, cuts)).map(([from, to, count]) => [Math.abs(to - from), (from + to) / 2, count]);
        expect(blocked).toEqual(joined);
      }),
    );
  });

  it("counts the ASTM E1049-85 worked example cut across three bursts as the standard publishes it", () => {
    // ASTM E1049-85 (reapproved 2017), 5.4.4 example: ranges 3 ×0.5, 4 ×1.5, 6 ×0.5, 8 ×1.0, 9 ×0.5.
    const config = { rateHz: 1, summaryMinutes: 10, rangeBin: 1 };
    const bursts = [ASTM_E1049_EXAMPLE.slice(0, 3), ASTM_E1049_EXAMPLE.slice(3, 6), ASTM_E1049_EXAMPLE.slice(6)];
    const histogram: RangeHistogram = emptyHistogram(1);
    let residue: RainflowResidue | undefined;
    let start = Date.UTC(2026, 0, 1);
    for (const burst of bursts) {
      const block = summarizeBlock(burst, start, config, residue);
      for (const interval of block.intervals) {
        interval.histogram.counts.forEach((count, i) => count > 0 && addRange(histogram, (i + 1) * 1, count));
      }
      residue = block.residue;
      start += burst.length * 1000;
    }
    // The history ends here: the residue's half cycles close it, as 5.4.4 step 6 says.
    createRainflowStream((from, to, count) => addRange(histogram, Math.abs(to - from), count), residue).finish();
    expect(occupiedBins(histogram)).toEqual([
      { range: 3, count: 0.5 },
      { range: 4, count: 1.5 },
      { range: 6, count: 0.5 },
      { range: 8, count: 1 },
      { range: 9, count: 0.5 },
    ]);
    expect(histogramCycles(histogram)).toBe(4);
  });
});
