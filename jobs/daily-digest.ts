import "server-only";
import { and, eq, gte, inArray, lt } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { alertEvents, alerts, gauges, rosettes, structureMembers, structures, users, type Structure } from "@/db/schema";
import type { AlertEventFacts } from "@/lib/mail/alert";
import type { Level } from "@/lib/limits";
import { buildDigestMail, type GaugeConditionLine } from "@/lib/mail/digest";
import { conditionText } from "@/lib/alerting/condition-display";
import { gaugeStatuses } from "@/lib/services/status";
import { appUrl } from "@/lib/mail/message";
import { queueMail } from "@/lib/mail/outbox";

const DAY_MS = 86_400_000;

async function limitEventsBetween(from: Date, to: Date) {
  return getDb()
    .select({ event: alertEvents, alert: alerts, gauge: gauges, rosette: rosettes.tag })
    .from(alertEvents)
    .innerJoin(alerts, eq(alerts.id, alertEvents.alertId))
    .innerJoin(gauges, eq(gauges.id, alerts.gaugeId))
    .leftJoin(rosettes, eq(rosettes.id, alerts.rosetteId))
    .where(and(eq(alerts.kind, "limit"), inArray(alertEvents.type, ["opened", "escalated", "cleared"]), gte(alertEvents.at, from), lt(alertEvents.at, to)));
}

type EventRow = Awaited<ReturnType<typeof limitEventsBetween>>[number];

function factsOf({ event, alert, gauge, rosette }: EventRow): AlertEventFacts {
  const bound = alert.bound ?? 0;
  return {
    gauge: { tag: gauge.tag, label: gauge.label, location: gauge.member },
    rosette,
    event: event.type as AlertEventFacts["event"],
    level: (event.level ?? alert.level) as Level,
    quantity: alert.quantity as AlertEventFacts["quantity"],
    value: event.value ?? alert.peak ?? 0,
    bound: { side: (alert.peak ?? 0) >= bound ? "upper" : "lower", value: bound },
    at: event.at,
  };
}

/** The structure's active gauges that are not within their limits now, in the condition's words. */
async function notWithinLimits(structure: Structure, now: number): Promise<GaugeConditionLine[]> {
  return (await gaugeStatuses(structure, now))
    .filter((status) => !status.retired && status.condition.state !== "within-limits")
    .map((status) => ({ tag: status.tag, condition: conditionText(status.condition) }));
}

/**
 * Once a day, everyone who chose the digest gets the alert events of the last 24 hours on the
 * structures they follow, in one e-mail (none when nothing happened).
 */
export async function runDailyDigest(now = Date.now()): Promise<string> {
  const to = new Date(Math.floor(now / DAY_MS) * DAY_MS);
  const from = new Date(to.getTime() - DAY_MS);
  const period = from.toISOString().slice(0, 10);
  const [events, subscriptions] = await Promise.all([
    limitEventsBetween(from, to),
    getDb()
      .select({ user: users, structure: structures })
      .from(structureMembers)
      .innerJoin(users, eq(users.id, structureMembers.userId))
      .innerJoin(structures, eq(structures.id, structureMembers.structureId))
      .where(and(eq(structureMembers.alertMail, "digest"), eq(users.active, true))),
  ]);
  const byUser = new Map<number, { user: (typeof subscriptions)[number]["user"]; structures: (typeof subscriptions)[number]["structure"][] }>();
  for (const { user, structure } of subscriptions) {
    const entry = byUser.get(user.id) ?? { user, structures: [] };
    entry.structures.push(structure);
    byUser.set(user.id, entry);
  }
  const conditions = new Map<number, Promise<GaugeConditionLine[]>>();
  // Each structure's conditions are gathered once, however many people follow it.
  const conditionsOf = (structure: Structure) => {
    if (!conditions.has(structure.id)) conditions.set(structure.id, notWithinLimits(structure, now));
    return conditions.get(structure.id)!;
  };
  let queued = 0;
  for (const { user, structures: followed } of byUser.values()) {
    const withEvents = followed
      .map((structure) => ({ structure, events: events.filter((row) => row.alert.structureId === structure.id).map(factsOf) }))
      .filter((section) => section.events.length > 0);
    const sections = await Promise.all(withEvents.map(async (section) => ({ ...section, conditions: await conditionsOf(section.structure) })));
    if (sections.length === 0) continue;
    const mail = buildDigestMail({ recipientName: user.name, period, structures: sections }, appUrl());
    const added = await writeTransaction((tx) => queueMail(tx, { ...mail, to: user.email, toUserId: user.id, kind: "digest", dedupeKey: `digest:${period}:${user.id}` }));
    if (added) queued += 1;
  }
  return `${events.length} events on ${period}, ${queued} digests queued`;
}
