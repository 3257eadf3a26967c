import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createRainflowCounter, rainflow, type Cycle } from "@/lib/fatigue";
import { ASTM_EXAMPLE } from "./fixtures";

function countsByRange(cycles: readonly Cycle[]): Record<number, number> {
  const counts: Record<number, number> = {};
  for (const { range, count } of cycles) counts[range] = (counts[range] ?? 0) + count;
  return counts;
}

/**
 * Reversals of a history, counted independently of the library: after merging repeated values,
 * the two ends plus every interior point where the slope changes sign.
 */
function reversalCount(values: readonly number[]): number {
  const levels = values.filter((value, i) => i === 0 || value !== values[i - 1]);
  if (levels.length < 2) return levels.length;
  let interior = 0;
  for (let i = 1; i < levels.length - 1; i++) {
    if ((levels[i]! - levels[i - 1]!) * (levels[i + 1]! - levels[i]!) < 0) interior++;
  }
  return interior + 2;
}

function feedOneByOne(values: readonly number[]): Cycle[] {
  const counter = createRainflowCounter();
  values.forEach((value) => counter.push(value));
  return counter.finish();
}

/** Same reversals, with a repeat of each value and a midpoint (a non-reversal) before the next. */
function withRedundantSamples(values: readonly number[]): number[] {
  return values.flatMap((value, i) => {
    const next = values[i + 1];
    return next === undefined ? [value, value] : [value, value, (value + next) / 2];
  });
}

// Integer histories keep every range exact, so a tie X = Y stays a tie after scaling or shifting;
// with rounded floats a tie could flip to X < Y and legitimately change which cycles close.
const integerHistory = fc.array(fc.integer({ min: -1000, max: 1000 }), { maxLength: 200 });

describe("rainflow counting, ASTM E1049-85 (2017) 5.4.4", () => {
  it("counts the standard's example exactly", () => {
    // Ranges and counts from the standard's example table (ASTM E1049-85, 5.4.4).
    expect(countsByRange(rainflow(ASTM_EXAMPLE))).toEqual({ 3: 0.5, 4: 1.5, 6: 0.5, 8: 1, 9: 0.5 });
  });

  it("closes the example's cycles in the order and with the means the standard's steps give", () => {
    // Worked by hand through steps 1–6 (S = starting point):
    // −2, 1, −3: X = 4 ≥ Y = 3 and Y holds S → half cycle −2..1 (mean −0.5), S moves to 1.
    // 1, −3, 5: X = 8 ≥ Y = 4, Y holds S → half cycle 1..−3 (mean −1), S moves to −3.
    // −1, 3, −4: X = 7 ≥ Y = 4 → full cycle −1..3 (mean 1); then −3, 5, −4: X = 9 ≥ Y = 8, Y holds
    // S → half cycle −3..5 (mean 1). Residue 5, −4, 4, −2 → half cycles of 9, 8, 6 (means 0.5, 0, 1).
    expect(rainflow(ASTM_EXAMPLE)).toEqual([
      { range: 3, mean: -0.5, count: 0.5 },
      { range: 4, mean: -1, count: 0.5 },
      { range: 4, mean: 1, count: 1 },
      { range: 8, mean: 1, count: 0.5 },
      { range: 9, mean: 0.5, count: 0.5 },
      { range: 8, mean: 0, count: 0.5 },
      { range: 6, mean: 1, count: 0.5 },
    ]);
  });

  it("streams the example sample by sample, ignoring repeats and non-reversals", () => {
    const sampled = [-2, -2, 0, 1, 1, 0.5, -3, 0, 2, 5, 5, 5, -1, 3, 2, 0, -4, -4, 4, 3, -2, -2];
    expect(feedOneByOne(sampled)).toEqual(rainflow(ASTM_EXAMPLE));
  });

  it("gives the same cycles whether the counted ones are taken early or at the end", () => {
    const counter = createRainflowCounter();
    const taken: Cycle[] = [];
    for (const value of ASTM_EXAMPLE) {
      counter.push(value);
      taken.push(...counter.takeCounted());
    }
    expect([...taken, ...counter.finish()]).toEqual(rainflow(ASTM_EXAMPLE));
  });

  it("starts afresh after finish", () => {
    const counter = createRainflowCounter();
    [0, 10, 0].forEach((value) => counter.push(value));
    counter.finish();
    ASTM_EXAMPLE.forEach((value) => counter.push(value));
    expect(counter.finish()).toEqual(rainflow(ASTM_EXAMPLE));
  });

  it("refuses a value that is not a number", () => {
    expect(() => rainflow([1, Number.NaN, 2])).toThrow(RangeError);
    expect(() => rainflow([1, Infinity])).toThrow(RangeError);
  });
});

