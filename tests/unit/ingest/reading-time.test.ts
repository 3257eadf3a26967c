import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseReadingTime } from "@/lib/ingest/reading-time";

const utc = (...parts: [number, number, number, number, number, number?, number?]) => Date.UTC(...parts);

describe("reading times", () => {
  it("reads Z and every offset form to the same instant", () => {
    const instant = utc(2026, 2, 1, 12, 0);
    for (const text of ["2026-03-01T12:00:00Z", "2026-03-01T13:00:00+01:00", "2026-03-01T13:00+0100", "2026-03-01 07:00:00-05", "2026-03-01T12:00:00.000z"]) {
      expect(parseReadingTime(text, null), text).toBe(instant);
    }
  });

  it("keeps milliseconds and cuts finer fractions", () => {
    expect(parseReadingTime("2026-03-01T12:00:00.2509Z", null)).toBe(utc(2026, 2, 1, 12, 0, 0, 250));
    // By hand: two digits of fraction are hundredths of a second.
    expect(parseReadingTime("2026-03-01T12:00:00.29Z", null)).toBe(utc(2026, 2, 1, 12, 0, 0, 290));
  });

  it("refuses what is not a date and time, a day that does not exist, and times before 1970", () => {
    for (const text of ["12:00:00Z", "2026-03-01", "2026-02-29T12:00:00Z", "2026-13-01T00:00:00Z", "2026-03-01T24:00:00Z", "1969-12-31T23:59:59Z", "2026-03-01T12:00:00+25:00", "now"]) {
      const result = parseReadingTime(text, "UTC");
      expect(typeof result === "number" ? result : result.code, text).toBe("invalid-time");
    }
  });

  it("follows the Gregorian leap-year rule for 29 February", () => {
    // ISO 8601 uses the Gregorian calendar: every 4th year is a leap year, except centuries not divisible by 400.
    expect(parseReadingTime("2024-02-29T00:00:00Z", null)).toBe(utc(2024, 1, 29, 0, 0));
    expect(parseReadingTime("2000-02-29T00:00:00Z", null)).toBe(utc(2000, 1, 29, 0, 0));
    for (const text of ["2100-02-29T00:00:00Z", "2026-04-31T00:00:00Z", "2026-02-00T00:00:00Z"]) {
      const result = parseReadingTime(text, null);
      expect(typeof result === "number" ? result : result.code, text).toBe("invalid-time");
    }
    // 31 December and 30 April exist.
    expect(parseReadingTime("2026-12-31T23:59:59Z", null)).toBe(utc(2026, 11, 31, 23, 59, 59));
    expect(parseReadingTime("2026-04-30T00:00:00Z", null)).toBe(utc(2026, 3, 30, 0, 0));
  });

  it("reads the common UTC form exactly as ECMAScript's Date.parse and as the same time with a +00:00 offset", () => {
    // Reference: the ECMAScript date-time string format (ECMA-262 §21.4.1.32), which Date.parse reads for this form.
    const instants = fc.integer({ min: Date.UTC(1970, 0, 1), max: Date.UTC(2199, 11, 31, 23, 59, 59, 999) });
    fc.assert(
      fc.property(instants, fc.integer({ min: 0, max: 3 }), (instant, fractionDigits) => {
        const iso = new Date(instant).toISOString();
        const text = fractionDigits === 0 ? iso.slice(0, 19) + "Z" : iso.slice(0, 20 + fractionDigits) + "Z";
        const expected = Date.parse(text);
        expect(parseReadingTime(text, null)).toBe(expected);
        expect(parseReadingTime(text.replace("Z", "+00:00"), null)).toBe(expected);
      }),
    );
  });

  it("asks for an offset when no zone may be assumed", () => {
    const result = parseReadingTime("2026-03-01T12:00:00", null);
    expect(typeof result === "number" ? result : result.message).toMatch(/offset/);
  });

  // UK clocks (from memory, as published every year): forward 01:00 UTC on 29 March 2026, back 01:00 UTC on 25 October 2026.
  it("reads wall-clock times in a zone, summer and winter", () => {
    expect(parseReadingTime("2026-07-01 12:00", "Europe/London")).toBe(utc(2026, 6, 1, 11, 0));
    expect(parseReadingTime("2026-01-15 12:00", "Europe/London")).toBe(utc(2026, 0, 15, 12, 0));
    expect(parseReadingTime("2026-07-01 12:00", "America/New_York")).toBe(utc(2026, 6, 1, 16, 0));
  });

  it("takes the earlier instant of an hour that happens twice, and reads a skipped hour with the offset before the change", () => {
    expect(parseReadingTime("2026-10-25 01:30", "Europe/London")).toBe(utc(2026, 9, 25, 0, 30));
    expect(parseReadingTime("2026-03-29 01:30", "Europe/London")).toBe(utc(2026, 2, 29, 1, 30));
    expect(parseReadingTime("2026-03-29 00:59", "Europe/London")).toBe(utc(2026, 2, 29, 0, 59));
    expect(parseReadingTime("2026-03-29 02:00", "Europe/London")).toBe(utc(2026, 2, 29, 1, 0));
  });
});
