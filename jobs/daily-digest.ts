import "server-only";
import { and, eq, gte, inArray, isNull, lt, or } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { alertEvents, alerts, gauges, rosettes, structureMembers, structures, users, type Structure } from "@/db/schema";
import type { AlertEventFacts } from "@/lib/mail/alert";
import type { Level } from "@/lib/limits";
import { buildDigestMail, type DigestEvent, type GaugeConditionLine } from "@/lib/mail/digest";
import { conditionText } from "@/lib/alerting/condition-display";
import { gaugeStatuses } from "@/lib/services/status";
import { appUrl } from "@/lib/mail/message";
import { queueMail } from "@/lib/mail/outbox";
import { sensorMailOf } from "@/lib/services/alert-mail";
import { EVALUATION_LABEL } from "@/lib/services/alert-raising";
import { receivesAlertMail } from "@/lib/auth/permissions";
import { dayOf, dayStart, startOfZoneDay } from "@/lib/time-format";
import { digestTimeZone } from "@/lib/time-zone-config";

/** The day's events: those that happened in it, and those recorded in it about older readings (deferred from immediate mail). */
async function eventsOfDay(from: Date, to: Date) {
  const happened = and(gte(alertEvents.at, from), lt(alertEvents.at, to), isNull(alertEvents.deferredAt));
  const deferred = and(gte(alertEvents.deferredAt, from), lt(alertEvents.deferredAt, to));
  return getDb()
    .select({ event: alertEvents, alert: alerts, gauge: gauges, rosette: rosettes.tag })
    .from(alertEvents)
    .innerJoin(alerts, eq(alerts.id, alertEvents.alertId))
    .innerJoin(gauges, eq(gauges.id, alerts.gaugeId))
    .leftJoin(rosettes, eq(rosettes.id, alerts.rosetteId))
    .where(and(inArray(alertEvents.type, ["opened", "escalated", "cleared"]), or(happened, deferred)));
}

type EventRow = Awaited<ReturnType<typeof eventsOfDay>>[number];

function factsOf({ event, alert, gauge, rosette }: EventRow): DigestEvent {
  if (alert.kind === "sensor") {
    return { gauge: { tag: gauge.tag }, code: alert.code ?? "sensor", event: event.type === "cleared" ? "cleared" : "opened", message: event.text ?? alert.message, at: event.at };
  }
  const bound = alert.bound ?? 0;
  return {
    gauge: { tag: gauge.tag, label: gauge.label, location: gauge.member },
    rosette,
    event: event.type as AlertEventFacts["event"],
    level: (event.level ?? alert.level) as Level,
    quantity: alert.quantity as AlertEventFacts["quantity"],
    value: event.value ?? alert.peak ?? 0,
    peak: alert.peak ?? event.value ?? 0,
    bound: { side: (alert.peak ?? 0) >= bound ? "upper" : "lower", value: bound },
    at: event.at,
    // Closed by a person (by hand, or by changing what the alert compared), not by the values: their words and name.
    closedBecause: event.type === "cleared" && event.byLabel !== EVALUATION_LABEL ? `${event.text ?? "Cleared"} (${event.byLabel ?? "unknown"})` : null,
  };
}

/** The structure's active gauges that are not within their limits now, in the condition's words. */
async function notWithinLimits(structure: Structure, now: number): Promise<GaugeConditionLine[]> {
  return (await gaugeStatuses(structure, now))
    .filter((status) => !status.retired && status.condition.state !== "within-limits")
    .map((status) => ({ tag: status.tag, condition: conditionText(status.condition) }));
}

type Member = { role: (typeof users.$inferSelect)["role"]; alertMail: "immediate" | "digest"; sensorMail: "immediate" | "digest" | null };

/**
 * Whether the digest carries an event for this member: everything for those who chose the digest;
 * for the others, what they were not mailed at once (events about old readings, and sensor faults
 * when they get those in the digest, as owners do unless they chose otherwise).
 */
function carries(member: Member, row: EventRow): boolean {
  if (member.alertMail === "digest") return true;
  if (!receivesAlertMail(member.role)) return false;
  if (row.event.deferredAt !== null) return true;
  return row.alert.kind === "sensor" && sensorMailOf(member) === "digest";
}

/** The day a digest sent at `now` covers: the zone's day before the one `now` is in, from its midnight to the next. */
export function digestDay(now: number, timeZone: string): { day: string; from: Date; to: Date } {
  const to = startOfZoneDay(now, timeZone);
  const day = dayOf(to.getTime() - 1, timeZone);
  return { day, from: dayStart(day, timeZone), to };
}

/**
 * Once a day, a member gets the alert events of the day before (a day of DIGEST_TIMEZONE, 23 or 25
 * hours across a clock change) on the structures they follow that they were not mailed one by
 * one, in one e-mail (none when there are none).
 */
export async function runDailyDigest(now = Date.now(), timeZone = digestTimeZone()): Promise<string> {
  const { day: period, from, to } = digestDay(now, timeZone);
  const [events, memberships] = await Promise.all([
    eventsOfDay(from, to),
    getDb()
      .select({ user: users, structure: structures, alertMail: structureMembers.alertMail, sensorMail: structureMembers.sensorMail })
      .from(structureMembers)
      .innerJoin(users, eq(users.id, structureMembers.userId))
      .innerJoin(structures, eq(structures.id, structureMembers.structureId))
      .where(eq(users.active, true)),
  ]);
  const byUser = new Map<number, { user: (typeof memberships)[number]["user"]; sections: { structure: (typeof memberships)[number]["structure"]; events: DigestEvent[] }[] }>();
  for (const { user, structure, alertMail, sensorMail } of memberships) {
    const member = { role: user.role, alertMail, sensorMail };
    const carried = events.filter((row) => row.alert.structureId === structure.id && carries(member, row)).map(factsOf);
    if (carried.length === 0) continue;
    const entry = byUser.get(user.id) ?? { user, sections: [] };
    entry.sections.push({ structure, events: carried });
    byUser.set(user.id, entry);
  }
  const conditions = new Map<number, Promise<GaugeConditionLine[]>>();
  // Each structure's conditions are gathered once, however many people follow it.
  const conditionsOf = (structure: Structure) => {
    if (!conditions.has(structure.id)) conditions.set(structure.id, notWithinLimits(structure, now));
    return conditions.get(structure.id)!;
  };
  let queued = 0;
  for (const { user, sections: carried } of byUser.values()) {
    const sections = await Promise.all(carried.map(async (section) => ({ ...section, conditions: await conditionsOf(section.structure) })));
    const mail = buildDigestMail({ recipientName: user.name, period: `${period} (${timeZone})`, structures: sections }, appUrl());
    const added = await writeTransaction((tx) => queueMail(tx, { ...mail, to: user.email, toUserId: user.id, kind: "digest", dedupeKey: `digest:${period}:${user.id}` }));
    if (added) queued += 1;
  }
  return `${events.length} events on ${period}, ${queued} digests queued`;
}
