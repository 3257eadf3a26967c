import "server-only";
import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import { bulkSql, type WriteTx } from "@/db/client";
import { alertEvents, alerts, evaluationCheckpoints, evaluationStates, gaugeLimits, type Alert, type Gauge } from "@/db/schema";
import {
  evaluateGauge,
  gaugeAlertSetup,
  initialGaugeEvaluationState,
  type EvaluatedReading,
  type GaugeAlertSetup,
  type GaugeEvaluationState,
} from "@/lib/alerting/evaluate-gauge";
import type { EpisodeEvent, Limit, Quantity, RosetteLimitQuantity, SensorFinding } from "@/lib/limits";
import { queueAlertMails } from "./alert-mail";
import { checkpointBefore, dropCheckpointsAfter, nextCheckpoint, saveCheckpoints, type Checkpoint } from "./evaluation-checkpoints";
import { limitOfRow } from "./limits";

export type AlertCounts = { opened: number; escalated: number; cleared: number };

type StoredState = { current: GaugeEvaluationState; lastCheckpointAt: number | null };

/** What a gauge's evaluation starts from; loaded for every gauge of a request at once. */
type GaugeContext = { limits: Limit[]; stored: StoredState; openStaleAlert: Alert | undefined };

async function loadContexts(tx: WriteTx, gaugeIds: number[]): Promise<Map<number, GaugeContext>> {
  const limitRows = await tx.select().from(gaugeLimits).where(inArray(gaugeLimits.gaugeId, gaugeIds));
  const stateRows = await tx.select().from(evaluationStates).where(inArray(evaluationStates.gaugeId, gaugeIds));
  const staleAlerts = await tx
    .select()
    .from(alerts)
    .where(and(inArray(alerts.gaugeId, gaugeIds), eq(alerts.kind, "sensor"), eq(alerts.code, "stale"), isNull(alerts.clearedAt)));
  const contexts = new Map<number, GaugeContext>();
  for (const gaugeId of gaugeIds) {
    const state = stateRows.find((row) => row.gaugeId === gaugeId);
    contexts.set(gaugeId, {
      limits: limitRows.filter((row) => row.gaugeId === gaugeId).map(limitOfRow),
      stored: state ? (state.state as StoredState) : { current: initialGaugeEvaluationState(), lastCheckpointAt: null },
      openStaleAlert: staleAlerts.find((alert) => alert.gaugeId === gaugeId),
    });
  }
  return contexts;
}

/** A gauge's state after a batch, and its checkpoint when an hour has passed since the last one. */
type StateUpdate = { gaugeId: number; lastTime: number | null; stored: StoredState; checkpoint: Checkpoint<GaugeEvaluationState> | null };

function stateUpdate(gaugeId: number, stored: StoredState, state: GaugeEvaluationState): StateUpdate {
  const lastTime = state.health.lastTime;
  const { lastCheckpointAt, checkpoint } = nextCheckpoint(lastTime, stored.lastCheckpointAt, state);
  return { gaugeId, lastTime, stored: { current: state, lastCheckpointAt }, checkpoint };
}

/** Saves every gauge's current state; checkpoints once an hour, kept three days, rather than a history each batch. */
async function saveStates(tx: WriteTx, updates: readonly StateUpdate[]) {
  if (updates.length === 0) return;
  await tx
    .insert(evaluationStates)
    .values(updates.map(({ gaugeId, lastTime, stored }) => ({ gaugeId, lastTime, state: stored })))
    .onConflictDoUpdate({ target: evaluationStates.gaugeId, set: { lastTime: sql`excluded.last_time`, state: sql`excluded.state` } });
  const checkpoints = updates.flatMap(({ gaugeId, checkpoint }) => (checkpoint ? [{ ownerId: gaugeId, ...checkpoint }] : []));
  await saveCheckpoints(tx, evaluationCheckpoints, checkpoints);
}

/** What a limit alert is about: a gauge's own quantity, or a rosette's (attached to its gauge a). */
export type AlertSubject = { gauge: Gauge; rosette: { id: number; tag: string } | null };

/** An episode event of a gauge's or a rosette's quantity. */
export type LimitEvent = EpisodeEvent & { quantity: Quantity | RosetteLimitQuantity };

/** The alerts on one quantity of a subject; two rosettes may share gauge a, so a rosette's are told apart by the rosette as well. */
function limitAlertsOf({ gauge, rosette }: AlertSubject, quantity: string) {
  return and(eq(alerts.gaugeId, gauge.id), eq(alerts.quantity, quantity), rosette === null ? isNull(alerts.rosetteId) : eq(alerts.rosetteId, rosette.id));
}

async function openAlertWhere(tx: WriteTx, condition: ReturnType<typeof and>) {
  const [row] = await tx
    .select()
    .from(alerts)
    .where(and(isNull(alerts.clearedAt), condition))
    .limit(1);
  return row;
}

