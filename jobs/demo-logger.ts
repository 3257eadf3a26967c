import { inArray, max } from "drizzle-orm";
import { getDb } from "@/db/client";
import { readings } from "@/db/schema";
import { DEMO_SEED, DEMO_STRUCTURE_CODES, demoStory } from "@/db/seed";
import { syntheticReadings, type SyntheticReading } from "@/lib/demo";
import { ingestDecoded } from "@/lib/services/ingest";
import { findStructureByCode } from "@/lib/services/structures";

/** Readings per ingestion transaction, as the seed sends them. */
const BATCH = 5_000;
/** After the demo was stopped a long time, one run catches up this much and the next runs the rest. */
const MAX_READINGS_PER_RUN = 50_000;

async function lastReadingTimes(gaugeIds: number[]): Promise<Map<number, number>> {
  if (gaugeIds.length === 0) return new Map();
  const rows = await getDb()
    .select({ gaugeId: readings.gaugeId, last: max(readings.time) })
    .from(readings)
    .where(inArray(readings.gaugeId, gaugeIds))
    .groupBy(readings.gaugeId);
  return new Map(rows.flatMap((row) => (row.last === null ? [] : [[row.gaugeId, row.last] as const])));
}

function byInterval<Gauge extends { intervalMs: number }>(gauges: readonly Gauge[]): Gauge[][] {
  const groups = new Map<number, Gauge[]>();
  for (const gauge of gauges) groups.set(gauge.intervalMs, [...(groups.get(gauge.intervalMs) ?? []), gauge]);
  return [...groups.values()];
}

/**
 * The demo's logger: for every active demo gauge, the synthetic readings due since its last stored
 * one, up to `now`, on the gauge's own interval, through the ingestion service like any logger's.
 * The readings continue the seeded story (same seed, same start), so the demo never goes stale. A
 * gauge that never reported starts at the current interval: its history is the seed's to write.
 * Two instances are kept apart by the job's lease; a reading sent twice is a duplicate anyway.
 */
export async function runDemoLogger(now = Date.now(), signal?: AbortSignal): Promise<string> {
  let sent = 0;
  let budget = MAX_READINGS_PER_RUN;
  for (const code of DEMO_STRUCTURE_CODES) {
    if (!(await findStructureByCode(code))) continue;
    const { target, start, gauges } = await demoStory(code);
    const active = gauges.filter((gauge) => !gauge.retired);
    const lastOf = await lastReadingTimes(active.map((gauge) => gauge.gaugeId));
    for (const group of byInterval(active)) {
      const interval = group[0]!.intervalMs;
      const after = new Map(group.map((gauge) => [gauge.tag, lastOf.get(gauge.gaugeId) ?? now - interval]));
      const from = Math.min(...after.values()) + 1;
      const send = async (batch: SyntheticReading[]) => {
        if (batch.length > 0) sent += (await ingestDecoded(target, batch, now)).accepted;
      };
      let batch: SyntheticReading[] = [];
      for (const reading of syntheticReadings({ start, interval, seed: DEMO_SEED, gauges: group, from, until: now + 1 })) {
        if (reading.time <= after.get(reading.gauge)!) continue;
        if (budget-- === 0 || signal?.aborted) break;
        batch.push(reading);
        if (batch.length === BATCH) {
          await send(batch);
          batch = [];
        }
      }
      await send(batch);
    }
  }
  return `${sent} demo readings sent`;
}
