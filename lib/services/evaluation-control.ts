import "server-only";
import { and, eq, inArray, isNull } from "drizzle-orm";
import type { WriteTx } from "@/db/client";
import { alertEvents, alerts, evaluationCheckpoints, evaluationStates, rosetteEvaluationCheckpoints, rosetteEvaluationStates, type Gauge } from "@/db/schema";
import { parseRosetteEvaluationState, restartAtNewZero, restartEpisode, restartQuantities, type GaugeEvaluationState } from "@/lib/alerting/evaluation-state";
import { QUANTITIES, type Quantity, type RosetteLimitQuantity } from "@/lib/limits";
import { queueAlertMails } from "./alert-mail";
import { storedStateOf, type AlertSubject, type Notification, type StoredState } from "./alert-raising";
import { dropCheckpointsAfter } from "./evaluation-checkpoints";

/** A gauge's stored evaluation state, checked; undefined when there is none (or it is being rebuilt anyway). */
export async function loadGaugeState(tx: WriteTx, gaugeId: number): Promise<{ stored: StoredState } | undefined> {
  const [row] = await tx.select().from(evaluationStates).where(eq(evaluationStates.gaugeId, gaugeId));
  if (!row) return undefined;
  const { stored, rebuildAfter } = storedStateOf(row);
  return rebuildAfter === null ? { stored } : undefined;
}

/**
 * Saves a state changed outside ingestion. Its checkpoints described the old state: a late reading
 * replayed from one would bring back what was just closed, so they go (ingestion makes new ones).
 */
export async function saveGaugeState(tx: WriteTx, gaugeId: number, current: GaugeEvaluationState) {
  await tx
    .update(evaluationStates)
    .set({ state: { current, lastCheckpointAt: null }, lastTime: current.health.lastTime })
    .where(eq(evaluationStates.gaugeId, gaugeId));
  await dropCheckpointsAfter(tx, evaluationCheckpoints, gaugeId, ALL_TIMES);
}

/** Before any reading time: dropping the checkpoints "after" it drops them all. */
const ALL_TIMES = -Number.MAX_SAFE_INTEGER;

/** Why a change closes a limit alert, and what happens next; the e-mail adds who made the change. */
type Closing = { because: string; next: string };

/**
 * Closes the gauge's open limit alerts on these quantities, saying why as a line of each alert's
 * history, and tells the people who were told they opened, through the alerts' own e-mails.
 */
async function closeLimitAlerts(tx: WriteTx, { gauge, rosette }: AlertSubject, quantities: readonly string[], closing: Closing, byLabel: string) {
  if (quantities.length === 0) return;
  const ofSubject = rosette === null ? isNull(alerts.rosetteId) : eq(alerts.rosetteId, rosette.id);
  const open = await tx
    .select()
    .from(alerts)
    .where(and(eq(alerts.gaugeId, gauge.id), eq(alerts.kind, "limit"), ofSubject, isNull(alerts.clearedAt), inArray(alerts.quantity, [...quantities])));
  const at = new Date();
  const notifications: Notification[] = [];
  for (const alert of open) {
    // settled: a restart is no flapping, the next crossing is a new alert
    await tx.update(alerts).set({ clearedAt: at, settledAt: at }).where(eq(alerts.id, alert.id));
    const [event] = await tx
      .insert(alertEvents)
      .values({ alertId: alert.id, type: "cleared", at, byLabel, text: `Closed because ${closing.because}. ${closing.next}` })
      .returning({ id: alertEvents.id });
    const because = `Closed because ${closing.because} by ${byLabel}. ${closing.next}`;
    notifications.push({ kind: "closed", alertId: alert.id, eventId: event!.id, alert, because, time: at.getTime(), rosette: rosette?.tag ?? null });
  }
  await queueAlertMails(tx, gauge, notifications, at.getTime());
}

/** A new zero is one of the two ways to settle a jump: the reference moved, and it is now measured from again. */
async function closeJumpAlert(tx: WriteTx, gauge: Gauge, byLabel: string) {
  const open = await tx
    .select({ id: alerts.id })
    .from(alerts)
    .where(and(eq(alerts.gaugeId, gauge.id), eq(alerts.kind, "sensor"), eq(alerts.code, "jump"), isNull(alerts.clearedAt)));
  const at = new Date();
  const message = `Resolved by a new zero recorded by ${byLabel}: the gauge's reference moved. ${ZERO_AFTER_JUMP}`;
  for (const { id } of open) {
    await tx.update(alerts).set({ clearedAt: at }).where(eq(alerts.id, id));
    const [event] = await tx.insert(alertEvents).values({ alertId: id, type: "cleared", at, byLabel, text: message }).returning({ id: alertEvents.id });
    await queueAlertMails(tx, gauge, [{ kind: "sensor", alertId: id, eventId: event!.id, type: "cleared", code: "jump", message, time: at.getTime() }], at.getTime());
  }
}

