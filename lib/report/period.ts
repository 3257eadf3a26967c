/**
 * Report periods. A period is whole UTC days [from, to): the daily roll-ups are UTC days, so their
 * min, max and counts cover such a period exactly. A month is picked in the structure's time zone
 * (on 1 December in Europe/London the previous month is November) and then covers the UTC days of
 * that month, so on a site east or west of UTC the report starts and ends a few hours off local
 * midnight; the page and the PDF say so.
 */

const DAY_MS = 86_400_000;

export type ReportPeriod = { from: Date; to: Date };

/** A calendar month, `month` 1–12. */
export type Month = { year: number; month: number };

const MONTH_NAMES = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];

/** The calendar month `at` falls in on the clocks of `timeZone`. */
export function monthIn(at: Date, timeZone: string): Month {
  const parts = new Intl.DateTimeFormat("en-GB", { timeZone, year: "numeric", month: "numeric" }).formatToParts(at);
  const value = (type: "year" | "month") => Number(parts.find((part) => part.type === type)!.value);
  return { year: value("year"), month: value("month") };
}

/** `count` months before `month`, the nearest first. */
export function monthsBefore(month: Month, count: number): Month[] {
  return Array.from({ length: count }, (_, i) => {
    const index = month.year * 12 + (month.month - 1) - (i + 1);
    return { year: Math.floor(index / 12), month: (index % 12) + 1 };
  });
}

export function monthPeriod({ year, month }: Month): ReportPeriod {
  return { from: new Date(Date.UTC(year, month - 1, 1)), to: new Date(Date.UTC(year, month, 1)) };
}

/** The report period of the calendar month before the one `now` falls in at the structure. */
export function previousMonthPeriod(now: Date, timeZone: string): ReportPeriod {
  return monthPeriod(monthsBefore(monthIn(now, timeZone), 1)[0]!);
}

/** "2026-11". */
export function monthKey({ year, month }: Month): string {
  return `${year}-${String(month).padStart(2, "0")}`;
}

export function monthName({ year, month }: Month): string {
  return `${MONTH_NAMES[month - 1]} ${year}`;
}

/** "2026-11-30": the UTC day of a moment. */
export function dayText(at: Date): string {
  return at.toISOString().slice(0, 10);
}

/** The last day a period includes (its end is excluded). */
export function lastDay(period: ReportPeriod): Date {
  return new Date(period.to.getTime() - DAY_MS);
}

/** The month a period is exactly, or null for any other run of days. */
export function wholeMonthOf(period: ReportPeriod): Month | null {
  const from = period.from;
  const month = { year: from.getUTCFullYear(), month: from.getUTCMonth() + 1 };
  const exact = monthPeriod(month);
  return exact.from.getTime() === from.getTime() && exact.to.getTime() === period.to.getTime() ? month : null;
}

function dayName(at: Date): string {
  return `${at.getUTCDate()} ${MONTH_NAMES[at.getUTCMonth()]} ${at.getUTCFullYear()}`;
}

/** "November 2026", "3 November 2026", or "3 November 2026 to 15 November 2026" (both days included). */
export function periodName(period: ReportPeriod): string {
  const month = wholeMonthOf(period);
  if (month) return monthName(month);
  const last = lastDay(period);
  return last.getTime() === period.from.getTime() ? dayName(last) : `${dayName(period.from)} to ${dayName(last)}`;
}

/** For file names and de-duplication: "2026-11" for a month, else "2026-11-03_2026-11-15" (first and last day). */
export function periodKey(period: ReportPeriod): string {
  const month = wholeMonthOf(period);
  return month ? monthKey(month) : `${dayText(period.from)}_${dayText(lastDay(period))}`;
}

/** Whether a moment is a UTC midnight, the only place a report period may start or end. */
export function isUtcMidnight(at: Date): boolean {
  return at.getTime() % DAY_MS === 0;
}

/** The query string naming the period for the report page and API: "month=2026-11", or "from=…&to=…" (last day included). */
export function periodQuery(period: ReportPeriod): string {
  const month = wholeMonthOf(period);
  return month ? `month=${monthKey(month)}` : `from=${dayText(period.from)}&to=${dayText(lastDay(period))}`;
}