const openSensorAlert = (tx: WriteTx, gaugeId: number, code: string) =>
  openAlertWhere(tx, and(eq(alerts.gaugeId, gaugeId), eq(alerts.kind, "sensor"), eq(alerts.code, code)));

async function alreadyRecorded(tx: WriteTx, subject: AlertSubject, event: LimitEvent): Promise<boolean> {
  const rows = await tx
    .select({ id: alertEvents.id })
    .from(alertEvents)
    .innerJoin(alerts, eq(alerts.id, alertEvents.alertId))
    .where(and(limitAlertsOf(subject, event.quantity), eq(alertEvents.type, event.type), eq(alertEvents.at, new Date(event.time))))
    .limit(1);
  return rows.length > 0;
}

/** An alert event whose e-mails must go out. */
export type Notification =
  | { kind: "limit"; alertId: number; type: "opened" | "escalated" | "cleared"; event: LimitEvent; rosette: string | null }
  | { kind: "sensor"; alertId: number; type: "opened" | "cleared"; code: string; message: string; time: number };

/**
 * Records a subject's limit events in time order. A replay from a checkpoint meets again the events
 * recorded since that checkpoint; those are left as they are rather than raised twice.
 */
export async function applyLimitEvents(
  tx: WriteTx,
  subject: AlertSubject,
  events: readonly LimitEvent[],
  replayed: boolean,
  notifications: Notification[],
  counts: AlertCounts,
) {
  for (const event of events) {
    if (replayed && (await alreadyRecorded(tx, subject, event))) continue;
    await applyLimitEvent(tx, subject, event, notifications, counts);
  }
}

async function applyLimitEvent(tx: WriteTx, subject: AlertSubject, event: LimitEvent, notifications: Notification[], counts: AlertCounts) {
  const { gauge, rosette } = subject;
  const at = new Date(event.time);
  const rosetteId = rosette?.id ?? null;
  let alertId: number | undefined;
  if (event.type === "opened") {
    const [created] = await tx
      .insert(alerts)
      .values({
        structureId: gauge.structureId,
        gaugeId: gauge.id,
        rosetteId,
        kind: "limit",
        level: event.level,
        quantity: event.quantity,
        openedAt: at,
        bound: event.bound,
        peak: event.peak,
      })
      .returning({ id: alerts.id });
    alertId = created!.id;
  } else {
    const open = await openAlertWhere(tx, and(eq(alerts.kind, "limit"), limitAlertsOf(subject, event.quantity)));
    if (!open) return;
    alertId = open.id;
    await tx
      .update(alerts)
      .set(event.type === "escalated" ? { level: event.level, bound: event.bound, peak: event.peak } : { clearedAt: at, peak: event.peak })
      .where(eq(alerts.id, open.id));
  }
  await tx.insert(alertEvents).values({ alertId, type: event.type, at, level: event.level, value: event.value, byLabel: "evaluation on ingest" });
  counts[event.type] += 1;
  notifications.push({ kind: "limit", alertId, type: event.type, event, rosette: rosette?.tag ?? null });
}

async function applySensorFinding(tx: WriteTx, gauge: Gauge, finding: SensorFinding, notifications: Notification[]) {
  const at = new Date(finding.time);
  const open = await openSensorAlert(tx, gauge.id, finding.code);
  if (finding.event === "resolved") {
    if (!open) return;
    await tx.update(alerts).set({ clearedAt: at }).where(eq(alerts.id, open.id));
    await tx.insert(alertEvents).values({ alertId: open.id, type: "cleared", at, byLabel: "evaluation on ingest", text: finding.message });
    notifications.push({ kind: "sensor", alertId: open.id, type: "cleared", code: finding.code, message: finding.message, time: finding.time });
    return;
  }
  // A sensor already under an open alert for the same fault is not alerted again.
  if (open) return;
  const [created] = await tx
    .insert(alerts)
    .values({ structureId: gauge.structureId, gaugeId: gauge.id, kind: "sensor", level: "warning", code: finding.code, message: finding.message, openedAt: at })
    .returning({ id: alerts.id });
  await tx.insert(alertEvents).values({ alertId: created!.id, type: "opened", at, level: "warning", byLabel: "evaluation on ingest", text: finding.message });
  notifications.push({ kind: "sensor", alertId: created!.id, type: "opened", code: finding.code, message: finding.message, time: finding.time });
}

/** Data arriving again ends a "no data" alert. */
async function clearStaleAlert(tx: WriteTx, open: Alert | undefined, time: number, notifications: Notification[]) {
  if (!open || open.openedAt.getTime() > time) return;
  const message = "Readings are arriving again.";
  await tx.update(alerts).set({ clearedAt: new Date(time) }).where(eq(alerts.id, open.id));
  await tx.insert(alertEvents).values({ alertId: open.id, type: "cleared", at: new Date(time), byLabel: "evaluation on ingest", text: message });
  notifications.push({ kind: "sensor", alertId: open.id, type: "cleared", code: "stale", message, time });
}

