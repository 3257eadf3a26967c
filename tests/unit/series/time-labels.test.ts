import { describe, expect, it } from "vitest";
import { DAY, HOUR, MINUTE, SECOND } from "@/lib/series";
import { legendTime, timeTickLabels } from "@/lib/series/time-labels";

/** Epoch seconds, as uPlot hands times to its formatters. */
const at = (iso: string) => Date.parse(iso) / SECOND;
const every = (ms: number) => ms / SECOND;

describe("time-axis labels", () => {
  it("labels hourly ticks with the time, and the date (YYYY-MM-DD) on the first tick and at each midnight", () => {
    // Europe/London keeps GMT in winter, so these UTC times are the clock on site.
    const ticks = ["2026-02-28T18:00:00Z", "2026-03-01T00:00:00Z", "2026-03-01T06:00:00Z", "2026-03-01T12:00:00Z"].map(at);
    expect(timeTickLabels(ticks, every(6 * HOUR), "Europe/London")).toEqual(["18:00\n2026-02-28", "00:00\n2026-03-01", "06:00", "12:00"]);
  });

  it("reads the structure's clock, not UTC", () => {
    // British Summer Time is UTC+1: 23:00 UTC on 30 June is midnight on 1 July on site.
    expect(timeTickLabels([at("2026-06-30T23:00:00Z")], every(HOUR), "Europe/London")).toEqual(["00:00\n2026-07-01"]);
    expect(timeTickLabels([at("2026-06-30T23:00:00Z")], every(HOUR), "America/Chicago")).toEqual(["18:00\n2026-06-30"]);
  });

  it("labels ticks minutes apart with the time", () => {
    const ticks = [at("2026-03-01T14:15:00Z"), at("2026-03-01T14:30:00Z")];
    expect(timeTickLabels(ticks, every(15 * MINUTE), "Europe/London")).toEqual(["14:15\n2026-03-01", "14:30"]);
  });

  it("labels ticks seconds apart with seconds", () => {
    const ticks = [at("2026-03-01T14:30:00Z"), at("2026-03-01T14:30:15Z")];
    expect(timeTickLabels(ticks, 15, "UTC")).toEqual(["14:30:00\n2026-03-01", "14:30:15"]);
  });

  it("labels daily ticks month-day, with the year on the first tick and when it turns", () => {
    const ticks = ["2026-12-30", "2026-12-31", "2027-01-01"].map((day) => at(`${day}T00:00:00Z`));
    expect(timeTickLabels(ticks, every(DAY), "Europe/London")).toEqual(["12-30\n2026", "12-31", "01-01\n2027"]);
  });

  it("labels monthly ticks with year and month and yearly ticks with the year", () => {
    // Midnight on the 1st in Berlin (UTC+1 in winter) is 23:00 UTC the day before.
    const months = [at("2026-11-30T23:00:00Z"), at("2026-12-31T23:00:00Z")];
    expect(timeTickLabels(months, every(30 * DAY), "Europe/Berlin")).toEqual(["2026-12", "2027-01"]);
    expect(timeTickLabels([at("2026-01-01T00:00:00Z"), at("2027-01-01T00:00:00Z")], every(365 * DAY), "UTC")).toEqual(["2026", "2027"]);
  });
});

describe("legend time", () => {
  it("reads the structure's clock in the app's one format, the zone named (BST is UTC+1, from memory)", () => {
    expect(legendTime(at("2026-03-01T14:30:00Z"), "Europe/London")).toBe("2026-03-01 14:30 GMT");
    expect(legendTime(at("2026-07-01T12:00:00Z"), "Europe/London")).toBe("2026-07-01 13:00 BST");
  });

  it("shows a dash when the cursor is on no reading", () => {
    expect(legendTime(null, "UTC")).toBe("—");
    expect(legendTime(Number.NaN, "UTC")).toBe("—");
  });
});
