"use client";

import { useMemo } from "react";
import type uPlot from "uplot";
import { cardClass } from "@/components/ui/styles";
import { offScaleLines, valueAxisRange, type LimitLine } from "@/lib/limits";
import { DEFAULT_EXPECTED_INTERVAL_S } from "@/lib/alerting/gauge-state";
import { chartColumns, gapThreshold, type SeriesAnswer } from "@/lib/series/chart-data";
import { formatInUnit, type DisplayUnit } from "@/lib/units";
import { UplotChart, timeChartOptions } from "./uplot-chart";

const LEVEL_COLOUR: Record<string, string> = { watch: "#8a6d00", warning: "#b45309", critical: "#b42318" };
const NONE: readonly never[] = [];

export type ChartEvent = { time: number; label: string };
export type ChartEpisode = { openedAt: number; clearedAt: number | null; level: string };
export type TimeRange = { from: number; to: number };
/** A horizontal band of expected values in display units, e.g. a thermal residual's ±2σ. */
export type ValueBand = { low: number; high: number; label: string };

/** The band shaded across the plot, listed in `data-band` so tests can tell it is drawn. */
function drawBand(chart: uPlot, band: ValueBand) {
  const { ctx, bbox } = chart;
  const top = Math.max(bbox.top, chart.valToPos(band.high, "y", true));
  const bottom = Math.min(bbox.top + bbox.height, chart.valToPos(band.low, "y", true));
  chart.root.dataset.band = JSON.stringify({ ...band, drawn: bottom > top });
  if (bottom <= top) return;
  ctx.save();
  ctx.fillStyle = "rgba(100,116,139,0.14)";
  ctx.fillRect(bbox.left, top, bbox.width, bottom - top);
  ctx.fillStyle = "#475569";
  ctx.font = `${11 * devicePixelRatio}px sans-serif`;
  ctx.fillText(band.label, bbox.left + 4, top + 12 * devicePixelRatio);
  ctx.restore();
}

/**
 * Limit lines, alert episodes and events, drawn on the canvas after the series. The lines actually
 * stroked are listed in `data-limit-lines` (canvas pixel row included), so tests and assistive
 * tooling can tell which limits are in view without reading pixels blindly.
 */
function drawOverlays(chart: uPlot, lines: readonly LimitLine[], episodes: readonly ChartEpisode[], events: readonly ChartEvent[], unit: DisplayUnit) {
  const { ctx, bbox } = chart;
  const drawn: { level: string; text: string; value: number; y: number }[] = [];
  ctx.save();
  for (const episode of episodes) {
    const left = Math.max(bbox.left, chart.valToPos(episode.openedAt / 1000, "x", true));
    const right = Math.min(bbox.left + bbox.width, chart.valToPos((episode.clearedAt ?? Date.now()) / 1000, "x", true));
    if (right <= left) continue;
    ctx.fillStyle = `${LEVEL_COLOUR[episode.level] ?? "#8a6d00"}22`;
    ctx.fillRect(left, bbox.top, Math.max(2, right - left), bbox.height);
  }
  ctx.font = `${11 * devicePixelRatio}px sans-serif`;
  for (const line of lines) {
    const y = chart.valToPos(line.value, "y", true);
    if (y < bbox.top || y > bbox.top + bbox.height) continue;
    ctx.strokeStyle = LEVEL_COLOUR[line.level] ?? "#444";
    ctx.fillStyle = ctx.strokeStyle;
    ctx.setLineDash([6 * devicePixelRatio, 4 * devicePixelRatio]);
    ctx.lineWidth = 1.5 * devicePixelRatio;
    ctx.beginPath();
    ctx.moveTo(bbox.left, y);
    ctx.lineTo(bbox.left + bbox.width, y);
    ctx.stroke();
    ctx.fillText(line.text, bbox.left + 4, y - 4);
    drawn.push({ level: line.level, text: line.text, value: line.value, y: Math.round(y) });
  }
  chart.root.dataset.limitLines = JSON.stringify(drawn);
  drawOffScaleMarkers(chart, lines, unit);
  ctx.setLineDash([2 * devicePixelRatio, 3 * devicePixelRatio]);
  ctx.strokeStyle = "#1f6f78";
  ctx.fillStyle = "#1f6f78";
  for (const event of events) {
    const x = chart.valToPos(event.time / 1000, "x", true);
    if (x < bbox.left || x > bbox.left + bbox.width) continue;
    ctx.beginPath();
    ctx.moveTo(x, bbox.top);
    ctx.lineTo(x, bbox.top + bbox.height);
    ctx.stroke();
    ctx.fillText(event.label, x + 3, bbox.top + 12 * devicePixelRatio);
  }
  ctx.restore();
}

