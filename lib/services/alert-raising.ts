import "server-only";
import { and, desc, eq, gte, inArray, isNotNull, isNull, lte, sql } from "drizzle-orm";
import { bulkSql, type WriteTx } from "@/db/client";
import { alertEvents, alerts, evaluationCheckpoints, evaluationStates, gaugeLimits, type Alert, type Gauge } from "@/db/schema";
import { evaluateGauge, gaugeAlertSetup, type EvaluatedReading, type GaugeAlertSetup } from "@/lib/alerting/evaluate-gauge";
import { initialGaugeEvaluationState, parseGaugeEvaluationState, type GaugeEvaluationState } from "@/lib/alerting/evaluation-state";
import { FLAP_WINDOW_MS, isFlappingNow, isFurther } from "@/lib/alerting/flapping";
import { levelRank, type EpisodeEvent, type EpisodeState, type Limit, type Quantity, type RosetteLimitQuantity, type SensorFinding } from "@/lib/limits";
import { queueAlertMails } from "./alert-mail";
import { CHECKPOINTS_KEPT_MS, readableCheckpointBefore, dropCheckpointsAfter, nextCheckpoint, saveCheckpoints, type Checkpoint } from "./evaluation-checkpoints";
import { limitOfRow } from "./limits";
import { refreshStaleAlert } from "./stale-alerts";

/** Who the alert history names for the events the evaluation itself records. */
export const EVALUATION_LABEL = "evaluation on ingest";

export type AlertCounts = { opened: number; escalated: number; cleared: number };

export type StoredState = { current: GaugeEvaluationState; lastCheckpointAt: number | null };

/**
 * A stored state read back, checked: `rebuild` when it is missing its version or shape (written by
 * an older build, or damaged), with `lastTime` the last reading it had seen, so the caller replays
 * the stored readings instead of trusting it.
 */
export function storedStateOf(row: { state: unknown; lastTime: number | null } | undefined): { stored: StoredState; rebuildAfter: number | null } {
  const fresh = { current: initialGaugeEvaluationState(), lastCheckpointAt: null };
  if (!row) return { stored: fresh, rebuildAfter: null };
  const value = row.state as { current?: unknown; lastCheckpointAt?: unknown } | null;
  const current = parseGaugeEvaluationState(value?.current);
  if (current) return { stored: { current, lastCheckpointAt: typeof value?.lastCheckpointAt === "number" ? value.lastCheckpointAt : null }, rebuildAfter: null };
  return { stored: fresh, rebuildAfter: row.lastTime ?? 0 };
}

/**
 * What a gauge's evaluation starts from; loaded for every gauge of a request at once.
 * `flapping`: the gauge has a flapping alert not settled yet, so a batch without limit events
 * still has to look for one to settle (alerts start flapping only through limit events).
 */
type GaugeContext = { limits: Limit[]; stored: StoredState; rebuildAfter: number | null; flapping: boolean };

async function loadContexts(tx: WriteTx, gaugeIds: number[]): Promise<Map<number, GaugeContext>> {
  const limitRows = await tx.select().from(gaugeLimits).where(inArray(gaugeLimits.gaugeId, gaugeIds));
  const stateRows = await tx.select().from(evaluationStates).where(inArray(evaluationStates.gaugeId, gaugeIds));
  const flappingRows = await tx
    .selectDistinct({ gaugeId: alerts.gaugeId })
    .from(alerts)
    .where(and(inArray(alerts.gaugeId, gaugeIds), unsettledFlappingAlerts()));
  const flapping = new Set(flappingRows.map((row) => row.gaugeId));
  const contexts = new Map<number, GaugeContext>();
  for (const gaugeId of gaugeIds) {
    const { stored, rebuildAfter } = storedStateOf(stateRows.find((row) => row.gaugeId === gaugeId));
    contexts.set(gaugeId, { limits: limitRows.filter((row) => row.gaugeId === gaugeId).map(limitOfRow), stored, rebuildAfter, flapping: flapping.has(gaugeId) });
  }
  return contexts;
}

