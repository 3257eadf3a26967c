import { describe, expect, it } from "vitest";
import { chartColumns, gapThreshold, leastSquaresSlope, pairByTime, type SeriesAnswer } from "@/lib/series/chart-data";

const series = (t: number[], mean: number[]): SeriesAnswer => ({ quantity: "q", unit: "u", t, min: mean, max: mean, mean, count: t.map(() => 1) });

describe("chart data", () => {
  it("puts time in seconds and maps values to display units", () => {
    const [t, min] = chartColumns(series([1000, 2000], [10, 20]), (v) => v * 2);
    expect(t).toEqual([1, 2]);
    expect(min).toEqual([20, 40]);
  });

  it("pairs only the buckets both series have", () => {
    expect(pairByTime(series([1, 2, 3], [10, 20, 30]), series([2, 3, 4], [5, 6, 7]))).toEqual({ x: [20, 30], y: [5, 6] });
  });

  // Free thermal expansion of steel: ε = α·ΔT with α = 12 µε/°C (handbook value for steel, from memory):
  // a gauge reading total strain against temperature has slope 12.
  it("recovers a known slope by least squares", () => {
    const temperatures = [0, 5, 10, 15, 20];
    expect(leastSquaresSlope(temperatures, temperatures.map((t) => 12 * t + 3))).toBeCloseTo(12, 12);
    expect(leastSquaresSlope([4, 4, 4], [1, 2, 3])).toBeNull();
  });
});

// A line drawn across a span without readings shows data nobody measured (common practice in
// plotting measured series: leave gaps as gaps).
describe("gaps in chart data", () => {
  const TEN_MINUTES = 600_000;
  const DAY = 86_400_000;
  const times = [0, 1, 2, 3].map((i) => i * TEN_MINUTES);
  const afterGap = times.map((t) => t + 3 * TEN_MINUTES + 12 * DAY);
  const withGap = series([...times, ...afterGap], [1, 2, 3, 4, 5, 6, 7, 8]);

  it("puts one empty point in a 12-day silence, in the line and in both edges of the band", () => {
    const [t, min, max, mean] = chartColumns(withGap, (v) => v, gapThreshold(600, 60_000));
    expect(t).toHaveLength(9);
    expect([min[4], max[4], mean[4]]).toEqual([null, null, null]);
    // Half-way between the last reading before the gap and the first after it, in seconds.
    expect(t[4]).toBe((times[3]! + afterGap[0]!) / 2000);
    expect(mean.filter((value) => value === null)).toHaveLength(1);
    expect(t).toEqual([...t].sort((a, b) => a - b));
  });

  it("keeps a steady logger's line whole, and breaks it on one missed reading", () => {
    const steady = chartColumns(series(times, [1, 2, 3, 4]), (v) => v, gapThreshold(600, 60_000));
    expect(steady[3]).toEqual([1, 2, 3, 4]);
    const missedOne = chartColumns(series([0, TEN_MINUTES, 3 * TEN_MINUTES], [1, 2, 3]), (v) => v, gapThreshold(600, 60_000));
    expect(missedOne[3]).toEqual([1, 2, null, 3]);
  });

  it("does not break a coarse view at every empty bucket", () => {
    // Day buckets over a year: readings every 10 minutes fill every day; one empty day is two bucket
    // widths between starts, under three.
    expect(gapThreshold(600, DAY)).toBe(3 * DAY);
    const days = chartColumns(series([0, DAY, 3 * DAY], [1, 2, 3]), (v) => v, gapThreshold(600, DAY));
    expect(days[3]).toEqual([1, 2, 3]);
  });
});
