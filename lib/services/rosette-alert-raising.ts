import { eq, inArray } from "drizzle-orm";
import { bulkSql, type WriteTx } from "@/db/client";
import { rosetteEvaluationStates, rosetteLimits, rosettes, type Gauge, type Rosette } from "@/db/schema";
import { evaluateReadings, initialEpisodeState, type EpisodeState, type Reading, type RosetteLimitQuantity } from "@/lib/limits";
import { analyseRosette } from "@/lib/mechanics";
import { applyLimitEvent, type AlertCounts, type LimitEvent, type Notification } from "./alert-raising";
import { queueAlertMails } from "./alert-mail";
import { limitOfRow } from "./limits";
import { MATCHED_STRAINS } from "./rosette-series";
import type { RosetteLimit } from "./rosette-limits";

/** Per quantity, as the machine left it; `lastTime` is the last matched instant taken in. */
type RosetteEvaluationState = { lastTime: number | null; episodes: Partial<Record<RosetteLimitQuantity, EpisodeState>> };

/** The span of times one gauge received in this request. */
export type InsertedSpan = { gaugeId: number; first: number; last: number };

async function limitedRosettes(tx: WriteTx, structureId: number): Promise<Map<Rosette, RosetteLimit[]>> {
  const ofStructure = await tx.select().from(rosettes).where(eq(rosettes.structureId, structureId));
  const byRosette = new Map<Rosette, RosetteLimit[]>();
  if (ofStructure.length === 0) return byRosette;
  const rows = await tx.select().from(rosetteLimits).where(inArray(rosetteLimits.rosetteId, ofStructure.map((rosette) => rosette.id)));
  for (const rosette of ofStructure) {
    const limits = rows.filter((row) => row.rosetteId === rosette.id).map(limitOfRow);
    if (limits.length > 0) byRosette.set(rosette, limits);
  }
  return byRosette;
}

async function loadState(tx: WriteTx, rosetteId: number): Promise<RosetteEvaluationState> {
  const [row] = await tx.select().from(rosetteEvaluationStates).where(eq(rosetteEvaluationStates.rosetteId, rosetteId)).limit(1);
  return row ? (row.state as RosetteEvaluationState) : { lastTime: null, episodes: {} };
}

/**
 * Evaluates the limits of every rosette of the structure whose gauges received readings, inside
 * the ingestion transaction, from the instants at which all three gauges have a reading. Only
 * instants after the rosette's last evaluated one count: a late reading completing an older instant
 * is stored but not evaluated (no replay, unlike a gauge's limits), which keeps this to one range
 * query per rosette and request.
 */
export async function evaluateRosetteLimits(
  tx: WriteTx,
  structureId: number,
  gaugesById: ReadonlyMap<number, Gauge>,
  spans: readonly InsertedSpan[],
): Promise<AlertCounts> {
  const counts: AlertCounts = { opened: 0, escalated: 0, cleared: 0 };
  for (const [rosette, limits] of await limitedRosettes(tx, structureId)) {
    const touched = spans.filter((span) => [rosette.gaugeAId, rosette.gaugeBId, rosette.gaugeCId].includes(span.gaugeId));
    if (touched.length === 0) continue;
    const state = await loadState(tx, rosette.id);
    const start = Math.max(Math.min(...touched.map((span) => span.first)), state.lastTime === null ? -Infinity : state.lastTime + 1);
    const end = Math.max(...touched.map((span) => span.last));
    if (start > end) continue;
    const matched = await bulkSql(tx).rows(MATCHED_STRAINS, { a: rosette.gaugeAId, b: rosette.gaugeBId, c: rosette.gaugeCId, start, end: end + 1 });
    if (matched.length === 0) continue;
    const gaugeA = gaugesById.get(rosette.gaugeAId)!;
    const analyses = matched.map((row) => ({
      time: row[0] as number,
      analysis: analyseRosette(rosette.layout, [row[1] as number, row[2] as number, row[3] as number], gaugeA.material),
    }));
    const episodes = { ...state.episodes };
    const events: LimitEvent[] = [];
    for (const quantity of new Set(limits.map((limit) => limit.quantity))) {
      // an instant the analysis refuses (a non-finite strain) is skipped as a faulty reading would be
      const readings: Reading[] = analyses.map(({ time, analysis }) => (analysis.ok ? { time, value: analysis[quantity] } : { time, value: Number.NaN, fault: true }));
      const evaluation = evaluateReadings(
        limits.filter((limit) => limit.quantity === quantity),
        episodes[quantity] ?? initialEpisodeState(),
        readings,
      );
      episodes[quantity] = evaluation.state;
      events.push(...evaluation.events.map((event) => ({ ...event, quantity })));
    }
    events.sort((a, b) => a.time - b.time);
    const notifications: Notification[] = [];
    const subject = { gauge: gaugeA, rosette: { id: rosette.id, tag: rosette.tag } };
    for (const event of events) await applyLimitEvent(tx, subject, event, notifications, counts);
    const saved = { rosetteId: rosette.id, state: { lastTime: analyses.at(-1)!.time, episodes } satisfies RosetteEvaluationState };
    await tx.insert(rosetteEvaluationStates).values(saved).onConflictDoUpdate({ target: rosetteEvaluationStates.rosetteId, set: saved });
    await queueAlertMails(tx, gaugeA, notifications);
  }
  return counts;
}
