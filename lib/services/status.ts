import "server-only";
import { and, asc, eq, inArray, isNull, sql, type SQL } from "drizzle-orm";
import { getDb } from "@/db/client";
import { alerts, gauges, readings, type Structure } from "@/db/schema";
import { gaugeCondition, worstCondition, type ConditionState, type GaugeCondition } from "@/lib/alerting/condition";
import { DEFAULT_EXPECTED_INTERVAL_S, isStale } from "@/lib/alerting/gauge-state";
import { rateStress, type StressRating } from "@/lib/mechanics";
import { ROLLUP_RESOLUTIONS } from "@/lib/series";
import { listGauges, resolveGauge } from "./gauges";
import { getVisibleStructure } from "./structures";
import type { Actor } from "@/lib/auth/actor";

/** `rating` is the stress against the material's yield or, for concrete, its compressive strength. */
export type LatestReading = { time: number; strain: number; stress: number; temperature: number | null; rating: StressRating | null; flags: number };

export type GaugeStatus = {
  tag: string;
  label: string | null;
  member: string | null;
  retired: boolean;
  condition: GaugeCondition;
  /** Whether any limit is set on it: under a worse condition, "no-limits" does not show. */
  hasLimits: boolean;
  latest: LatestReading | null;
  openAlerts: number;
};

const withRating = (material: Parameters<typeof rateStress>[1], row: Omit<LatestReading, "rating">): LatestReading => ({ ...row, rating: rateStress(row.stress, material) });

/** One gauge's latest reading, for pages about that gauge alone. */
export async function latestReadingOf(actor: Actor, code: string, tag: string): Promise<LatestReading | null> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const [facts] = await gaugeFacts(eq(gauges.id, gauge.id), Date.now() - DAY_MS);
  return facts?.latest ?? null;
}

const DAY_MS = 86_400_000;

/**
 * Per gauge chosen, in tag order, what its condition and its structure's card are made of, in one
 * query whatever the number of gauges: its first reading's time and its latest reading, whether it
 * has limits, when its last limit alert cleared and its largest |σ| / yield since `peakSince`
 * (from the hourly roll-ups, so a spike counts). Each correlated subquery seeks an index
 * (readings' and roll-ups' primary keys, alerts_gauge, gauge_limits_level) instead of scanning.
 */
async function gaugeFacts(which: SQL, peakSince: number) {
  const rows = await getDb()
    .select({
      id: gauges.id,
      structureId: gauges.structureId,
      tag: gauges.tag,
      label: gauges.label,
      member: gauges.member,
      status: gauges.status,
      material: gauges.material,
      expectedInterval: gauges.expectedInterval,
      createdAt: gauges.createdAt,
      firstAt: sql<number | null>`(select min(r.t) from readings r where r.gauge_id = ${gauges.id})`,
      time: readings.time,
      strain: readings.strain,
      stress: readings.stress,
      temperature: readings.temperature,
      flags: readings.flags,
      hasLimits: sql<number>`exists (select 1 from gauge_limits l where l.gauge_id = ${gauges.id})`,
      lastLimitClearedAt: sql<number | null>`(select max(a.cleared_at) from alerts a where a.gauge_id = ${gauges.id} and a.kind = 'limit' and a.cleared_at is not null)`,
      // The largest |σ| of a set of readings is at one of its extremes, so the largest of the hours'
      // max(|σ_max|, |σ_min|) is the day's; one subquery reads each hour once.
      peakStress: sql<number | null>`(select max(max(abs(u.stress_max), abs(u.stress_min))) from rollups u where u.gauge_id = ${gauges.id} and u.resolution = ${ROLLUP_RESOLUTIONS.hourly} and u.bucket >= ${peakSince})`,
    })
    .from(gauges)
    .leftJoin(readings, and(eq(readings.gaugeId, gauges.id), eq(readings.time, sql`(select max(r.t) from readings r where r.gauge_id = ${gauges.id})`)))
    .where(which)
    .orderBy(asc(gauges.tag));
  // Each field named: copying the row with a rest pattern took half as long as the query itself on a
  // 60-gauge structure (CPU profile of the summaries).
  return rows.map((row) => ({
    id: row.id,
    structureId: row.structureId,
    tag: row.tag,
    label: row.label,
    member: row.member,
    status: row.status,
    expectedInterval: row.expectedInterval,
    registeredAt: row.createdAt.getTime(),
    firstAt: row.firstAt === null ? null : Number(row.firstAt),
    latest:
      row.time === null
        ? null
        : withRating(row.material, { time: row.time, strain: row.strain!, stress: row.stress!, temperature: row.temperature, flags: row.flags! }),
    hasLimits: Boolean(row.hasLimits),
    lastLimitClearedAt: row.lastLimitClearedAt === null ? null : Number(row.lastLimitClearedAt),
    peakUtilisation: row.material.yield && row.peakStress !== null ? row.peakStress / row.material.yield : null,
  }));
}

