import { alignToBucket, DAY, HOUR } from "./bucket-grid";

/** Roll-up resolutions kept per gauge, in ms; rows are keyed by the start of their period. */
export const ROLLUP_RESOLUTIONS = { hourly: HOUR, daily: DAY } as const;
export type Rollup = keyof typeof ROLLUP_RESOLUTIONS;
export type SeriesSource = "raw" | Rollup;

const ALL_ROLLUPS: readonly Rollup[] = ["hourly", "daily"];

/** The roll-up row (start of its UTC hour or day) a reading at `time` belongs to. */
export function rollupKey(time: number, rollup: Rollup): number {
  return alignToBucket(time, ROLLUP_RESOLUTIONS[rollup]);
}

/**
 * Where to read a series from: the coarsest available roll-up whose resolution divides the bucket
 * width, so that each bucket is an exact union of roll-up rows (rows and buckets are both aligned
 * to the epoch) and its min and max are exact; raw readings when none does.
 */
export function chooseSource(bucketWidth: number, available: readonly Rollup[] = ALL_ROLLUPS): SeriesSource {
  let best: SeriesSource = "raw";
  for (const rollup of available) {
    const resolution = ROLLUP_RESOLUTIONS[rollup];
    if (bucketWidth % resolution === 0 && (best === "raw" || resolution > ROLLUP_RESOLUTIONS[best])) best = rollup;
  }
  return best;
}
