import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DAY, HOUR, MINUTE, NICE_BUCKET_WIDTHS, WEEK, bucketGrid, bucketIndex, type BucketGrid } from "@/lib/series";

const YEAR_2026 = Date.UTC(2026, 0, 1);

/** Epoch ms from 1970 to about 2096, spans from 1 ms to about 30 years. */
const ranges = fc
  .tuple(fc.integer({ min: 0, max: 4e12 }), fc.integer({ min: 1, max: 1e12 }), fc.integer({ min: 1, max: 5000 }))
  .map(([from, span, maxBuckets]) => ({ from, to: from + span, maxBuckets }));

/** Epoch-aligned buckets of `width` that [from, to) touches, counted independently of the grid. */
function touchedBuckets(from: number, to: number, width: number): number {
  return Math.floor((to - 1) / width) - Math.floor(from / width) + 1;
}

/** The next finer candidate width: the ladder's previous rung, or one week less past the ladder. */
function finerWidth(width: number): number | undefined {
  const rung = NICE_BUCKET_WIDTHS.indexOf(width);
  if (rung < 0) return width - WEEK;
  return rung > 0 ? NICE_BUCKET_WIDTHS[rung - 1] : undefined;
}

describe("bucket grid", () => {
  // Hand-worked from the nice-width ladder: 86 400 s / 1000 = 86.4 s, so 1 min (1440 buckets) is
  // too fine and 2 min (720) is the finest that fits.
  it("picks the finest nice width that fits: one UTC day at 1000 points is 2-minute buckets", () => {
    const grid = bucketGrid(YEAR_2026, YEAR_2026 + DAY, 1000);
    expect(grid).toEqual({ width: 2 * MINUTE, start: YEAR_2026, end: YEAR_2026 + DAY, count: 720 });
  });

  // Hand-worked: 30 days / 1000 = 43.2 min, so 30 min (1440) is too fine and 1 h (720) fits.
  it("uses hour buckets for a month at 1000 points", () => {
    expect(bucketGrid(YEAR_2026, YEAR_2026 + 30 * DAY, 1000).width).toBe(HOUR);
  });

  // Hand-worked: 30 years / 1000 ≈ 11 days, past the ladder's week, so whole weeks: 2 weeks.
  it("continues in whole weeks past the ladder", () => {
    const grid = bucketGrid(YEAR_2026, YEAR_2026 + 30 * 365 * DAY, 1000);
    expect(grid.width).toBe(2 * WEEK);
    expect(grid.count).toBeLessThanOrEqual(1000);
  });

  // Common practice: aligned edges make day buckets UTC calendar days whatever the range's start.
  it("aligns buckets to epoch multiples of the width, so day buckets start at 00:00 UTC", () => {
    const from = YEAR_2026 + 5 * DAY + 7 * HOUR + 123;
    const grid = bucketGrid(from, from + 700 * DAY, 1000);
    expect(grid.width).toBe(DAY);
    expect(new Date(grid.start).toISOString()).toBe("2026-01-06T00:00:00.000Z");
  });

  it("keeps the bucket count within the requested points and covers the range, for any range", () => {
    fc.assert(
      fc.property(ranges, ({ from, to, maxBuckets }) => {
        const grid = bucketGrid(from, to, maxBuckets);
        expect(grid.count).toBeLessThanOrEqual(maxBuckets);
        expect(grid.start % grid.width).toBe(0);
        expect(grid.start).toBeLessThanOrEqual(from);
        expect(grid.end).toBeGreaterThanOrEqual(to);
        expect(grid.end - grid.start).toBe(grid.count * grid.width);
        expect(bucketIndex(grid, from)).toBe(0);
        expect(bucketIndex(grid, to - 1)).toBe(grid.count - 1);
      }),
    );
  });

  it("never picks a coarser width than needed: the next finer width would exceed the points", () => {
    fc.assert(
      fc.property(ranges, ({ from, to, maxBuckets }) => {
        const { width } = bucketGrid(from, to, maxBuckets);
        const finer = finerWidth(width);
        expect(NICE_BUCKET_WIDTHS.includes(width) || width % WEEK === 0).toBe(true);
        if (finer !== undefined) expect(touchedBuckets(from, to, finer)).toBeGreaterThan(maxBuckets);
      }),
    );
  });

  it("places every time of a bucket at that bucket's index", () => {
    const grid: BucketGrid = bucketGrid(YEAR_2026, YEAR_2026 + 30 * DAY, 1000);
    expect(bucketIndex(grid, YEAR_2026 + HOUR - 1)).toBe(0);
    expect(bucketIndex(grid, YEAR_2026 + HOUR)).toBe(1);
    expect(bucketIndex(grid, grid.end)).toBe(grid.count);
  });

  it.each([
    ["an empty range", YEAR_2026, YEAR_2026, 1000],
    ["a reversed range", YEAR_2026, YEAR_2026 - 1, 1000],
    ["fractional milliseconds", YEAR_2026 + 0.5, YEAR_2026 + DAY, 1000],
    ["a time before the epoch", -DAY, DAY, 1000],
    ["no buckets", YEAR_2026, YEAR_2026 + DAY, 0],
  ])("refuses %s", (_, from, to, maxBuckets) => {
    expect(() => bucketGrid(from, to, maxBuckets)).toThrow(RangeError);
  });
});
