import { describe, expect, it } from "vitest";
import { daysPeriod, monthPeriod, monthsBefore, periodDays, periodKey, periodName, periodQuery, previousMonthPeriod, resolvePeriod, wholeMonthOf } from "@/lib/report/period";

const HOUR = 3_600_000;
const utc = (...parts: [number, number, number, number?]) => new Date(Date.UTC(parts[0], parts[1] - 1, parts[2], parts[3] ?? 0));
const hours = ({ from, to }: { from: Date; to: Date }) => (to.getTime() - from.getTime()) / HOUR;

describe("report periods", () => {
  it("picks the previous month on the structure's clocks (by hand: 23:00 UTC on 30 November is 1 December in Tokyo, UTC+9 from memory)", () => {
    const at = utc(2026, 11, 30, 23);
    expect(previousMonthPeriod(at, "Asia/Tokyo")).toEqual(monthPeriod({ year: 2026, month: 11 }, "Asia/Tokyo"));
    expect(previousMonthPeriod(at, "UTC")).toEqual(monthPeriod({ year: 2026, month: 10 }, "UTC"));
  });

  it("goes back across the new year (by hand)", () => {
    expect(monthsBefore({ year: 2027, month: 2 }, 3)).toEqual([
      { year: 2027, month: 1 },
      { year: 2026, month: 12 },
      { year: 2026, month: 11 },
    ]);
    expect(previousMonthPeriod(utc(2027, 1, 1, 7), "UTC")).toEqual({ from: utc(2026, 12, 1), to: utc(2027, 1, 1), timeZone: "UTC" });
  });

  it("covers whole days, February of a leap year included (common practice: 29 days in 2028)", () => {
    expect(hours(monthPeriod({ year: 2028, month: 2 }, "UTC"))).toBe(29 * 24);
  });

  it("runs from local midnight to local midnight, the clock changes' days 23 and 25 hours long (EU rule: last Sundays of March and October, from memory)", () => {
    const november = monthPeriod({ year: 2026, month: 11 }, "Europe/Berlin");
    expect(november).toEqual({ from: utc(2026, 10, 31, 23), to: utc(2026, 11, 30, 23), timeZone: "Europe/Berlin" });
    expect(hours(monthPeriod({ year: 2026, month: 3 }, "Europe/Berlin"))).toBe(31 * 24 - 1);
    expect(hours(monthPeriod({ year: 2026, month: 10 }, "Europe/Berlin"))).toBe(31 * 24 + 1);
    expect(hours(daysPeriod("2026-03-29", "2026-03-29", "Europe/Berlin"))).toBe(23);
    expect(hours(daysPeriod("2026-10-25", "2026-10-25", "Europe/Berlin"))).toBe(25);
  });

  it("names months, single days and runs of days, with matching keys", () => {
    const november = monthPeriod({ year: 2026, month: 11 }, "Europe/Berlin");
    expect(periodName(november)).toBe("November 2026");
    expect(periodKey(november)).toBe("2026-11");
    const run = daysPeriod("2026-11-03", "2026-11-15", "Europe/Berlin");
    expect(wholeMonthOf(run)).toBeNull();
    expect(periodName(run)).toBe("3 November 2026 to 15 November 2026");
    expect(periodKey(run)).toBe("2026-11-03_2026-11-15");
    expect(periodName(daysPeriod("2026-11-03", "2026-11-03", "America/Chicago"))).toBe("3 November 2026");
  });

  it("resolves a reader's request in the structure's zone", () => {
    expect(resolvePeriod({ month: { year: 2026, month: 11 } }, "Asia/Tokyo")).toEqual(monthPeriod({ year: 2026, month: 11 }, "Asia/Tokyo"));
    expect(resolvePeriod({ firstDay: "2026-11-03", lastDay: "2026-11-15" }, "Asia/Tokyo")).toEqual({ from: utc(2026, 11, 2, 15), to: utc(2026, 11, 15, 15), timeZone: "Asia/Tokyo" });
  });
});

describe("period query strings", () => {
  it("name a month by month and other runs by their first and last day", () => {
    expect(periodQuery(periodDays(monthPeriod({ year: 2026, month: 11 }, "Europe/Berlin")))).toBe("month=2026-11");
    expect(periodQuery(periodDays(daysPeriod("2026-11-03", "2026-11-15", "Europe/Berlin")))).toBe("from=2026-11-03&to=2026-11-15");
  });
});