type GaugeFacts = Awaited<ReturnType<typeof gaugeFacts>>[number];

type OpenAlert = { structureId: number; gaugeId: number | null; kind: string; level: string; code: string | null; openedAt: Date };

/**
 * The open alerts of the structures, and each gauge's. A sensor fault is, for now, an open sensor
 * alert on the gauge: `sensorFaults` is the one place that says so.
 */
async function openAlertsOf(structureIds: number[]) {
  const rows: OpenAlert[] = await getDb()
    .select({ structureId: alerts.structureId, gaugeId: alerts.gaugeId, kind: alerts.kind, level: alerts.level, code: alerts.code, openedAt: alerts.openedAt })
    .from(alerts)
    .where(and(inArray(alerts.structureId, structureIds), isNull(alerts.clearedAt)));
  const byGauge = new Map<number, OpenAlert[]>();
  for (const row of rows) if (row.gaugeId !== null) byGauge.set(row.gaugeId, [...(byGauge.get(row.gaugeId) ?? []), row]);
  const of = (gaugeId: number) => byGauge.get(gaugeId) ?? [];
  return {
    rows,
    count: (gaugeId: number) => of(gaugeId).length,
    limitAlerts: (gaugeId: number) => of(gaugeId).filter((row) => row.kind === "limit").map((row) => ({ level: row.level, openedAt: row.openedAt.getTime() })),
    sensorFaults: (gaugeId: number) => of(gaugeId).filter((row) => row.kind === "sensor").map((row) => ({ code: row.code, openedAt: row.openedAt.getTime() })),
  };
}

/**
 * Every gauge of the structure with its latest reading and its condition now, from a fixed number
 * of queries whatever the number of gauges.
 */
export async function gaugeStatuses(structure: Structure, now = Date.now()): Promise<GaugeStatus[]> {
  return (await statusesOf([structure.id], now)).map(({ status }) => status);
}

/**
 * Each gauge of the structures `structureIds` in tag order, its facts and its status, from two
 * queries however many structures and gauges.
 */
async function statusesOf(structureIds: number[], now: number) {
  const [facts, open] = await Promise.all([gaugeFacts(inArray(gauges.structureId, structureIds), now - DAY_MS), openAlertsOf(structureIds)]);
  const gaugesOf = facts.map((gauge) => {
    const condition = gaugeCondition({
      openLimitAlerts: open.limitAlerts(gauge.id),
      openSensorAlerts: open.sensorFaults(gauge.id),
      firstReadingAt: gauge.firstAt,
      lastReadingAt: gauge.latest?.time ?? null,
      lastLimitClearedAt: gauge.lastLimitClearedAt,
      expectedIntervalS: gauge.expectedInterval,
      hasLimits: gauge.hasLimits,
      registeredAt: gauge.registeredAt,
      now,
    });
    const status: GaugeStatus = {
      tag: gauge.tag,
      label: gauge.label,
      member: gauge.member,
      retired: gauge.status === "retired",
      condition,
      hasLimits: gauge.hasLimits,
      latest: gauge.latest,
      openAlerts: open.count(gauge.id),
    };
    return { gauge, status };
  });
  return Object.assign(gaugesOf, { openAlerts: open.rows });
}

