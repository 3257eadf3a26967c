import { describe, expect, it } from "vitest";
import { binRanges, rainflow, rainflowMatrix } from "@/lib/fatigue";
import { ASTM_EXAMPLE } from "./fixtures";

describe("range histogram", () => {
  it("puts a range lying on an upper edge into that edge's bin", () => {
    // The standard's table: ranges 3 ×0.5, 4 ×1.5, 6 ×0.5, 8 ×1.0, 9 ×0.5, all on 1-unit edges.
    expect(binRanges(rainflow(ASTM_EXAMPLE), 1)).toEqual([
      { range: 3, count: 0.5 },
      { range: 4, count: 1.5 },
      { range: 6, count: 0.5 },
      { range: 8, count: 1 },
      { range: 9, count: 0.5 },
    ]);
  });

  it("labels wider bins by their upper edge", () => {
    // By hand from the standard's table: (2.5, 5] holds 3 and 4 → 2; (5, 7.5] holds 6 → 0.5;
    // (7.5, 10] holds 8 and 9 → 1.5.
    expect(binRanges(rainflow(ASTM_EXAMPLE), 2.5)).toEqual([
      { range: 5, count: 2 },
      { range: 7.5, count: 0.5 },
      { range: 10, count: 1.5 },
    ]);
  });

  it("keeps a range with rounding noise in the bin of the edge it means", () => {
    // 0.1 + 0.2 is 0.30000000000000004 in binary floating point (IEEE 754, common knowledge).
    const [bin] = binRanges([{ range: 0.1 + 0.2, mean: 0, count: 1 }], 0.1);
    expect(bin?.range).toBeCloseTo(0.3, 12);
    expect(() => binRanges([], 0)).toThrow(RangeError);
  });
});

describe("rainflow matrix", () => {
  it("spreads the example over range and mean bins", () => {
    // Cycles of the example (range, mean, count), worked by hand in rainflow.test.ts:
    // (3, −0.5, ½) (4, −1, ½) (4, 1, 1) (8, 1, ½) (9, 0.5, ½) (8, 0, ½) (6, 1, ½).
    // Range bins of 5 by upper edge: 3, 4 → 5; 6, 8, 9 → 10. Mean bins of 1 centred on integers,
    // a boundary going up: −0.5 → 0, 0.5 → 1.
    expect(rainflowMatrix(rainflow(ASTM_EXAMPLE), 5, 1)).toEqual({
      rangeUpperEdges: [5, 10],
      meanCentres: [-1, 0, 1],
      counts: [
        [0.5, 0.5, 1],
        [0, 0.5, 1.5],
      ],
    });
  });

  it("is empty without cycles", () => {
    expect(rainflowMatrix([], 5, 1)).toEqual({ rangeUpperEdges: [], meanCentres: [], counts: [] });
  });
});
