import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  DAY,
  EMPTY_AGGREGATE,
  HOUR,
  MINUTE,
  NICE_BUCKET_WIDTHS,
  ROLLUP_RESOLUTIONS,
  WEEK,
  aggregateOf,
  bucketGrid,
  chooseSource,
  mergeAggregate,
  rollupKey,
  type Aggregate,
} from "@/lib/series";

const YEAR_2026 = Date.UTC(2026, 0, 1);

describe("series source", () => {
  // Hand-worked: 30 days / 1000 points → 1 h buckets, one hourly row each.
  it("reads hourly roll-ups for a 30-day query at 1000 points", () => {
    expect(chooseSource(bucketGrid(YEAR_2026, YEAR_2026 + 30 * DAY, 1000).width)).toBe("hourly");
  });

  // Hand-worked: 5 × 365 days / 1000 ≈ 1.8 days → 2-day buckets, two daily rows each.
  it("reads daily roll-ups for a 5-year query at 1000 points", () => {
    expect(chooseSource(bucketGrid(YEAR_2026, YEAR_2026 + 5 * 365 * DAY, 1000).width)).toBe("daily");
  });

  it("reads raw readings for a one-day query, whose buckets are finer than an hour", () => {
    expect(chooseSource(bucketGrid(YEAR_2026, YEAR_2026 + DAY, 1000).width)).toBe("raw");
  });

  it("falls back to what is available", () => {
    expect(chooseSource(2 * DAY, ["hourly"])).toBe("hourly");
    expect(chooseSource(2 * DAY, [])).toBe("raw");
    expect(chooseSource(90 * MINUTE)).toBe("raw");
  });

  // Physical invariant of exact min/max: a bucket must be a union of whole roll-up rows.
  it("only ever picks a resolution that divides the width, and the coarsest such", () => {
    for (const width of [...NICE_BUCKET_WIDTHS, 2 * WEEK, 5 * WEEK]) {
      const source = chooseSource(width);
      const dividing = Object.values(ROLLUP_RESOLUTIONS).filter((resolution) => width % resolution === 0);
      expect(source === "raw" ? 0 : ROLLUP_RESOLUTIONS[source]).toBe(Math.max(0, ...dividing));
    }
  });

  it("keys a reading by the start of its UTC hour or day", () => {
    const time = YEAR_2026 + 3 * DAY + 5 * HOUR + 17 * MINUTE;
    expect(rollupKey(time, "hourly")).toBe(YEAR_2026 + 3 * DAY + 5 * HOUR);
    expect(new Date(rollupKey(time, "daily")).toISOString()).toBe("2026-01-04T00:00:00.000Z");
  });
});

/** The summary of all values at once, computed directly rather than by merging. */
function summaryOf(values: readonly number[]): Aggregate {
  return { min: Math.min(...values), max: Math.max(...values), sum: values.reduce((a, b) => a + b, 0), count: values.length };
}

function expectSameAggregate(actual: Aggregate, expected: Aggregate): void {
  expect(actual.min).toBe(expected.min);
  expect(actual.max).toBe(expected.max);
  expect(actual.count).toBe(expected.count);
  // Floating-point addition is not associative: only the sum may differ, by rounding.
  expect(Math.abs(actual.sum - expected.sum)).toBeLessThanOrEqual(1e-9 * (1 + Math.abs(expected.sum)));
}

const values = fc.array(fc.double({ min: -5000, max: 5000, noNaN: true }), { minLength: 1, maxLength: 200 });

describe("roll-up merge", () => {
  // Physical invariant of a summary: late and out-of-order readings, absorbed in any grouping
  // and order, leave a roll-up row equal to the summary of its readings taken at once.
  it("gives the same aggregate in any order and grouping as all values at once", () => {
    const arrivals = values.chain((all) =>
      fc.tuple(
        fc.constant(all),
        fc.shuffledSubarray(all, { minLength: all.length, maxLength: all.length }),
        fc.array(fc.nat({ max: all.length }), { maxLength: 10 }),
      ),
    );
    fc.assert(
      fc.property(arrivals, ([all, arrivalOrder, cuts]) => {
        const edges = [0, ...new Set(cuts)].sort((a, b) => a - b).concat(arrivalOrder.length);
        const batches = edges.slice(1).map((end, i) => arrivalOrder.slice(edges[i], end));
        const batchSummaries = batches.map((batch) => batch.map(aggregateOf).reduce(mergeAggregate, EMPTY_AGGREGATE));
        const merged = batchSummaries.reverse().reduce(mergeAggregate, EMPTY_AGGREGATE);
        expectSameAggregate(merged, summaryOf(all));
      }),
    );
  });

  it("is commutative, and merging the empty aggregate changes nothing", () => {
    fc.assert(
      fc.property(values, values, (a, b) => {
        expect(mergeAggregate(summaryOf(a), summaryOf(b))).toEqual(mergeAggregate(summaryOf(b), summaryOf(a)));
        expect(mergeAggregate(summaryOf(a), EMPTY_AGGREGATE)).toEqual(summaryOf(a));
      }),
    );
  });
});
