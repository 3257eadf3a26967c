import { tzOffset } from "@date-fns/tz";
import { failure, type Failure } from "@/lib/mechanics/result";
import { DAY, MINUTE } from "@/lib/series";

/**
 * Reading times: ISO-8601 date and time, `T` or a space between them, seconds and a fraction
 * optional, then `Z` or an offset (`+01:00`, `+0100`, `+01`). Without an offset the time is a wall
 * clock time read in a time zone (CSV files only; the contract wants an offset in JSON).
 * Stored times are epoch milliseconds: finer fractions are cut to the millisecond.
 */
const ISO_TIME = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?(?:\s*(Z|[+-]\d{2}(?::?\d{2})?))?$/i;

const EXAMPLE = "e.g. 2026-03-01T12:00:00Z or 2026-03-01T13:00:00+01:00";

const INVALID_TIME = failure("invalid-time", `The time is not an ISO-8601 date and time (${EXAMPLE}).`);
const TIME_WITHOUT_OFFSET = failure(
  "invalid-time",
  `The time has no offset; send UTC with Z or the logger's offset (${EXAMPLE}).`,
);
const TIME_BEFORE_EPOCH = failure("invalid-time", "The time is before 1970-01-01; check the logger's clock.");

/**
 * Epoch ms of an ISO-8601 time. `zone` (an IANA name) reads times that carry no offset; with
 * `zone` null such times are refused.
 */
export function parseReadingTime(text: string, zone: string | null): number | Failure<"invalid-time"> {
  const utc = canonicalUtc(text);
  if (utc !== undefined) return utc === null ? INVALID_TIME : utc < 0 ? TIME_BEFORE_EPOCH : utc;
  const match = ISO_TIME.exec(text.trim());
  if (!match) return INVALID_TIME;
  const [, year, month, day, hour, minute, second = "0", fraction = "", offset] = match;
  const wall = wallClock(+year!, +month!, +day!, +hour!, +minute!, +second, Number(fraction.slice(0, 3).padEnd(3, "0")));
  if (wall === null) return INVALID_TIME;
  let time: number;
  if (offset !== undefined) {
    const offsetMs = parseOffset(offset);
    if (offsetMs === null) return INVALID_TIME;
    time = wall - offsetMs;
  } else if (zone === null) {
    return TIME_WITHOUT_OFFSET;
  } else {
    time = wallClockToEpoch(wall, zone);
  }
  return time < 0 ? TIME_BEFORE_EPOCH : time;
}

const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

function daysInMonth(year: number, month: number): number {
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  return month === 2 && leap ? 29 : DAYS_IN_MONTH[month - 1]!;
}

/**
 * The wall-clock fields as if they were UTC, or null when a field is out of range (31 February).
 * Checked by arithmetic rather than through a Date: this runs once per reading.
 */
function wallClock(year: number, month: number, day: number, hour: number, minute: number, second: number, ms: number) {
  // Date.UTC maps years 0–99 to 1900–1999.
  if (year < 100 || month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month) || hour > 23 || minute > 59 || second > 59) return null;
  return Date.UTC(year, month - 1, day, hour, minute, second, ms);
}

/** The number the `count` digits of `text` from `from` spell, or -1 if one of them is not a digit. */
function digitsAt(text: string, from: number, count: number): number {
  let value = 0;
  for (let i = from; i < from + count; i++) {
    const digit = text.charCodeAt(i) - 48;
    if (digit < 0 || digit > 9) return -1;
    value = value * 10 + digit;
  }
  return value;
}

/**
 * The form loggers send most, "2026-03-01T12:00:00Z" with up to three digits of fraction, read
 * character by character: it runs once per reading, and the general pattern costs several times
 * more. Epoch ms, null for a day or time that does not exist, undefined for any other form (the
 * general pattern decides those).
 */
function canonicalUtc(text: string): number | null | undefined {
  const { length } = text;
  if (length !== 20 && (length < 22 || length > 24)) return undefined;
  if (text[4] !== "-" || text[7] !== "-" || text[10] !== "T" || text[13] !== ":" || text[16] !== ":" || text[length - 1] !== "Z") return undefined;
  const digits = length - 21;
  if (length > 20 && text[19] !== ".") return undefined;
  const fraction = length > 20 ? digitsAt(text, 20, digits) : 0;
  const fields = [digitsAt(text, 0, 4), digitsAt(text, 5, 2), digitsAt(text, 8, 2), digitsAt(text, 11, 2), digitsAt(text, 14, 2), digitsAt(text, 17, 2), fraction];
  if (fields.some((field) => field < 0)) return undefined;
  const [year, month, day, hour, minute, second] = fields as [number, number, number, number, number, number];
  return wallClock(year, month, day, hour, minute, second, length > 20 ? fraction * 10 ** (3 - digits) : 0);
}

function parseOffset(offset: string): number | null {
  if (offset === "Z" || offset === "z") return 0;
  const sign = offset[0] === "-" ? -1 : 1;
  const digits = offset.slice(1).replace(":", "");
  const hours = Number(digits.slice(0, 2));
  const minutes = digits.length > 2 ? Number(digits.slice(2)) : 0;
  if (hours > 23 || minutes > 59) return null;
  return sign * (hours * 60 + minutes) * MINUTE;
}

/** Offset of `zone` from UTC at an instant, ms (positive east of Greenwich), from the IANA data the runtime carries. */
export function zoneOffset(zone: string, instant: number): number {
  return tzOffset(zone, new Date(instant)) * MINUTE;
}

/**
 * Zones change offset on quarter-hour wall-clock boundaries, so one shift serves a whole
 * quarter hour of wall time; caching it keeps a million-row file from formatting a million dates.
 */
const QUARTER_HOUR = 15 * MINUTE;
const shiftCache = new Map<string, number>();
const SHIFT_CACHE_LIMIT = 100_000;

/**
 * The instant a wall-clock time in `zone` names. Where clocks go back (the hour happens twice)
 * the earlier instant is taken; where they go forward (the hour never happens) the time is read
 * with the offset in force before the change, landing as far after it — the "compatible" rule
 * of the ECMAScript Temporal proposal.
 */
export function wallClockToEpoch(wall: number, zone: string): number {
  const block = Math.floor(wall / QUARTER_HOUR);
  const key = `${zone}|${block}`;
  let shift = shiftCache.get(key);
  if (shift === undefined) {
    shift = offsetForWallClock(block * QUARTER_HOUR, zone);
    if (shiftCache.size >= SHIFT_CACHE_LIMIT) shiftCache.clear();
    shiftCache.set(key, shift);
  }
  return wall - shift;
}

function offsetForWallClock(wall: number, zone: string): number {
  // At most one change of offset lies within a day either side of any wall-clock time.
  const before = zoneOffset(zone, wall - DAY);
  const after = zoneOffset(zone, wall + DAY);
  const earlierFits = zoneOffset(zone, wall - before) === before;
  const laterFits = zoneOffset(zone, wall - after) === after;
  if (earlierFits && laterFits) return Math.max(before, after);
  if (laterFits) return after;
  return before;
}
