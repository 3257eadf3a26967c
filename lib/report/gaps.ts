import type { Span } from "./completeness";

const HOUR_MS = 3_600_000;

/** A run of consecutive hours without readings, [start, end) in epoch ms. */
export type Gap = { start: number; end: number; hours: number };

/**
 * Runs of whole hours inside the span with no reading, from the start times of the hourly
 * roll-ups that hold readings. Hours cut by the span's ends are left out, so an installation at
 * 10:50 does not make 10:00–11:00 look like a gap. A run shorter than the gauge's own interval is
 * no gap: a logger reading every two hours leaves every other hour empty by design.
 */
export function missingHourRuns(hoursWithData: Iterable<number>, span: Span | null, expectedIntervalS: number): Gap[] {
  if (!span) return [];
  const present = new Set(hoursWithData);
  const first = Math.ceil(span.start / HOUR_MS) * HOUR_MS;
  const end = Math.floor(span.end / HOUR_MS) * HOUR_MS;
  const runs: Gap[] = [];
  let runStart: number | null = null;
  const close = (at: number) => {
    if (runStart === null) return;
    const hours = (at - runStart) / HOUR_MS;
    if (hours * 3600 >= expectedIntervalS) runs.push({ start: runStart, end: at, hours });
    runStart = null;
  };
  for (let hour = first; hour < end; hour += HOUR_MS) {
    if (present.has(hour)) close(hour);
    else runStart ??= hour;
  }
  close(end);
  return runs;
}

/** The first `max` items and how many more there are, for lists a reader should not drown in. */
export function firstOf<T>(items: readonly T[], max: number): { shown: T[]; more: number } {
  return { shown: items.slice(0, max), more: Math.max(0, items.length - max) };
}

/** "3 h", "2 d 5 h": gap lengths as a reader takes them in. */
export function formatHours(hours: number): string {
  const days = Math.floor(hours / 24);
  const rest = hours % 24;
  if (days === 0) return `${rest} h`;
  return rest === 0 ? `${days} d` : `${days} d ${rest} h`;
}