export type StructureSummary = {
  /** The worst condition of the structure's active gauges. */
  state: ConditionState;
  /** How many active gauges are in each condition. */
  gaugesIn: Partial<Record<ConditionState, number>>;
  openAlerts: Record<"watch" | "warning" | "critical", number>;
  sensorAlerts: number;
  /** Peak over the gauges whose readings are believed: a gauge in sensor fault is left out. */
  peakUtilisation24h: number | null;
  /** Gauges left out of the peak because their sensor is in fault. */
  peakLeavesOut: number;
  lastReadingAt: number | null;
  stale: boolean;
  gaugeCount: number;
};

export async function structureSummary(structure: Structure, now = Date.now()): Promise<StructureSummary> {
  return (await structureSummaries([structure], now))[0]!;
}

/** Each structure's summary, in the order given, from a fixed number of queries however many structures and gauges. */
export async function structureSummaries(structureList: Structure[], now = Date.now()): Promise<StructureSummary[]> {
  if (structureList.length === 0) return [];
  const statuses = await statusesOf(
    structureList.map((structure) => structure.id),
    now,
  );
  return structureList.map((structure) =>
    summarise(
      statuses.filter(({ gauge }) => gauge.structureId === structure.id),
      statuses.openAlerts.filter((row) => row.structureId === structure.id),
      now,
    ),
  );
}

function summarise(mine: { gauge: GaugeFacts; status: GaugeStatus }[], openRows: { kind: string; level: string }[], now: number): StructureSummary {
  const statuses = mine.map(({ status }) => status);
  const active = mine.filter(({ gauge }) => gauge.status === "active");
  const activeStatuses = statuses.filter((status) => !status.retired);
  const faulty = new Set(activeStatuses.filter((status) => status.condition.faults.length > 0).map((status) => status.tag));
  const lastReadingAt = statuses.reduce<number | null>((last, status) => Math.max(last ?? 0, status.latest?.time ?? 0) || last, null);
  const gaugesIn: Partial<Record<ConditionState, number>> = {};
  for (const status of activeStatuses) gaugesIn[status.condition.state] = (gaugesIn[status.condition.state] ?? 0) + 1;
  const limitOpen = (level: string) => openRows.filter((row) => row.kind === "limit" && row.level === level).length;
  const believedPeaks = active.filter(({ gauge }) => !faulty.has(gauge.tag)).flatMap(({ gauge }) => gauge.peakUtilisation ?? []);
  return {
    state: worstCondition(activeStatuses.map((status) => status.condition.state)),
    gaugesIn,
    openAlerts: { watch: limitOpen("watch"), warning: limitOpen("warning"), critical: limitOpen("critical") },
    sensorAlerts: openRows.filter((row) => row.kind === "sensor").length,
    peakUtilisation24h: believedPeaks.length > 0 ? Math.max(...believedPeaks) : null,
    peakLeavesOut: faulty.size,
    lastReadingAt,
    // The structure is stale when even its newest reading is: nothing at all is arriving.
    stale:
      active.length > 0 &&
      isStale(lastReadingAt, Math.max(...active.map(({ gauge }) => gauge.expectedInterval ?? DEFAULT_EXPECTED_INTERVAL_S)), now),
    gaugeCount: active.length,
  };
}

/** A condition as the API and the browser get it: times in ISO-8601 UTC. */
export type ConditionView = Omit<GaugeCondition, "since"> & { since: string | null };

export const conditionView = (condition: GaugeCondition): ConditionView => ({
  ...condition,
  since: condition.since === null ? null : new Date(condition.since).toISOString(),
});

/** The structure's gauges as the API lists them, each with its condition now (GET /structures/{code}). */
export async function listGaugesWithConditions(actor: Actor, code: string, now = Date.now()) {
  const structure = await getVisibleStructure(actor, code);
  const [views, statuses] = await Promise.all([listGauges(actor, code), gaugeStatuses(structure, now)]);
  const conditionOf = new Map(statuses.map((status) => [status.tag, conditionView(status.condition)]));
  return { structure, gauges: views.map((view) => ({ ...view, condition: conditionOf.get(view.tag)! })) };
}
