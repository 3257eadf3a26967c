/** A time span [start, end) in epoch ms. */
export type Span = { start: number; end: number };

/**
 * The part of the period in which the gauge was expected to send readings: from its installation
 * to its retirement, and never past `now` (readings of the future are not missing).
 */
export function activeSpan(life: { start: number; end: number | null }, period: Span, now: number): Span | null {
  const start = Math.max(life.start, period.start);
  const end = Math.min(life.end ?? Infinity, period.end, now);
  return end > start ? { start, end } : null;
}

/** Readings a logger sending every `intervalS` seconds delivers over the span (whole intervals only). */
export function expectedReadings(span: Span | null, intervalS: number): number {
  if (!span || intervalS <= 0) return 0;
  return Math.floor((span.end - span.start) / (intervalS * 1000));
}

/**
 * Received ÷ expected, null when nothing was expected. Not capped at 1: a logger sending more
 * often than its registered interval shows as over 100 %, which tells the engineer the interval
 * in the registry is wrong.
 */
export function completeness(received: number, expected: number): number | null {
  return expected > 0 ? received / expected : null;
}
