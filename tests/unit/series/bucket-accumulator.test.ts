import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  DAY,
  HOUR,
  MINUTE,
  aggregateOf,
  bucketGrid,
  bucketIndex,
  chooseSource,
  createBucketAccumulator,
  mergeAggregate,
  rollupKey,
  type Aggregate,
  type Rollup,
} from "@/lib/series";

const YEAR_2026 = Date.UTC(2026, 0, 1);

describe("bucket accumulator", () => {
  // The series promise (OpenAPI document): a bucket's largest and smallest stored values are never lost, so a
  // single-reading spike in a year of data must show.
  it("keeps a single spike and a single dip in a year of one-minute readings at 1000 buckets", () => {
    const minutes = 365 * 24 * 60;
    const spikeAt = YEAR_2026 + 200_003 * MINUTE;
    const dipAt = YEAR_2026 + 411_111 * MINUTE;
    const grid = bucketGrid(YEAR_2026, YEAR_2026 + minutes * MINUTE, 1000);
    const buckets = createBucketAccumulator(grid);
    for (let i = 0; i < minutes; i++) {
      const time = YEAR_2026 + i * MINUTE;
      const daily = 40 * Math.sin((2 * Math.PI * i) / 1440);
      buckets.addValue(time, time === spikeAt ? 2500 : time === dipAt ? -2500 : daily);
    }
    const series = buckets.result();
    const spikeBucket = series.t.indexOf(grid.start + bucketIndex(grid, spikeAt) * grid.width);
    const dipBucket = series.t.indexOf(grid.start + bucketIndex(grid, dipAt) * grid.width);
    expect(series.t.length).toBeLessThanOrEqual(1000);
    expect(series.max[spikeBucket]).toBe(2500);
    expect(series.min[dipBucket]).toBe(-2500);
    expect(series.max.filter((max) => max > 40)).toEqual([2500]);
    expect(series.count.reduce((a, b) => a + b, 0)).toBe(minutes);
  });

  // Hand-worked: readings 1, 3 in the first hour and 10, 20, 60 in the fourth.
  it("omits empty buckets and reports min, max, mean and count of the others", () => {
    const grid = bucketGrid(YEAR_2026, YEAR_2026 + DAY, 24);
    const buckets = createBucketAccumulator(grid);
    for (const [offset, value] of [[0, 1], [59 * MINUTE, 3], [3 * HOUR, 10], [3 * HOUR + 1, 60], [4 * HOUR - 1, 20]]) {
      buckets.addValue(YEAR_2026 + offset!, value!);
    }
    expect(buckets.result()).toEqual({
      t: [YEAR_2026, YEAR_2026 + 3 * HOUR],
      min: [1, 10],
      max: [3, 60],
      mean: [2, 30],
      count: [2, 3],
    });
  });

  it("refuses rows out of time order or outside the grid, instead of splitting a bucket", () => {
    const grid = bucketGrid(YEAR_2026, YEAR_2026 + DAY, 24);
    const buckets = createBucketAccumulator(grid);
    buckets.addValue(YEAR_2026 + 5 * HOUR, 1);
    expect(() => buckets.addValue(YEAR_2026 + HOUR, 1)).toThrow(RangeError);
    expect(() => buckets.addValue(grid.end, 1)).toThrow(RangeError);
    expect(() => createBucketAccumulator(grid).addValue(grid.start - 1, 1)).toThrow(RangeError);
  });

  // Physical invariant of roll-ups: a bucket that is a union of whole roll-up rows has the same
  // min, max and count as the readings those rows summarise (the mean up to rounding).
  it("gives the same series from roll-up rows as from the raw readings they summarise", () => {
    const query = fc
      .tuple(fc.integer({ min: 1, max: 120 }), fc.integer({ min: 0, max: 23 }))
      .chain(([days, startHour]) => {
        const from = YEAR_2026 + startHour * HOUR;
        const to = from + days * DAY;
        const readings = fc.uniqueArray(
          fc.tuple(fc.integer({ min: from, max: to - 1 }), fc.double({ min: -3000, max: 3000, noNaN: true })),
          { selector: ([time]) => time, minLength: 1, maxLength: 300 },
        );
        // At most 12 points a day keeps buckets at 2 h or wider, so a roll-up always serves them.
        return fc.tuple(fc.constant({ from, to }), fc.integer({ min: 1, max: 12 * days }), readings);
      });
    fc.assert(
      fc.property(query, ([{ from, to }, points, readings]) => {
        const grid = bucketGrid(from, to, points);
        const source = chooseSource(grid.width);
        if (source === "raw") throw new Error(`expected a roll-up source for ${grid.width} ms buckets`);
        const sorted = [...readings].sort(([a], [b]) => a - b);
        const fromRaw = createBucketAccumulator(grid);
        for (const [time, value] of sorted) fromRaw.addValue(time, value);
        const fromRollups = createBucketAccumulator(grid);
        for (const [time, row] of rollupRows(readings, source)) {
          fromRollups.addAggregate(time, row.min, row.max, row.sum, row.count);
        }
        const raw = fromRaw.result();
        const rolled = fromRollups.result();
        expect({ ...rolled, mean: [] }).toEqual({ ...raw, mean: [] });
        rolled.mean.forEach((mean, i) => expect(Math.abs(mean - raw.mean[i]!)).toBeLessThanOrEqual(1e-9 * 3000));
      }),
    );
  });
});

/** Roll-up rows built the way ingestion keeps them: readings merged into their row as they arrive. */
function rollupRows(readings: readonly (readonly [number, number])[], rollup: Rollup): [number, Aggregate][] {
  const rows = new Map<number, Aggregate>();
  for (const [time, value] of readings) {
    const key = rollupKey(time, rollup);
    const row = rows.get(key);
    rows.set(key, row ? mergeAggregate(row, aggregateOf(value)) : aggregateOf(value));
  }
  return [...rows].sort(([a], [b]) => a - b);
}
