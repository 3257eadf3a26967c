import { addDays, addMonths, startOfDay, startOfMonth } from "date-fns";
import { tz, tzOffset, TZDate } from "@date-fns/tz";

/**
 * The one way the product shows time. A moment reads "2026-12-02 06:10 CET": the clock on site,
 * named, so a reader abroad knows which clock; a day reads "2026-12-02". Every page, chart, e-mail,
 * PDF and CSV a person reads takes its text from here, in the structure's zone (or, on pages about
 * no structure, the configured default zone), while stored instants and the API stay in UTC.
 * Days are the zone's calendar days, so a day across a daylight-saving change has 23 or 25 hours.
 */

/** How finely a moment is shown: minutes on pages and in mail, seconds or milliseconds where events are that close. */
export type Precision = "minute" | "second" | "millisecond";

/** The short parts a chart axis shows beside a line naming the day or year (see lib/series/time-labels.ts). */
export type AxisPart = "year" | "month" | "monthDay" | "minute" | "second" | "day";

type Moment = Date | number;
const epochMs = (at: Moment) => (typeof at === "number" ? at : at.getTime());

// `tz(zone)` builds the zone's date constructor for date-fns's calendar arithmetic.
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
function nameOfZone(ms: number, timeZone: string): string {
  let namer = zoneNamers.get(timeZone);
  if (!namer) {
    namer = new Intl.DateTimeFormat("en-GB", { timeZone, timeZoneName: "short" });
    zoneNamers.set(timeZone, namer);
  }
  return namer.formatToParts(ms).find((part) => part.type === "timeZoneName")?.value ?? timeZone;
}

/**
 * A zone's offset and name hold for a whole UTC quarter hour: offsets are whole quarter hours and
 * clocks change on whole local hours or half hours. Caching them per quarter hour makes a moment's
 * text cost about a microsecond, where date-fns's `format` on a TZDate costs some 60 (measured), which
 * matters to a CSV of a million readings and to chart labels redrawn under the cursor.
 */
const QUARTER_HOUR = 900_000;
const zoneStates = new Map<string, { offsetMs: number; name: string }>();
const ZONE_STATE_LIMIT = 100_000;
function zoneAt(ms: number, timeZone: string) {
  const key = `${timeZone} ${Math.floor(ms / QUARTER_HOUR)}`;
  let state = zoneStates.get(key);
  if (!state) {
    if (zoneStates.size >= ZONE_STATE_LIMIT) zoneStates.clear();
    state = { offsetMs: tzOffset(timeZone, new Date(ms)) * 60_000, name: nameOfZone(ms, timeZone) };
    zoneStates.set(key, state);
  }
  return state;
}

const pad = (value: number, width = 2) => String(value).padStart(width, "0");

/** The zone's wall clock at a moment, as text fields. */
function wallClock(at: Moment, timeZone: string) {
  const ms = epochMs(at);
  const { offsetMs, name } = zoneAt(ms, timeZone);
  const local = new Date(ms + offsetMs);
  return {
    year: pad(local.getUTCFullYear(), 4),
    month: pad(local.getUTCMonth() + 1),
    day: pad(local.getUTCDate()),
    hour: pad(local.getUTCHours()),
    minute: pad(local.getUTCMinutes()),
    second: pad(local.getUTCSeconds()),
    millisecond: pad(local.getUTCMilliseconds(), 3),
    name,
  };
}

/** The zone's short name at a moment: "CET", "CEST", "BST", "UTC", or an offset such as "GMT+5:30". */
export function zoneName(at: Moment, timeZone: string): string {
  return zoneAt(epochMs(at), timeZone).name;
}

/** "2026-12-02 06:10 CET": a moment on the zone's clock with the zone named. */
export function formatInTimeZone(at: Moment, timeZone: string, { precision = "minute" }: { precision?: Precision } = {}): string {
  const c = wallClock(at, timeZone);
  const seconds = precision === "minute" ? "" : precision === "second" ? `:${c.second}` : `:${c.second}.${c.millisecond}`;
  return `${c.year}-${c.month}-${c.day} ${c.hour}:${c.minute}${seconds} ${c.name}`;
}

/** "2026-12-02": the zone's calendar day a moment falls in. */
export function dayOf(at: Moment, timeZone: string): string {
  const c = wallClock(at, timeZone);
  return `${c.year}-${c.month}-${c.day}`;
}

/** One part of a chart's time axis ("2026", "2026-03", "03-02", "14:30", "14:30:15", "2026-03-02") on the zone's clock. */
export function axisText(at: Moment, timeZone: string, part: AxisPart): string {
  const c = wallClock(at, timeZone);
  switch (part) {
    case "year":
      return c.year;
    case "month":
      return `${c.year}-${c.month}`;
    case "monthDay":
      return `${c.month}-${c.day}`;
    case "minute":
      return `${c.hour}:${c.minute}`;
    case "second":
      return `${c.hour}:${c.minute}:${c.second}`;
    case "day":
      return `${c.year}-${c.month}-${c.day}`;
  }
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

const WALL_CLOCK_INPUT = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/;

/** A date-and-time field's value ("2026-03-10T09:00", as `<input type="datetime-local">` gives it) read on the zone's clock, as ISO UTC; "" while unset or unreadable. */
export function wallClockInputToIso(value: string, timeZone: string): string {
  const match = WALL_CLOCK_INPUT.exec(value);
  if (!match) return "";
  const [year, month, date, hour, minute, second = 0] = match.slice(1).map((part) => (part === undefined ? undefined : Number(part))) as number[];
  return new Date(new TZDate(year!, month! - 1, date!, hour!, minute!, second, timeZone).getTime()).toISOString();
}

const dayStarts = new Map<string, number>();
/** The start of the zone's day holding a moment (remembered per day: grouping thousands of rows by day asks for few). */
export function startOfZoneDay(at: Moment, timeZone: string): Date {
  const key = `${timeZone} ${dayOf(at, timeZone)}`;
  let start = dayStarts.get(key);
  if (start === undefined) {
    if (dayStarts.size >= ZONE_STATE_LIMIT) dayStarts.clear();
    start = startOfDay(epochMs(at), inZone(timeZone)).getTime();
    dayStarts.set(key, start);
  }
  return new Date(start);
}

/** A calendar month, `month` 1–12. */
export type Month = { year: number; month: number };

/** The calendar month a moment falls in on the zone's clocks. */
export function monthOf(at: Moment, timeZone: string): Month {
  const c = wallClock(at, timeZone);
  return { year: Number(c.year), month: Number(c.month) };
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
  const ms = epochMs(at);
  const local = new Date(ms + zoneAt(ms, timeZone).offsetMs);
  return new Date(local.getUTCFullYear(), local.getUTCMonth(), local.getUTCDate(), local.getUTCHours(), local.getUTCMinutes(), local.getUTCSeconds(), local.getUTCMilliseconds());
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
