import { and, asc, desc, eq, gt, gte, inArray, isNull, lt, or, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { alertEvents, alerts, rollups, users, zeroReadings, type Alert, type AlertEvent, type Gauge } from "@/db/schema";
import { DEFAULT_EXPECTED_INTERVAL_S } from "@/lib/alerting/gauge-state";
import type { ReportAlert, ReportGauge, StructureReport } from "@/lib/api/report-schema";
import type { Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { REPORT_CAUTIONS } from "@/lib/report/cautions";
import { activeSpan, completeness, expectedReadings, type Span } from "@/lib/report/completeness";
import { firstOf, missingHourRuns } from "@/lib/report/gaps";
import { dayText, lastDay, periodKey, periodName, previousMonthPeriod, type ReportPeriod } from "@/lib/report/period";
import { periodHeadline, periodLevel } from "@/lib/report/status";
import { ROLLUP_RESOLUTIONS, type Rollup } from "@/lib/series";
import { gaugeFatigue } from "./fatigue";
import { gaugeRowsOf } from "./gauges";
import { structureSummary } from "./status";
import { getVisibleStructure } from "./structures";

/** Gap runs listed per gauge; a dead logger for a month would otherwise fill pages. */
const GAPS_LISTED = 10;

const iso = (ms: number) => new Date(ms).toISOString();

/** When each gauge began: its first zero reading (installation on site) or its registration, whichever came first. */
async function installedAt(gaugeRows: Gauge[]): Promise<Map<number, number>> {
  const firstZero = await getDb()
    .select({ gaugeId: zeroReadings.gaugeId, time: sql<number>`min(${zeroReadings.time})` })
    .from(zeroReadings)
    .where(inArray(zeroReadings.gaugeId, gaugeRows.map((gauge) => gauge.id)))
    .groupBy(zeroReadings.gaugeId);
  const zeroOf = new Map(firstZero.map((row) => [row.gaugeId, Number(row.time)]));
  return new Map(gaugeRows.map((gauge) => [gauge.id, Math.min(gauge.createdAt.getTime(), zeroOf.get(gauge.id) ?? Infinity)]));
}

/** The gauges' roll-up rows of one resolution whose bucket starts inside the period. */
function rollupsWithin(gaugeIds: number[], resolution: Rollup, period: Span) {
  return and(
    inArray(rollups.gaugeId, gaugeIds),
    eq(rollups.resolution, ROLLUP_RESOLUTIONS[resolution]),
    gte(rollups.bucket, period.start),
    lt(rollups.bucket, period.end),
  );
}

/** Per gauge, the period's totals from the daily roll-ups: exact, since the period is whole UTC days. */
async function dailyTotals(gaugeIds: number[], period: Span) {
  const rows = await getDb()
    .select({
      gaugeId: rollups.gaugeId,
      count: sql<number>`sum(${rollups.count})`,
      strainMin: sql<number>`min(${rollups.strainMin})`,
      strainMax: sql<number>`max(${rollups.strainMax})`,
      stressMin: sql<number>`min(${rollups.stressMin})`,
      stressMax: sql<number>`max(${rollups.stressMax})`,
      temperatureMin: sql<number | null>`min(${rollups.temperatureMin})`,
      temperatureMax: sql<number | null>`max(${rollups.temperatureMax})`,
    })
    .from(rollups)
    .where(rollupsWithin(gaugeIds, "daily", period))
    .groupBy(rollups.gaugeId);
  return new Map(rows.map((row) => [row.gaugeId, row]));
}

/** Per gauge, the starts of the hours in the period that hold at least one reading. */
async function hoursWithReadings(gaugeIds: number[], period: Span): Promise<Map<number, number[]>> {
  const rows = await getDb()
    .select({ gaugeId: rollups.gaugeId, bucket: rollups.bucket })
    .from(rollups)
    .where(and(rollupsWithin(gaugeIds, "hourly", period), gt(rollups.count, 0)));
  const byGauge = new Map<number, number[]>();
  for (const row of rows) byGauge.set(row.gaugeId, [...(byGauge.get(row.gaugeId) ?? []), row.bucket]);
  return byGauge;
}

type Totals = Awaited<ReturnType<typeof dailyTotals>> extends Map<number, infer T> ? T : never;

function gaugeSection(gauge: Gauge, totals: Totals | undefined, span: Span | null, hours: number[], fatigue: ReportGauge["fatigue"]): ReportGauge {
  const intervalS = gauge.expectedInterval ?? DEFAULT_EXPECTED_INTERVAL_S;
  const received = Number(totals?.count ?? 0);
  const expected = expectedReadings(span, intervalS);
  const gaps = missingHourRuns(hours, span, intervalS);
  const listed = firstOf(gaps, GAPS_LISTED);
  const yieldStress = gauge.material.yield ?? null;
  const has = totals !== undefined && received > 0;
  return {
    tag: gauge.tag,
    label: gauge.label,
    member: gauge.member,
    status: gauge.status,
    expectedIntervalS: intervalS,
    activeSpan: span && { from: iso(span.start), to: iso(span.end) },
    readings: { received, expected, completeness: completeness(received, expected) },
    stress: has ? { min: totals.stressMin, max: totals.stressMax, unit: "MPa" } : null,
    strain: has ? { min: totals.strainMin, max: totals.strainMax, unit: "µε" } : null,
    temperature:
      has && totals.temperatureMin !== null && totals.temperatureMax !== null
        ? { min: totals.temperatureMin, max: totals.temperatureMax, unit: "°C" }
        : null,
    utilisationPeak:
      has && yieldStress ? { ratio: Math.max(Math.abs(totals.stressMin), Math.abs(totals.stressMax)) / yieldStress, yield: yieldStress } : null,
    gaps: {
      list: listed.shown.map((gap) => ({ start: iso(gap.start), end: iso(gap.end), hours: gap.hours })),
      more: listed.more,
      totalHours: gaps.reduce((sum, gap) => sum + gap.hours, 0),
    },
    fatigue,
  };
}

const ALERT_UNITS: Record<string, string> = { stress: "MPa", strain: "µε", utilisation: "ratio" };

/** Alerts open at any moment of the period, with their whole history and who acknowledged them. */
async function alertsOf(structureId: number, period: Span, tagOf: Map<number, string>): Promise<ReportAlert[]> {
  const rows = await getDb()
    .select({ alert: alerts, acknowledgedBy: users.name })
    .from(alerts)
    .leftJoin(users, eq(users.id, alerts.acknowledgedById))
    .where(
      and(
        eq(alerts.structureId, structureId),
        lt(alerts.openedAt, new Date(period.end)),
        or(isNull(alerts.clearedAt), gte(alerts.clearedAt, new Date(period.start))),
      ),
    )
    .orderBy(desc(alerts.openedAt), desc(alerts.id));
  const events = rows.length
    ? await getDb()
        .select()
        .from(alertEvents)
        .where(inArray(alertEvents.alertId, rows.map((row) => row.alert.id)))
        .orderBy(asc(alertEvents.at), asc(alertEvents.id))
    : [];
  return rows.map(({ alert, acknowledgedBy }) => alertSection(alert, acknowledgedBy, events.filter((event) => event.alertId === alert.id), period, tagOf));
}

function alertSection(alert: Alert, acknowledgedBy: string | null, events: AlertEvent[], period: Span, tagOf: Map<number, string>): ReportAlert {
  const acknowledgement = events.findLast((event) => event.type === "acknowledged");
  return {
    id: alert.id,
    gauge: tagOf.get(alert.gaugeId) ?? String(alert.gaugeId),
    kind: alert.kind,
    level: alert.level,
    quantity: alert.quantity,
    code: alert.code,
    message: alert.message,
    unit: alert.quantity ? (ALERT_UNITS[alert.quantity] ?? null) : null,
    bound: alert.bound,
    peak: alert.peak,
    openedAt: alert.openedAt.toISOString(),
    openedBeforePeriod: alert.openedAt.getTime() < period.start,
    clearedAt: alert.clearedAt?.toISOString() ?? null,
    acknowledged: alert.acknowledgedAt
      ? { at: alert.acknowledgedAt.toISOString(), by: acknowledgedBy ?? acknowledgement?.byLabel ?? null, comment: alert.comment }
      : null,
    events: events.map((event) => ({
      type: event.type,
      at: event.at.toISOString(),
      level: event.level,
      by: event.byLabel,
      text: event.text,
    })),
  };
}

/**
 * The periodic report of a structure: how the period went, per gauge the extremes, utilisation,
 * completeness and gaps, the alerts and how they were handled, and the fatigue damage of the
 * period. Minima, maxima and counts come from the daily roll-ups and gaps from the hourly ones,
 * so a month costs a few hundred rows per gauge; only the fatigue count reads the raw stresses,
 * as rainflow counting needs the history itself. Default period: the previous calendar month at
 * the structure (see lib/report/period.ts).
 */
export async function structureReport(actor: Actor, code: string, requested?: ReportPeriod, now = new Date()): Promise<StructureReport> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  const period = requested ?? previousMonthPeriod(now, structure.timezone);
  const span: Span = { start: period.from.getTime(), end: period.to.getTime() };

  const allGauges = await gaugeRowsOf(structure.id);
  const installed = allGauges.length ? await installedAt(allGauges) : new Map<number, number>();
  const lifeOf = (gauge: Gauge) => ({ start: installed.get(gauge.id)!, end: gauge.retiredAt?.getTime() ?? null });
  // A gauge belongs in the report if it was on the structure at some time in the period.
  const inPeriod = allGauges.filter((gauge) => lifeOf(gauge).start < span.end && (lifeOf(gauge).end ?? Infinity) > span.start);
  const ids = inPeriod.map((gauge) => gauge.id);
  const [totals, hours, current] = await Promise.all([
    ids.length ? dailyTotals(ids, span) : new Map<number, Totals>(),
    ids.length ? hoursWithReadings(ids, span) : new Map<number, number[]>(),
    structureSummary(structure, now.getTime()),
  ]);

  const gauges: ReportGauge[] = [];
  for (const gauge of inPeriod) {
    const fatigue: ReportGauge["fatigue"] =
      gauge.detailCategory == null
        ? { status: "not-assessed" }
        : await gaugeFatigue(actor, code, gauge.tag, { from: period.from, to: period.to }).then(({ fatigue: f }) => ({
            status: "assessed" as const,
            category: f.category,
            damage: f.damage,
            cyclesCounted: f.cyclesCounted,
            readingsUsed: f.readingsUsed,
          }));
    gauges.push(gaugeSection(gauge, totals.get(gauge.id), activeSpan(lifeOf(gauge), span, now.getTime()), hours.get(gauge.id) ?? [], fatigue));
  }

  const reportAlerts = await alertsOf(structure.id, span, new Map(allGauges.map((gauge) => [gauge.id, gauge.tag])));
  const received = gauges.reduce((sum, gauge) => sum + gauge.readings.received, 0);
  const expected = gauges.reduce((sum, gauge) => sum + gauge.readings.expected, 0);
  const limitLevels = reportAlerts.filter((alert) => alert.kind === "limit").map((alert) => alert.level);
  const level = periodLevel(limitLevels, received);
  const share = completeness(received, expected);
  return {
    structure: { code: structure.code, name: structure.name, location: structure.location, timezone: structure.timezone },
    period: { from: period.from.toISOString(), to: period.to.toISOString(), lastDay: dayText(lastDay(period)), name: periodName(period), key: periodKey(period) },
    generatedAt: now.toISOString(),
    summary: {
      level,
      headline: periodHeadline(level, share),
      alerts: {
        watch: limitLevels.filter((l) => l === "watch").length,
        warning: limitLevels.filter((l) => l === "warning").length,
        critical: limitLevels.filter((l) => l === "critical").length,
        sensor: reportAlerts.filter((alert) => alert.kind === "sensor").length,
      },
      readings: { received, expected, completeness: share },
      current: { state: current.state, stale: current.stale, lastReadingAt: current.lastReadingAt === null ? null : iso(current.lastReadingAt) },
    },
    gauges,
    alerts: reportAlerts,
    cautions: REPORT_CAUTIONS,
  };
}
