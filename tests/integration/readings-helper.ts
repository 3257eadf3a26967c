import { getClient } from "@/db/client";
import { ROLLUP_RESOLUTIONS } from "@/lib/series";

export type StoredReading = { time: number; stress: number; strain: number; temperature: number | null };

/** Rows per INSERT: 7 columns each, under SQLite's 32 766 bound parameters. */
const CHUNK = 4000;

/**
 * Stores readings as ingestion would, with the hourly and daily roll-ups rebuilt from them:
 * this branch has no ingestion service yet. The roll-ups come from one GROUP BY per resolution
 * (integer division keys a reading to the start of its UTC hour or day, as lib/series rollupKey
 * does), so they equal what merging the readings one at a time would give.
 */
export async function storeReadings(gaugeId: number, rows: StoredReading[]) {
  const client = getClient();
  for (let i = 0; i < rows.length; i += CHUNK) {
    const chunk = rows.slice(i, i + CHUNK);
    await client.execute({
      sql: `INSERT INTO readings (gauge_id, t, value, temperature, strain, stress, flags) VALUES ${chunk.map(() => "(?, ?, ?, ?, ?, ?, 0)").join(", ")}`,
      args: chunk.flatMap((r) => [gaugeId, r.time, r.strain, r.temperature, r.strain, r.stress]),
    });
  }
  for (const resolution of Object.values(ROLLUP_RESOLUTIONS)) {
    await client.execute({
      sql: `INSERT OR REPLACE INTO rollups
              (gauge_id, resolution, bucket, count, strain_min, strain_max, strain_sum, stress_min, stress_max, stress_sum,
               temperature_count, temperature_min, temperature_max, temperature_sum)
            SELECT gauge_id, ?, (t / ?) * ?, count(*), min(strain), max(strain), sum(strain), min(stress), max(stress), sum(stress),
                   count(temperature), min(temperature), max(temperature), sum(temperature)
            FROM readings WHERE gauge_id = ? GROUP BY t / ?`,
      args: [resolution, resolution, resolution, gaugeId, resolution],
    });
  }
}