/**
 * Where the lines stop for want of readings, in canvas pixels, on the chart's root (as
 * `data-breaks`), so tests and assistive tooling can find the gaps without guessing.
 */
function markBreaks(chart: uPlot) {
  const [x, ...values] = chart.data;
  const breaks: { time: number; x: number }[] = [];
  x.forEach((seconds, i) => {
    if (values.every((column) => column[i] === null)) breaks.push({ time: seconds * 1000, x: Math.round(chart.valToPos(seconds, "x", true)) });
  });
  chart.root.dataset.breaks = JSON.stringify(breaks);
}

/**
 * A bound beyond the fitted axis gets an arrow at the plot's top or bottom edge with its value, so
 * the person knows it exists and how far away it is; listed in `data-off-scale-lines`.
 */
function drawOffScaleMarkers(chart: uPlot, lines: readonly LimitLine[], unit: DisplayUnit) {
  const { ctx, bbox } = chart;
  const scale = chart.scales.y;
  const off = scale?.min == null || scale.max == null ? [] : offScaleLines(lines, [scale.min, scale.max]);
  const step = 14 * devicePixelRatio;
  const placed = { above: 0, below: 0 };
  ctx.setLineDash([]);
  for (const line of off) {
    const slot = placed[line.side]++;
    const y = line.side === "above" ? bbox.top + 10 * devicePixelRatio + slot * step : bbox.top + bbox.height - 4 * devicePixelRatio - slot * step;
    ctx.fillStyle = LEVEL_COLOUR[line.level] ?? "#444";
    // Short enough for a phone's plot; it never starts left of the plot when the plot is narrow.
    const text = `${line.side === "above" ? "▲" : "▼"} ${line.level} ${formatInUnit(line.value, unit)}`;
    ctx.fillText(text, Math.max(bbox.left + 4, bbox.left + bbox.width - ctx.measureText(text).width - 4), y);
  }
  chart.root.dataset.offScaleLines = JSON.stringify(off.map(({ level, text, value, side }) => ({ level, text, value, side })));
}

const EPISODE_LEVELS = ["watch", "warning", "critical"] as const;

/** What the shading means, with the levels actually shaded on this chart. */
function EpisodeLegend({ episodes }: { episodes: readonly ChartEpisode[] }) {
  const levels = EPISODE_LEVELS.filter((level) => episodes.some((episode) => episode.level === level));
  if (levels.length === 0) return null;
  return (
    <p className="mt-1 flex flex-wrap items-center gap-3 text-xs text-slate-600 dark:text-slate-400" data-testid="episode-legend">
      <span>Shaded: alert episode, from opening to clearing —</span>
      {levels.map((level) => (
        <span key={level} className="inline-flex items-center gap-1">
          <span aria-hidden className="inline-block h-3 w-5 rounded-sm border" style={{ backgroundColor: `${LEVEL_COLOUR[level]}33`, borderColor: LEVEL_COLOUR[level] }} />
          {level}
        </span>
      ))}
    </p>
  );
}

/**
 * One quantity of a series answer over time: the min/max envelope of each interval, so a spike
 * always shows, its mean, and any limit lines, alert episodes and events. With `onZoom`, dragging
 * across the chart hands the chosen range back instead of zooming into the data already fetched.
 */
