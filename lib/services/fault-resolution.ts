import "server-only";
import { and, eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { alertEvents, alerts, readings } from "@/db/schema";
import { rebuildRollupsOfDay } from "@/jobs/rollup-maintenance";
import { actorLabel, type Actor } from "@/lib/auth/actor";
import { acceptStep, gaugeAlertSetup } from "@/lib/alerting/evaluate-gauge";
import { AppError } from "@/lib/errors";
import { applyLimitEvents, followOpenPeaks, storedReadingsAfter, storeVerdicts, type AlertCounts, type Notification } from "./alert-raising";
import { queueAlertMails } from "./alert-mail";
import { getAlert, type AlertView } from "./alerts";
import { recordAudit } from "./audit";
import { loadGaugeState, saveGaugeState } from "./evaluation-control";
import { recordZero, resolveGauge } from "./gauges";
import { limitsOfGauge } from "./limits";

/**
 * How an engineer settles a jump: the structure really moved ("accept-step": the quarantined
 * readings are evaluated against the limits from the jump on), or the gauge's reference moved
 * ("new-zero": the reading at the jump becomes the zero, and the readings between stay set aside).
 */
export const FAULT_RESOLUTIONS = ["accept-step", "new-zero"] as const;
export type FaultResolution = (typeof FAULT_RESOLUTIONS)[number];

const DAY_MS = 86_400_000;

async function heldJumpAlert(actor: Actor, id: number): Promise<AlertView> {
  const { alert } = await getAlert(actor, id);
  if (alert.kind !== "sensor" || alert.code !== "jump") throw new AppError("conflict", `Alert ${id} is not a jump; only a jump is resolved this way.`);
  if (alert.clearedAt) throw new AppError("conflict", `Alert ${id} is already cleared.`);
  return alert;
}

export async function resolveSensorFault(actor: Actor, id: number, resolution: FaultResolution, text: string): Promise<AlertView> {
  const alert = await heldJumpAlert(actor, id);
  if (resolution === "new-zero") {
    const { gauge } = await resolveGauge(actor, alert.structure, alert.gauge, "zero:record");
    const since = (await loadGaugeStateOutside(gauge.id)) ?? Date.parse(alert.openedAt);
    const [reading] = await getDb()
      .select({ value: readings.value, temperature: readings.temperature })
      .from(readings)
      .where(and(eq(readings.gaugeId, gauge.id), eq(readings.time, since)));
    if (!reading) throw new AppError("conflict", "The reading at the jump is no longer stored; record the new zero on the gauge page instead.");
    // recordZero closes the jump alert and restarts the evaluation from the new reference.
    await recordZero(actor, alert.structure, alert.gauge, { value: reading.value, temperature: reading.temperature, time: new Date(since).toISOString(), reason: text });
    return (await getAlert(actor, id)).alert;
  }
  const { structure, gauge } = await resolveGauge(actor, alert.structure, alert.gauge, "alert:acknowledge");
  const setup = gaugeAlertSetup(gauge, await limitsOfGauge(gauge.id));
  const counts: AlertCounts = { opened: 0, escalated: 0, cleared: 0 };
  const since = await writeTransaction(async (tx) => {
    const loaded = await loadGaugeState(tx, gauge.id);
    const hold = loaded?.stored.current.hold ?? null;
    const notifications: Notification[] = [];
    if (loaded && hold) {
      const quarantined = await storedReadingsAfter(tx, gauge.id, hold.since - 1);
      const result = acceptStep(setup, loaded.stored.current, quarantined);
      await storeVerdicts(tx, gauge.id, result.verdicts);
      const subject = { gauge, rosette: null };
      await applyLimitEvents(tx, subject, result.events, true, notifications, counts);
      await followOpenPeaks(tx, subject, {}, result.state.episodes);
      await saveGaugeState(tx, gauge.id, result.state);
    }
    const now = new Date();
    await tx.update(alerts).set({ clearedAt: now }).where(eq(alerts.id, id));
    const message = `Accepted as a real step by ${actorLabel(actor)}; limits are checked again from the jump on. ${text}`;
    const [event] = await tx
      .insert(alertEvents)
      .values({ alertId: id, type: "cleared", at: now, byId: actor.kind === "user" ? actor.id : null, byLabel: actorLabel(actor), text: message })
      .returning({ id: alertEvents.id });
    // Those told of the jump are told how it was settled.
    notifications.push({ kind: "sensor", alertId: id, eventId: event!.id, type: "cleared", code: "jump", message, time: now.getTime() });
    await recordAudit(tx, { actor, action: "alert.accept-step", entityType: "alert", entityKey: String(id), structureId: structure.id, after: { text, since: hold?.since ?? null, ...counts } });
    await queueAlertMails(tx, gauge, notifications);
    return hold?.since ?? null;
  });
  // The readings taken back belong in the roll-ups again.
  if (since !== null) for (let day = Math.floor(since / DAY_MS) * DAY_MS; day <= Date.now(); day += DAY_MS) await rebuildRollupsOfDay(day);
  return (await getAlert(actor, id)).alert;
}

/** When the held jump began, read outside a transaction for the zero service, which runs its own. */
async function loadGaugeStateOutside(gaugeId: number): Promise<number | null> {
  return writeTransaction(async (tx) => (await loadGaugeState(tx, gaugeId))?.stored.current.hold?.since ?? null);
}
