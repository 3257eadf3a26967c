import "server-only";
import { eq, inArray, sql } from "drizzle-orm";
import { bulkSql, type WriteTx } from "@/db/client";
import { gauges, rosetteEvaluationCheckpoints, rosetteEvaluationStates, rosetteLimits, rosettes, type Gauge, type Rosette } from "@/db/schema";
import {
  evaluateRosette,
  initialRosetteEvaluationState,
  type FaultTimesOfGauges,
  type MatchedInstant,
  type RosetteEvaluationState,
} from "@/lib/alerting/evaluate-rosette";
import { parseRosetteEvaluationState } from "@/lib/alerting/evaluation-state";
import { applyLimitEvents, type AlertCounts, type FaultTimesByGauge, type Notification } from "./alert-raising";
import { queueAlertMails } from "./alert-mail";
import { CHECKPOINTS_KEPT_MS, readableCheckpointBefore, dropCheckpointsAfter, nextCheckpoint, saveCheckpoints, type Checkpoint } from "./evaluation-checkpoints";
import { limitOfRow } from "./limits";
import { MATCHED_STRAINS, matchedInstantOf, matchedStrainsArgs } from "./rosette-series";
import type { RosetteLimit } from "./rosette-limits";

/** `lastCheckpointAt` is absent from states saved before rosettes kept checkpoints. */
type StoredRosetteState = RosetteEvaluationState & { lastCheckpointAt?: number | null };

/** The times one gauge received in this request, in order. */
export type InsertedTimes = { gaugeId: number; times: readonly number[] };

/** A rosette with limits whose gauges received readings in this request, and where its evaluation stands; `rebuild` when its stored state was unreadable. */
type RosetteContext = { rosette: Rosette; gaugeA: Gauge; limits: RosetteLimit[]; touched: InsertedTimes[]; stored: StoredRosetteState; rebuild: boolean };

type StateUpdate = { rosetteId: number; stored: StoredRosetteState; checkpoint: Checkpoint<RosetteEvaluationState> | null };

const gaugeIdsOf = (rosette: Rosette) => [rosette.gaugeAId, rosette.gaugeBId, rosette.gaugeCId];

async function loadContexts(tx: WriteTx, structureId: number, gaugesById: ReadonlyMap<number, Gauge>, inserted: readonly InsertedTimes[]): Promise<RosetteContext[]> {
  const ofStructure = (await tx.select().from(rosettes).where(eq(rosettes.structureId, structureId))).flatMap((rosette) => {
    const touched = inserted.filter(({ gaugeId }) => gaugeIdsOf(rosette).includes(gaugeId));
    return touched.length > 0 ? [{ rosette, touched }] : [];
  });
  if (ofStructure.length === 0) return [];
  const rosetteIds = ofStructure.map(({ rosette }) => rosette.id);
  const limitRows = await tx.select().from(rosetteLimits).where(inArray(rosetteLimits.rosetteId, rosetteIds));
  const stateRows = await tx.select().from(rosetteEvaluationStates).where(inArray(rosetteEvaluationStates.rosetteId, rosetteIds));
  // A batch naming only gauge b or c leaves gauge a, whose material the rosette uses, out of the request's gauges.
  const unloaded = ofStructure.map(({ rosette }) => rosette.gaugeAId).filter((id) => !gaugesById.has(id));
  const loaded = unloaded.length === 0 ? [] : await tx.select().from(gauges).where(inArray(gauges.id, unloaded));
  return ofStructure.flatMap(({ rosette, touched }) => {
    const limits = limitRows.filter((row) => row.rosetteId === rosette.id).map(limitOfRow);
    if (limits.length === 0) return [];
    const gaugeA = gaugesById.get(rosette.gaugeAId) ?? loaded.find((gauge) => gauge.id === rosette.gaugeAId)!;
    const row = stateRows.find((candidate) => candidate.rosetteId === rosette.id);
    const stored = row ? parseRosetteEvaluationState(row.state) : null;
    return [{ rosette, gaugeA, limits, touched, stored: stored ?? initialRosetteEvaluationState(), rebuild: row !== undefined && stored === null }];
  });
}

async function saveStates(tx: WriteTx, updates: readonly StateUpdate[]) {
  if (updates.length === 0) return;
  await tx
    .insert(rosetteEvaluationStates)
    .values(updates.map(({ rosetteId, stored }) => ({ rosetteId, state: stored })))
    .onConflictDoUpdate({ target: rosetteEvaluationStates.rosetteId, set: { state: sql`excluded.state` } });
  const checkpoints = updates.flatMap(({ rosetteId, checkpoint }) => (checkpoint ? [{ ownerId: rosetteId, ...checkpoint }] : []));
  await saveCheckpoints(tx, rosetteEvaluationCheckpoints, checkpoints);
}

async function matchedInstants(tx: WriteTx, rosette: Rosette, start: number, end: number): Promise<MatchedInstant[]> {
  return (await bulkSql(tx).rows(MATCHED_STRAINS, matchedStrainsArgs(rosette, start, end))).map(matchedInstantOf);
}

/**
 * The earliest instant up to `upTo` that a reading of this request completed: before the request
 * it lacked that reading, so it was never evaluated. A late reading that leaves its instant short
 * of a gauge has nothing to replay.
 */
