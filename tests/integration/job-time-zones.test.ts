import { like } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import { digestDay } from "@/jobs/daily-digest";
import { monthlyReportDue, runMonthlyReport } from "@/jobs/monthly-report";
import { JOBS } from "@/jobs/registry";
import { isTimeZone } from "@/lib/time-format";
import { addMember } from "@/lib/services/memberships";
import { createStructure } from "@/lib/services/structures";
import { makeUser } from "./helpers";

const MINUTE = 60_000;
const utc = (iso: string) => Date.parse(iso);

// Offsets are the IANA time zone database's (from memory): Tokyo UTC+9 all year; Chicago UTC−6 in
// November (CST, after the US change on the first Sunday of November); Berlin CET/CEST with the EU
// change on the last Sunday of October (2026-10-25) at 01:00 UTC.

describe("job schedules", () => {
  it("name an IANA zone for every job, the digest's from DIGEST_TIMEZONE (UTC when unset)", () => {
    for (const job of JOBS) expect(isTimeZone(job.timezone), `${job.name}: ${job.timezone}`).toBe(true);
    expect(JOBS.find((job) => job.name === "daily-digest")).toMatchObject({ schedule: "0 0 6 * * *", timezone: process.env.DIGEST_TIMEZONE || "UTC" });
    // Every half hour, so each zone's 07:00 on the 1st is met (zones sit on whole or half hours from UTC, save a few at :45).
    expect(JOBS.find((job) => job.name === "monthly-report")).toMatchObject({ schedule: "0 */30 * * * *" });
  });
});

describe("the daily digest's day", () => {
  it("is the zone's day before, 25 hours long across the autumn change in Berlin (EU rule, from memory)", () => {
    const sixOnMonday = utc("2026-10-26T05:00:00Z"); // 06:00 CET
    expect(digestDay(sixOnMonday, "Europe/Berlin")).toEqual({ day: "2026-10-25", from: new Date("2026-10-24T22:00:00Z"), to: new Date("2026-10-25T23:00:00Z") });
    expect(digestDay(utc("2026-10-26T06:00:00Z"), "UTC")).toEqual({ day: "2026-10-25", from: new Date("2026-10-25T00:00:00Z"), to: new Date("2026-10-26T00:00:00Z") });
  });
});

describe("the monthly report in each structure's zone", () => {
  it("is due from 07:00 on the 1st of the structure's clocks, not before (by hand from the offsets)", () => {
    expect(monthlyReportDue(utc("2026-11-30T21:59:00Z"), "Asia/Tokyo")).toBe(false);
    expect(monthlyReportDue(utc("2026-11-30T22:00:00Z"), "Asia/Tokyo")).toBe(true);
    expect(monthlyReportDue(utc("2026-12-01T12:59:00Z"), "America/Chicago")).toBe(false);
    expect(monthlyReportDue(utc("2026-12-01T13:00:00Z"), "America/Chicago")).toBe(true);
    // Later in the month it stays due, so a day without jobs delays the report rather than losing it.
    expect(monthlyReportDue(utc("2026-12-15T12:00:00Z"), "America/Chicago")).toBe(true);
  });

  it("sends each structure's report once, at the first half-hour run from 07:00 on its clocks", async () => {
    const owner = await makeUser("owner");
    for (const [code, timezone] of [["TOKYO", "Asia/Tokyo"], ["CHICAGO", "America/Chicago"]] as const) {
      await createStructure(null, { code, name: `Structure ${code}`, timezone });
      await addMember(null, owner.email, code);
    }
    // Every 30 minutes from 12:00 UTC on 30 November to 00:00 UTC on 3 December, as the schedule runs.
    const firstSent = new Map<string, number>();
    for (let now = utc("2026-11-30T12:00:00Z"); now <= utc("2026-12-03T00:00:00Z"); now += 30 * MINUTE) {
      await runMonthlyReport(now);
      for (const mail of await getDb().select().from(mailOutbox).where(like(mailOutbox.dedupeKey, "report:%"))) {
        const [, code, month] = mail.dedupeKey!.split(":");
        if (!firstSent.has(`${code} ${month}`)) firstSent.set(`${code} ${month}`, now);
      }
    }
    const keys = (await getDb().select({ key: mailOutbox.dedupeKey }).from(mailOutbox).where(like(mailOutbox.dedupeKey, "report:%"))).map((row) => row.key);
    // October, still due in November, goes at the first run; November once each, whatever the runs after.
    expect(keys.sort()).toEqual(["CHICAGO:2026-10", "CHICAGO:2026-11", "TOKYO:2026-10", "TOKYO:2026-11"].map((key) => `report:${key}:${owner.id}`));
    expect(firstSent.get("TOKYO 2026-10")).toBe(utc("2026-11-30T12:00:00Z"));
    expect(firstSent.get("TOKYO 2026-11")).toBe(utc("2026-11-30T22:00:00Z"));
    expect(firstSent.get("CHICAGO 2026-11")).toBe(utc("2026-12-01T13:00:00Z"));
  });
});
