import { ROLLUP_RESOLUTIONS, rollupKey, type Rollup } from "@/lib/series";
import { selectRows, type GaugeRows } from "./batch";

/** Columns of the rollups table, in the order `rollupValues` lays them out. */
export const ROLLUP_COLUMNS = [
  "gauge_id",
  "resolution",
  "bucket",
  "count",
  "strain_min",
  "strain_max",
  "strain_sum",
  "stress_min",
  "stress_max",
  "stress_sum",
  "temperature_count",
  "temperature_min",
  "temperature_max",
  "temperature_sum",
  "residual_count",
  "residual_min",
  "residual_max",
  "residual_sum",
] as const;

const ROLLUPS = Object.keys(ROLLUP_RESOLUTIONS) as Rollup[];

/**
 * The roll-up rows of newly stored readings (time-ordered, as GaugeRows are), one per touched
 * hour and day, as flat SQL parameters appended to `out`. They are merged into stored rows by
 * min/max/sum/count, which do not depend on order, so late readings need nothing special.
 * Returns the number of rows appended. A reading whose strain or stress is not finite is left out
 * (ingestion rejects such readings first): one Infinity would make every later sum of its
 * bucket Infinity or NaN, which SQLite stores as NULL.
 */
export function appendRollupValues(rows: GaugeRows, out: (number | null)[]): number {
  const finite = finiteRows(rows);
  const { time, strain, stress, temperature, residual } = finite;
  let appended = 0;
  for (const rollup of ROLLUPS) {
    for (let start = 0; start < time.length; ) {
      const bucket = rollupKey(time[start]!, rollup);
      let end = start + 1;
      while (end < time.length && rollupKey(time[end]!, rollup) === bucket) end++;
      out.push(finite.gaugeId, ROLLUP_RESOLUTIONS[rollup], bucket, end - start);
      pushRange(out, strain, start, end);
      pushRange(out, stress, start, end);
      pushOptional(out, temperature, start, end);
      pushOptional(out, residual, start, end);
      appended++;
      start = end;
    }
  }
  return appended;
}

function finiteRows(rows: GaugeRows): GaugeRows {
  const { strain, stress } = rows;
  let allFinite = true;
  for (let i = 0; i < strain.length && allFinite; i++) allFinite = Number.isFinite(strain[i]) && Number.isFinite(stress[i]);
  if (allFinite) return rows;
  return selectRows(rows, Array.from(strain.keys()).filter((i) => Number.isFinite(strain[i]) && Number.isFinite(stress[i])));
}

function pushRange(out: (number | null)[], values: readonly number[], start: number, end: number) {
  let min = Infinity;
  let max = -Infinity;
  let sum = 0;
  for (let i = start; i < end; i++) {
    const value = values[i]!;
    if (value < min) min = value;
    if (value > max) max = value;
    sum += value;
  }
  out.push(min, max, sum);
}

/** Temperature and residual are optional per reading: each has its own count, and nulls when no reading had one. */
function pushOptional(out: (number | null)[], values: readonly (number | null)[], start: number, end: number) {
  let count = 0;
  let min = Infinity;
  let max = -Infinity;
  let sum = 0;
  for (let i = start; i < end; i++) {
    const value = values[i];
    if (value == null || !Number.isFinite(value)) continue;
    count++;
    if (value < min) min = value;
    if (value > max) max = value;
    sum += value;
  }
  if (count === 0) out.push(0, null, null, null);
  else out.push(count, min, max, sum);
}
