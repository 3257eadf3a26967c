/** No reading for three expected intervals means the data stopped (common practice: more than one missed cycle). */
export const STALE_AFTER_INTERVALS = 3;
export const DEFAULT_EXPECTED_INTERVAL_S = 600;

export function isStale(lastReadingAt: number | null, expectedIntervalS: number | null, now: number): boolean {
  if (lastReadingAt === null) return false;
  return now - lastReadingAt > STALE_AFTER_INTERVALS * (expectedIntervalS ?? DEFAULT_EXPECTED_INTERVAL_S) * 1000;
}
