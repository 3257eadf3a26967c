import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import type { WriteTx } from "@/db/client";
import { alertEvents, structureMembers, structures, users, type Alert, type AlertMailMode, type Gauge, type Role } from "@/db/schema";
import { IMMEDIATE_MAIL_MAX_AGE_MS } from "@/lib/alerting/flapping";
import type { Level, Quantity, RosetteLimitQuantity } from "@/lib/limits";
import { buildAlertMail, type AlertStructure } from "@/lib/mail/alert";
import { buildFlappingMail } from "@/lib/mail/flapping";
import { ALERT_MAIL_ROLES, sensorMailDigestByDefault } from "@/lib/auth/permissions";
import { appUrl } from "@/lib/mail/message";
import { queueMail } from "@/lib/mail/outbox";
import { MAIL_PRIORITY, priorityOfLimitMail } from "@/lib/mail/priority";
import { buildSensorAlertMail } from "@/lib/mail/sensor-alert";
import type { LimitEvent, Notification } from "./alert-raising";

/**
 * How a member gets sensor-fault e-mails when they have not chosen: owners in the digest (a sensor
 * fault asks the engineer to act, not the owner), everyone else as they happen.
 */
export function sensorMailOf(member: { role: Role; alertMail: AlertMailMode; sensorMail: AlertMailMode | null }): AlertMailMode {
  if (member.alertMail === "digest") return "digest";
  return member.sensorMail ?? (sensorMailDigestByDefault(member.role) ? "digest" : "immediate");
}

/** Owners and engineers of the structure, with how each wants alert and sensor e-mails. */
async function alertRecipients(tx: WriteTx, structureId: number) {
  return tx
    .select({ id: users.id, email: users.email, role: users.role, alertMail: structureMembers.alertMail, sensorMail: structureMembers.sensorMail })
    .from(structureMembers)
    .innerJoin(users, eq(users.id, structureMembers.userId))
    .where(and(eq(structureMembers.structureId, structureId), eq(users.active, true), inArray(users.role, [...ALERT_MAIL_ROLES])));
}

type Recipient = Awaited<ReturnType<typeof alertRecipients>>[number];

type MailFacts = { structure: AlertStructure; gauge: { tag: string; label: string | null; location: string | null } };

/** An episode event's facts as the limit and flapping e-mails tell them. */
function eventFacts(event: LimitEvent, rosette: string | null) {
  return {
    rosette,
    level: event.level,
    quantity: event.quantity,
    value: event.value,
    peak: event.peak,
    bound: { side: event.peak >= event.bound ? ("upper" as const) : ("lower" as const), value: event.bound },
    at: new Date(event.time),
  };
}

/** An alert row told as its last event: a clearing at `time`, its peak as the value. */
function clearingOf(alert: Alert, time: number): LimitEvent {
  const bound = alert.bound ?? 0;
  const peak = alert.peak ?? bound;
  return { type: "cleared", level: alert.level as Level, time, value: peak, bound, peak, peakAt: time, quantity: alert.quantity as Quantity | RosetteLimitQuantity };
}

function mailFor(notification: Notification, facts: MailFacts) {
  switch (notification.kind) {
    case "sensor":
      return buildSensorAlertMail(
        { ...facts, event: notification.type, code: notification.code, message: notification.message, at: new Date(notification.time), gauges: notification.gauges },
        appUrl(),
      );
    case "limit":
      return buildAlertMail({ ...facts, ...eventFacts(notification.event, notification.rosette), event: notification.type }, appUrl());
    case "flapping":
      return buildFlappingMail(
        { ...facts, ...eventFacts(notification.event, notification.rosette), phase: "started", openings: notification.openings, since: new Date(notification.since) },
        appUrl(),
      );
    case "flapping-settled": {
      const { alert } = notification;
      // The alert row carries what the summary tells: its last clearing as the event, its peak as the value.
      return buildFlappingMail(
        { ...facts, ...eventFacts(clearingOf(alert, notification.time), null), phase: "settled", openings: alert.openings, since: alert.openedAt },
        appUrl(),
      );
    }
    case "closed":
      return buildAlertMail(
        { ...facts, ...eventFacts(clearingOf(notification.alert, notification.time), notification.rosette), event: "cleared", closedBecause: notification.because },
        appUrl(),
      );
  }
}

function priorityOf(notification: Notification): number {
  if (notification.kind === "sensor") return MAIL_PRIORITY.sensor;
  if (notification.kind === "limit") return priorityOfLimitMail(notification.event.level, notification.type === "cleared");
  if (notification.kind === "flapping") return MAIL_PRIORITY[notification.event.level];
  // A closing, like a settling, asks nobody to act at once.
  return MAIL_PRIORITY.watch;
}

function timeOf(notification: Notification): number {
  return notification.kind === "limit" || notification.kind === "flapping" ? notification.event.time : notification.time;
}

function stepOf(notification: Notification): string {
  switch (notification.kind) {
    case "limit":
      return `${notification.type}:${notification.event.level}:${notification.event.time}`;
    case "flapping":
      return `flapping:${notification.event.time}`;
    case "flapping-settled":
      return `settled:${notification.time}`;
    case "closed":
      return `closed:${notification.time}`;
    case "sensor":
      return `${notification.type}:${notification.time}`;
  }
}

function wantsNow(recipient: Recipient, notification: Notification): boolean {
  if (notification.kind === "sensor") return sensorMailOf(recipient) === "immediate";
  return recipient.alertMail === "immediate";
}

/**
 * Queues one e-mail per recipient and alert event in the transaction that raised the event, so
 * mail is neither lost when the relay is down nor sent for an alert that was rolled back. An event
 * about readings more than a day old (a backfill, a logger's memory emptied late) is news to nobody
 * in a hurry: it is marked for the next digest instead.
 */
export async function queueAlertMails(tx: WriteTx, gauge: Gauge, notifications: readonly Notification[], now = Date.now()): Promise<void> {
  if (notifications.length === 0) return;
  const current = notifications.filter((notification) => now - timeOf(notification) <= IMMEDIATE_MAIL_MAX_AGE_MS);
  const deferred = notifications.flatMap((notification) => (current.includes(notification) || !("eventId" in notification) ? [] : [notification.eventId]));
  if (deferred.length > 0) await tx.update(alertEvents).set({ deferredAt: new Date(now) }).where(inArray(alertEvents.id, deferred));
  if (current.length === 0) return;
  const [structure] = await tx
    .select({ code: structures.code, name: structures.name, timezone: structures.timezone })
    .from(structures)
    .where(eq(structures.id, gauge.structureId));
  const facts = { structure: structure!, gauge: { tag: gauge.tag, label: gauge.label, location: gauge.member } };
  const recipients = await alertRecipients(tx, gauge.structureId);
  for (const notification of current) {
    const mail = mailFor(notification, facts);
    const priority = priorityOf(notification);
    for (const recipient of recipients) {
      if (!wantsNow(recipient, notification)) continue;
      const dedupeKey = `alert:${notification.alertId}:${stepOf(notification)}:${recipient.id}`;
      await queueMail(tx, { ...mail, to: recipient.email, toUserId: recipient.id, kind: "alert", dedupeKey, priority });
    }
  }
}
