import { and, desc, eq, inArray, isNotNull, isNull, type SQL } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { alertEvents, alerts, gauges, rosettes, structures, users, type Alert } from "@/db/schema";
import { actorLabel, type Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { recordAudit } from "./audit";
import { getVisibleStructure, listStructuresFor } from "./structures";

export const ALERT_STATES = ["open", "acknowledged", "cleared", "all"] as const;
export type AlertState = (typeof ALERT_STATES)[number];

/** An alert as the API contract shows it, with where it is for the app's lists. */
export type AlertView = {
  id: number;
  structure: string;
  gauge: string;
  /** The rosette a rosette quantity's alert is about; `gauge` is then its gauge a. */
  rosette: string | null;
  kind: Alert["kind"];
  level: Alert["level"];
  quantity: string | null;
  code: string | null;
  message: string | null;
  openedAt: string;
  bound: number | null;
  peak: number | null;
  acknowledgedAt: string | null;
  acknowledgedBy: string | null;
  clearedAt: string | null;
  comment: string | null;
};

function stateCondition(state: AlertState): SQL | undefined {
  switch (state) {
    case "open":
      return and(isNull(alerts.clearedAt), isNull(alerts.acknowledgedAt));
    case "acknowledged":
      return and(isNull(alerts.clearedAt), isNotNull(alerts.acknowledgedAt));
    case "cleared":
      return isNotNull(alerts.clearedAt);
    case "all":
      return undefined;
  }
}

const iso = (date: Date | null) => date?.toISOString() ?? null;

function alertQuery(where: (SQL | undefined)[]) {
  return getDb()
    .select({ alert: alerts, structure: structures.code, gauge: gauges.tag, rosette: rosettes.tag, acknowledgedBy: users.email })
    .from(alerts)
    .innerJoin(structures, eq(structures.id, alerts.structureId))
    .innerJoin(gauges, eq(gauges.id, alerts.gaugeId))
    .leftJoin(rosettes, eq(rosettes.id, alerts.rosetteId))
    .leftJoin(users, eq(users.id, alerts.acknowledgedById))
    .where(and(...where))
    .orderBy(desc(alerts.openedAt), desc(alerts.id));
}

type AlertRow = Awaited<ReturnType<typeof alertQuery>>[number];

function toAlertView({ alert, structure, gauge, rosette, acknowledgedBy }: AlertRow): AlertView {
  return {
    id: alert.id,
    structure,
    gauge,
    rosette,
    kind: alert.kind,
    level: alert.level,
    quantity: alert.quantity,
    code: alert.code,
    message: alert.message,
    openedAt: alert.openedAt.toISOString(),
    bound: alert.bound,
    peak: alert.peak,
    acknowledgedAt: iso(alert.acknowledgedAt),
    acknowledgedBy,
    clearedAt: iso(alert.clearedAt),
    comment: alert.comment,
  };
}

export async function listAlerts(actor: Actor, code: string, state: AlertState, limit = 500): Promise<AlertView[]> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  const rows = await alertQuery([eq(alerts.structureId, structure.id), stateCondition(state)]).limit(limit);
  return rows.map(toAlertView);
}

/** Alerts of every structure the actor may see, for the cross-structure list. */
export async function listAlertsAcross(actor: Actor, state: AlertState, limit = 500): Promise<AlertView[]> {
  const visible = (await listStructuresFor(actor)).map((structure) => structure.id);
  if (visible.length === 0) return [];
  const rows = await alertQuery([inArray(alerts.structureId, visible), stateCondition(state)]).limit(limit);
  return rows.map(toAlertView);
}

export async function countOpenAlerts(structureId: number): Promise<number> {
  const rows = await getDb().select({ id: alerts.id }).from(alerts).where(and(eq(alerts.structureId, structureId), isNull(alerts.clearedAt)));
  return rows.length;
}

async function resolveAlert(actor: Actor, id: number) {
  const [row] = await alertQuery([eq(alerts.id, id)]).limit(1);
  if (!row) throw new AppError("not_found", `Alert ${id} was not found.`);
  const structure = await getVisibleStructure(actor, row.structure).catch(() => {
    throw new AppError("not_found", `Alert ${id} was not found.`);
  });
  return { row, structure };
}

export async function getAlert(actor: Actor, id: number) {
  const { row } = await resolveAlert(actor, id);
  const history = await getDb().select().from(alertEvents).where(eq(alertEvents.alertId, id)).orderBy(alertEvents.at, alertEvents.id);
  return { alert: toAlertView(row), history };
}

type Handling = "acknowledged" | "note" | "cleared";

/** Acknowledge, add a note or clear by hand: each is a line in the alert's history and the audit trail. */
export async function handleAlert(actor: Actor, id: number, handling: Handling, text: string): Promise<AlertView> {
  const { row, structure } = await resolveAlert(actor, id);
  await requirePermission(actor, handling === "note" ? "structure:view" : "alert:acknowledge", structure);
  if (handling === "note" && actor.kind !== "user") throw new AppError("forbidden", "Notes are written by people.");
  const now = new Date();
  const change: Partial<Alert> =
    handling === "acknowledged"
      ? { acknowledgedAt: row.alert.acknowledgedAt ?? now, acknowledgedById: actor.kind === "user" ? actor.id : null, comment: text }
      : handling === "cleared"
        ? { clearedAt: row.alert.clearedAt ?? now }
        : {};
  await writeTransaction(async (tx) => {
    if (Object.keys(change).length > 0) await tx.update(alerts).set(change).where(eq(alerts.id, id));
    await tx.insert(alertEvents).values({
      alertId: id,
      type: handling,
      at: now,
      byId: actor.kind === "user" ? actor.id : null,
      byLabel: actorLabel(actor),
      text,
    });
    await recordAudit(tx, {
      actor,
      action: `alert.${handling}`,
      entityType: "alert",
      entityKey: String(id),
      structureId: structure.id,
      after: { text },
    });
  });
  return (await getAlert(actor, id)).alert;
}
