import { describe, expect, it } from "vitest";
import { atWallClock, axisText, wallClockInputToIso, dayEnd, dayOf, dayStart, formatInTimeZone, isTimeZone, monthBounds, monthOf, startOfZoneDay, zoneName, zoneWallClock } from "@/lib/time-format";

const HOUR = 3_600_000;
const at = (iso: string) => new Date(iso);

// Offsets and rules below are the IANA time zone database's (from memory): the EU changes clocks on
// the last Sunday of March and of October at 01:00 UTC (2026-03-29, 2026-10-25); Central Europe is
// UTC+1 (CET) / UTC+2 (CEST); the UK UTC+0 (GMT) / UTC+1 (BST); the US changes on the second Sunday
// of March and the first Sunday of November (2026-03-08, 2026-11-01) at 02:00 local; New York is
// UTC−5 / UTC−4; India UTC+5:30 all year; Japan UTC+9 all year.

describe("a moment as people read it", () => {
  it("shows the zone's clock in one format and names the zone (IANA offsets, from memory)", () => {
    expect(formatInTimeZone(at("2026-12-02T05:10:00Z"), "Europe/Berlin")).toBe("2026-12-02 06:10 CET");
    expect(formatInTimeZone(at("2026-07-01T12:00:00Z"), "Europe/Berlin")).toBe("2026-07-01 14:00 CEST");
    expect(formatInTimeZone(at("2026-07-01T12:00:00Z"), "Europe/London")).toBe("2026-07-01 13:00 BST");
    expect(formatInTimeZone(at("2026-01-15T12:00:00Z"), "Europe/London")).toBe("2026-01-15 12:00 GMT");
    expect(formatInTimeZone(at("2026-12-02T05:10:00Z"), "UTC")).toBe("2026-12-02 05:10 UTC");
    // Zones without a British abbreviation are named by their offset.
    expect(formatInTimeZone(at("2026-12-02T05:10:00Z"), "America/New_York")).toBe("2026-12-02 00:10 GMT-5");
    expect(formatInTimeZone(at("2026-07-02T05:10:00Z"), "America/New_York")).toBe("2026-07-02 01:10 GMT-4");
    expect(formatInTimeZone(at("2026-12-02T05:10:00Z"), "Asia/Kolkata")).toBe("2026-12-02 10:40 GMT+5:30");
  });

  it("takes epoch milliseconds as well as dates, and shows seconds or milliseconds where asked", () => {
    const moment = Date.parse("2026-12-02T05:10:07.250Z");
    expect(formatInTimeZone(moment, "Europe/Berlin", { precision: "second" })).toBe("2026-12-02 06:10:07 CET");
    expect(formatInTimeZone(moment, "Europe/Berlin", { precision: "millisecond" })).toBe("2026-12-02 06:10:07.250 CET");
  });

  it("names the zone of the moment, not of today: the hour either side of the autumn change (EU rule, from memory)", () => {
    // 00:30 UTC on 25 October is 02:30 CEST; 01:30 UTC is 02:30 CET: the same wall clock twice, told apart by the name.
    expect(formatInTimeZone(at("2026-10-25T00:30:00Z"), "Europe/Berlin")).toBe("2026-10-25 02:30 CEST");
    expect(formatInTimeZone(at("2026-10-25T01:30:00Z"), "Europe/Berlin")).toBe("2026-10-25 02:30 CET");
    expect(zoneName(at("2026-03-29T00:59:00Z"), "Europe/Berlin")).toBe("CET");
    expect(zoneName(at("2026-03-29T01:00:00Z"), "Europe/Berlin")).toBe("CEST");
  });
});

