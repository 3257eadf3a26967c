import "server-only";
import { eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { gauges } from "@/db/schema";
import { refreshStaleAlert } from "@/lib/services/stale-alerts";

/**
 * Raises one "no data" sensor alert (and its e-mails) per structure whose gauges have gone silent,
 * naming them; keeps its list current and clears it when every gauge reports again.
 */
export async function runStaleWatch(now = Date.now()): Promise<string> {
  const rows = await getDb().selectDistinct({ structureId: gauges.structureId }).from(gauges).where(eq(gauges.status, "active"));
  let raised = 0;
  for (const { structureId } of rows) raised += await writeTransaction((tx) => refreshStaleAlert(tx, structureId, now, true));
  return `${rows.length} structures checked, ${raised} newly stale`;
}