/** A gauge's state after a batch, and its checkpoint when an hour has passed since the last one. */
type StateUpdate = { gaugeId: number; lastTime: number | null; stored: StoredState; checkpoint: Checkpoint<GaugeEvaluationState> | null };

export function stateUpdate(gaugeId: number, stored: StoredState, state: GaugeEvaluationState): StateUpdate {
  const lastTime = state.health.lastTime;
  const { lastCheckpointAt, checkpoint } = nextCheckpoint(lastTime, stored.lastCheckpointAt, state);
  return { gaugeId, lastTime, stored: { current: state, lastCheckpointAt }, checkpoint };
}

/** Saves every gauge's current state; checkpoints once an hour, kept three days, rather than a history each batch. */
export async function saveStates(tx: WriteTx, updates: readonly StateUpdate[]) {
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

/** An alert event whose e-mails must go out; `eventId` is its alert_events row, marked when the e-mail waits for the digest. */
export type Notification =
  | { kind: "limit"; alertId: number; eventId: number; type: "opened" | "escalated" | "cleared"; event: LimitEvent; rosette: string | null }
  | { kind: "sensor"; alertId: number; eventId: number; type: "opened" | "cleared"; code: string; message: string; time: number; gauges?: string[] }
  | { kind: "flapping"; alertId: number; type: "started"; openings: number; event: LimitEvent; rosette: string | null; since: number }
  | { kind: "flapping-settled"; alertId: number; alert: Alert; time: number }
  /** A person's change closed the alert (limits, material or zero changed): `because` says which and by whom. */
  | { kind: "closed"; alertId: number; eventId: number; alert: Alert; because: string; time: number; rosette: string | null };

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

/** The alert an "opened" event continues: the subject's last one, cleared by the machine within the flapping window. */
async function recentlyClearedAlert(tx: WriteTx, subject: AlertSubject, event: LimitEvent) {
  const [row] = await tx
    .select()
    .from(alerts)
    .where(
      and(
        eq(alerts.kind, "limit"),
        limitAlertsOf(subject, event.quantity),
        isNotNull(alerts.clearedAt),
        isNull(alerts.settledAt),
        gte(alerts.clearedAt, new Date(event.time - FLAP_WINDOW_MS)),
        lte(alerts.clearedAt, new Date(event.time)),
      ),
    )
    .orderBy(desc(alerts.clearedAt))
    .limit(1);
  return row;
}

async function applyLimitEvent(tx: WriteTx, subject: AlertSubject, event: LimitEvent, notifications: Notification[], counts: AlertCounts) {
  const { gauge, rosette } = subject;
  const at = new Date(event.time);
  const rosetteId = rosette?.id ?? null;
  let alertId: number | undefined;
  let mailed = true;
  const stillOpen = event.type === "opened" ? await openAlertWhere(tx, and(eq(alerts.kind, "limit"), limitAlertsOf(subject, event.quantity))) : undefined;
  const reopened = event.type === "opened" && !stillOpen ? await recentlyClearedAlert(tx, subject, event) : undefined;
  if (stillOpen) {
    // A rebuilt state meets an episode whose alert is still open: the same alert goes on (one open alert per quantity), nobody is told twice.
    alertId = stillOpen.id;
    mailed = false;
  } else if (reopened) {
    // Back beyond soon after clearing: the same episode goes on, rather than a new alert and e-mail per crossing.
    const openings = reopened.openings + 1;
    const flapping = reopened.flappingSince !== null || isFlappingNow(openings);
    const higher = levelRank(event.level) > levelRank(reopened.level);
    const peak = higher || reopened.peak === null || isFurther(event.peak, reopened.peak, event.bound) ? { peak: event.peak, peakAt: new Date(event.peakAt) } : {};
    await tx
      .update(alerts)
      .set({
        clearedAt: null,
        openings,
        ...(flapping && reopened.flappingSince === null ? { flappingSince: at } : {}),
        ...(higher ? { level: event.level, bound: event.bound } : {}),
        ...peak,
      })
      .where(eq(alerts.id, reopened.id));
    alertId = reopened.id;
    mailed = higher || reopened.flappingSince === null;
    if (flapping && reopened.flappingSince === null) {
      notifications.push({ kind: "flapping", alertId, type: "started", openings, event, rosette: rosette?.tag ?? null, since: reopened.openedAt.getTime() });
      mailed = higher;
    }
  } else if (event.type === "opened") {
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
        peakAt: new Date(event.peakAt),
      })
      .returning({ id: alerts.id });
    alertId = created!.id;
  } else {
    const open = await openAlertWhere(tx, and(eq(alerts.kind, "limit"), limitAlertsOf(subject, event.quantity)));
    if (!open) return;
    alertId = open.id;
    const peak = { peak: event.peak, peakAt: new Date(event.peakAt) };
    await tx
      .update(alerts)
      .set(event.type === "escalated" ? { level: event.level, bound: event.bound, ...peak } : { clearedAt: at, ...peak })
      .where(eq(alerts.id, open.id));
    // A flapping alert's crossings are told by its summary; a higher level is always told at once.
    mailed = open.flappingSince === null || event.type === "escalated";
  }
  const [recorded] = await tx
    .insert(alertEvents)
    .values({ alertId, type: event.type, at, level: event.level, value: event.value, byLabel: EVALUATION_LABEL })
    .returning({ id: alertEvents.id });
  counts[event.type] += 1;
  if (mailed) notifications.push({ kind: "limit", alertId, eventId: recorded!.id, type: event.type, event, rosette: rosette?.tag ?? null });
}

