import type { Limit } from "./limit";

/** The bound a value is beyond (strictly above `upper` or strictly below `lower`), or null. */
export function crossedBound(limit: Limit<string>, value: number): number | null {
  if (limit.upper !== undefined && value > limit.upper) return limit.upper;
  if (limit.lower !== undefined && value < limit.lower) return limit.lower;
  return null;
}

/**
 * Values at which an open alert counts as back to normal: inside the innermost bound on each side
 * by that bound's hysteresis (the dead band of common practice). With levels escalating outward the
 * innermost bounds are the lowest level's; taking each side separately also covers a set whose
 * lowest level bounds one side only. ±Infinity where no limit bounds a side.
 */
export interface ClearBand {
  readonly upper: number;
  readonly lower: number;
}

/** `limits` mildest level first, so that on a tie the lowest level's hysteresis applies. */
export function clearBand(limits: readonly Limit<string>[]): ClearBand {
  let upper = Infinity;
  let lower = -Infinity;
  let innermostUpper = Infinity;
  let innermostLower = -Infinity;
  for (const limit of limits) {
    if (limit.upper !== undefined && limit.upper < innermostUpper) {
      innermostUpper = limit.upper;
      upper = limit.upper - limit.hysteresis;
    }
    if (limit.lower !== undefined && limit.lower > innermostLower) {
      innermostLower = limit.lower;
      lower = limit.lower + limit.hysteresis;
    }
  }
  return { upper, lower };
}

export function isInside(band: ClearBand, value: number): boolean {
  return value <= band.upper && value >= band.lower;
}

/** How far a value lies outside the clear band (negative inside): the measure of "most extreme". */
export function distanceOutside(band: ClearBand, value: number): number {
  return Math.max(value - band.upper, band.lower - value);
}
