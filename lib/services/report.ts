import "server-only";
import { and, asc, desc, eq, gt, gte, inArray, isNull, lt, lte, or, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { alertEvents, alerts, calibrationCertificates, gauges as gaugeTable, readings, rollups, shuntChecks, thermalModels, users, zeroReadings, type Alert, type AlertEvent, type Gauge } from "@/db/schema";
import { CONCRETE_CAUTION, peakRating, type StressRating } from "@/lib/mechanics";
import { Flag } from "@/lib/mechanics/validity";
import { DEFAULT_EXPECTED_INTERVAL_S } from "@/lib/alerting/gauge-state";
import type { ReportAlert, ReportCertificate, ReportDrawing, ReportGauge, ReportShuntCheck, ReportThermalModel, StructureReport } from "@/lib/api/report-schema";
import { addDays } from "@/lib/field-records/calendar";
import { shuntCheckVerdict } from "@/lib/mechanics/shunt-calibration";
import type { Actor } from "@/lib/auth/actor";
import { requirePermission } from "@/lib/auth/authorize";
import { REPORT_CAUTIONS } from "@/lib/report/cautions";
import { activeSpan, completeness, expectedReadings, type Span } from "@/lib/report/completeness";
import { firstOf, missingHourRuns } from "@/lib/report/gaps";
import { periodDays, periodName, previousMonthPeriod, resolvePeriod, type PeriodRequest, type ReportPeriod } from "@/lib/report/period";
import { periodHeadline, periodLevel, type CheckedGauges } from "@/lib/report/status";
import { PDF_IMAGE_TYPES, renderReportPdf } from "@/lib/report/pdf";
import { limitLines } from "@/lib/limits";
import { ROLLUP_RESOLUTIONS } from "@/lib/series";
import { gaugeFatigue } from "./fatigue";
import { reminderDays } from "./certificates";
import { listDrawings, openFile } from "./files";
import { limitsOfGauge } from "./limits";
import { getSeries } from "./readings";
import { gaugeRowsOf } from "./gauges";
import { loadTestsOfPeriod } from "./load-tests";
import { conditionView, gaugeStatuses, structureSummary, type ConditionView } from "./status";
import { getVisibleStructure } from "./structures";

/** Gap runs listed per gauge; a dead logger for a month would otherwise fill pages. */
const GAPS_LISTED = 10;

/** Intervals of a report chart: three hours each over a month, finer than a printed line can show. */
const CHART_POINTS = 250;

const iso = (ms: number) => new Date(ms).toISOString();
const HOUR_MS = 3_600_000;

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

/** The gauges' hourly roll-up rows whose hour starts inside the period. */
function hoursWithin(gaugeIds: number[], period: Span) {
  return and(
    inArray(rollups.gaugeId, gaugeIds),
    eq(rollups.resolution, ROLLUP_RESOLUTIONS.hourly),
    gte(rollups.bucket, period.start),
    lt(rollups.bucket, period.end),
  );
}

/**
 * Per gauge, the period's totals from the hourly roll-ups: the period is days of the structure's
 * zone, whose midnights are whole UTC hours wherever the offset is whole hours (for a zone such as
 * Asia/Kolkata, +05:30, the first and last half hour are read by the hour they fall in).
 */
async function periodTotals(gaugeIds: number[], period: Span) {
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
    .where(hoursWithin(gaugeIds, period))
    .groupBy(rollups.gaugeId);
  return new Map(rows.map((row) => [row.gaugeId, row]));
}

type HourCount = { bucket: number; count: number };

/** Per gauge, the hours in the period that hold readings, with how many, oldest first. */
async function hoursWithReadings(gaugeIds: number[], period: Span): Promise<Map<number, HourCount[]>> {
  const rows = await getDb()
    .select({ gaugeId: rollups.gaugeId, bucket: rollups.bucket, count: rollups.count })
    .from(rollups)
    .where(and(hoursWithin(gaugeIds, period), gt(rollups.count, 0)))
    .orderBy(asc(rollups.gaugeId), asc(rollups.bucket));
  const byGauge = new Map<number, HourCount[]>();
  for (const row of rows) {
    const hours = byGauge.get(row.gaugeId) ?? [];
    hours.push({ bucket: row.bucket, count: row.count });
    byGauge.set(row.gaugeId, hours);
  }
  return byGauge;
}

/**
 * Per gauge with readings in the period it does not believe, the extremes of the others and how
 * many were left out. Not believed: a stored sensor-health verdict (a jump, a flat line, out of
 * the sensor's range, or held after a jump until an engineer resolves it), or beyond the gauge's
 * rated range. The verdict is read as stored, so a step the engineer accepted counts again and a
 * held reading counts as faulty whether or not its alert is still open.
 */
async function believedExtremes(gaugeIds: number[], period: Span) {
  const believed = sql`${readings.fault} = 0 and (${readings.flags} & ${Flag.outOfRange}) = 0`;
  const rows = await getDb()
    .select({
      gaugeId: readings.gaugeId,
      count: sql<number>`sum(case when ${believed} then 1 else 0 end)`,
      all: sql<number>`count(*)`,
      strainMin: sql<number>`min(case when ${believed} then ${readings.strain} end)`,
      strainMax: sql<number>`max(case when ${believed} then ${readings.strain} end)`,
      stressMin: sql<number>`min(case when ${believed} then ${readings.stress} end)`,
      stressMax: sql<number>`max(case when ${believed} then ${readings.stress} end)`,
      temperatureMin: sql<number | null>`min(case when ${believed} then ${readings.temperature} end)`,
      temperatureMax: sql<number | null>`max(case when ${believed} then ${readings.temperature} end)`,
    })
    .from(readings)
    .where(and(inArray(readings.gaugeId, gaugeIds), gte(readings.time, period.start), lt(readings.time, period.end)))
    .groupBy(readings.gaugeId)
    .having(sql`count(*) > sum(case when ${believed} then 1 else 0 end)`);
  return new Map(rows.map((row) => [row.gaugeId, { ...row, count: Number(row.count), leftOut: Number(row.all) - Number(row.count) }]));
}

type Totals = Awaited<ReturnType<typeof periodTotals>> extends Map<number, infer T> ? T : never;

type GaugeFacts = {
  chart: Pick<ReportGauge, "stressSeries" | "stressLimitLines">;
  totals: Totals | undefined;
  /** Set when some readings were not believed: the extremes of the others. */
  believed: (Totals & { leftOut: number }) | undefined;
  span: Span | null;
  hours: HourCount[];
  condition: ConditionView;
  fatigue: ReportGauge["fatigue"];
};

const LEFT_OUT_REASON = "found faulty by the sensor checks (jump, flat line, beyond the sensor's range, or held after a jump until an engineer resolves it), or beyond the gauge's rated range";

function gaugeSection(gauge: Gauge, { chart, totals: allTotals, believed, span, hours, condition, fatigue }: GaugeFacts): ReportGauge {
  const intervalS = gauge.expectedInterval ?? DEFAULT_EXPECTED_INTERVAL_S;
  const inSpan = span ? hours.filter((hour) => hour.bucket + HOUR_MS > span.start && hour.bucket < span.end) : [];
  const received = inSpan.reduce((sum, hour) => sum + hour.count, 0);
  const expected = expectedReadings(span, intervalS);
  const gaps = missingHourRuns(
    inSpan.map((hour) => hour.bucket),
    span,
    intervalS,
  );
  const listed = firstOf(gaps, GAPS_LISTED);
  const totals = believed ?? allTotals;
  const has = totals !== undefined && Number(totals.count) > 0;
  return {
    tag: gauge.tag,
    label: gauge.label,
    member: gauge.member,
    status: gauge.status,
    expectedIntervalS: intervalS,
    activeSpan: span && { from: iso(span.start), to: iso(span.end) },
    readings: readingShare(received, expected),
    condition,
    leftOut: believed && believed.leftOut > 0 ? { readings: believed.leftOut, reason: LEFT_OUT_REASON } : null,
    stress: has ? { min: totals.stressMin, max: totals.stressMax, unit: "MPa" } : null,
    strain: has ? { min: totals.strainMin, max: totals.strainMax, unit: "µε" } : null,
    temperature:
      has && totals.temperatureMin !== null && totals.temperatureMax !== null
        ? { min: totals.temperatureMin, max: totals.temperatureMax, unit: "°C" }
        : null,
    utilisationPeak: has ? utilisationPeakOf(peakRating(totals.stressMin, totals.stressMax, gauge.material)) : null,
    gaps: {
      list: listed.shown.map((gap) => ({ start: iso(gap.start), end: iso(gap.end), hours: gap.hours })),
      more: listed.more,
      totalHours: gaps.reduce((sum, gap) => sum + gap.hours, 0),
    },
    fatigue,
    ...chart,
    placement: gauge.drawingId != null && gauge.drawingX != null && gauge.drawingY != null ? { drawing: gauge.drawingId, x: gauge.drawingX, y: gauge.drawingY } : null,
  };
}

/** The stress chart of a gauge: the envelope the gauge page's chart shows over the period, and its stress and utilisation bounds. */
async function gaugeChart(actor: Actor, code: string, gauge: Gauge, period: ReportPeriod, stored: boolean): Promise<GaugeFacts["chart"]> {
  const lines = limitLines(await limitsOfGauge(gauge.id), "stress", (value) => value, gauge.material.yield ?? null);
  if (!stored) return { stressSeries: null, stressLimitLines: lines };
  const series = await getSeries(actor, code, gauge.tag, { from: period.from.getTime(), to: period.to.getTime(), points: CHART_POINTS, quantity: "stress" });
  const { t, min, max, mean, bucketWidth } = series;
  return { stressSeries: t.length ? { t, min, max, mean, bucketWidth } : null, stressLimitLines: lines };
}

const drawingOf = ({ id, title, contentType, width, height, url }: ReportDrawing): ReportDrawing => ({ id, title, contentType, width, height, url });

/**
 * The report as a PDF, with the images of its drawings read from the file store. A drawing the
 * PDF cannot hold (a WebP image) or whose bytes are gone is named there without its image.
 */
export async function structureReportPdf(actor: Actor, report: StructureReport): Promise<Buffer> {
  const images = new Map<number, Uint8Array>();
  for (const drawing of report.drawings) {
    if (!PDF_IMAGE_TYPES.includes(drawing.contentType)) continue;
    const file = await openFile(actor, drawing.id).catch(() => null);
    if (file) images.set(drawing.id, new Uint8Array(await new Response(file.stream).arrayBuffer()));
  }
  return renderReportPdf(report, images);
}

/** Which of the report's gauges an all clear covers; faulty readings are not in `received`, so a gauge that sent only those is faulty, not silent. */
function checkedGauges(gauges: ReportGauge[], limitedTags: Set<string>): CheckedGauges {
  const checked: CheckedGauges = { withLimits: 0, withoutLimits: 0, faulty: 0, silent: 0 };
  for (const gauge of gauges) {
    const faulty = gauge.leftOut !== null || gauge.condition.state === "sensor-fault";
    if (faulty) checked.faulty++;
    if (gauge.readings.received > 0) checked[limitedTags.has(gauge.tag) ? "withLimits" : "withoutLimits"]++;
    else if (!faulty) checked.silent++;
  }
  return checked;
}

const readingShare = (received: number, expected: number) => ({
  received,
  expected,
  completeness: completeness(received, expected),
  surplus: Math.max(0, received - expected),
});

function utilisationPeakOf(rating: StressRating | null): ReportGauge["utilisationPeak"] {
  if (!rating) return null;
  return rating.basis === "yield"
    ? { basis: "yield", ratio: rating.ratio!, yield: rating.strength }
    : { basis: "compressive-strength", ratio: rating.ratio, compressiveStrength: rating.strength };
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

/** The shunt checks of the report's gauges taken in the period, oldest first. */
async function shuntChecksOf(gaugeIds: number[], period: Span, tagOf: Map<number, string>): Promise<ReportShuntCheck[]> {
  if (gaugeIds.length === 0) return [];
  const rows = await getDb()
    .select()
    .from(shuntChecks)
    .where(and(inArray(shuntChecks.gaugeId, gaugeIds), gte(shuntChecks.time, new Date(period.start)), lt(shuntChecks.time, new Date(period.end))))
    .orderBy(asc(shuntChecks.time), asc(shuntChecks.id));
  return rows.map((row) => ({
    gauge: tagOf.get(row.gaugeId)!,
    time: row.time.toISOString(),
    expectedOutput: row.expectedOutput,
    measuredOutput: row.measuredOutput,
    unit: row.unit,
    differencePercent: shuntCheckVerdict(row.measuredOutput, row.expectedOutput, row.tolerancePercent).deviationPercent,
    tolerancePercent: row.tolerancePercent,
    passed: row.passed,
  }));
}

/**
 * The structure's certificates that expired in the period (on its days) or expire within the
 * largest reminder window after its last day: what the owner must have renewed, or soon must.
 */
async function certificatesDue(structureId: number, firstDay: string, lastDay: string): Promise<ReportCertificate[]> {
  const windowEnd = addDays(lastDay, reminderDays()[0] ?? 0);
  const rows = await getDb()
    .select({ certificate: calibrationCertificates, gaugeTag: gaugeTable.tag })
    .from(calibrationCertificates)
    .leftJoin(gaugeTable, eq(gaugeTable.id, calibrationCertificates.gaugeId))
    .where(and(eq(calibrationCertificates.structureId, structureId), gte(calibrationCertificates.expiresOn, firstDay), lte(calibrationCertificates.expiresOn, windowEnd)))
    .orderBy(asc(calibrationCertificates.expiresOn), asc(calibrationCertificates.id));
  return rows.map(({ certificate, gaugeTag }) => ({
    gauge: gaugeTag,
    logger: certificate.loggerName,
    number: certificate.certificateNumber,
    expiresOn: certificate.expiresOn,
    expiredInPeriod: certificate.expiresOn <= lastDay,
  }));
}

/** The thermal models of the report's gauges, with the residual range of the period from the hourly roll-ups (which leave faulty readings out). */
async function thermalModelsOf(gaugeRows: Gauge[], period: Span): Promise<ReportThermalModel[]> {
  const ids = gaugeRows.map((gauge) => gauge.id);
  if (ids.length === 0) return [];
  const [models, residuals] = await Promise.all([
    getDb().select().from(thermalModels).where(inArray(thermalModels.gaugeId, ids)),
    getDb()
      .select({ gaugeId: rollups.gaugeId, min: sql<number>`min(${rollups.residualMin})`, max: sql<number>`max(${rollups.residualMax})` })
      .from(rollups)
      .where(and(hoursWithin(ids, period), gt(rollups.residualCount, 0)))
      .groupBy(rollups.gaugeId),
  ]);
  const modelOf = new Map(models.map((model) => [model.gaugeId, model]));
  const residualOf = new Map(residuals.map((row) => [row.gaugeId, row]));
  return gaugeRows.flatMap((gauge) => {
    const model = modelOf.get(gauge.id);
    if (!model) return [];
    const residual = residualOf.get(gauge.id);
    return [
      {
        gauge: gauge.tag,
        slope: model.slope,
        lagMinutes: model.lagMinutes,
        r2: model.r2,
        residualStd: model.residualStd,
        residual: residual ? { min: Number(residual.min), max: Number(residual.max), unit: "µε" as const } : null,
      },
    ];
  });
}

/**
 * The periodic report of a structure: how the period went, per gauge the extremes, utilisation,
 * completeness and gaps, the alerts and how they were handled, and the fatigue damage of the
 * period. Minima, maxima, counts and gaps come from the hourly roll-ups, so a month costs some
 * 750 rows per gauge; only the fatigue count reads the raw stresses,
 * as rainflow counting needs the history itself. Default period: the previous calendar month at
 * the structure (see lib/report/period.ts).
 */
export async function structureReport(actor: Actor, code: string, requested?: PeriodRequest, now = new Date()): Promise<StructureReport> {
  const structure = await getVisibleStructure(actor, code);
  await requirePermission(actor, "structure:view", structure);
  const period = requested ? resolvePeriod(requested, structure.timezone) : previousMonthPeriod(now, structure.timezone);
  const span: Span = { start: period.from.getTime(), end: period.to.getTime() };

  const allGauges = await gaugeRowsOf(structure.id);
  const allIds = allGauges.map((gauge) => gauge.id);
  const [installed, totals, hours, believed, statuses, current] = await Promise.all([
    allIds.length ? installedAt(allGauges) : new Map<number, number>(),
    allIds.length ? periodTotals(allIds, span) : new Map<number, Totals>(),
    allIds.length ? hoursWithReadings(allIds, span) : new Map<number, HourCount[]>(),
    allIds.length ? believedExtremes(allIds, span) : new Map<number, Totals & { leftOut: number }>(),
    gaugeStatuses(structure, now.getTime()),
    structureSummary(structure, now.getTime()),
  ]);
  // A gauge that sent readings was on the structure, whatever its registration says.
  const lifeOf = (gauge: Gauge) => ({
    start: Math.min(installed.get(gauge.id)!, hours.get(gauge.id)?.[0]?.bucket ?? Infinity),
    end: gauge.retiredAt?.getTime() ?? null,
  });
  // A gauge belongs in the report if it was on the structure at some time in the period.
  const inPeriod = allGauges.filter((gauge) => lifeOf(gauge).start < span.end && (lifeOf(gauge).end ?? Infinity) > span.start);
  const conditionOf = new Map(statuses.map((status) => [status.tag, conditionView(status.condition)]));
  const limitedTags = new Set(statuses.filter((status) => status.hasLimits).map((status) => status.tag));

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
    gauges.push(
      gaugeSection(gauge, {
        chart: await gaugeChart(actor, code, gauge, period, totals.has(gauge.id) || believed.has(gauge.id)),
        totals: totals.get(gauge.id),
        believed: believed.get(gauge.id),
        span: activeSpan(lifeOf(gauge), span, now.getTime()),
        hours: hours.get(gauge.id) ?? [],
        condition: conditionOf.get(gauge.tag)!,
        fatigue,
      }),
    );
  }

  const tagOf = new Map(allGauges.map((gauge) => [gauge.id, gauge.tag]));
  const reportAlerts = await alertsOf(structure.id, span, tagOf);
  const days = periodDays(period);
  const received = gauges.reduce((sum, gauge) => sum + gauge.readings.received, 0);
  const expected = gauges.reduce((sum, gauge) => sum + gauge.readings.expected, 0);
  // A gauge sending too often does not make up for one that is silent.
  const onSchedule = gauges.reduce((sum, gauge) => sum + Math.min(gauge.readings.received, gauge.readings.expected), 0);
  const limitLevels = reportAlerts.filter((alert) => alert.kind === "limit").map((alert) => alert.level);
  const level = periodLevel(limitLevels, received);
  const share = completeness(onSchedule, expected);
  return {
    structure: { code: structure.code, name: structure.name, location: structure.location, timezone: structure.timezone },
    period: { from: period.from.toISOString(), to: period.to.toISOString(), ...days, name: periodName(period) },
    generatedAt: now.toISOString(),
    summary: {
      level,
      headline: periodHeadline(level, share, checkedGauges(gauges, limitedTags)),
      alerts: {
        watch: limitLevels.filter((l) => l === "watch").length,
        warning: limitLevels.filter((l) => l === "warning").length,
        critical: limitLevels.filter((l) => l === "critical").length,
        sensor: reportAlerts.filter((alert) => alert.kind === "sensor").length,
      },
      readings: { ...readingShare(received, expected), completeness: share },
      current: { state: current.state, stale: current.stale, lastReadingAt: current.lastReadingAt === null ? null : iso(current.lastReadingAt) },
    },
    gauges,
    alerts: reportAlerts,
    drawings: (await listDrawings(actor, code)).map(drawingOf),
    loadTests: await loadTestsOfPeriod(structure, span),
    shuntChecks: await shuntChecksOf(inPeriod.map((gauge) => gauge.id), span, tagOf),
    certificates: await certificatesDue(structure.id, days.firstDay, days.lastDay),
    thermalModels: await thermalModelsOf(inPeriod, span),
    cautions: gauges.some((gauge) => gauge.utilisationPeak?.basis === "compressive-strength") ? [...REPORT_CAUTIONS, CONCRETE_CAUTION] : REPORT_CAUTIONS,
  };
}