/**
 * While an episode is open its alert follows the furthest value reached, not only the value at its
 * last event: the API's `peak` and `peakAt`, the page and the e-mails read it from there.
 */
export async function followOpenPeaks(tx: WriteTx, subject: AlertSubject, before: Partial<Record<string, EpisodeState>>, after: Partial<Record<string, EpisodeState>>) {
  for (const [quantity, episode] of Object.entries(after)) {
    if (!episode?.episode || episode.peak === null || episode.peakAt === null) continue;
    if (before[quantity]?.peakAt === episode.peakAt) continue;
    await tx
      .update(alerts)
      .set({ peak: episode.peak, peakAt: new Date(episode.peakAt) })
      .where(and(isNull(alerts.clearedAt), eq(alerts.kind, "limit"), limitAlertsOf(subject, quantity)));
  }
}

/** Limit alerts that have flapped and whose settling summary has not gone out yet. */
function unsettledFlappingAlerts() {
  return and(eq(alerts.kind, "limit"), isNotNull(alerts.flappingSince), isNull(alerts.settledAt));
}

/** Flapping alerts that have stayed cleared for a whole window by `upTo`: settled, their summary due. */
export function quietFlappingAlerts(upTo: number) {
  return and(unsettledFlappingAlerts(), lte(alerts.clearedAt, new Date(upTo - FLAP_WINDOW_MS)));
}

/**
 * A flapping alert has settled when it stayed cleared for the whole window: its summary e-mail
 * goes out then. Ingestion judges by the readings' own clock (the newest reading evaluated); the
 * settling job by the wall clock, for a gauge that falls quiet with no reading to tell.
 */
export async function settleFlapping(tx: WriteTx, gaugeId: number, upTo: number, notifications: Notification[]) {
  const settled = await tx
    .select()
    .from(alerts)
    .where(and(eq(alerts.gaugeId, gaugeId), quietFlappingAlerts(upTo)));
  for (const alert of settled) {
    await tx.update(alerts).set({ settledAt: new Date(upTo) }).where(eq(alerts.id, alert.id));
    notifications.push({ kind: "flapping-settled", alertId: alert.id, alert, time: alert.clearedAt!.getTime() });
  }
}