export function EnvelopeChart({
  title,
  answer,
  error,
  unit,
  toDisplay,
  timeZone,
  empty,
  lines = NONE,
  episodes = NONE,
  events = NONE,
  onZoom,
  onZoomOut,
  showAllLimits = false,
  onCreate,
  expectedIntervalS,
  band,
}: {
  title: string;
  answer: SeriesAnswer | undefined;
  error: Error | undefined;
  unit: DisplayUnit;
  /** From the series' stored unit to `unit`. */
  toDisplay: (value: number) => number;
  timeZone: string;
  /** What to say when the answer holds no interval. */
  empty: string;
  lines?: readonly LimitLine[];
  episodes?: readonly ChartEpisode[];
  events?: readonly ChartEvent[];
  onZoom?: (range: TimeRange) => void;
  /** A double-click on the chart: back to the range before the last zoom. */
  onZoomOut?: () => void;
  /** Every limit line in view; by default the axis fits the data and far bounds are marked at the edge. */
  showAllLimits?: boolean;
  onCreate?: (chart: uPlot) => void;
  /** The gauge's interval between readings, s: silences longer than it break the line. */
  expectedIntervalS?: number | null;
  band?: ValueBand;
}) {
  const data = useMemo(
    () => (answer ? chartColumns(answer, toDisplay, gapThreshold(expectedIntervalS ?? DEFAULT_EXPECTED_INTERVAL_S, answer.bucketWidth)) : null),
    [answer, toDisplay, expectedIntervalS],
  );
  const options = useMemo(
    () =>
      timeChartOptions(timeZone, unit, {
        cursor: { drag: { x: true, y: false } },
        legend: { show: true },
        scales: { y: { range: (_chart, min, max) => valueAxisRange(Math.min(min, band?.low ?? min), Math.max(max, band?.high ?? max), lines, showAllLimits) } },
        valueAxis: { label: `${title} (${unit})`, size: 70 },
        series: [
          { label: "min", stroke: "#7aa7ad", width: 1, points: { show: false } },
          { label: "max", stroke: "#7aa7ad", width: 1, points: { show: false } },
          { label: "mean", stroke: "#17565d", width: 1.5, points: { show: false } },
        ],
        bands: [{ series: [2, 1], fill: "rgba(31,111,120,0.15)" }],
        hooks: {
          draw: [...(band ? [(chart: uPlot) => drawBand(chart, band)] : []), (chart) => drawOverlays(chart, lines, episodes, events, unit), markBreaks],
          ready: onZoomOut ? [(chart) => chart.over.addEventListener("dblclick", onZoomOut)] : [],
          setSelect: onZoom
            ? [
                (chart) => {
                  if (chart.select.width < 5) return;
                  const from = chart.posToVal(chart.select.left, "x") * 1000;
                  const to = chart.posToVal(chart.select.left + chart.select.width, "x") * 1000;
                  chart.setSelect({ left: 0, top: 0, width: 0, height: 0 }, false);
                  onZoom({ from: Math.round(from), to: Math.round(to) });
                },
              ]
            : [],
        },
      }),
    [title, lines, episodes, events, unit, timeZone, onZoom, onZoomOut, showAllLimits, band],
  );
  return (
    <section className={`${cardClass} p-3`} aria-label={`${title} chart`}>
      <h3 className="mb-1 text-sm font-semibold">
        {title} <span className="font-normal text-slate-500">({unit}; band = min to max in each interval, line = mean; breaks where no readings arrived)</span>
      </h3>
      {error ? (
        <p className="p-6 text-sm text-critical" role="alert">
          The {title.toLowerCase()} could not be loaded: {error.message} Try again, or choose a shorter period.
        </p>
      ) : !data ? (
        <div className="flex h-60 animate-pulse items-center justify-center rounded bg-slate-100 text-sm text-slate-500 dark:bg-slate-800" role="status">
          Loading the {title.toLowerCase()}…
        </div>
      ) : data[0].length === 0 ? (
        <p className="p-6 text-sm text-slate-600 dark:text-slate-400">{empty}</p>
      ) : (
        <>
          <UplotChart options={options} data={data} label={`${title} over time`} onCreate={onCreate} />
          <EpisodeLegend episodes={episodes} />
        </>
      )}
    </section>
  );
}
