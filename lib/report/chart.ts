import { STATE_LOOK, type ShownState } from "@/lib/alerting/condition-display";
import { offScaleLines, valueAxisRange, type LimitLine, type OffScaleLine } from "@/lib/limits";
import { chartColumns, gapThreshold, type SeriesAnswer } from "@/lib/series/chart-data";
import { timeTickLabels } from "@/lib/series/time-labels";
import { dayEnd, dayOf, formatInTimeZone, startOfZoneDay } from "@/lib/time-format";
import { inDisplayUnits, type UnitSystem } from "@/lib/units";
import type { ReportAlert, ReportGauge, StructureReport } from "@/lib/api/report-schema";
import { alertTitle } from "./format";

/**
 * A report chart as plain geometry: the min/max envelope of each interval with its mean, the
 * limit lines, and the alerts of the period, placed in a box of `width` × `height` (points in the
 * PDF, pixels on the page). The page draws it as SVG and the PDF with pdfkit's paths, so both show
 * the same chart from the same series answer.
 */

export type Point = { x: number; y: number };

/** The colours of the gauge page's charts, for the report's page and paper alike. */
export const CHART_INK = { band: "#1f6f78", mean: "#17565d", axis: "#475569", grid: "#e2e8f0", text: "#0f172a" } as const;

/** A limit's or an alert's level in the condition code's ink. */
export const levelInk = (level: string) => STATE_LOOK[level as ShownState]?.ink ?? CHART_INK.axis;

/** An alert of the period on the chart: shaded from opening to clearing (or to the period's end), numbered at its opening. */
export type ChartMark = { from: number; to: number | null; level: string };

export type ChartInput = {
  series: Pick<SeriesAnswer, "t" | "min" | "max" | "mean" | "bucketWidth">;
  /** From the series' stored unit to `unit`. */
  toDisplay: (value: number) => number;
  unit: string;
  quantity: string;
  /** In `unit`. */
  lines: readonly LimitLine[];
  marks: readonly ChartMark[];
  from: number;
  to: number;
  timeZone: string;
  expectedIntervalS: number;
  width: number;
  height: number;
};

export type ChartGeometry = {
  width: number;
  height: number;
  plot: { left: number; top: number; width: number; height: number };
  /** Value at the plot's bottom and top edges, in the display unit. */
  range: { low: number; high: number };
  /** One polygon per run of intervals with readings: max forward, min back. */
  bands: Point[][];
  /** The mean, one polyline per run; a run of one interval is a short level stroke. */
  means: Point[][];
  yTicks: { y: number; value: number; label: string }[];
  xTicks: { x: number; lines: string[] }[];
  valueLabel: string;
  timeLabel: string;
  limits: { y: number; level: string; text: string }[];
  /** Limits beyond the fitted axis, marked at its top or bottom edge. */
  offScale: (OffScaleLine & { label: string })[];
  marks: { number: number; left: number; right: number; level: string }[];
};

/** Where the plot sits in the box: room for value labels on the left, two-line time labels below, alert numbers above. */
const PAD = { left: 58, right: 10, top: 16, bottom: 30 };

/**
 * Tick values 1, 2 or 5 × 10ⁿ apart that fall inside [low, high], about `wanted` of them: the
 * "nice numbers" rule of P. S. Heckbert, "Nice numbers for graph labels", Graphics Gems (1990).
 */
export function niceTicks(low: number, high: number, wanted = 6): number[] {
  if (!(high > low)) return [low];
  const rough = (high - low) / Math.max(1, wanted - 1);
  const power = 10 ** Math.floor(Math.log10(rough));
  // Heckbert's rounding: the nice factor nearest the rough step.
  const fraction = rough / power;
  const step = (fraction < 1.5 ? 1 : fraction < 3 ? 2 : fraction < 7 ? 5 : 10) * power;
  const ticks: number[] = [];
  for (let value = Math.ceil(low / step) * step; value <= high + step * 1e-9; value += step) ticks.push(Math.abs(value) < step * 1e-9 ? 0 : value);
  return ticks;
}