async function earliestCompletedInstant(tx: WriteTx, rosette: Rosette, touched: readonly InsertedTimes[], from: number, upTo: number) {
  const inserted = new Set(touched.flatMap(({ times }) => times.filter((time) => time <= upTo)));
  const instants = await matchedInstants(tx, rosette, from, upTo + 1);
  return instants.find(({ time }) => inserted.has(time))?.time;
}

const NO_FAULTS: ReadonlySet<number> = new Set();

/**
 * Sensor health judges a reading against the gauge's readings before it (a flat line is many
 * readings in a row) and stores only its detectors' state, not a verdict per reading. So rather
 * than judge the three gauges again, the rosette takes the verdicts their own evaluation reached
 * in this request, replays included. An instant outside what that evaluation covered (replayed
 * from the rosette's own checkpoint) has only the stored mechanics flags: a reading past its rated
 * range still counts as a fault there, a flat line or jump found by an earlier request does not.
 */
function faultTimesOf(rosette: Rosette, faults: FaultTimesByGauge): FaultTimesOfGauges {
  return [faults.get(rosette.gaugeAId) ?? NO_FAULTS, faults.get(rosette.gaugeBId) ?? NO_FAULTS, faults.get(rosette.gaugeCId) ?? NO_FAULTS];
}

/**
 * Evaluates the limits of every rosette of the structure whose gauges received readings, inside
 * the ingestion transaction, from the instants at which all three gauges have a reading, after the
 * gauges' own evaluation (`faults` are the readings it took as faults). A reading completing an
 * instant at or before the rosette's last evaluated one is taken in by replaying the stored
 * instants from the checkpoint before it; events recorded before are not raised twice.
 */
export async function evaluateRosetteLimits(
  tx: WriteTx,
  structureId: number,
  gaugesById: ReadonlyMap<number, Gauge>,
  inserted: readonly InsertedTimes[],
  faults: FaultTimesByGauge,
): Promise<AlertCounts> {
  const counts: AlertCounts = { opened: 0, escalated: 0, cleared: 0 };
  const updates: StateUpdate[] = [];
  for (const context of await loadContexts(tx, structureId, gaugesById, inserted)) {
    const update = await evaluateRosetteInstants(tx, context, faults, counts);
    if (update) updates.push(update);
  }
  await saveStates(tx, updates);
  return counts;
}

async function evaluateRosetteInstants(tx: WriteTx, context: RosetteContext, faults: FaultTimesByGauge, counts: AlertCounts) {
  const { rosette, touched, stored } = context;
  const first = Math.min(...touched.map(({ times }) => times[0]!));
  const last = Math.max(...touched.map(({ times }) => times.at(-1)!));
  if (context.rebuild) {
    // A state this build cannot read: rebuilt from nothing over the instants checkpoints would cover, events already recorded kept.
    const from = first - CHECKPOINTS_KEPT_MS;
    await dropCheckpointsAfter(tx, rosetteEvaluationCheckpoints, rosette.id, from);
    return applyEvaluation(tx, context, stored, await matchedInstants(tx, rosette, from, last + 1), faults, counts, true);
  }
  const { lastTime } = stored;
  const lateInstant = lastTime !== null && first <= lastTime ? await earliestCompletedInstant(tx, rosette, touched, first, Math.min(last, lastTime)) : undefined;
  const checkpoint = lateInstant === undefined ? undefined : await readableCheckpointBefore(tx, rosetteEvaluationCheckpoints, rosette.id, lateInstant, parseRosetteEvaluationState);
  if (!checkpoint) {
    // In time, or too late for any checkpoint: only instants after the last one evaluated count.
    const start = lastTime === null ? first : Math.max(first, lastTime + 1);
    const instants = start > last ? [] : await matchedInstants(tx, rosette, start, last + 1);
    return instants.length === 0 ? null : applyEvaluation(tx, context, stored, instants, faults, counts, false);
  }
  await dropCheckpointsAfter(tx, rosetteEvaluationCheckpoints, rosette.id, checkpoint.time);
  const instants = await matchedInstants(tx, rosette, checkpoint.time + 1, Math.max(last, lastTime!) + 1);
  const fromCheckpoint = { ...checkpoint.state, lastCheckpointAt: checkpoint.time };
  return applyEvaluation(tx, context, fromCheckpoint, instants, faults, counts, true);
}

async function applyEvaluation(
  tx: WriteTx,
  { rosette, gaugeA, limits }: RosetteContext,
  from: StoredRosetteState,
  instants: readonly MatchedInstant[],
  faults: FaultTimesByGauge,
  counts: AlertCounts,
  replayed: boolean,
): Promise<StateUpdate> {
  const setup = { layout: rosette.layout, material: gaugeA.material, limits };
  const { state, events } = evaluateRosette(setup, from, instants, faultTimesOf(rosette, faults));
  const notifications: Notification[] = [];
  await applyLimitEvents(tx, { gauge: gaugeA, rosette: { id: rosette.id, tag: rosette.tag } }, events, replayed, notifications, counts);
  await queueAlertMails(tx, gaugeA, notifications);
  const { lastCheckpointAt, checkpoint } = nextCheckpoint(state.lastTime, from.lastCheckpointAt ?? null, state);
  return { rosetteId: rosette.id, stored: { ...state, lastCheckpointAt }, checkpoint };
}
