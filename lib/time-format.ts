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