describe("days of a zone", () => {
  it("puts a moment in the zone's day (by hand: 23:00 UTC on 30 November is 08:00 on 1 December in Tokyo)", () => {
    expect(dayOf(at("2026-11-30T23:00:00Z"), "Asia/Tokyo")).toBe("2026-12-01");
    expect(dayOf(at("2026-11-30T23:00:00Z"), "UTC")).toBe("2026-11-30");
    expect(dayOf(at("2026-12-01T03:00:00Z"), "America/New_York")).toBe("2026-11-30");
  });

  it("gives 23 hours to the spring-forward day and 25 to the fall-back day in Europe/Berlin (EU rule, from memory)", () => {
    expect(dayStart("2026-03-29", "Europe/Berlin")).toEqual(at("2026-03-28T23:00:00Z"));
    expect(dayEnd("2026-03-29", "Europe/Berlin")).toEqual(at("2026-03-29T22:00:00Z"));
    expect(dayEnd("2026-03-29", "Europe/Berlin").getTime() - dayStart("2026-03-29", "Europe/Berlin").getTime()).toBe(23 * HOUR);
    expect(dayStart("2026-10-25", "Europe/Berlin")).toEqual(at("2026-10-24T22:00:00Z"));
    expect(dayEnd("2026-10-25", "Europe/Berlin")).toEqual(at("2026-10-25T23:00:00Z"));
    expect(dayEnd("2026-10-25", "Europe/Berlin").getTime() - dayStart("2026-10-25", "Europe/Berlin").getTime()).toBe(25 * HOUR);
    // An ordinary day either side has 24.
    expect(dayEnd("2026-03-28", "Europe/Berlin").getTime() - dayStart("2026-03-28", "Europe/Berlin").getTime()).toBe(24 * HOUR);
    expect(dayEnd("2026-10-26", "Europe/Berlin").getTime() - dayStart("2026-10-26", "Europe/Berlin").getTime()).toBe(24 * HOUR);
  });

  it("finds the start of the day holding a moment, on each side of a change", () => {
    expect(startOfZoneDay(at("2026-03-29T21:59:00Z"), "Europe/Berlin")).toEqual(at("2026-03-28T23:00:00Z"));
    expect(startOfZoneDay(at("2026-03-29T22:00:00Z"), "Europe/Berlin")).toEqual(at("2026-03-29T22:00:00Z"));
    expect(startOfZoneDay(at("2026-10-25T22:59:00Z"), "Europe/Berlin")).toEqual(at("2026-10-24T22:00:00Z"));
    expect(startOfZoneDay(at("2026-12-02T05:10:00Z"), "Asia/Kolkata")).toEqual(at("2026-12-01T18:30:00Z"));
  });

  it("refuses a day that is not YYYY-MM-DD", () => {
    expect(() => dayStart("1 March 2026", "UTC")).toThrow(/YYYY-MM-DD/);
  });

  it("reads a wall-clock time on a day: 07:00 on the US fall-back day is standard time (US rule, from memory)", () => {
    expect(atWallClock("2026-11-01", 7, 0, "America/Chicago")).toEqual(at("2026-11-01T13:00:00Z"));
    expect(atWallClock("2026-10-01", 7, 0, "America/Chicago")).toEqual(at("2026-10-01T12:00:00Z"));
    expect(atWallClock("2026-12-01", 7, 0, "Asia/Tokyo")).toEqual(at("2026-11-30T22:00:00Z"));
  });
});

describe("times typed on the structure's clock", () => {
  it("read a date-and-time field in the zone, not the device's (IANA offsets, from memory)", () => {
    expect(wallClockInputToIso("2026-03-10T09:00", "Europe/London")).toBe("2026-03-10T09:00:00.000Z");
    expect(wallClockInputToIso("2026-07-10T09:00", "Europe/London")).toBe("2026-07-10T08:00:00.000Z");
    expect(wallClockInputToIso("2026-07-10T09:00:30", "Asia/Kolkata")).toBe("2026-07-10T03:30:30.000Z");
    expect(wallClockInputToIso("", "UTC")).toBe("");
    expect(wallClockInputToIso("10/07/2026 09:00", "UTC")).toBe("");
  });
});

describe("months of a zone", () => {
  it("picks the month on the zone's clocks and bounds it by local midnights (EU rule, from memory)", () => {
    expect(monthOf(at("2026-11-30T23:30:00Z"), "Europe/Berlin")).toEqual({ year: 2026, month: 12 });
    expect(monthOf(at("2026-11-30T23:30:00Z"), "UTC")).toEqual({ year: 2026, month: 11 });
    const october = monthBounds({ year: 2026, month: 10 }, "Europe/Berlin");
    expect(october).toEqual({ from: at("2026-09-30T22:00:00Z"), to: at("2026-10-31T23:00:00Z") });
    // 31 days, one of them 25 hours long.
    expect((october.to.getTime() - october.from.getTime()) / HOUR).toBe(31 * 24 + 1);
  });
});

describe("chart axes", () => {
  it("show the parts of the zone's clock in the same format", () => {
    const moment = at("2026-03-01T14:30:15Z");
    expect(axisText(moment, "Europe/London", "year")).toBe("2026");
    expect(axisText(moment, "Europe/London", "month")).toBe("2026-03");
    expect(axisText(moment, "Europe/London", "monthDay")).toBe("03-01");
    expect(axisText(moment, "Europe/London", "minute")).toBe("14:30");
    expect(axisText(moment, "Europe/London", "second")).toBe("14:30:15");
    expect(axisText(moment, "Asia/Tokyo", "day")).toBe("2026-03-01");
  });

  it("give uPlot a Date whose local fields read the zone's clock (BST is UTC+1, from memory)", () => {
    const clock = zoneWallClock(at("2026-07-01T12:00:00Z"), "Europe/London");
    expect([clock.getFullYear(), clock.getMonth() + 1, clock.getDate(), clock.getHours(), clock.getMinutes()]).toEqual([2026, 7, 1, 13, 0]);
    expect(zoneWallClock(at("2026-06-30T23:00:00Z"), "Europe/London").getHours()).toBe(0);
  });
});

describe("zone names", () => {
  it("knows the IANA names and refuses others", () => {
    expect(isTimeZone("Europe/Berlin")).toBe(true);
    expect(isTimeZone("UTC")).toBe(true);
    expect(isTimeZone("Europe/Atlantis")).toBe(false);
  });
});
