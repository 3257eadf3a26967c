/** How a gauge stands, worst first in `STATE_ORDER`, for markers, tables and the overview. */
export const STATE_ORDER = ["critical", "warning", "watch", "stale", "no-data", "ok", "retired"] as const;
export type GaugeState = (typeof STATE_ORDER)[number];

/** No reading for three expected intervals means the data stopped (common practice: more than one missed cycle). */
export const STALE_AFTER_INTERVALS = 3;
export const DEFAULT_EXPECTED_INTERVAL_S = 600;

export function isStale(lastReadingAt: number | null, expectedIntervalS: number | null, now: number): boolean {
  if (lastReadingAt === null) return false;
  return now - lastReadingAt > STALE_AFTER_INTERVALS * (expectedIntervalS ?? DEFAULT_EXPECTED_INTERVAL_S) * 1000;
}

export function gaugeState(input: {
  retired: boolean;
  openLevels: readonly string[];
  lastReadingAt: number | null;
  expectedIntervalS: number | null;
  now: number;
}): GaugeState {
  if (input.retired) return "retired";
  for (const level of ["critical", "warning", "watch"] as const) if (input.openLevels.includes(level)) return level;
  if (input.lastReadingAt === null) return "no-data";
  return isStale(input.lastReadingAt, input.expectedIntervalS, input.now) ? "stale" : "ok";
}

export function worstState(states: readonly GaugeState[]): GaugeState {
  const ranked = states.filter((state) => state !== "retired");
  if (ranked.length === 0) return "no-data";
  return ranked.reduce((worst, state) => (STATE_ORDER.indexOf(state) < STATE_ORDER.indexOf(worst) ? state : worst));
}