describe("rainflow invariants (common practice)", () => {
  it("gives no cycle for a constant signal or a single sample", () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.nat(50), (level, repeats) => {
        expect(rainflow(Array.from({ length: repeats }, () => level))).toEqual([]);
      }),
    );
  });

  it("uses every range between reversals once: Σ 2·count = reversals − 1", () => {
    // R reversals span R − 1 ranges. A full cycle (step 4) removes two reversals and merges three
    // ranges into one (−2 ranges, 2·count = 2); a half cycle at S (step 5) drops one reversal
    // (−1 range, 2·count = 1); the residue of k reversals gives k − 1 half cycles (step 6).
    fc.assert(
      fc.property(integerHistory, (values) => {
        const doubled = rainflow(values).reduce((sum, { count }) => sum + 2 * count, 0);
        expect(doubled).toBe(Math.max(0, reversalCount(values) - 1));
      }),
    );
  });

  it("gives the same cycles when repeats and non-reversal points are inserted", () => {
    fc.assert(
      fc.property(integerHistory, (values) => {
        expect(feedOneByOne(withRedundantSamples(values))).toEqual(rainflow(values));
      }),
    );
  });

  it("scales every range and mean by k > 0 and leaves the counts alone", () => {
    fc.assert(
      fc.property(integerHistory, fc.integer({ min: 1, max: 1000 }), (values, k) => {
        const expected = rainflow(values).map(({ range, mean, count }) => ({ range: k * range, mean: k * mean, count }));
        expect(rainflow(values.map((value) => k * value))).toEqual(expected);
      }),
    );
  });

  it("keeps every range and shifts every mean when a constant is added", () => {
    fc.assert(
      fc.property(integerHistory, fc.integer({ min: -1e6, max: 1e6 }), (values, offset) => {
        const expected = rainflow(values).map(({ range, mean, count }) => ({ range, mean: mean + offset, count }));
        expect(rainflow(values.map((value) => value + offset))).toEqual(expected);
      }),
    );
  });
});

/** Integer random walk with steps of −2..2, held within ±amplitude. */
function* boundedWalk(samples: number, amplitude: number, seed: number): Generator<number> {
  let state = seed >>> 0;
  let value = 0;
  for (let i = 0; i < samples; i++) {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0; // Numerical Recipes LCG, common practice
    value = Math.max(-amplitude, Math.min(amplitude, value + ((state >>> 16) % 5) - 2));
    yield value;
  }
}

describe("streaming memory", () => {
  // Why the stack is bounded: counting stops only when the newest range is smaller than the one
  // before it (X < Y), and only the top of the stack changes, so the ranges between unmatched
  // reversals strictly decrease from bottom to top. With integer values within ±A every range is
  // an integer in 1..2A, hence at most 2A ranges and 2A + 1 unmatched reversals, whatever the
  // length of the history.
  it("keeps at most 2A + 1 unmatched reversals for integer histories within ±A", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 20 }), fc.nat(), (amplitude, seed) => {
        const counter = createRainflowCounter();
        let most = 0;
        for (const value of boundedWalk(5000, amplitude, seed)) {
          counter.push(value);
          most = Math.max(most, counter.unmatchedReversals);
        }
        counter.finish();
        expect(most).toBeLessThanOrEqual(2 * amplitude + 1);
        expect(counter.unmatchedReversals).toBe(0);
      }),
      { numRuns: 30 },
    );
  });

  it("counts a million samples taken page by page with a small stack", () => {
    const amplitude = 50;
    const counter = createRainflowCounter();
    let most = 0;
    let doubledCounts = 0;
    const addTaken = (cycles: Cycle[]) => cycles.forEach(({ count }) => (doubledCounts += 2 * count));
    const history = [...boundedWalk(1_000_000, amplitude, 42)];
    history.forEach((value, i) => {
      counter.push(value);
      most = Math.max(most, counter.unmatchedReversals);
      if (i % 10_000 === 0) addTaken(counter.takeCounted());
    });
    addTaken(counter.finish());
    expect(most).toBeLessThanOrEqual(2 * amplitude + 1);
    expect(doubledCounts).toBe(reversalCount(history) - 1);
  });
});
