"use client";

import { useMemo } from "react";
import useSWR from "swr";
import type uPlot from "uplot";
import { UplotChart, timeChartOptions } from "@/components/charts/uplot-chart";
import { cardClass } from "@/components/ui/styles";
import { DEFAULT_EXPECTED_INTERVAL_S } from "@/lib/alerting/gauge-state";
import { fetchJson } from "@/lib/api/fetcher";
import { chartColumns, gapThreshold, type SeriesAnswer } from "@/lib/series/chart-data";

const WINDOW_FILL = "rgba(180, 83, 9, 0.14)";
const WINDOW_EDGE = "#b45309";
const BASELINE = "#475569";
const POINTS = 600;

/** The test window shaded and the baseline drawn dashed; both listed on the chart's root for tests and assistive tooling. */
function drawWindow(chart: uPlot, window: { start: number; end: number }, baseline: number | null) {
  const { ctx, bbox } = chart;
  const left = chart.valToPos(window.start / 1000, "x", true);
  const right = chart.valToPos(window.end / 1000, "x", true);
  ctx.save();
  ctx.fillStyle = WINDOW_FILL;
  ctx.fillRect(left, bbox.top, Math.max(2, right - left), bbox.height);
  ctx.strokeStyle = WINDOW_EDGE;
  ctx.lineWidth = devicePixelRatio;
  for (const x of [left, right]) {
    ctx.beginPath();
    ctx.moveTo(x, bbox.top);
    ctx.lineTo(x, bbox.top + bbox.height);
    ctx.stroke();
  }
  if (baseline !== null) {
    const y = chart.valToPos(baseline, "y", true);
    ctx.strokeStyle = BASELINE;
    ctx.setLineDash([6 * devicePixelRatio, 4 * devicePixelRatio]);
    ctx.beginPath();
    ctx.moveTo(bbox.left, y);
    ctx.lineTo(bbox.left + bbox.width, y);
    ctx.stroke();
  }
  ctx.restore();
  chart.root.dataset.window = JSON.stringify({ left: Math.round(left), right: Math.round(right) });
  chart.root.dataset.baseline = baseline === null ? "" : String(baseline);
}

/**
 * One gauge's stress-producing strain around a load test: the window shaded, as much again either
 * side of it (at least an hour) so the rest state before and after shows, and the baseline the
 * peak is measured from. Data come from the series API, downsampled to the chart's width.
 */
export function LoadTestChart({
  code,
  tag,
  timeZone,
  window,
  baseline,
  expectedIntervalS,
}: {
  code: string;
  tag: string;
  timeZone: string;
  window: { start: number; end: number };
  baseline: number | null;
  expectedIntervalS: number | null;
}) {
  const margin = Math.max(3_600_000, window.end - window.start);
  const from = new Date(window.start - margin).toISOString();
  const to = new Date(window.end + margin).toISOString();
  const url = `/api/v1/structures/${encodeURIComponent(code)}/gauges/${encodeURIComponent(tag)}/series?quantity=strain&points=${POINTS}&from=${from}&to=${to}`;
  const { data: answer, error } = useSWR<SeriesAnswer>(url, fetchJson);
  const data = useMemo(
    () => (answer ? chartColumns(answer, (value) => value, gapThreshold(expectedIntervalS ?? DEFAULT_EXPECTED_INTERVAL_S, answer.bucketWidth)) : null),
    [answer, expectedIntervalS],
  );
  const options = useMemo(
    () =>
      timeChartOptions(timeZone, "µε", {
        legend: { show: true },
        scales: {
          x: { range: () => [(window.start - margin) / 1000, (window.end + margin) / 1000] },
          // Keep the baseline in view even when the record stays on one side of it.
          y: { range: (_chart, min, max) => padded(Math.min(min, baseline ?? min), Math.max(max, baseline ?? max)) },
        },
        valueAxis: { label: "Strain (µε)", size: 64 },
        series: [
          { label: "min", stroke: "#7aa7ad", width: 1, points: { show: false } },
          { label: "max", stroke: "#7aa7ad", width: 1, points: { show: false } },
          { label: "mean", stroke: "#17565d", width: 1.5, points: { show: false } },
        ],
        bands: [{ series: [2, 1], fill: "rgba(31,111,120,0.15)" }],
        hooks: { draw: [(chart) => drawWindow(chart, window, baseline)] },
      }),
    [timeZone, window, margin, baseline],
  );
  return (
    <figure className={`${cardClass} p-3`} aria-label={`Strain of ${tag} around the test`}>
      <figcaption className="mb-1 text-sm font-semibold">
        {tag} <span className="font-normal text-slate-500">(µε; shaded: test window; dashed: baseline; band: min to max per interval)</span>
      </figcaption>
      {error ? (
        <p className="p-6 text-sm text-critical" role="alert">
          The strain of {tag} could not be loaded: {(error as Error).message} Try again later.
        </p>
      ) : !data ? (
        <div className="flex h-60 animate-pulse items-center justify-center rounded bg-slate-100 text-sm text-slate-500 dark:bg-slate-800" role="status">
          Loading the strain of {tag}…
        </div>
      ) : data[0].length === 0 ? (
        <p className="p-6 text-sm text-slate-600 dark:text-slate-400">No readings of {tag} around the test window.</p>
      ) : (
        <UplotChart options={options} data={data} height={220} label={`Strain of ${tag} over time with the test window shaded`} />
      )}
    </figure>
  );
}

function padded(min: number, max: number): [number, number] {
  const pad = Math.max(1, (max - min) * 0.08);
  return [min - pad, max + pad];
}
