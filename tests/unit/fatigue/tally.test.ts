import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  binRanges,
  createFatigueTally,
  createRainflowCounter,
  fatigueSummary,
  mergeIntoCells,
  rainflow,
  rainflowMatrix,
  rainflowMatrixCsv,
} from "@/lib/fatigue";
import { ASTM_EXAMPLE } from "./fixtures";

// Integer histories keep ranges and means exact, so cells compare equal without tolerance.
const history = fc.array(fc.integer({ min: -300, max: 300 }), { maxLength: 300 });

describe("merging cycles into cells", () => {
  it("merges the example's cycles per cell, labelled by range upper edge and mean centre", () => {
    // Cycles of the example (rainflow.test.ts): (3, −0.5, ½) (4, −1, ½) (4, 1, 1) (8, 1, ½)
    // (9, 0.5, ½) (8, 0, ½) (6, 1, ½). Range bins of 5, mean bins of 1 (a boundary going up), by hand:
    // range 5: mean 0 ← (3, −0.5); mean −1 ← (4, −1); mean 1 ← (4, 1).
    // range 10: mean 0 ← (8, 0); mean 1 ← (8, 1), (9, 0.5), (6, 1) → 1.5.
    expect(mergeIntoCells(rainflow(ASTM_EXAMPLE), 5, 1)).toEqual([
      { range: 5, mean: -1, count: 0.5 },
      { range: 5, mean: 0, count: 0.5 },
      { range: 5, mean: 1, count: 1 },
      { range: 10, mean: 0, count: 0.5 },
      { range: 10, mean: 1, count: 1.5 },
    ]);
  });

  it("bins to the same histogram and matrix as the cycles it merged", () => {
    fc.assert(
      fc.property(history, fc.integer({ min: 1, max: 20 }), fc.integer({ min: 1, max: 50 }), (values, rangeWidth, meanWidth) => {
        const cycles = rainflow(values);
        const cells = mergeIntoCells(cycles, rangeWidth, meanWidth);
        expect(binRanges(cells, rangeWidth)).toEqual(binRanges(cycles, rangeWidth));
        expect(rainflowMatrix(cells, rangeWidth, meanWidth)).toEqual(rainflowMatrix(cycles, rangeWidth, meanWidth));
        expect(mergeIntoCells(cells, rangeWidth, meanWidth)).toEqual(cells);
      }),
    );
  });
});

describe("fatigue tally over a history counted in pages", () => {
  it("matches the summary of the whole history, wherever the pages break", () => {
    fc.assert(
      fc.property(history, fc.integer({ min: 1, max: 40 }), (values, pageSize) => {
        const stresses = values.map((value) => value / 4);
        const counter = createRainflowCounter();
        const tally = createFatigueTally(71, 1, 10);
        for (let start = 0; start < stresses.length; start += pageSize) {
          stresses.slice(start, start + pageSize).forEach((value) => counter.push(value));
          tally.add(counter.takeCounted());
        }
        tally.add(counter.finish());
        const whole = fatigueSummary(rainflow(stresses), 71, 1);
        const paged = tally.summary();
        expect(paged.cycles).toEqual(whole.cycles);
        expect(paged.cyclesCounted).toBe(whole.cyclesCounted);
        expect(paged.damage).toBeCloseTo(whole.damage, 15);
        expect(tally.matrix()).toEqual(rainflowMatrix(rainflow(stresses), 1, 10));
      }),
    );
  });

  it("takes its damage from the exact ranges, not from the bin edges", () => {
    // 29 MPa lies above the category-71 cut-off of 28.735 MPa (EN 1993-1-9, from memory, see
    // summary.test.ts): N = 95.5×10⁶, D = 1.047×10⁻⁸; its 50 MPa bin edge would give far more.
    const tally = createFatigueTally(71, 50, 10);
    tally.add([{ range: 29, mean: 0, count: 1 }]);
    expect(tally.summary()).toMatchObject({ cycles: [{ range: 50, count: 1 }], category: 71, cyclesCounted: 1 });
    expect(tally.summary().damage).toBeCloseTo(1.047e-8, 11);
  });
});

describe("rainflow matrix as CSV", () => {
  it("writes range rows and mean columns with a self-explaining corner cell", () => {
    // The example's matrix at range bins of 5 and mean bins of 1, as in histogram.test.ts.
    expect(rainflowMatrixCsv(rainflowMatrix(rainflow(ASTM_EXAMPLE), 5, 1))).toBe(
      "range bin upper edge (MPa) \\ mean bin centre (MPa),-1,0,1\r\n5,0.5,0.5,1\r\n10,0,0.5,1.5\r\n",
    );
  });

  it("gives cycles stored without their mean a column of their own, spanning their range bins too", () => {
    // The example's cycles with means (histogram.test.ts), plus 2 cycles of range 22 whose mean was never recorded.
    const matrix = rainflowMatrix(rainflow(ASTM_EXAMPLE), 5, 1, [{ range: 22, count: 2 }]);
    expect(rainflowMatrixCsv(matrix)).toBe(
      "range bin upper edge (MPa) \\ mean bin centre (MPa),-1,0,1,mean not recorded\r\n" +
        "5,0.5,0.5,1,0\r\n10,0,0.5,1.5,0\r\n15,0,0,0,0\r\n20,0,0,0,0\r\n25,0,0,0,2\r\n",
    );
  });

  it("strips binary rounding noise from the labels", () => {
    // 3 × 0.1 is 0.30000000000000004 in IEEE 754 doubles (common knowledge).
    const csv = rainflowMatrixCsv({ rangeUpperEdges: [3 * 0.1], meanCentres: [0], counts: [[1]] });
    expect(csv.split("\r\n")[1]).toBe("0.3,1");
  });
});
