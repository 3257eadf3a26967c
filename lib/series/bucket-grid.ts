export const SECOND = 1000;
export const MINUTE = 60 * SECOND;
export const HOUR = 60 * MINUTE;
export const DAY = 24 * HOUR;
export const WEEK = 7 * DAY;

/** The series endpoint's `points`: default and ceiling, as the API documents them. */
export const DEFAULT_SERIES_POINTS = 1000;
export const MAX_SERIES_POINTS = 5000;

/**
 * Bucket widths a person reads at a glance on a time axis (common practice). Past a week, widths
 * continue as whole weeks. Every width from an hour up is a whole number of hours, and from a day
 * up a whole number of days, so buckets can be built from hourly or daily roll-ups.
 */
export const NICE_BUCKET_WIDTHS: readonly number[] = [
  SECOND, 2 * SECOND, 5 * SECOND, 10 * SECOND, 15 * SECOND, 30 * SECOND,
  MINUTE, 2 * MINUTE, 5 * MINUTE, 10 * MINUTE, 15 * MINUTE, 30 * MINUTE,
  HOUR, 2 * HOUR, 3 * HOUR, 6 * HOUR, 12 * HOUR,
  DAY, 2 * DAY, WEEK,
];

/**
 * Buckets [start + i·width, start + (i+1)·width) for i < count, covering a requested range.
 *
 * Alignment: every bucket starts at a whole multiple of its width counted from the Unix epoch, so
 * bucket edges do not move when the requested range shifts, and a day bucket is a UTC calendar
 * day (epoch milliseconds have no leap seconds). Week buckets therefore start on Thursdays 00:00
 * UTC, the epoch's weekday. The first and last bucket may stick out of the requested range: they
 * are whole buckets, and the caller reads [start, end) so that raw rows and roll-up rows give the
 * same answer.
 */
export interface BucketGrid {
  readonly width: number;
  readonly start: number;
  readonly end: number;
  readonly count: number;
}

/**
 * The grid of the finest nice width with at most `maxBuckets` buckets over [from, to), times in
 * epoch ms. Callers validate their input first, so a violated precondition is a programming error.
 */
export function bucketGrid(from: number, to: number, maxBuckets: number): BucketGrid {
  if (!Number.isSafeInteger(from) || !Number.isSafeInteger(to) || from < 0 || from >= to) {
    throw new RangeError(`A series range needs integer epoch ms with 0 ≤ from < to, got [${from}, ${to}).`);
  }
  if (!Number.isSafeInteger(maxBuckets) || maxBuckets < 1) {
    throw new RangeError(`A series needs at least one bucket, got ${maxBuckets}.`);
  }
  const width = finestWidth(from, to, maxBuckets);
  const start = alignToBucket(from, width);
  const count = alignedBucketCount(from, to, width);
  return { width, start, end: start + count * width, count };
}

/** The start of the bucket of `width` that holds `time`. */
export function alignToBucket(time: number, width: number): number {
  return Math.floor(time / width) * width;
}

/** Index of the grid's bucket holding `time`; outside [start, end) it falls outside [0, count). */
export function bucketIndex(grid: BucketGrid, time: number): number {
  return Math.floor((time - grid.start) / grid.width);
}

function alignedBucketCount(from: number, to: number, width: number): number {
  return Math.floor((to - 1) / width) - Math.floor(from / width) + 1;
}

function finestWidth(from: number, to: number, maxBuckets: number): number {
  const nice = NICE_BUCKET_WIDTHS.find((width) => alignedBucketCount(from, to, width) <= maxBuckets);
  if (nice !== undefined) return nice;
  // Alignment can add one bucket to ceil(span / width); the loop ends once one bucket holds [0, to).
  let weeks = Math.ceil((to - from) / (WEEK * maxBuckets));
  while (alignedBucketCount(from, to, weeks * WEEK) > maxBuckets) weeks++;
  return weeks * WEEK;
}
