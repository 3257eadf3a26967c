import "server-only";
import { getClient } from "@/db/client";
import { ROLLUP_RESOLUTIONS } from "@/lib/series";

const DAY_MS = ROLLUP_RESOLUTIONS.daily;

/** Aggregates one resolution's buckets of [from, to) straight from the readings table. */
function rebuildSql(resolution: number) {
  return `INSERT INTO rollups (gauge_id, resolution, bucket, count, strain_min, strain_max, strain_sum, stress_min, stress_max, stress_sum,
      temperature_count, temperature_min, temperature_max, temperature_sum, residual_count, residual_min, residual_max, residual_sum)
    SELECT gauge_id, ${resolution}, (t / ${resolution}) * ${resolution}, count(*), min(strain), max(strain), sum(strain), min(stress), max(stress), sum(stress),
      count(temperature), min(temperature), max(temperature), sum(temperature), count(residual), min(residual), max(residual), sum(residual)
    FROM readings WHERE t >= :from AND t < :to AND fault = 0 GROUP BY gauge_id, t / ${resolution}`;
}

/**
 * Rebuilds the hourly and daily roll-ups of one UTC day from the readings themselves, leaving out
 * faulty ones as ingestion does (and taking in those whose verdict was lifted). Ingestion
 * keeps them up to date as readings arrive; this nightly pass makes the stored summaries agree
 * with the readings again after anything that bypassed ingestion (a restored backup, a manual fix).
 */
export async function rebuildRollupsOfDay(dayStart: number): Promise<number> {
  const args = { from: dayStart, to: dayStart + DAY_MS };
  const results = await getClient().batch(
    [
      { sql: "DELETE FROM rollups WHERE bucket >= :from AND bucket < :to", args },
      { sql: rebuildSql(ROLLUP_RESOLUTIONS.hourly), args },
      { sql: rebuildSql(ROLLUP_RESOLUTIONS.daily), args },
    ],
    "write",
  );
  return results[1]!.rowsAffected + results[2]!.rowsAffected;
}

/** The nightly run: yesterday, in UTC, whose readings have all arrived by now in the normal case. */
export async function runRollupMaintenance(now = Date.now()): Promise<string> {
  const yesterday = Math.floor(now / DAY_MS) * DAY_MS - DAY_MS;
  const rows = await rebuildRollupsOfDay(yesterday);
  return `${rows} roll-up rows rebuilt for ${new Date(yesterday).toISOString().slice(0, 10)}`;
}
