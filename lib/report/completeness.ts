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
 * Received ÷ expected, null when nothing was expected, and never above 1: readings arriving more
 * often than the registered interval do not make up for hours without any (the surplus is
 * reported apart, as it tells the engineer the registered interval is wrong).
 */
export function completeness(received: number, expected: number): number | null {
  return expected > 0 ? Math.min(received, expected) / expected : null;
}
