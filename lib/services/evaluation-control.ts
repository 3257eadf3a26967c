import "server-only";
import { and, eq, inArray, isNull } from "drizzle-orm";
import type { WriteTx } from "@/db/client";
import { alertEvents, alerts, evaluationCheckpoints, evaluationStates, rosetteEvaluationCheckpoints, rosetteEvaluationStates, type Gauge } from "@/db/schema";
import { parseRosetteEvaluationState, restartAtNewZero, restartEpisode, restartQuantities, type GaugeEvaluationState } from "@/lib/alerting/evaluation-state";
import { QUANTITIES, type Quantity, type RosetteLimitQuantity } from "@/lib/limits";
import { storedStateOf, type StoredState } from "./alert-raising";
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

/** Closes the gauge's open limit alerts on these quantities, saying why, as a line of each alert's history. */
async function closeLimitAlerts(tx: WriteTx, gauge: Gauge, quantities: readonly string[], reason: string, byLabel: string) {
  if (quantities.length === 0) return;
  const open = await tx
    .select({ id: alerts.id })
    .from(alerts)
    .where(and(eq(alerts.gaugeId, gauge.id), eq(alerts.kind, "limit"), isNull(alerts.rosetteId), isNull(alerts.clearedAt), inArray(alerts.quantity, [...quantities])));
  const at = new Date();
  for (const { id } of open) {
    // settled: a restart is no flapping, the next crossing is a new alert
    await tx.update(alerts).set({ clearedAt: at, settledAt: at }).where(eq(alerts.id, id));
    await tx.insert(alertEvents).values({ alertId: id, type: "cleared", at, byLabel, text: reason });
  }
}

/** A new zero is one of the two ways to settle a jump: the reference moved, and it is now measured from again. */
async function closeJumpAlert(tx: WriteTx, gauge: Gauge, byLabel: string) {
  const open = await tx
    .select({ id: alerts.id })
    .from(alerts)
    .where(and(eq(alerts.gaugeId, gauge.id), eq(alerts.kind, "sensor"), eq(alerts.code, "jump"), isNull(alerts.clearedAt)));
  const at = new Date();
  for (const { id } of open) {
    await tx.update(alerts).set({ clearedAt: at }).where(eq(alerts.id, id));
    await tx.insert(alertEvents).values({ alertId: id, type: "cleared", at, byLabel, text: REASONS.zeroJump });
  }
}

export type EvaluationChange =
  | { kind: "limits"; removed: readonly Quantity[]; changed: readonly Quantity[] }
  | { kind: "material" }
  | { kind: "zero" };

const REASONS = {
  removed: "Cleared: the limits of this quantity were removed.",
  changed: "Cleared: the limits changed; evaluation starts again against the new limits, and a crossing of them opens a new alert.",
  material: "Cleared: the gauge's material changed; evaluation starts again with it, and a crossing opens a new alert.",
  zero: "Cleared: a new zero was recorded; evaluation starts again from it, and a crossing opens a new alert.",
  zeroJump: "Resolved by a new zero: the gauge's reference moved. Readings from the jump to the new zero stay set aside; limits are checked again from the new zero on.",
} as const;

/**
 * What a configuration change does to a gauge's evaluation: an episode measured against old limits,
 * an old yield or an old zero cannot be continued, so the affected machines start again and their
 * open alerts close saying why (otherwise nothing could ever clear them). A new zero also restarts
 * the jump detector, so the change of reference is never taken for a jump, and settles a held jump.
 */
export async function restartGaugeEvaluation(tx: WriteTx, gauge: Gauge, change: EvaluationChange, byLabel: string) {
  const loaded = await loadGaugeState(tx, gauge.id);
  if (change.kind === "limits") {
    await closeLimitAlerts(tx, gauge, change.removed, REASONS.removed, byLabel);
    await closeLimitAlerts(tx, gauge, change.changed, REASONS.changed, byLabel);
    if (loaded) await saveGaugeState(tx, gauge.id, restartQuantities(loaded.stored.current, [...change.removed, ...change.changed]));
    return;
  }
  const quantities: Quantity[] = change.kind === "zero" ? [...QUANTITIES] : ["stress", "utilisation"];
  await closeLimitAlerts(tx, gauge, quantities, REASONS[change.kind], byLabel);
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
  const [row] = await tx.select().from(rosetteEvaluationStates).where(eq(rosetteEvaluationStates.rosetteId, alert.rosetteId));
  const state = row && parseRosetteEvaluationState(row.state);
  const quantity = alert.quantity as RosetteLimitQuantity;
  // An unreadable state is rebuilt by the next ingestion anyway.
  if (!state?.episodes[quantity]) return;
  const episodes = { ...state.episodes, [quantity]: restartEpisode(state.episodes[quantity]) };
  await tx.update(rosetteEvaluationStates).set({ state: { ...state, episodes, lastCheckpointAt: null } }).where(eq(rosetteEvaluationStates.rosetteId, alert.rosetteId));
  await dropCheckpointsAfter(tx, rosetteEvaluationCheckpoints, alert.rosetteId, ALL_TIMES);
}
