/**
 * Time-series helpers for the series endpoint and the roll-ups behind it. Pure functions, no I/O.
 *
 *   const grid = bucketGrid(from, to, points);        // nice, epoch-aligned buckets, at most `points`
 *   const source = chooseSource(grid.width);          // "raw", "hourly" or "daily"
 *   const buckets = createBucketAccumulator(grid);
 *   for (const row of rowsOf(source, grid.start, grid.end)) buckets.addAggregate(row.t, row.min, row.max, row.sum, row.count);
 *   return { quantity, unit, from, to, ...buckets.result() };
 *
 * Ingestion keeps roll-ups current with `rollupKey` and `mergeAggregate`, in any order of arrival.
 */
export {
  DAY,
  DEFAULT_SERIES_POINTS,
  HOUR,
  MAX_SERIES_POINTS,
  MINUTE,
  NICE_BUCKET_WIDTHS,
  SECOND,
  WEEK,
  alignToBucket,
  bucketGrid,
  bucketIndex,
  type BucketGrid,
} from "./bucket-grid";
export { EMPTY_AGGREGATE, aggregateOf, mergeAggregate, type Aggregate } from "./aggregate";
export { ROLLUP_RESOLUTIONS, chooseSource, rollupKey, type Rollup, type SeriesSource } from "./rollup";
export { createBucketAccumulator, type BucketAccumulator, type SeriesBuckets } from "./bucket-accumulator";
