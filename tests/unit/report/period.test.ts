import { describe, expect, it } from "vitest";
import { monthIn, monthPeriod, monthsBefore, periodKey, periodName, periodQuery, previousMonthPeriod, wholeMonthOf } from "@/lib/report/period";

const utc = (...parts: [number, number, number, number?]) => new Date(Date.UTC(parts[0], parts[1] - 1, parts[2], parts[3] ?? 0));

describe("report periods", () => {
  it("picks the month on the structure's clocks (by hand: 23:30 UTC on 30 November is 1 December in Tokyo)", () => {
    const at = utc(2026, 11, 30, 23);
    expect(monthIn(at, "UTC")).toEqual({ year: 2026, month: 11 });
    expect(monthIn(at, "Asia/Tokyo")).toEqual({ year: 2026, month: 12 });
    expect(previousMonthPeriod(at, "Asia/Tokyo")).toEqual(monthPeriod({ year: 2026, month: 11 }));
    expect(previousMonthPeriod(at, "UTC")).toEqual(monthPeriod({ year: 2026, month: 10 }));
  });

  it("goes back across the new year (by hand)", () => {
    expect(monthsBefore({ year: 2027, month: 2 }, 3)).toEqual([
      { year: 2027, month: 1 },
      { year: 2026, month: 12 },
      { year: 2026, month: 11 },
    ]);
    expect(previousMonthPeriod(utc(2027, 1, 1, 7), "UTC")).toEqual({ from: utc(2026, 12, 1), to: utc(2027, 1, 1) });
  });

  it("covers whole UTC days, February of a leap year included (common practice: 29 days in 2028)", () => {
    const { from, to } = monthPeriod({ year: 2028, month: 2 });
    expect((to.getTime() - from.getTime()) / 86_400_000).toBe(29);
  });

  it("names months, single days and runs of days, with matching keys", () => {
    const november = monthPeriod({ year: 2026, month: 11 });
    expect(periodName(november)).toBe("November 2026");
    expect(periodKey(november)).toBe("2026-11");
    const run = { from: utc(2026, 11, 3), to: utc(2026, 11, 16) };
    expect(wholeMonthOf(run)).toBeNull();
    expect(periodName(run)).toBe("3 November 2026 to 15 November 2026");
    expect(periodKey(run)).toBe("2026-11-03_2026-11-15");
    expect(periodName({ from: utc(2026, 11, 3), to: utc(2026, 11, 4) })).toBe("3 November 2026");
  });
});

describe("period query strings", () => {
  it("name a month by month and other runs by their first and last day", () => {
    expect(periodQuery(monthPeriod({ year: 2026, month: 11 }))).toBe("month=2026-11");
    expect(periodQuery({ from: utc(2026, 11, 3), to: utc(2026, 11, 16) })).toBe("from=2026-11-03&to=2026-11-15");
  });
});