/** A replay reads back up to three days of a gauge's readings: as plain rows, not mapped objects. */
async function storedReadingsAfter(tx: WriteTx, gaugeId: number, after: number): Promise<EvaluatedReading[]> {
  const rows = await bulkSql(tx).rows("SELECT t, value, strain, stress, flags FROM readings WHERE gauge_id = ? AND t > ? ORDER BY t", [gaugeId, after]);
  return rows.map((row) => ({ time: row[0] as number, raw: row[1] as number, strain: row[2] as number, stress: row[3] as number, flags: row[4] as number }));
}

/** A gauge and the readings this request stored for it. */
export type InsertedReadings = { gauge: Gauge; readings: readonly EvaluatedReading[] };

/** By gauge id, the times of readings the gauge's evaluation took as faults; gauges without any are absent. */
export type FaultTimesByGauge = ReadonlyMap<number, ReadonlySet<number>>;

/**
 * Evaluates each gauge's newly stored readings against its limits and sensor health, inside the
 * ingestion transaction, and records what opened, escalated or cleared. Readings older than a
 * gauge's last evaluated one are taken in by replaying from the checkpoint before them; events
 * recorded before are not raised twice. Also answers which readings it took as faults (replayed
 * ones included), for the rosettes on these gauges.
 */
export async function evaluateInsertedReadings(tx: WriteTx, inserted: readonly InsertedReadings[]): Promise<{ counts: AlertCounts; faultTimes: FaultTimesByGauge }> {
  const counts: AlertCounts = { opened: 0, escalated: 0, cleared: 0 };
  const faultTimes = new Map<number, ReadonlySet<number>>();
  const batches = inserted.filter(({ readings }) => readings.length > 0);
  if (batches.length === 0) return { counts, faultTimes };
  const contexts = await loadContexts(tx, batches.map(({ gauge }) => gauge.id));
  const updates: StateUpdate[] = [];
  for (const { gauge, readings } of batches) {
    const { update, faults } = await evaluateGaugeReadings(tx, gauge, readings, contexts.get(gauge.id)!, counts);
    updates.push(update);
    if (faults.length > 0) faultTimes.set(gauge.id, new Set(faults));
  }
  await saveStates(tx, updates);
  return { counts, faultTimes };
}

async function evaluateGaugeReadings(tx: WriteTx, gauge: Gauge, inserted: readonly EvaluatedReading[], context: GaugeContext, counts: AlertCounts) {
  const setup = gaugeAlertSetup(gauge, context.limits);
  const { stored } = context;
  const lastTime = stored.current.health.lastTime;
  const earliest = inserted.reduce((least, reading) => Math.min(least, reading.time), Infinity);
  const late = lastTime !== null && earliest <= lastTime;
  const checkpoint = late ? await checkpointBefore<GaugeEvaluationState>(tx, evaluationCheckpoints, gauge.id, earliest) : undefined;
  if (!checkpoint) {
    // In time, or too late for any checkpoint: the machines skip what is older than they have seen.
    const batch = [...inserted].sort((a, b) => a.time - b.time);
    return applyEvaluation(tx, gauge, setup, context, stored, batch, counts);
  }
  await dropCheckpointsAfter(tx, evaluationCheckpoints, gauge.id, checkpoint.time);
  const replayed = await storedReadingsAfter(tx, gauge.id, checkpoint.time);
  const fromCheckpoint = { current: checkpoint.state, lastCheckpointAt: checkpoint.time };
  return applyEvaluation(tx, gauge, setup, context, fromCheckpoint, replayed, counts, true);
}

async function applyEvaluation(
  tx: WriteTx,
  gauge: Gauge,
  setup: GaugeAlertSetup,
  context: GaugeContext,
  from: StoredState,
  batch: EvaluatedReading[],
  counts: AlertCounts,
  replayed = false,
): Promise<{ update: StateUpdate; faults: number[] }> {
  const notifications: Notification[] = [];
  const result = evaluateGauge(setup, from.current, batch);
  await applyLimitEvents(tx, { gauge, rosette: null }, result.events, replayed, notifications, counts);
  for (const finding of result.findings) await applySensorFinding(tx, gauge, finding, notifications);
  if (batch.length > 0) await clearStaleAlert(tx, context.openStaleAlert, batch.at(-1)!.time, notifications);
  await queueAlertMails(tx, gauge, notifications);
  return { update: stateUpdate(gauge.id, from, result.state), faults: result.faultTimes };
}

/** Raises (or resolves) one sensor finding found outside ingestion, such as a gauge gone silent. */
export async function raiseSensorFinding(tx: WriteTx, gauge: Gauge, finding: SensorFinding): Promise<Notification[]> {
  const notifications: Notification[] = [];
  await applySensorFinding(tx, gauge, finding, notifications);
  await queueAlertMails(tx, gauge, notifications);
  return notifications;
}
