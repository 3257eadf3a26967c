import { DAY, MINUTE, SECOND } from "./bucket-grid";

/**
 * Chart times as people on site read them: day-first (like every date in the app) and on the
 * structure's clock, whatever zone the browser is in. Times arrive in epoch seconds, as uPlot
 * keeps them. Intl carries the IANA time zone data, so no library is needed.
 */

const STYLES = {
  year: { year: "numeric" },
  month: { month: "short" },
  day: { day: "numeric", month: "short" },
  dayOfYear: { day: "numeric", month: "short", year: "numeric" },
  minute: { hour: "2-digit", minute: "2-digit", hourCycle: "h23" },
  second: { hour: "2-digit", minute: "2-digit", second: "2-digit", hourCycle: "h23" },
  moment: { dateStyle: "medium", timeStyle: "short", hourCycle: "h23" },
  // Numeric fields of the zone's wall clock; h23, since en-US would call midnight hour 24.
  fields: { year: "numeric", month: "numeric", day: "numeric", hour: "numeric", minute: "numeric", second: "numeric", hourCycle: "h23" },
} as const satisfies Record<string, Intl.DateTimeFormatOptions>;
type Style = keyof typeof STYLES;

// A formatter costs far more to build than to use, and uPlot asks for thousands of dates per redraw.
const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(style: Style, timeZone: string): Intl.DateTimeFormat {
  const key = `${style} ${timeZone}`;
  let found = formatters.get(key);
  if (!found) {
    found = new Intl.DateTimeFormat(style === "fields" ? "en-US" : "en-GB", { ...STYLES[style], timeZone });
    formatters.set(key, found);
  }
  return found;
}

const format = (style: Style, seconds: number, timeZone: string) => formatter(style, timeZone).format(seconds * SECOND);

/**
 * A Date whose local fields (getHours() and so on) show the zone's wall clock at `seconds`: uPlot
 * places its ticks at whole days and hours of such a Date (its `tzDate` option).
 */
export function zoneWallClock(seconds: number, timeZone: string): Date {
  const field = Object.fromEntries(
    formatter("fields", timeZone)
      .formatToParts(seconds * SECOND)
      .map((part) => [part.type, Number(part.value)]),
  );
  return new Date(field.year!, field.month! - 1, field.day!, field.hour!, field.minute!, field.second!);
}

/**
 * What a tick shows at each spacing, coarsest first (uPlot's own steps: a year is 365 days, a month
 * at least 28). The first tick, and any tick where the year or the day turns over, adds a second line
 * naming the year or the day, so a reader can place the short labels after it.
 */
const TICK_STYLES: readonly { from: number; label: Style; newYear?: Style; newDay?: Style }[] = [
  { from: 365 * DAY, label: "year" },
  { from: 28 * DAY, label: "month", newYear: "year" },
  { from: DAY, label: "day", newYear: "year" },
  { from: MINUTE, label: "minute", newYear: "dayOfYear", newDay: "day" },
  { from: 0, label: "second", newYear: "dayOfYear", newDay: "day" },
];

/** Time-axis labels for uPlot's ticks (`splits`, epoch seconds) `increment` seconds apart: "2026", "Mar", "2 Mar", "14:30". */
export function timeTickLabels(splits: readonly number[], increment: number, timeZone: string): string[] {
  const styles = TICK_STYLES.find((tick) => increment * SECOND >= tick.from)!;
  let previousYear: string | undefined;
  let previousDay: string | undefined;
  return splits.map((seconds) => {
    const year = format("year", seconds, timeZone);
    const day = format("dayOfYear", seconds, timeZone);
    const context = year !== previousYear ? styles.newYear : day !== previousDay ? styles.newDay : undefined;
    previousYear = year;
    previousDay = day;
    const label = format(styles.label, seconds, timeZone);
    return context ? `${label}\n${format(context, seconds, timeZone)}` : label;
  });
}

/** "1 Mar 2026, 14:30", the way the app's other dates read; a dash where the legend has no time to show. */
export function legendTime(seconds: number | null, timeZone: string): string {
  return seconds === null || !Number.isFinite(seconds) ? "—" : format("moment", seconds, timeZone);
}
