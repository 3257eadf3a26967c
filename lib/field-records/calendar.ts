import { z } from "zod";

/**
 * Calendar days as certificates print them ("YYYY-MM-DD"), read on the structure's clock (its
 * today from lib/time-format's dayOf): a certificate is valid through its expiry day wherever the
 * structure stands. Pure functions.
 */

const DAY_MS = 86_400_000;
const DATE_PATTERN = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Days since 1970-01-01 of a calendar date, or null when it names no real day (2026-02-30). */
function dayNumber(date: string): number | null {
  const match = DATE_PATTERN.exec(date);
  if (!match) return null;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const ms = Date.UTC(year, month - 1, day);
  const back = new Date(ms);
  if (back.getUTCFullYear() !== year || back.getUTCMonth() !== month - 1 || back.getUTCDate() !== day) return null;
  return ms / DAY_MS;
}

const DATE_RULE = "Give a date as YYYY-MM-DD, e.g. 2026-05-01.";

export const calendarDate = z
  .string({ error: DATE_RULE })
  .trim()
  .refine((value) => dayNumber(value) !== null, DATE_RULE)
  .refine((value) => value >= "1900-01-01" && value <= "2199-12-31", "Give a date between 1900 and 2199.");

/** Whole days from `from` to `to` (negative when `to` is earlier). Both must be valid dates. */
export function daysBetween(from: string, to: string): number {
  return dayNumber(to)! - dayNumber(from)!;
}

/** The date `days` whole days after `date` (before, when negative). `date` must be a valid date. */
export function addDays(date: string, days: number): string {
  return new Date((dayNumber(date)! + days) * DAY_MS).toISOString().slice(0, 10);
}
