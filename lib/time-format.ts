import { wallClockToEpoch } from "@/lib/ingest/reading-time";

/**
 * "2026-07-01 13:00 BST": a moment as the clock on site showed it, with the zone's abbreviation
 * so a reader abroad knows which clock. Intl carries the IANA time zone data, so no library is needed.
 */
export function formatInTimeZone(at: Date, timeZone: string, { milliseconds = false } = {}): string {
  const parts = new Intl.DateTimeFormat("en-GB", {
    timeZone,
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    ...(milliseconds ? { second: "2-digit", fractionalSecondDigits: 3 } : {}),
    hourCycle: "h23",
    timeZoneName: "short",
  }).formatToParts(at);
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? "";
  const seconds = milliseconds ? `:${part("second")}.${part("fractionalSecond")}` : "";
  return `${part("year")}-${part("month")}-${part("day")} ${part("hour")}:${part("minute")}${seconds} ${part("timeZoneName")}`;
}


/** The value a datetime-local input shows for `at` on the clock of `timeZone`: "2026-07-01T13:00". */
export function clockInputValue(at: Date, timeZone: string): string {
  const parts = new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit", hour: "2-digit", minute: "2-digit", hourCycle: "h23" }).formatToParts(at);
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? "";
  return `${part("year")}-${part("month")}-${part("day")}T${part("hour")}:${part("minute")}`;
}

/** A datetime-local value read on the clock of `timeZone`, as ISO UTC; "" while unset or unreadable. */
export function isoFromClockInput(value: string, timeZone: string): string {
  if (!value) return "";
  const wall = Date.parse(`${value}:00Z`);
  return Number.isNaN(wall) ? "" : new Date(wallClockToEpoch(wall, timeZone)).toISOString();
}
