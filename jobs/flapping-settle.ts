import "server-only";
import { eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { alerts, gauges } from "@/db/schema";
import { queueAlertMails } from "@/lib/services/alert-mail";
import { quietFlappingAlerts, settleFlapping, type Notification } from "@/lib/services/alert-raising";

/**
 * Settles flapping alerts by the clock: a gauge whose value came back and stayed back may send no
 * reading for a long while (a logger that reports on change, or one that stopped), and its
 * summary e-mail must not wait for the next one. Each gauge is settled in its own transaction, and
 * an alert once settled is not found again, so a second instance or a second run sends nothing more.
 */
export async function runFlappingSettle(now = Date.now()): Promise<string> {
  const due = await getDb().selectDistinct({ gaugeId: alerts.gaugeId }).from(alerts).where(quietFlappingAlerts(now));
  let settled = 0;
  for (const { gaugeId } of due) {
    settled += await writeTransaction(async (tx) => {
      const [gauge] = await tx.select().from(gauges).where(eq(gauges.id, gaugeId));
      const notifications: Notification[] = [];
      await settleFlapping(tx, gaugeId, now, notifications);
      await queueAlertMails(tx, gauge!, notifications, now);
      return notifications.length;
    });
  }
  return `${settled} flapping alerts settled`;
}