/** Decimals that tell the ticks apart and no more: a step of 20 needs none, 0.5 one. */
function tickDecimals(ticks: readonly number[]): number {
  if (ticks.length < 2) return 1;
  const step = ticks[1]! - ticks[0]!;
  return Math.max(0, Math.ceil(-Math.log10(step) - 1e-9));
}

const formatTick = (value: number, decimals: number) =>
  value.toLocaleString("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals, signDisplay: "negative" });

const DAY_MS = 86_400_000;
const HOUR_MS = 3_600_000;
const MAX_TIME_TICKS = 8;

/** "2026-11-01" → "2026-11-02", by the calendar. */

/**
 * Time ticks on the structure's clock: midnights every 1, 2, 7 or 14 days over a long period,
 * else every 1 to 12 hours from a midnight, at most eight of them, in epoch ms.
 */
export function timeTicks(from: number, to: number, timeZone: string): { times: number[]; stepS: number } {
  const days = (to - from) / DAY_MS;
  if (days >= 3) {
    const every = [1, 2, 7, 14, 28].find((step) => days / step <= MAX_TIME_TICKS) ?? 28;
    const midnights: number[] = [];
    for (let midnight = startOfZoneDay(from, timeZone).getTime(); midnight < to; midnight = dayEnd(dayOf(midnight, timeZone), timeZone).getTime()) {
      if (midnight >= from) midnights.push(midnight);
    }
    return { times: midnights.filter((_, i) => i % every === 0), stepS: (every * DAY_MS) / 1000 };
  }
  const hours = (to - from) / HOUR_MS;
  const every = [1, 2, 3, 6, 12, 24].find((step) => hours / step <= MAX_TIME_TICKS) ?? 24;
  const first = startOfZoneDay(from, timeZone).getTime();
  const times: number[] = [];
  for (let time = first; time < to; time += every * HOUR_MS) if (time >= from) times.push(time);
  return { times, stepS: every * 3600 };
}

/** Runs of non-null values in chart columns, as index ranges. */
function runs(values: readonly (number | null)[]): [number, number][] {
  const found: [number, number][] = [];
  let start = -1;
  values.forEach((value, i) => {
    if (value !== null && start < 0) start = i;
    if (value === null && start >= 0) {
      found.push([start, i - 1]);
      start = -1;
    }
  });
  if (start >= 0) found.push([start, values.length - 1]);
  return found;
}

/** The chart of one quantity over the period, or null when the series holds no interval to draw. */
export function envelopeChart(input: ChartInput): ChartGeometry | null {
  const [seconds, min, max, mean] = chartColumns(input.series as SeriesAnswer, input.toDisplay, gapThreshold(input.expectedIntervalS, input.series.bucketWidth));
  const lows = min.filter((value) => value !== null);
  const highs = max.filter((value) => value !== null);
  if (lows.length === 0) return null;
  const [low, high] = valueAxisRange(Math.min(...lows), Math.max(...highs), input.lines, false);
  const plot = { left: PAD.left, top: PAD.top, width: input.width - PAD.left - PAD.right, height: input.height - PAD.top - PAD.bottom };
  const xOf = (ms: number) => plot.left + ((Math.min(input.to, Math.max(input.from, ms)) - input.from) / (input.to - input.from)) * plot.width;
  const yOf = (value: number) => plot.top + ((high - value) / (high - low)) * plot.height;
  const at = (i: number, column: readonly (number | null)[]): Point => ({ x: xOf(seconds[i]! * 1000), y: yOf(column[i]!) });

  const bands: Point[][] = [];
  const means: Point[][] = [];
  for (const [first, last] of runs(mean)) {
    const indices = Array.from({ length: last - first + 1 }, (_, k) => first + k);
    if (indices.length === 1) {
      // One interval alone: as wide as its bucket, at least a stroke, so it shows.
      const half = Math.max(1, ((input.series.bucketWidth ?? 0) / (input.to - input.from)) * plot.width) / 2;
      const centre = at(first, mean);
      const top = yOf(max[first]!);
      const bottom = yOf(min[first]!);
      bands.push([{ x: centre.x - half, y: top }, { x: centre.x + half, y: top }, { x: centre.x + half, y: bottom }, { x: centre.x - half, y: bottom }]);
      means.push([{ x: centre.x - half, y: centre.y }, { x: centre.x + half, y: centre.y }]);
      continue;
    }
    bands.push([...indices.map((i) => at(i, max)), ...[...indices].reverse().map((i) => at(i, min))]);
    means.push(indices.map((i) => at(i, mean)));
  }

  const ticks = niceTicks(low, high);
  const decimals = tickDecimals(ticks);
  const { times, stepS } = timeTicks(input.from, input.to, input.timeZone);
  const timeLabels = timeTickLabels(
    times.map((time) => time / 1000),
    stepS,
    input.timeZone,
  );
  return {
    width: input.width,
    height: input.height,
    plot,
    range: { low, high },
    bands,
    means,
    yTicks: ticks.map((value) => ({ y: yOf(value), value, label: formatTick(value, decimals) })),
    xTicks: times.map((time, i) => ({ x: xOf(time), lines: timeLabels[i]!.split("\n") })),
    valueLabel: `${input.quantity} (${input.unit})`,
    timeLabel: `Time (${input.timeZone})`,
    limits: input.lines.filter((line) => line.value >= low && line.value <= high).map((line) => ({ y: yOf(line.value), level: line.level, text: line.text })),
    offScale: offScaleLines(input.lines, [low, high]).map((line) => ({ ...line, label: `${line.text} ${formatTick(line.value, Math.max(1, decimals))} ${input.unit} ${line.side === "above" ? "above" : "below"} the chart` })),
    marks: input.marks.map((mark, i) => ({ number: i + 1, left: xOf(mark.from), right: Math.max(xOf(mark.from) + 1, xOf(mark.to ?? input.to)), level: mark.level })),
  };
}

/** The alerts of a gauge in the order they are numbered on its chart: by opening time. */
export function chartAlerts(alerts: readonly ReportAlert[], tag: string): ReportAlert[] {
  return alerts.filter((alert) => alert.gauge === tag).sort((a, b) => Date.parse(a.openedAt) - Date.parse(b.openedAt));
}

/**
 * A report gauge's stress chart in the reader's units, with one line per numbered alert saying
 * what it was, or null when nothing was stored in the period. Shared by the page and the PDF.
 */
export function reportStressChart(
  report: Pick<StructureReport, "alerts" | "period" | "structure">,
  gauge: ReportGauge,
  units: UnitSystem,
  box: { width: number; height: number },
): { geometry: ChartGeometry; legend: string[] } | null {
  if (!gauge.stressSeries) return null;
  const toDisplay = (value: number) => inDisplayUnits(units, "stress", value).value;
  const alerts = chartAlerts(report.alerts, gauge.tag);
  const zone = report.structure.timezone;
  const geometry = envelopeChart({
    series: gauge.stressSeries,
    toDisplay,
    unit: inDisplayUnits(units, "stress", 0).unit,
    quantity: "Stress",
    lines: gauge.stressLimitLines.map((line) => ({ ...line, value: toDisplay(line.value) })),
    marks: alerts.map((alert) => ({ from: Date.parse(alert.openedAt), to: alert.clearedAt ? Date.parse(alert.clearedAt) : null, level: alert.level })),
    from: Date.parse(report.period.from),
    to: Date.parse(report.period.to),
    timeZone: zone,
    expectedIntervalS: gauge.expectedIntervalS,
    ...box,
  });
  if (!geometry) return null;
  const legend = alerts.map((alert, i) => {
    const cleared = alert.clearedAt ? `cleared ${formatInTimeZone(new Date(alert.clearedAt), zone)}` : "still open";
    return `${i + 1}: ${alertTitle(alert, units)}; opened ${formatInTimeZone(new Date(alert.openedAt), zone)}, ${cleared}`;
  });
  return { geometry, legend };
}
