import { describe, expect, it } from "vitest";
import { addDays, daysBetween } from "@/lib/field-records/calendar";
import { dayOf } from "@/lib/time-format";
import { certificateFields, certificateStanding, parseReminderDays, thresholdsDue } from "@/lib/field-records/certificates";

describe("calendar days on the structure's clock", () => {
  it("counts whole days across month ends and leap days (Gregorian calendar)", () => {
    expect(daysBetween("2026-02-28", "2026-03-01")).toBe(1);
    expect(daysBetween("2028-02-28", "2028-03-01")).toBe(2); // 2028 is a leap year
    expect(daysBetween("2026-07-01", "2026-06-01")).toBe(-30);
  });

  it("adds whole days across month ends, year ends and leap days (Gregorian calendar)", () => {
    expect(addDays("2026-10-31", 30)).toBe("2026-11-30"); // November has 30 days
    expect(addDays("2028-02-28", 1)).toBe("2028-02-29"); // 2028 is a leap year
    expect(addDays("2026-02-28", 1)).toBe("2026-03-01");
    expect(addDays("2026-12-31", 1)).toBe("2027-01-01");
    expect(addDays("2026-03-01", -1)).toBe("2026-02-28");
  });

  it("reads today's date in the structure's zone (IANA tz: New Zealand is UTC+12 in June, from memory)", () => {
    const instant = Date.UTC(2026, 5, 30, 13, 0);
    expect(dayOf(instant, "UTC")).toBe("2026-06-30");
    expect(dayOf(instant, "Pacific/Auckland")).toBe("2026-07-01");
  });
});

describe("certificate standing and reminders", () => {
  it("says in words whether a certificate is expired, expiring or valid, valid through its expiry day", () => {
    expect(certificateStanding("2026-07-01", "2026-07-02", 30)).toEqual({ state: "expired", daysLeft: -1, words: "Expired on 2026-07-01 (1 day ago)" });
    expect(certificateStanding("2026-07-01", "2026-07-01", 30).words).toBe("Expires today, 2026-07-01");
    expect(certificateStanding("2026-07-01", "2026-06-01", 30)).toMatchObject({ state: "expiring", daysLeft: 30, words: "Expires in 30 days, on 2026-07-01" });
    expect(certificateStanding("2026-07-01", "2026-05-31", 30)).toMatchObject({ state: "valid", words: "Valid until 2026-07-01 (31 days left)" });
  });

  it("names each threshold reached and not yet reminded of, and none once expired", () => {
    expect(thresholdsDue(31, [30, 7], new Set())).toEqual([]);
    expect(thresholdsDue(30, [30, 7], new Set())).toEqual([30]);
    expect(thresholdsDue(20, [30, 7], new Set([30]))).toEqual([]);
    expect(thresholdsDue(5, [30, 7], new Set())).toEqual([30, 7]);
    expect(thresholdsDue(-1, [30, 7], new Set())).toEqual([]);
  });

  it("reads CERTIFICATE_REMINDER_DAYS and refuses what is not days", () => {
    expect(parseReminderDays(undefined)).toEqual([30]);
    expect(parseReminderDays("7, 60,30,7")).toEqual([60, 30, 7]);
    expect(() => parseReminderDays("thirty")).toThrow(/whole numbers of days/);
    expect(() => parseReminderDays("400")).toThrow(/0 to 365/);
  });

  it("refuses an expiry on or before the issue date, a day that does not exist, and a certificate for nothing or for two things", () => {
    const base = { number: "C-1", issuedBy: "Lab", issuedOn: "2026-01-10", expiresOn: "2027-01-10", gauge: "G1" };
    expect(certificateFields.parse(base).subject).toEqual({ gauge: "G1" });
    const problems = (fields: Record<string, unknown>) => certificateFields.safeParse(fields).error?.issues.map((issue) => `${issue.path.join(".")}: ${issue.message}`);
    expect(problems({ ...base, expiresOn: "2026-01-09" })).toEqual(["expiresOn: The expiry date must be after the issue date (2026-01-10)."]);
    expect(problems({ ...base, expiresOn: "2026-02-30" })?.[0]).toMatch(/^expiresOn: Give a date as YYYY-MM-DD/);
    expect(problems({ ...base, gauge: "" })?.[0]).toMatch(/^gauge: Name either the gauge/);
    expect(problems({ ...base, logger: "Pier 2" })?.[0]).toMatch(/^logger: Name either the gauge/);
  });
});
