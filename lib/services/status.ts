import "server-only";
import { and, asc, eq, gte, inArray, isNotNull, isNull, max, sql, type SQL } from "drizzle-orm";
import { getDb } from "@/db/client";
import { alerts, gaugeLimits, gauges, readings, rollups, type Gauge, type Structure } from "@/db/schema";
import { gaugeCondition, worstCondition, type ConditionState, type GaugeCondition } from "@/lib/alerting/condition";
import { DEFAULT_EXPECTED_INTERVAL_S, isStale } from "@/lib/alerting/gauge-state";
import { rateStress, type StressRating } from "@/lib/mechanics";
import { ROLLUP_RESOLUTIONS } from "@/lib/series";
import { gaugeRowsOf, listGauges, resolveGauge } from "./gauges";
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

const withRating = (gauge: Gauge, row: Omit<LatestReading, "rating">): LatestReading => ({ ...row, rating: rateStress(row.stress, gauge.material) });

/** One gauge's latest reading, for pages about that gauge alone. */
export async function latestReadingOf(actor: Actor, code: string, tag: string): Promise<LatestReading | null> {
  const { gauge } = await resolveGauge(actor, code, tag, "structure:view");
  const latest = (await readingEnds(eq(gauges.id, gauge.id))).get(gauge.id)?.latest;
  return latest ? withRating(gauge, latest) : null;
}

/**
 * Per gauge chosen, its first reading's time and its latest reading, in one query: the correlated
 * min/max each seek the readings' primary key instead of scanning a gauge's history.
 */
async function readingEnds(which: SQL) {
  const rows = await getDb()
    .select({
      gaugeId: gauges.id,
      firstAt: sql<number | null>`(select min(r.t) from readings r where r.gauge_id = ${gauges.id})`,
      time: readings.time,
      strain: readings.strain,
      stress: readings.stress,
      temperature: readings.temperature,
      flags: readings.flags,
    })
    .from(gauges)
    .leftJoin(readings, and(eq(readings.gaugeId, gauges.id), eq(readings.time, sql`(select max(r.t) from readings r where r.gauge_id = ${gauges.id})`)))
    .where(which);
  return new Map(
    rows.map((row) => [
      row.gaugeId,
      {
        firstAt: row.firstAt === null ? null : Number(row.firstAt),
        latest: row.time === null ? null : { time: row.time, strain: row.strain!, stress: row.stress!, temperature: row.temperature, flags: row.flags! },
      },
    ]),
  );
}

/**
 * The open alerts of the structures. A sensor fault is, for now, an open sensor alert on the gauge:
 * `sensorFaults` is the one place that says so.
 */
async function openAlertsOf(structureIds: number[]) {
  const rows = await getDb()
    .select({ structureId: alerts.structureId, gaugeId: alerts.gaugeId, kind: alerts.kind, level: alerts.level, code: alerts.code, openedAt: alerts.openedAt })
    .from(alerts)
    .where(and(inArray(alerts.structureId, structureIds), isNull(alerts.clearedAt)));
  const of = (gaugeId: number) => rows.filter((row) => row.gaugeId === gaugeId);
  return {
    rows,
    count: (gaugeId: number) => of(gaugeId).length,
    limitAlerts: (gaugeId: number) => of(gaugeId).filter((row) => row.kind === "limit").map((row) => ({ level: row.level, openedAt: row.openedAt.getTime() })),
    sensorFaults: (gaugeId: number) => of(gaugeId).filter((row) => row.kind === "sensor").map((row) => ({ code: row.code, openedAt: row.openedAt.getTime() })),
  };
}

/** When each gauge's last limit alert cleared. */
async function lastLimitClears(structureIds: number[]): Promise<Map<number, number>> {
  const rows = await getDb()
    .select({ gaugeId: alerts.gaugeId, at: max(alerts.clearedAt) })
    .from(alerts)
    .where(and(inArray(alerts.structureId, structureIds), eq(alerts.kind, "limit"), isNotNull(alerts.clearedAt)))
    .groupBy(alerts.gaugeId);
  return new Map(rows.filter((row) => row.at !== null).map((row) => [row.gaugeId, new Date(row.at!).getTime()]));
}

async function gaugesWithLimits(structureIds: number[]): Promise<Set<number>> {
  const rows = await getDb()
    .selectDistinct({ gaugeId: gaugeLimits.gaugeId })
    .from(gaugeLimits)
    .innerJoin(gauges, eq(gauges.id, gaugeLimits.gaugeId))
    .where(inArray(gauges.structureId, structureIds));
  return new Set(rows.map((row) => row.gaugeId));
}

/**
 * Every gauge of the structure with its latest reading and its condition now, from a fixed number
 * of queries whatever the number of gauges.
 */
