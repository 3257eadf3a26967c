import type { SensorFinding } from "./finding";

/**
 * Loggers report at a known interval but miss the odd one; `intervals` (k) is how many expected
 * intervals of silence are tolerated before the gauge counts as stale. Example only: k = 3.
 */
export interface StaleThresholds {
  readonly expectedIntervalMs: number;
  readonly intervals: number;
}

/**
 * Stale when nothing arrived for longer than k × the expected interval. `lastReadingAt` is the
 * last reading's time, or when monitoring began if the gauge never reported. Stateless: the clock
 * decides, so a stale-data job can call it between ingestion batches.
 */
export function checkStale(thresholds: StaleThresholds, lastReadingAt: number, now: number): SensorFinding | null {
  const silence = now - lastReadingAt;
  if (silence <= thresholds.intervals * thresholds.expectedIntervalMs) return null;
  return {
    kind: "sensor",
    code: "stale",
    event: "raised",
    time: now,
    message: `No reading for ${describeDuration(silence)}, more than ${thresholds.intervals} × the expected interval of ${describeDuration(thresholds.expectedIntervalMs)}; check the logger, its power and its link. Values shown are not current.`,
  };
}

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
const DAY = 24 * HOUR;

function describeDuration(ms: number): string {
  if (ms >= 2 * DAY) return `${Math.floor(ms / DAY)} days`;
  if (ms >= 2 * HOUR) return `${Math.floor(ms / HOUR)} hours`;
  if (ms >= 2 * MINUTE) return `${Math.floor(ms / MINUTE)} minutes`;
  return `${Math.round(ms / 1000)} seconds`;
}
