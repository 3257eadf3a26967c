import { and, asc, desc, eq, gt, isNull, lt } from "drizzle-orm";
import type { Database } from "@/db/client";
import { alertEvents, alerts, evaluationCheckpoints, evaluationStates, gaugeLimits, readings, type Gauge } from "@/db/schema";
import {
  defaultHealthThresholds,
  evaluateGauge,
  initialGaugeEvaluationState,
  type EvaluatedReading,
  type GaugeEvaluationState,
  type QuantityEvent,
} from "@/lib/alerting/evaluate-gauge";
import type { EpisodeEvent, Limit, Quantity, RosetteLimitQuantity, SensorFinding } from "@/lib/limits";
import { queueAlertMails } from "./alert-mail";

type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];

export type AlertCounts = { opened: number; escalated: number; cleared: number };

/** A state saved after a batch, so a late reading can be evaluated from the state just before it. */
type Checkpoint = { time: number; state: GaugeEvaluationState };
type StoredState = { current: GaugeEvaluationState; lastCheckpointAt: number | null };

const CHECKPOINT_SPACING_MS = 3_600_000;
/** Three days of hourly checkpoints: readings later than that are stored but not evaluated for alerts. */
const CHECKPOINTS_KEPT_MS = 3 * 86_400_000;

async function loadState(tx: Tx, gaugeId: number): Promise<StoredState> {
  const [row] = await tx.select().from(evaluationStates).where(eq(evaluationStates.gaugeId, gaugeId)).limit(1);
  return row ? (row.state as StoredState) : { current: initialGaugeEvaluationState(), lastCheckpointAt: null };
}

/** Saves the current state; once an hour also as a checkpoint (kept three days), rather than rewriting a history each batch. */
async function saveState(tx: Tx, gaugeId: number, stored: StoredState, state: GaugeEvaluationState) {
  const lastTime = state.health.lastTime;
  let lastCheckpointAt = stored.lastCheckpointAt;
  if (lastTime !== null && (lastCheckpointAt === null || lastTime - lastCheckpointAt >= CHECKPOINT_SPACING_MS)) {
    await tx.insert(evaluationCheckpoints).values({ gaugeId, time: lastTime, state }).onConflictDoNothing();
    await tx.delete(evaluationCheckpoints).where(and(eq(evaluationCheckpoints.gaugeId, gaugeId), lt(evaluationCheckpoints.time, lastTime - CHECKPOINTS_KEPT_MS)));
    lastCheckpointAt = lastTime;
  }
  const value = { gaugeId, lastTime, state: { current: state, lastCheckpointAt } };
  await tx.insert(evaluationStates).values(value).onConflictDoUpdate({ target: evaluationStates.gaugeId, set: value });
}

async function checkpointBefore(tx: Tx, gaugeId: number, time: number): Promise<Checkpoint | undefined> {
  const [row] = await tx
    .select()
    .from(evaluationCheckpoints)
    .where(and(eq(evaluationCheckpoints.gaugeId, gaugeId), lt(evaluationCheckpoints.time, time)))
    .orderBy(desc(evaluationCheckpoints.time))
    .limit(1);
  return row && { time: row.time, state: row.state as GaugeEvaluationState };
}

/** A replay rewrites what happened after its checkpoint, so later checkpoints no longer hold. */
async function dropCheckpointsAfter(tx: Tx, gaugeId: number, time: number) {
  await tx.delete(evaluationCheckpoints).where(and(eq(evaluationCheckpoints.gaugeId, gaugeId), gt(evaluationCheckpoints.time, time)));
}

async function limitsFor(tx: Tx, gaugeId: number): Promise<Limit[]> {
  const rows = await tx.select().from(gaugeLimits).where(eq(gaugeLimits.gaugeId, gaugeId));
  return rows.map(({ quantity, level, upper, lower, hysteresis, persistence }) => ({
    quantity,
    level,
    hysteresis,
    persistence,
    ...(upper === null ? {} : { upper }),
    ...(lower === null ? {} : { lower }),
  }));
}

/** What a limit alert is about: a gauge's own quantity, or a rosette's (attached to its gauge a). */
export type AlertSubject = { gauge: Gauge; rosette: { id: number; tag: string } | null };

/** An episode event of a gauge's or a rosette's quantity. */
export type LimitEvent = EpisodeEvent & { quantity: Quantity | RosetteLimitQuantity };

type AlertMatch = { kind: "limit"; quantity: string; rosetteId: number | null } | { kind: "sensor"; code: string };

async function openAlertOf(tx: Tx, gaugeId: number, match: AlertMatch) {
  // two rosettes may share gauge a, so a rosette's alert is told apart by the rosette as well
  const condition =
    match.kind === "limit"
      ? and(eq(alerts.quantity, match.quantity), match.rosetteId === null ? isNull(alerts.rosetteId) : eq(alerts.rosetteId, match.rosetteId))
      : eq(alerts.code, match.code);
  const [row] = await tx
    .select()
    .from(alerts)
    .where(and(eq(alerts.gaugeId, gaugeId), eq(alerts.kind, match.kind), isNull(alerts.clearedAt), condition))
    .limit(1);
  return row;
}

