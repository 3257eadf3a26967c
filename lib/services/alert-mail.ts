import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import type { WriteTx } from "@/db/client";
import { structureMembers, structures, users, type Gauge } from "@/db/schema";
import { ALERT_MAIL_ROLES } from "@/lib/auth/permissions";
import { buildAlertMail } from "@/lib/mail/alert";
import { appUrl } from "@/lib/mail/message";
import { queueMail } from "@/lib/mail/outbox";
import { buildSensorAlertMail } from "@/lib/mail/sensor-alert";
import type { Notification } from "./alert-raising";


/** Owners and engineers of the structure who asked for alert e-mails as they happen (the others get the digest). */
async function immediateRecipients(tx: WriteTx, structureId: number) {
  return tx
    .select({ id: users.id, email: users.email })
    .from(structureMembers)
    .innerJoin(users, eq(users.id, structureMembers.userId))
    .where(
      and(
        eq(structureMembers.structureId, structureId),
        eq(structureMembers.alertMail, "immediate"),
        eq(users.active, true),
        inArray(users.role, [...ALERT_MAIL_ROLES]),
      ),
    );
}

function mailFor(notification: Notification, gauge: Gauge, structure: { code: string; name: string; timezone: string }) {
  const facts = { structure, gauge: { tag: gauge.tag, label: gauge.label, location: gauge.member } };
  if (notification.kind === "sensor") {
    return buildSensorAlertMail(
      { ...facts, event: notification.type, code: notification.code, message: notification.message, at: new Date(notification.time) },
      appUrl(),
    );
  }
  const { event } = notification;
  return buildAlertMail(
    {
      ...facts,
      rosette: notification.rosette,
      event: notification.type,
      level: event.level,
      quantity: event.quantity,
      value: event.value,
      bound: { side: event.peak >= event.bound ? "upper" : "lower", value: event.bound },
      at: new Date(event.time),
    },
    appUrl(),
  );
}

/**
 * Queues one e-mail per recipient and alert event in the transaction that raised the event, so
 * mail is neither lost when the relay is down nor sent for an alert that was rolled back.
 */
export async function queueAlertMails(tx: WriteTx, gauge: Gauge, notifications: readonly Notification[]): Promise<void> {
  if (notifications.length === 0) return;
  const [structure] = await tx
    .select({ code: structures.code, name: structures.name, timezone: structures.timezone })
    .from(structures)
    .where(eq(structures.id, gauge.structureId));
  const recipients = await immediateRecipients(tx, gauge.structureId);
  for (const notification of notifications) {
    const mail = mailFor(notification, gauge, structure!);
    const step = notification.kind === "limit" ? `${notification.type}:${notification.event.level}:${notification.event.time}` : `${notification.type}:${notification.time}`;
    for (const recipient of recipients) {
      await queueMail(tx, { ...mail, to: recipient.email, toUserId: recipient.id, kind: "alert", dedupeKey: `alert:${notification.alertId}:${step}:${recipient.id}` });
    }
  }
}
