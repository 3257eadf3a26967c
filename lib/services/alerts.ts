import "server-only";
import { and, count, desc, eq, inArray, isNotNull, isNull, lt, ne, or, type SQL } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { alertEvents, alerts, gauges, rosettes, structures, users, type Alert } from "@/db/schema";
import { actorLabel, type Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import type { AlertFilter, AlertState } from "@/lib/alerting/filters";
import { recordAudit } from "./audit";
import { restartAfterHandClear } from "./evaluation-control";
import { resolveGauge } from "./gauges";
import { getVisibleStructure, listStructuresFor } from "./structures";

export { ALERT_STATES, type AlertState } from "@/lib/alerting/filters";

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
  /** When the episode reached `peak`. */
  peakAt: string | null;
  /** How many times the episode opened; more than once when it came back soon after clearing. */
  openings: number;
  /** Since when the alert is flapping (re-opening again and again), or null. */
  flappingSince: string | null;
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

/** Which alerts a list shows, and which page of them: filtered, counted and paged in the database. */
export type AlertQuery = AlertFilter & {
  /** Only this gauge's alerts (its own and those of rosettes it is gauge a of). */
  gauge?: string;
  limit: number;
  /** Rows to skip (pages of a screen), or… */
  offset?: number;
  /** …the `nextCursor` of the previous page (the API), which stays right while new alerts arrive. */
  cursor?: string;
};

export type AlertPage = { alerts: AlertView[]; total: number; nextCursor: string | null };

/** Newest first, so a cursor is the last row's opening time and id: "1764760000000.42". */
const cursorOf = (alert: Alert) => `${alert.openedAt.getTime()}.${alert.id}`;

function afterCursor(cursor: string | undefined): SQL | undefined {
  if (cursor === undefined) return undefined;
  const [at, id] = cursor.split(".").map(Number);
  if (!Number.isSafeInteger(at) || !Number.isSafeInteger(id)) throw new AppError("validation_failed", "cursor is the nextCursor of the previous page.");
  return or(lt(alerts.openedAt, new Date(at!)), and(eq(alerts.openedAt, new Date(at!)), lt(alerts.id, id!)));
}

function filterConditions(filter: AlertFilter): (SQL | undefined)[] {
  return [
    stateCondition(filter.state),
    filter.level === "any" ? undefined : eq(alerts.level, filter.level),
    filter.kind === "any" ? undefined : eq(alerts.kind, filter.kind),
  ];
}

async function alertPage(scope: SQL, query: AlertQuery): Promise<AlertPage> {
  const where = [scope, ...filterConditions(query)];
  const [rows, [counted]] = await Promise.all([
    alertQuery([...where, afterCursor(query.cursor)])
      .limit(query.limit + 1)
      .offset(query.offset ?? 0),
    getDb().select({ total: count() }).from(alerts).where(and(...where)),
  ]);
  const more = rows.length > query.limit;
  const shown = rows.slice(0, query.limit);
  return { alerts: shown.map(toAlertView), total: counted?.total ?? 0, nextCursor: more ? cursorOf(shown.at(-1)!.alert) : null };
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
    peakAt: iso(alert.peakAt),
    openings: alert.openings,
    flappingSince: iso(alert.flappingSince),
    acknowledgedAt: iso(alert.acknowledgedAt),
    acknowledgedBy,
    clearedAt: iso(alert.clearedAt),
    comment: alert.comment,
  };
}

/** One page of a structure's alerts (or of one gauge's) with the filter's total. */
export async function listAlerts(actor: Actor, code: string, query: AlertQuery): Promise<AlertPage> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  if (query.gauge === undefined) return alertPage(eq(alerts.structureId, structure.id), query);
  const [gauge] = await getDb()
    .select({ id: gauges.id })
    .from(gauges)
    .where(and(eq(gauges.structureId, structure.id), eq(gauges.tag, query.gauge)));
  if (!gauge) throw new AppError("not_found", `Gauge ${query.gauge} was not found on ${structure.code}.`);
  return alertPage(eq(alerts.gaugeId, gauge.id), query);
}