export type EvaluationChange =
  | { kind: "limits"; removed: readonly Quantity[]; changed: readonly Quantity[] }
  | { kind: "material" }
  | { kind: "zero" }
  | { kind: "thermal-model" };

const CLOSINGS = {
  removed: { because: "the limits of this quantity were removed", next: "Its readings are no longer checked against limits." },
  changed: { because: "the limits were changed", next: "Evaluation starts again against the new limits, and a crossing of them opens a new alert." },
  material: { because: "the gauge's material was changed", next: "Evaluation starts again with it, and a crossing opens a new alert." },
  zero: { because: "a new zero was recorded", next: "Evaluation starts again from it, and a crossing opens a new alert." },
  "thermal-model": {
    because: "the gauge's thermal model was changed",
    next: "The residual is measured against the model now in force, and a crossing of its limits opens a new alert.",
  },
} as const satisfies Record<string, Closing>;

const ZERO_AFTER_JUMP = "Readings from the jump to the new zero stay set aside; limits are checked again from the new zero on.";

/**
 * What a configuration change does to a gauge's evaluation: an episode measured against old limits,
 * an old yield or an old zero cannot be continued, so the affected machines start again and their
 * open alerts close saying why (otherwise nothing could ever clear them). A new zero also restarts
 * the jump detector, so the change of reference is never taken for a jump, and settles a held jump.
 */
export async function restartGaugeEvaluation(tx: WriteTx, gauge: Gauge, change: EvaluationChange, byLabel: string) {
  const loaded = await loadGaugeState(tx, gauge.id);
  const subject = { gauge, rosette: null };
  if (change.kind === "limits") {
    await closeLimitAlerts(tx, subject, change.removed, CLOSINGS.removed, byLabel);
    await closeLimitAlerts(tx, subject, change.changed, CLOSINGS.changed, byLabel);
    if (loaded) await saveGaugeState(tx, gauge.id, restartQuantities(loaded.stored.current, [...change.removed, ...change.changed]));
    return;
  }
  const quantities: Quantity[] = change.kind === "zero" ? [...QUANTITIES] : change.kind === "thermal-model" ? ["residual"] : ["stress", "utilisation"];
  await closeLimitAlerts(tx, subject, quantities, CLOSINGS[change.kind], byLabel);
  if (change.kind === "zero") await closeJumpAlert(tx, gauge, byLabel);
  if (!loaded) return;
  const current = loaded.stored.current;
  await saveGaugeState(tx, gauge.id, change.kind === "zero" ? restartAtNewZero(current, quantities) : restartQuantities(current, quantities));
}

/** After a limit alert is cleared by hand, its machine starts again, so the next crossing opens a new alert. */
export async function restartAfterHandClear(tx: WriteTx, alert: { gaugeId: number; rosetteId: number | null; quantity: string | null }) {
  if (!alert.quantity) return;
  if (alert.rosetteId === null) {
    const loaded = await loadGaugeState(tx, alert.gaugeId);
    if (loaded) await saveGaugeState(tx, alert.gaugeId, restartQuantities(loaded.stored.current, [alert.quantity as Quantity]));
    return;
  }
  await restartRosetteQuantities(tx, alert.rosetteId, [alert.quantity as RosetteLimitQuantity]);
}

/** The rosette's machines of these quantities start again; its checkpoints go, as a gauge's do. */
async function restartRosetteQuantities(tx: WriteTx, rosetteId: number, quantities: readonly RosetteLimitQuantity[]) {
  if (quantities.length === 0) return;
  const [row] = await tx.select().from(rosetteEvaluationStates).where(eq(rosetteEvaluationStates.rosetteId, rosetteId));
  const state = row && parseRosetteEvaluationState(row.state);
  // An unreadable state is rebuilt by the next ingestion anyway.
  if (!state) return;
  const episodes = { ...state.episodes };
  for (const quantity of quantities) if (episodes[quantity]) episodes[quantity] = restartEpisode(episodes[quantity]);
  await tx.update(rosetteEvaluationStates).set({ state: { ...state, episodes, lastCheckpointAt: null } }).where(eq(rosetteEvaluationStates.rosetteId, rosetteId));
  await dropCheckpointsAfter(tx, rosetteEvaluationCheckpoints, rosetteId, ALL_TIMES);
}

/**
 * A rosette's limits changed: as for a gauge, a quantity whose limits went or changed starts again
 * and its open alert closes, saying why, to the people told it opened.
 */
export async function restartRosetteEvaluation(
  tx: WriteTx,
  subject: { gauge: Gauge; rosette: { id: number; tag: string } },
  change: { removed: readonly RosetteLimitQuantity[]; changed: readonly RosetteLimitQuantity[] },
  byLabel: string,
) {
  await closeLimitAlerts(tx, subject, change.removed, CLOSINGS.removed, byLabel);
  await closeLimitAlerts(tx, subject, change.changed, CLOSINGS.changed, byLabel);
  await restartRosetteQuantities(tx, subject.rosette.id, [...change.removed, ...change.changed]);
}