export async function gaugeStatuses(structure: Structure, now = Date.now()): Promise<GaugeStatus[]> {
  return (await statusesOf([structure.id], await gaugeRowsOf(structure.id), now)).statuses;
}

/** The statuses of `gaugeRows`, which belong to the structures `structureIds`, in the same order. */
async function statusesOf(structureIds: number[], gaugeRows: Gauge[], now: number) {
  const [ends, open, clears, limited] = await Promise.all([
    readingEnds(inArray(gauges.structureId, structureIds)),
    openAlertsOf(structureIds),
    lastLimitClears(structureIds),
    gaugesWithLimits(structureIds),
  ]);
  const statuses = gaugeRows.map((gauge): GaugeStatus => {
    const end = ends.get(gauge.id);
    const latest = end?.latest ? withRating(gauge, end.latest) : null;
    const condition = gaugeCondition({
      openLimitAlerts: open.limitAlerts(gauge.id),
      openSensorAlerts: open.sensorFaults(gauge.id),
      firstReadingAt: end?.firstAt ?? null,
      lastReadingAt: latest?.time ?? null,
      lastLimitClearedAt: clears.get(gauge.id) ?? null,
      expectedIntervalS: gauge.expectedInterval,
      hasLimits: limited.has(gauge.id),
      registeredAt: gauge.createdAt.getTime(),
      now,
    });
    return { tag: gauge.tag, label: gauge.label, member: gauge.member, retired: gauge.status === "retired", condition, hasLimits: limited.has(gauge.id), latest, openAlerts: open.count(gauge.id) };
  });
  return { statuses, open };
}

/**
 * Highest |σ| / yield over the last day per gauge, from the hourly roll-ups (so a spike counts),
 * in one query.
 */
async function peakUtilisations(gaugeRows: Gauge[], since: number): Promise<Map<number, number>> {
  const withYield = gaugeRows.filter((gauge) => gauge.material.yield);
  if (withYield.length === 0) return new Map();
  const rows = await getDb()
    .select({ gaugeId: rollups.gaugeId, max: sql<number>`max(${rollups.stressMax})`, min: sql<number>`min(${rollups.stressMin})` })
    .from(rollups)
    .where(and(inArray(rollups.gaugeId, withYield.map((gauge) => gauge.id)), eq(rollups.resolution, ROLLUP_RESOLUTIONS.hourly), gte(rollups.bucket, since)))
    .groupBy(rollups.gaugeId);
  const yieldOf = new Map(withYield.map((gauge) => [gauge.id, gauge.material.yield!]));
  return new Map(rows.map((row) => [row.gaugeId, Math.max(Math.abs(row.max), Math.abs(row.min)) / yieldOf.get(row.gaugeId)!]));
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
  const ids = structureList.map((structure) => structure.id);
  const gaugeRows = await getDb().select().from(gauges).where(inArray(gauges.structureId, ids)).orderBy(asc(gauges.tag));
  const [{ statuses, open }, peaks] = await Promise.all([
    statusesOf(ids, gaugeRows, now),
    peakUtilisations(
      gaugeRows.filter((gauge) => gauge.status === "active"),
      now - 86_400_000,
    ),
  ]);
  return structureList.map((structure) => {
    const mine = gaugeRows.flatMap((gauge, i) => (gauge.structureId === structure.id ? [{ gauge, status: statuses[i]! }] : []));
    const openRows = open.rows.filter((row) => row.structureId === structure.id);
    return summarise(mine, openRows, peaks, now);
  });
}

function summarise(
  mine: { gauge: Gauge; status: GaugeStatus }[],
  openRows: { kind: string; level: string }[],
  peaks: Map<number, number>,
  now: number,
): StructureSummary {
  const statuses = mine.map(({ status }) => status);
  const active = mine.filter(({ gauge }) => gauge.status === "active");
  const activeStatuses = statuses.filter((status) => !status.retired);
  const faulty = new Set(activeStatuses.filter((status) => status.condition.faults.length > 0).map((status) => status.tag));
  const lastReadingAt = statuses.reduce<number | null>((last, status) => Math.max(last ?? 0, status.latest?.time ?? 0) || last, null);
  const gaugesIn: Partial<Record<ConditionState, number>> = {};
  for (const status of activeStatuses) gaugesIn[status.condition.state] = (gaugesIn[status.condition.state] ?? 0) + 1;
  const limitOpen = (level: string) => openRows.filter((row) => row.kind === "limit" && row.level === level).length;
  const believedPeaks = active.filter(({ gauge }) => !faulty.has(gauge.tag)).flatMap(({ gauge }) => peaks.get(gauge.id) ?? []);
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
