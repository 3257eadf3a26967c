import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { bulkSql, type WriteTx } from "@/db/client";
import { alertEvents, alerts, gauges, type Gauge } from "@/db/schema";
import { DEFAULT_EXPECTED_INTERVAL_S, STALE_AFTER_INTERVALS } from "@/lib/alerting/gauge-state";
import { checkStale } from "@/lib/limits";
import { queueAlertMails } from "./alert-mail";

/** The structure's active gauges silent at `now`, each with its last reading's time (its registration when it never reported). */
async function silentGauges(tx: WriteTx, structureId: number, now: number): Promise<{ gauge: Gauge; since: number }[]> {
  const active = await tx
    .select()
    .from(gauges)
    .where(and(eq(gauges.structureId, structureId), eq(gauges.status, "active")));
  const silent: { gauge: Gauge; since: number }[] = [];
  for (const gauge of active) {
    // One max() per gauge is a single probe of the (gauge, time) key; a GROUP BY over all gauges would scan it.
    const [row] = await bulkSql(tx).rows("SELECT max(t) FROM readings WHERE gauge_id = ?", [gauge.id]);
    const since = (row?.[0] as number | null) ?? gauge.createdAt.getTime();
    const thresholds = { expectedIntervalMs: (gauge.expectedInterval ?? DEFAULT_EXPECTED_INTERVAL_S) * 1000, intervals: STALE_AFTER_INTERVALS };
    if (checkStale(thresholds, since, now)) silent.push({ gauge, since });
  }
  return silent;
}

function staleMessage(silent: readonly { gauge: Gauge; since: number }[]): string {
  const names = silent.map(({ gauge, since }) => `${gauge.tag} (last reading ${new Date(since).toISOString().slice(0, 16).replace("T", " ")} UTC)`);
  return `No data from ${silent.length === 1 ? "1 gauge" : `${silent.length} gauges`}: ${names.join(", ")}. Check the logger, its power and its link; values shown for these gauges are not current.`;
}

/**
 * One "no data" alert per structure, naming the silent gauges: a logger that stops silences all its
 * gauges at once, and one alert (one e-mail each) tells that better than one per gauge. Opened by
 * the stale-data job (`raise`); ingestion only narrows or clears an open one, judging the other
 * gauges as of the newest reading it stored. Answers how many alerts were opened (0 or 1).
 */
export async function refreshStaleAlert(tx: WriteTx, structureId: number, now: number, raise = false): Promise<number> {
  const [open] = await tx
    .select()
    .from(alerts)
    .where(and(eq(alerts.structureId, structureId), eq(alerts.kind, "sensor"), eq(alerts.code, "stale"), isNull(alerts.clearedAt)))
    .limit(1);
  if (!open && !raise) return 0;
  const silent = await silentGauges(tx, structureId, now);
  const at = new Date(now);
  if (open && silent.length === 0) {
    const message = "Readings are arriving again from every gauge.";
    await tx.update(alerts).set({ clearedAt: at, message }).where(eq(alerts.id, open.id));
    const [event] = await tx.insert(alertEvents).values({ alertId: open.id, type: "cleared", at, byLabel: "data watch", text: message }).returning({ id: alertEvents.id });
    const [gauge] = await tx.select().from(gauges).where(eq(gauges.id, open.gaugeId));
    await queueAlertMails(tx, gauge!, [{ kind: "sensor", alertId: open.id, eventId: event!.id, type: "cleared", code: "stale", message, time: now }]);
    return 0;
  }
  if (silent.length === 0) return 0;
  const message = staleMessage(silent);
  if (open) {
    // The list changes as gauges fall silent or report again; the one alert says so without another e-mail.
    if (open.message !== message) await tx.update(alerts).set({ message }).where(eq(alerts.id, open.id));
    return 0;
  }
  const first = silent[0]!.gauge;
  // "watch": silence says nothing about the structure, only that it is not being watched.
  const [created] = await tx
    .insert(alerts)
    .values({ structureId, gaugeId: first.id, kind: "sensor", level: "watch", code: "stale", message, openedAt: at })
    .returning({ id: alerts.id });
  const [event] = await tx
    .insert(alertEvents)
    .values({ alertId: created!.id, type: "opened", at, level: "watch", byLabel: "data watch", text: message })
    .returning({ id: alertEvents.id });
  const tags = silent.map(({ gauge }) => gauge.tag);
  await queueAlertMails(tx, first, [{ kind: "sensor", alertId: created!.id, eventId: event!.id, type: "opened", code: "stale", message, time: now, gauges: tags }]);
  return 1;
}