async function applySensorFinding(tx: WriteTx, gauge: Gauge, finding: SensorFinding, notifications: Notification[]) {
  const at = new Date(finding.time);
  const open = await openSensorAlert(tx, gauge.id, finding.code);
  if (finding.event === "resolved") {
    if (!open) return;
    await tx.update(alerts).set({ clearedAt: at }).where(eq(alerts.id, open.id));
    const [event] = await tx
      .insert(alertEvents)
      .values({ alertId: open.id, type: "cleared", at, byLabel: EVALUATION_LABEL, text: finding.message })
      .returning({ id: alertEvents.id });
    notifications.push({ kind: "sensor", alertId: open.id, eventId: event!.id, type: "cleared", code: finding.code, message: finding.message, time: finding.time });
    return;
  }
  // A sensor already under an open alert for the same fault is not alerted again.
  if (open) return;
  const [created] = await tx
    .insert(alerts)
    .values({ structureId: gauge.structureId, gaugeId: gauge.id, kind: "sensor", level: "warning", code: finding.code, message: finding.message, openedAt: at })
    .returning({ id: alerts.id });
  const [event] = await tx
    .insert(alertEvents)
    .values({ alertId: created!.id, type: "opened", at, level: "warning", byLabel: EVALUATION_LABEL, text: finding.message })
    .returning({ id: alertEvents.id });
  notifications.push({ kind: "sensor", alertId: created!.id, eventId: event!.id, type: "opened", code: finding.code, message: finding.message, time: finding.time });
}

/** A replay reads back up to three days of a gauge's readings, with their stored verdicts: as plain rows, not mapped objects. */
export async function storedReadingsAfter(tx: WriteTx, gaugeId: number, after: number): Promise<(EvaluatedReading & { faultBits: number })[]> {
  const rows = await bulkSql(tx).rows("SELECT t, value, strain, stress, flags, fault, residual FROM readings WHERE gauge_id = ? AND t > ? ORDER BY t", [gaugeId, after]);
  return rows.map((row) => ({
    time: row[0] as number,
    raw: row[1] as number,
    strain: row[2] as number,
    stress: row[3] as number,
    flags: row[4] as number,
    faultBits: row[5] as number,
    residual: row[6] as number | null,
  }));
}

/** A reading judged again by a replay, with the verdict stored for it when it is known. */
type RejudgedReading = { time: number; faultBits?: number };

/**
 * Stores each reading's verdict with it. A replay judges its readings again, so the ones found
 * healthy go back to 0 where a fault was stored (or is not known); a batch in time only has its
 * faulty ones to mark.
 */
export async function storeVerdicts(tx: WriteTx, gaugeId: number, verdicts: ReadonlyMap<number, number>, rejudged: readonly RejudgedReading[] = []) {
  const raw = bulkSql(tx);
  const byBits = new Map<number, number[]>();
  const record = (bits: number, time: number) => {
    const times = byBits.get(bits);
    if (times) times.push(time);
    else byBits.set(bits, [time]);
  };
  for (const { time, faultBits } of rejudged) if (!verdicts.has(time) && faultBits !== 0) record(0, time);
  for (const [time, bits] of verdicts) record(bits, time);
  for (const [bits, times] of byBits) {
    await raw.rows("UPDATE readings SET fault = ? WHERE gauge_id = ? AND t IN (SELECT value FROM json_each(?)) RETURNING 1", [bits, gaugeId, JSON.stringify(times)]);
  }
}

/** A gauge and the readings this request stored for it. */
export type InsertedReadings = { gauge: Gauge; readings: readonly EvaluatedReading[] };

/** By gauge id, the times of readings the gauge's evaluation took as faults; gauges without any are absent. */
export type FaultTimesByGauge = ReadonlyMap<number, ReadonlySet<number>>;

/** The evaluation of a request: what it raised, which readings limits skipped, and which sensor health found faulty (to keep out of roll-ups). */
export type RequestEvaluation = { counts: AlertCounts; faultTimes: FaultTimesByGauge; quarantined: FaultTimesByGauge };

