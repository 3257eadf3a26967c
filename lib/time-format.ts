import { addDays, addMonths, format, startOfDay, startOfMonth } from "date-fns";
import { tz, TZDate } from "@date-fns/tz";

/**
 * The one way the product shows time. A moment reads "2026-12-02 06:10 CET": the clock on site,
 * named, so a reader abroad knows which clock; a day reads "2026-12-02". Every page, chart, e-mail,
 * PDF and CSV a person reads takes its text from here, in the structure's zone (or, on pages about
 * no structure, the configured default zone), while stored instants and the API stay in UTC.
 * Days are the zone's calendar days, so a day across a daylight-saving change has 23 or 25 hours.
 */

/** How finely a moment is shown: minutes on pages and in mail, seconds or milliseconds where events are that close. */
export type Precision = "minute" | "second" | "millisecond";

const MOMENT_PATTERNS: Record<Precision, string> = {
  minute: "yyyy-MM-dd HH:mm",
  second: "yyyy-MM-dd HH:mm:ss",
  millisecond: "yyyy-MM-dd HH:mm:ss.SSS",
};
const DAY_PATTERN = "yyyy-MM-dd";

/** The short parts a chart axis shows beside a line naming the day or year (see lib/series/time-labels.ts). */
export type AxisPart = "year" | "month" | "monthDay" | "minute" | "second" | "day";
const AXIS_PATTERNS: Record<AxisPart, string> = {
  year: "yyyy",
  month: "yyyy-MM",
  monthDay: "MM-dd",
  minute: "HH:mm",
  second: "HH:mm:ss",
  day: DAY_PATTERN,
};

type Moment = Date | number;

// `tz(zone)` builds the zone's date constructor; uPlot asks for thousands of labels per redraw.
const zoneContexts = new Map<string, ReturnType<typeof tz>>();
function inZone(timeZone: string) {
  let context = zoneContexts.get(timeZone);
  if (!context) {
    context = tz(timeZone);
    zoneContexts.set(timeZone, context);
  }
  return { in: context };
}

// British English names the zones of Europe (CET, BST, GMT) and otherwise gives the offset ("GMT-5"): never an invented abbreviation.
const zoneNamers = new Map<string, Intl.DateTimeFormat>();
/** The zone's short name at a moment: "CET", "CEST", "BST", "UTC", or an offset such as "GMT+5:30". */
export function zoneName(at: Moment, timeZone: string): string {
  let namer = zoneNamers.get(timeZone);
  if (!namer) {
    namer = new Intl.DateTimeFormat("en-GB", { timeZone, timeZoneName: "short" });
    zoneNamers.set(timeZone, namer);
  }
  return namer.formatToParts(at).find((part) => part.type === "timeZoneName")?.value ?? timeZone;
}

/** "2026-12-02 06:10 CET": a moment on the zone's clock with the zone named. */
export function formatInTimeZone(at: Moment, timeZone: string, { precision = "minute" }: { precision?: Precision } = {}): string {
  return `${format(at, MOMENT_PATTERNS[precision], inZone(timeZone))} ${zoneName(at, timeZone)}`;
}

/** "2026-12-02": the zone's calendar day a moment falls in. */
export function dayOf(at: Moment, timeZone: string): string {
  return format(at, DAY_PATTERN, inZone(timeZone));
}

/** One part of a chart's time axis ("2026", "2026-03", "03-02", "14:30", "14:30:15", "2026-03-02") on the zone's clock. */
export function axisText(at: Moment, timeZone: string, part: AxisPart): string {
  return format(at, AXIS_PATTERNS[part], inZone(timeZone));
}

const DAY_TEXT = /^(\d{4})-(\d{2})-(\d{2})$/;

function dayParts(day: string): [number, number, number] {
  const match = DAY_TEXT.exec(day);
  if (!match) throw new RangeError(`A day reads YYYY-MM-DD, not "${day}".`);
  return [Number(match[1]), Number(match[2]), Number(match[3])];
}

/** The moment the zone's day "2026-03-29" begins (its local midnight, or the first moment after it where a change skips midnight). */
export function dayStart(day: string, timeZone: string): Date {
  const [year, month, date] = dayParts(day);
  return new Date(startOfDay(new TZDate(year, month - 1, date, 12, timeZone)).getTime());
}

/** The moment after the zone's day "2026-03-29" ends: the next day's start (23 hours later on a spring-forward day). */
export function dayEnd(day: string, timeZone: string): Date {
  return new Date(addDays(dayStart(day, timeZone), 1, inZone(timeZone)).getTime());
}

/** The moment the zone's clocks show `hour`:`minute` on `day`. */
export function atWallClock(day: string, hour: number, minute: number, timeZone: string): Date {
  const [year, month, date] = dayParts(day);
  return new Date(new TZDate(year, month - 1, date, hour, minute, timeZone).getTime());
}

/** The start of the zone's day holding a moment. */
export function startOfZoneDay(at: Moment, timeZone: string): Date {
  return new Date(startOfDay(at, inZone(timeZone)).getTime());
}

/** A calendar month, `month` 1–12. */
export type Month = { year: number; month: number };

/** The calendar month a moment falls in on the zone's clocks. */
export function monthOf(at: Moment, timeZone: string): Month {
  const local = new TZDate(typeof at === "number" ? at : at.getTime(), timeZone);
  return { year: local.getFullYear(), month: local.getMonth() + 1 };
}

/** The moment the zone's month begins (its first local midnight), and the next month's. */
export function monthBounds({ year, month }: Month, timeZone: string): { from: Date; to: Date } {
  const first = startOfMonth(new TZDate(year, month - 1, 15, 12, timeZone));
  return { from: new Date(first.getTime()), to: new Date(addMonths(first, 1, inZone(timeZone)).getTime()) };
}

/**
 * A Date whose local fields (getHours() and so on) show the zone's wall clock at `at`: uPlot
 * places its ticks at whole days and hours of such a Date (its `tzDate` option).
 */
export function zoneWallClock(at: Moment, timeZone: string): Date {
  const local = new TZDate(typeof at === "number" ? at : at.getTime(), timeZone);
  return new Date(local.getFullYear(), local.getMonth(), local.getDate(), local.getHours(), local.getMinutes(), local.getSeconds(), local.getMilliseconds());
}

/** Whether the runtime's time zone data knows an IANA name (or "UTC"). */
export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat("en", { timeZone: name });
    return true;
  } catch {
    return false;
  }
}
