import "server-only";
import { desc, eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { gauges, readings, type Gauge } from "@/db/schema";
import { DEFAULT_EXPECTED_INTERVAL_S, STALE_AFTER_INTERVALS } from "@/lib/alerting/gauge-state";
import { checkStale } from "@/lib/limits";
import { raiseSensorFinding } from "@/lib/services/alert-raising";

async function lastReadingAt(gauge: Gauge): Promise<number> {
  const [row] = await getDb().select({ time: readings.time }).from(readings).where(eq(readings.gaugeId, gauge.id)).orderBy(desc(readings.time)).limit(1);
  // A gauge that never reported counts from its registration.
  return row?.time ?? gauge.createdAt.getTime();
}

/**
 * Raises a "no data" sensor alert (and its e-mails) for every active gauge whose logger has gone
 * silent; ingestion clears it when data arrive again. Already-open alerts are not raised twice.
 */
export async function runStaleWatch(now = Date.now()): Promise<string> {
  const active = await getDb().select().from(gauges).where(eq(gauges.status, "active"));
  let raised = 0;
  for (const gauge of active) {
    const thresholds = { expectedIntervalMs: (gauge.expectedInterval ?? DEFAULT_EXPECTED_INTERVAL_S) * 1000, intervals: STALE_AFTER_INTERVALS };
    const finding = checkStale(thresholds, await lastReadingAt(gauge), now);
    if (!finding) continue;
    const notifications = await writeTransaction((tx) => raiseSensorFinding(tx, gauge, finding));
    raised += notifications.length;
  }
  return `${active.length} gauges checked, ${raised} newly stale`;
}
