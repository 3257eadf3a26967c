import { dayEnd, dayOf, dayStart, monthBounds, monthOf, type Month } from "@/lib/time-format";

/**
 * Report periods. A period is whole days of the structure's time zone [from, to): a November
 * report of a site in Europe/Berlin runs from 1 November 00:00 CET to 1 December 00:00 CET, and
 * a day across a daylight-saving change has 23 or 25 hours. The instants stay UTC; the days are
 * the site's.
 */

export type { Month };

export type ReportPeriod = { from: Date; to: Date; timeZone: string };

/** What a reader asks for before the structure's zone is known: a month, or a first and last day (both included). */
export type PeriodRequest = { month: Month } | { firstDay: string; lastDay: string };

/** How a built report names its period: enough to ask for the same period again. */
export type PeriodDays = { key: string; firstDay: string; lastDay: string };

const MONTH_NAMES = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];

/** `count` months before `month`, the nearest first. */
export function monthsBefore(month: Month, count: number): Month[] {
  return Array.from({ length: count }, (_, i) => {
    const index = month.year * 12 + (month.month - 1) - (i + 1);
    return { year: Math.floor(index / 12), month: (index % 12) + 1 };
  });
}

/** The month as days of the zone: from its first local midnight to the next month's. */
export function monthPeriod(month: Month, timeZone: string): ReportPeriod {
  return { ...monthBounds(month, timeZone), timeZone };
}

/** The zone's days from `firstDay` to `lastDay`, both included. */
export function daysPeriod(firstDay: string, lastDay: string, timeZone: string): ReportPeriod {
  return { from: dayStart(firstDay, timeZone), to: dayEnd(lastDay, timeZone), timeZone };
}

export function resolvePeriod(request: PeriodRequest, timeZone: string): ReportPeriod {
  return "month" in request ? monthPeriod(request.month, timeZone) : daysPeriod(request.firstDay, request.lastDay, timeZone);
}

/** The report period of the calendar month before the one `now` falls in at the structure. */
export function previousMonthPeriod(now: Date, timeZone: string): ReportPeriod {
  return monthPeriod(monthsBefore(monthOf(now, timeZone), 1)[0]!, timeZone);
}

/** "2026-11". */
export function monthKey({ year, month }: Month): string {
  return `${year}-${String(month).padStart(2, "0")}`;
}

export function monthName({ year, month }: Month): string {
  return `${MONTH_NAMES[month - 1]} ${year}`;
}

/** The first day a period includes, on the zone's calendar. */
export function firstDay(period: ReportPeriod): string {
  return dayOf(period.from, period.timeZone);
}

/** The last day a period includes (its end, a local midnight, is excluded). */
export function lastDay(period: ReportPeriod): string {
  return dayOf(period.to.getTime() - 1, period.timeZone);
}

/** The month a period is exactly, or null for any other run of days. */
export function wholeMonthOf(period: ReportPeriod): Month | null {
  const month = monthOf(period.from, period.timeZone);
  const exact = monthBounds(month, period.timeZone);
  return exact.from.getTime() === period.from.getTime() && exact.to.getTime() === period.to.getTime() ? month : null;
}

function dayName(day: string): string {
  const [year, month, date] = day.split("-").map(Number) as [number, number, number];
  return `${date} ${MONTH_NAMES[month - 1]} ${year}`;
}

/** "November 2026", "3 November 2026", or "3 November 2026 to 15 November 2026" (both days included). */
export function periodName(period: ReportPeriod): string {
  const month = wholeMonthOf(period);
  if (month) return monthName(month);
  const [first, last] = [firstDay(period), lastDay(period)];
  return first === last ? dayName(first) : `${dayName(first)} to ${dayName(last)}`;
}

/** For file names and de-duplication: "2026-11" for a month, else "2026-11-03_2026-11-15" (first and last day). */
export function periodKey(period: ReportPeriod): string {
  const month = wholeMonthOf(period);
  return month ? monthKey(month) : `${firstDay(period)}_${lastDay(period)}`;
}

/** The days and key of a period, as the report carries them. */
export function periodDays(period: ReportPeriod): PeriodDays {
  return { key: periodKey(period), firstDay: firstDay(period), lastDay: lastDay(period) };
}

/** "2026-11" when the period is that whole month, else null. */
export function wholeMonthKey({ key }: PeriodDays): string | null {
  return /^\d{4}-\d{2}$/.test(key) ? key : null;
}

/** The query string naming the period for the report page and API: "month=2026-11", or "from=…&to=…" (last day included). */
export function periodQuery(days: PeriodDays): string {
  const month = wholeMonthKey(days);
  return month ? `month=${month}` : `from=${days.firstDay}&to=${days.lastDay}`;
}