/** Episodes drawn on a gauge's charts at most; past that the page says how many it left out. */
export const EPISODES_DRAWN = 2_000;

/** The gauge's own limit alerts (not its rosettes'), newest first, as spans for its charts, with how many there are. */
export async function listGaugeEpisodes(actor: Actor, code: string, tag: string) {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const own = and(eq(alerts.gaugeId, gauge.id), eq(alerts.kind, "limit"), isNull(alerts.rosetteId));
  const [rows, [counted]] = await Promise.all([
    getDb()
      .select({ openedAt: alerts.openedAt, clearedAt: alerts.clearedAt, level: alerts.level })
      .from(alerts)
      .where(own)
      .orderBy(desc(alerts.openedAt), desc(alerts.id))
      .limit(EPISODES_DRAWN),
    getDb().select({ total: count() }).from(alerts).where(own),
  ]);
  return {
    episodes: rows.map((row) => ({ openedAt: row.openedAt.getTime(), clearedAt: row.clearedAt?.getTime() ?? null, level: row.level })),
    total: counted?.total ?? 0,
  };
}

/** One page of the alerts of every structure the actor may see, for the cross-structure list. */
export async function listAlertsAcross(actor: Actor, query: AlertQuery): Promise<AlertPage> {
  const visible = (await listStructuresFor(actor)).map((structure) => structure.id);
  if (visible.length === 0) return { alerts: [], total: 0, nextCursor: null };
  return alertPage(inArray(alerts.structureId, visible), query);
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
  if (handling === "cleared" && row.alert.kind === "sensor" && row.alert.code === "jump" && !row.alert.clearedAt) {
    throw new AppError("conflict", "A jump is resolved, not cleared: accept the step as real, or record a new zero.", { field: "handling" });
  }
  const now = new Date();
  const change: Partial<Alert> =
    handling === "acknowledged"
      ? { acknowledgedAt: row.alert.acknowledgedAt ?? now, acknowledgedById: actor.kind === "user" ? actor.id : null, comment: text }
      : handling === "cleared"
        ? // settled: cleared by a person, it is not re-opened as flapping; the next crossing is a new alert
          { clearedAt: row.alert.clearedAt ?? now, settledAt: row.alert.settledAt ?? now }
        : {};
  await writeTransaction(async (tx) => {
    if (Object.keys(change).length > 0) await tx.update(alerts).set(change).where(eq(alerts.id, id));
    if (handling === "cleared" && !row.alert.clearedAt && row.alert.kind === "limit") await restartAfterHandClear(tx, row.alert);
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

/** A gauge's unresolved sensor faults: since when (the earliest still open) and which. */
export type SensorFaultStatus = { since: Date; faults: string[] };

/**
 * Which of these gauges are in an unresolved sensor fault (flat line, jump, out of range; "no data"
 * is staleness, answered apart), since when and which faults: an open sensor alert is the record
 * of it. A held jump stays here until an engineer resolves it, so the gauge's condition can say
 * `sensor-fault` and its limits are not being checked. Gauges without any are absent.
 */
export async function openSensorFaults(gaugeIds: readonly number[]): Promise<Map<number, SensorFaultStatus>> {
  const faults = new Map<number, SensorFaultStatus>();
  if (gaugeIds.length === 0) return faults;
  const rows = await getDb()
    .select({ gaugeId: alerts.gaugeId, code: alerts.code, openedAt: alerts.openedAt })
    .from(alerts)
    .where(and(inArray(alerts.gaugeId, [...gaugeIds]), eq(alerts.kind, "sensor"), isNull(alerts.clearedAt), ne(alerts.code, "stale")))
    .orderBy(alerts.openedAt);
  for (const { gaugeId, code, openedAt } of rows) {
    const status = faults.get(gaugeId) ?? { since: openedAt, faults: [] };
    if (code && !status.faults.includes(code)) status.faults.push(code);
    faults.set(gaugeId, status);
  }
  return faults;
}
