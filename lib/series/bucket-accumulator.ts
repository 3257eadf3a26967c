import { bucketIndex, type BucketGrid } from "./bucket-grid";

/**
 * The series response's columns. Only buckets that hold at least one reading appear: the chart
 * draws a gap wherever a bucket is missing, so a logger that was offline shows as a gap instead
 * of a line drawn through invented values.
 */
export interface SeriesBuckets {
  /** Bucket start, epoch ms. */
  t: number[];
  min: number[];
  max: number[];
  mean: number[];
  count: number[];
}

/**
 * Folds readings or roll-up rows, in time order, into the buckets of a grid. Inputs are plain
 * numbers and the columns are preallocated for the grid, so a year of one-minute readings costs no
 * allocation per reading.
 */
export interface BucketAccumulator {
  /** One stored reading; `value` is finite (readings without the quantity are skipped by the caller). */
  addValue(time: number, value: number): void;
  /**
   * One roll-up row keyed by the start of its period. Its resolution must divide the grid's width
   * (see `chooseSource`) so that the whole row lies in one bucket.
   */
  addAggregate(time: number, min: number, max: number, sum: number, count: number): void;
  /** The non-empty buckets so far, oldest first; mean = sum / count. */
  result(): SeriesBuckets;
}

/**
 * Throws a RangeError for a time outside [grid.start, grid.end) or earlier than the current
 * bucket: the query must read exactly the grid's range ordered by time, and anything else would
 * silently split a bucket in two.
 */
export function createBucketAccumulator(grid: BucketGrid): BucketAccumulator {
  const starts = new Float64Array(grid.count);
  const mins = new Float64Array(grid.count);
  const maxs = new Float64Array(grid.count);
  const sums = new Float64Array(grid.count);
  const counts = new Float64Array(grid.count);
  let filled = 0;
  let slot = -1;
  let bucketStart = -Infinity;
  let bucketEnd = -Infinity;

  function openBucket(time: number): void {
    if (!(time >= grid.start && time < grid.end)) {
      throw new RangeError(`Time ${time} lies outside the series grid [${grid.start}, ${grid.end}).`);
    }
    if (time < bucketStart) throw new RangeError(`Time ${time} comes before the bucket at ${bucketStart}: feed rows in time order.`);
    bucketStart = grid.start + bucketIndex(grid, time) * grid.width;
    bucketEnd = bucketStart + grid.width;
    slot = filled++;
    starts[slot] = bucketStart;
    mins[slot] = Infinity;
    maxs[slot] = -Infinity;
  }

  function addAggregate(time: number, min: number, max: number, sum: number, count: number): void {
    if (count === 0) return;
    if (!(time >= bucketStart && time < bucketEnd)) openBucket(time);
    if (min < mins[slot]!) mins[slot] = min;
    if (max > maxs[slot]!) maxs[slot] = max;
    sums[slot]! += sum;
    counts[slot]! += count;
  }

  return {
    addValue: (time, value) => addAggregate(time, value, value, value, 1),
    addAggregate,
    result() {
      const mean = new Array<number>(filled);
      for (let i = 0; i < filled; i++) mean[i] = sums[i]! / counts[i]!;
      return {
        t: Array.from(starts.subarray(0, filled)),
        min: Array.from(mins.subarray(0, filled)),
        max: Array.from(maxs.subarray(0, filled)),
        mean,
        count: Array.from(counts.subarray(0, filled)),
      };
    },
  };
}
