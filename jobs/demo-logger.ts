import { inArray, max } from "drizzle-orm";
import { getDb } from "@/db/client";
import { bursts, readings } from "@/db/schema";
import { DEMO_BURSTS, DEMO_SEED, DEMO_STRUCTURE_CODES, demoBurstStory, demoStory } from "@/db/seed";
import { syntheticBursts, syntheticReadings, type SyntheticBurst, type SyntheticReading } from "@/lib/demo";
import { ingestBursts } from "@/lib/services/bursts";
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

async function lastBurstStarts(gaugeIds: number[]): Promise<Map<number, number>> {
  if (gaugeIds.length === 0) return new Map();
  const rows = await getDb().select({ gaugeId: bursts.gaugeId, last: max(bursts.start) }).from(bursts).where(inArray(bursts.gaugeId, gaugeIds)).groupBy(bursts.gaugeId);
  return new Map(rows.flatMap((row) => (row.last === null ? [] : [[row.gaugeId, row.last] as const])));
}

const BURST_STEP_MS = DEMO_BURSTS.everyMinutes * 60_000;
const BURST_MS = DEMO_BURSTS.burstSeconds * 1000;
/**
 * After the demo was stopped, its dynamic gauges resume with the last hour's bursts (a dozen each)
 * rather than replaying days of samples at 100 Hz on a small machine: the gap is a logger's gap.
 */
const MAX_BURST_CATCH_UP_MS = 3_600_000;

/**
 * The demo's dynamic gauges, on the seed's grid of bursts: each burst that has ended by `now` and is
 * newer than the gauge's last. Each burst is made from its own place on the grid (the seed and its
 * index), so two instances, or a run repeated, make the same burst, and a resent one is a duplicate.
 */
async function sendDemoBursts(code: string, now: number, signal?: AbortSignal): Promise<number> {
  const story = await demoBurstStory(code);
  if (!story) return 0;
  const active = story.gauges.filter((gauge) => !gauge.retired);
  const lastOf = await lastBurstStarts(active.map((gauge) => gauge.gaugeId));
  const latest = Math.floor((now - BURST_MS - story.start) / BURST_STEP_MS);
  const batch: SyntheticBurst[] = [];
  for (const gauge of active) {
    const last = lastOf.get(gauge.gaugeId);
    const after = last === undefined ? latest - 1 : Math.floor((last - story.start) / BURST_STEP_MS);
    const first = Math.max(after + 1, latest - MAX_BURST_CATCH_UP_MS / BURST_STEP_MS + 1);
    for (let index = first; index <= latest && !signal?.aborted; index++) {
      const start = story.start + index * BURST_STEP_MS;
      batch.push(...syntheticBursts({ start, count: 1, seed: DEMO_SEED + index, ...DEMO_BURSTS, gauges: [gauge] }));
    }
  }
  if (batch.length === 0) return 0;
  return (await ingestBursts(story.target, batch, now)).bursts;
}

function byInterval<Gauge extends { intervalMs: number }>(gauges: readonly Gauge[]): Gauge[][] {
  const groups = new Map<number, Gauge[]>();
  for (const gauge of gauges) groups.set(gauge.intervalMs, [...(groups.get(gauge.intervalMs) ?? []), gauge]);
  return [...groups.values()];
}

/**
 * The demo's logger: for every active demo gauge, the synthetic readings due since its last stored
 * one, up to `now`, on the gauge's own interval, through the ingestion service like any logger's;
 * for the dynamic gauges, their bursts due, through the burst service.
 * The readings continue the seeded story (same seed, same start), so the demo never goes stale. A
 * gauge that never reported starts at the current interval: its history is the seed's to write.
 * Two instances are kept apart by the job's lease; a reading sent twice is a duplicate anyway.
 */
export async function runDemoLogger(now = Date.now(), signal?: AbortSignal): Promise<string> {
  let sent = 0;
  let burstsSent = 0;
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
    burstsSent += await sendDemoBursts(code, now, signal);
  }
  return `${sent} demo readings and ${burstsSent} bursts sent`;
}
