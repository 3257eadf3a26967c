import { describe, expect, it } from "vitest";
import { activeSpan, completeness, expectedReadings } from "@/lib/report/completeness";

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const period = { start: 0, end: 30 * DAY };

describe("data completeness", () => {
  it("expects one reading per interval over the whole period (by hand: 30 days × 144 a day = 4320 at 10 minutes)", () => {
    const span = activeSpan({ start: -DAY, end: null }, period, 40 * DAY);
    expect(span).toEqual(period);
    expect(expectedReadings(span, 600)).toBe(4320);
    // 72 readings (12 hours) missing: 4248 / 4320 = 0.98333… (by hand)
    expect(completeness(4248, 4320)).toBeCloseTo(0.983333, 6);
  });

  it("counts only the gauge's installed life and nothing after now (by hand)", () => {
    // Installed on day 10, retired on day 20: 10 days × 24 readings an hour apart.
    expect(expectedReadings(activeSpan({ start: 10 * DAY, end: 20 * DAY }, period, 40 * DAY), 3600)).toBe(240);
    // Now is day 5 12:00: 5.5 days at one an hour.
    expect(expectedReadings(activeSpan({ start: 0, end: null }, period, 5.5 * DAY), 3600)).toBe(132);
    // Whole intervals only (common practice): 2.5 hours at one an hour expects 2.
    expect(expectedReadings({ start: 0, end: 2.5 * HOUR }, 3600)).toBe(2);
  });

  it("expects nothing from a gauge outside the period, and gives no share then", () => {
    const span = activeSpan({ start: 31 * DAY, end: null }, period, 40 * DAY);
    expect(span).toBeNull();
    expect(expectedReadings(span, 600)).toBe(0);
    expect(completeness(0, 0)).toBeNull();
  });

  // A share of what was expected cannot exceed the whole (by definition): extra readings in one hour
  // do not fill another hour's silence.
  it("never rises above 100 %, however many extra readings arrive", () => {
    expect(completeness(300, 150)).toBe(1);
    expect(completeness(23_130, 255)).toBe(1);
    expect(completeness(75, 150)).toBe(0.5);
  });
});