/**
 * Evaluates each gauge's newly stored readings against its limits and sensor health, inside the
 * ingestion transaction, and records what opened, escalated or cleared. Readings older than a
 * gauge's last evaluated one are taken in by replaying from the checkpoint before them; events
 * recorded before are not raised twice. Also answers which readings it took as faults (replayed
 * ones included), for the rosettes on these gauges.
 */
export async function evaluateInsertedReadings(tx: WriteTx, inserted: readonly InsertedReadings[]): Promise<RequestEvaluation> {
  const counts: AlertCounts = { opened: 0, escalated: 0, cleared: 0 };
  const faultTimes = new Map<number, ReadonlySet<number>>();
  const quarantined = new Map<number, ReadonlySet<number>>();
  const batches = inserted.filter(({ readings }) => readings.length > 0);
  if (batches.length === 0) return { counts, faultTimes, quarantined };
  const contexts = await loadContexts(tx, batches.map(({ gauge }) => gauge.id));
  const updates: StateUpdate[] = [];
  for (const { gauge, readings } of batches) {
    const { update, faults, verdicts } = await evaluateGaugeReadings(tx, gauge, readings, contexts.get(gauge.id)!, counts);
    updates.push(update);
    if (faults.length > 0) faultTimes.set(gauge.id, new Set(faults));
    if (verdicts.size > 0) quarantined.set(gauge.id, new Set(verdicts.keys()));
  }
  await saveStates(tx, updates);
  const newest = Math.max(...batches.map(({ readings }) => readings.reduce((latest, reading) => Math.max(latest, reading.time), -Infinity)));
  await refreshStaleAlert(tx, batches[0]!.gauge.structureId, newest);
  return { counts, faultTimes, quarantined };
}

async function evaluateGaugeReadings(tx: WriteTx, gauge: Gauge, inserted: readonly EvaluatedReading[], context: GaugeContext, counts: AlertCounts) {
  const setup = gaugeAlertSetup(gauge, context.limits);
  const { stored } = context;
  const lastTime = stored.current.health.lastTime;
  const earliest = inserted.reduce((least, reading) => Math.min(least, reading.time), Infinity);
  if (context.rebuildAfter !== null) {
    // A state this build cannot read: rebuilt from nothing over the readings checkpoints would cover, events already recorded kept.
    const from = Math.min(earliest - 1, context.rebuildAfter) - CHECKPOINTS_KEPT_MS;
    await dropCheckpointsAfter(tx, evaluationCheckpoints, gauge.id, from);
    const replayed = await storedReadingsAfter(tx, gauge.id, from);
    return applyEvaluation(tx, gauge, setup, context, stored, replayed, counts, true);
  }
  const late = lastTime !== null && earliest <= lastTime;
  const checkpoint = late ? await readableCheckpointBefore(tx, evaluationCheckpoints, gauge.id, earliest, parseGaugeEvaluationState) : undefined;
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
  batch: (EvaluatedReading & RejudgedReading)[],
  counts: AlertCounts,
  replayed = false,
): Promise<{ update: StateUpdate; faults: number[]; verdicts: Map<number, number> }> {
  const notifications: Notification[] = [];
  const subject = { gauge, rosette: null };
  const result = evaluateGauge(setup, from.current, batch);
  await applyLimitEvents(tx, subject, result.events, replayed, notifications, counts);
  await followOpenPeaks(tx, subject, from.current.episodes, result.state.episodes);
  for (const finding of result.findings) await applySensorFinding(tx, gauge, finding, notifications);
  await storeVerdicts(tx, gauge.id, result.verdicts, replayed ? batch : []);
  if (batch.length > 0 && (context.flapping || result.events.length > 0)) await settleFlapping(tx, gauge.id, batch.at(-1)!.time, notifications);
  await queueAlertMails(tx, gauge, notifications);
  return { update: stateUpdate(gauge.id, from, result.state), faults: result.faultTimes, verdicts: result.verdicts };
}

