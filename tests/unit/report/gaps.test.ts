import { describe, expect, it } from "vitest";
import { firstOf, formatHours, missingHourRuns } from "@/lib/report/gaps";

const HOUR = 3_600_000;
const hours = (...indices: number[]) => indices.map((i) => i * HOUR);
const range = (from: number, to: number) => Array.from({ length: to - from }, (_, i) => (from + i) * HOUR);

describe("gaps from the hourly roll-ups", () => {
  it("merges consecutive missing hours into runs (by hand)", () => {
    const present = [...range(0, 5), ...range(8, 10), ...range(11, 24)];
    expect(missingHourRuns(present, { start: 0, end: 24 * HOUR }, 600)).toEqual([
      { start: 5 * HOUR, end: 8 * HOUR, hours: 3 },
      { start: 10 * HOUR, end: 11 * HOUR, hours: 1 },
    ]);
  });

  it("finds a run at the end of the span and an all-empty span", () => {
    expect(missingHourRuns(range(0, 20), { start: 0, end: 24 * HOUR }, 600)).toEqual([{ start: 20 * HOUR, end: 24 * HOUR, hours: 4 }]);
    expect(missingHourRuns([], { start: 0, end: 3 * HOUR }, 600)).toEqual([{ start: 0, end: 3 * HOUR, hours: 3 }]);
  });

  it("leaves out hours cut by the span's ends (installed at 00:50, period ends at 05:30)", () => {
    expect(missingHourRuns(hours(1, 2, 3, 4), { start: 50 * 60_000, end: 5.5 * HOUR }, 600)).toEqual([]);
  });

  it("does not call an hour a gap when the logger reads every two hours (common practice)", () => {
    expect(missingHourRuns(hours(0, 2, 4, 6), { start: 0, end: 8 * HOUR }, 7200)).toEqual([]);
    expect(missingHourRuns(hours(0, 4, 6), { start: 0, end: 8 * HOUR }, 7200)).toEqual([{ start: HOUR, end: 4 * HOUR, hours: 3 }]);
  });

  it("gives nothing without a span", () => {
    expect(missingHourRuns([], null, 600)).toEqual([]);
  });

  it("lists the first items and counts the rest", () => {
    expect(firstOf([1, 2, 3, 4, 5], 3)).toEqual({ shown: [1, 2, 3], more: 2 });
    expect(firstOf([1], 3)).toEqual({ shown: [1], more: 0 });
  });

  it("writes lengths in days and hours", () => {
    expect([formatHours(3), formatHours(24), formatHours(53)]).toEqual(["3 h", "1 d", "2 d 5 h"]);
  });
});
