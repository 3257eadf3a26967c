import { describe, expect, it } from "vitest";
import { chartColumns, leastSquaresSlope, pairByTime, type SeriesAnswer } from "@/lib/series/chart-data";

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

  // Free thermal expansion of steel: ε = α·ΔT with α = 12 µε/°C (trade brief, physics check values):
  // a gauge reading total strain against temperature has slope 12.
  it("recovers a known slope by least squares", () => {
    const temperatures = [0, 5, 10, 15, 20];
    expect(leastSquaresSlope(temperatures, temperatures.map((t) => 12 * t + 3))).toBeCloseTo(12, 12);
    expect(leastSquaresSlope([4, 4, 4], [1, 2, 3])).toBeNull();
  });
});

describe("a structure's days", () => {
  // IANA time zone data (common practice): London is on GMT+1 (BST) on 1 July, Chicago on CDT (UTC−5).
  it("start at the structure's own midnight", async () => {
    const { startOfDayIn } = await import("@/lib/ingest/reading-time");
    expect(startOfDayIn("2026-07-01", "Europe/London")).toBe(Date.UTC(2026, 5, 30, 23));
    expect(startOfDayIn("2026-07-01", "America/Chicago")).toBe(Date.UTC(2026, 6, 1, 5));
    expect(startOfDayIn("not a day", "UTC")).toBeNull();
  });
});