async function alreadyRecorded(tx: Tx, gaugeId: number, event: QuantityEvent): Promise<boolean> {
  const rows = await tx
    .select({ id: alertEvents.id })
    .from(alertEvents)
    .innerJoin(alerts, eq(alerts.id, alertEvents.alertId))
    .where(and(eq(alerts.gaugeId, gaugeId), eq(alerts.quantity, event.quantity), eq(alertEvents.type, event.type), eq(alertEvents.at, new Date(event.time))))
    .limit(1);
  return rows.length > 0;
}

/** An alert event whose e-mails must go out. */
export type Notification =
  | { kind: "limit"; alertId: number; type: "opened" | "escalated" | "cleared"; event: LimitEvent; rosette: string | null }
  | { kind: "sensor"; alertId: number; type: "opened" | "cleared"; code: string; message: string; time: number };

export async function applyLimitEvent(tx: Tx, { gauge, rosette }: AlertSubject, event: LimitEvent, notifications: Notification[], counts: AlertCounts) {
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
    const open = await openAlertOf(tx, gauge.id, { kind: "limit", quantity: event.quantity, rosetteId });
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

async function applySensorFinding(tx: Tx, gauge: Gauge, finding: SensorFinding, notifications: Notification[]) {
  const at = new Date(finding.time);
  const open = await openAlertOf(tx, gauge.id, { kind: "sensor", code: finding.code });
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
async function clearStaleAlert(tx: Tx, gauge: Gauge, time: number, notifications: Notification[]) {
  const open = await openAlertOf(tx, gauge.id, { kind: "sensor", code: "stale" });
  if (!open || open.openedAt.getTime() > time) return;
  const message = "Readings are arriving again.";
  await tx.update(alerts).set({ clearedAt: new Date(time) }).where(eq(alerts.id, open.id));
  await tx.insert(alertEvents).values({ alertId: open.id, type: "cleared", at: new Date(time), byLabel: "evaluation on ingest", text: message });
  notifications.push({ kind: "sensor", alertId: open.id, type: "cleared", code: "stale", message, time });
}

async function storedReadingsAfter(tx: Tx, gaugeId: number, after: number): Promise<EvaluatedReading[]> {
  return tx
    .select({ time: readings.time, raw: readings.value, strain: readings.strain, stress: readings.stress, flags: readings.flags })
    .from(readings)
    .where(and(eq(readings.gaugeId, gaugeId), gt(readings.time, after)))
    .orderBy(asc(readings.time));
}

/**
 * Evaluates a gauge's newly stored readings against its limits and sensor health, inside the
 * ingestion transaction, and records what opened, escalated or cleared. Readings older than the
 * last evaluated one are taken in by replaying from the checkpoint before them; events recorded
 * before are not raised twice.
 */
export async function evaluateInsertedReadings(
  tx: Tx,
  gauge: Gauge,
  inserted: readonly EvaluatedReading[],
): Promise<{ counts: AlertCounts; notifications: Notification[] }> {
  const counts: AlertCounts = { opened: 0, escalated: 0, cleared: 0 };
  const notifications: Notification[] = [];
  if (inserted.length === 0) return { counts, notifications };
  const limits = await limitsFor(tx, gauge.id);
  const setup = { limits, yieldStress: gauge.material.yield ?? null, health: defaultHealthThresholds(gauge.input) };
  const stored = await loadState(tx, gauge.id);
  const lastTime = stored.current.health.lastTime;
  const earliest = Math.min(...inserted.map((reading) => reading.time));
  const late = lastTime !== null && earliest <= lastTime;
  const checkpoint = late ? await checkpointBefore(tx, gauge.id, earliest) : undefined;
  if (!checkpoint) {
    // In time, or too late for any checkpoint: the machines skip what is older than they have seen.
    const batch = [...inserted].sort((a, b) => a.time - b.time);
    return applyEvaluation(tx, gauge, setup, stored, stored.current, batch, counts, notifications);
  }
  await dropCheckpointsAfter(tx, gauge.id, checkpoint.time);
  const replayed = await storedReadingsAfter(tx, gauge.id, checkpoint.time);
  const fromCheckpoint = { current: checkpoint.state, lastCheckpointAt: checkpoint.time };
  return applyEvaluation(tx, gauge, setup, fromCheckpoint, checkpoint.state, replayed, counts, notifications, true);
}

async function applyEvaluation(
  tx: Tx,
  gauge: Gauge,
  setup: Parameters<typeof evaluateGauge>[0],
  stored: StoredState,
  from: GaugeEvaluationState,
  batch: EvaluatedReading[],
  counts: AlertCounts,
  notifications: Notification[],
  replayed = false,
) {
  const result = evaluateGauge(setup, from, batch);
  for (const event of result.events) {
    if (replayed && (await alreadyRecorded(tx, gauge.id, event))) continue;
    await applyLimitEvent(tx, { gauge, rosette: null }, event, notifications, counts);
  }
  for (const finding of result.findings) await applySensorFinding(tx, gauge, finding, notifications);
  if (batch.length > 0) await clearStaleAlert(tx, gauge, batch.at(-1)!.time, notifications);
  await saveState(tx, gauge.id, stored, result.state);
  await queueAlertMails(tx, gauge, notifications);
  return { counts, notifications };
}

/** Raises (or resolves) one sensor finding found outside ingestion, such as a gauge gone silent. */
export async function raiseSensorFinding(tx: Tx, gauge: Gauge, finding: SensorFinding): Promise<Notification[]> {
  const notifications: Notification[] = [];
  await applySensorFinding(tx, gauge, finding, notifications);
  await queueAlertMails(tx, gauge, notifications);
  return notifications;
}
