"use client";

import { useCallback, useMemo, useRef, useState } from "react";
import useSWR from "swr";
import type uPlot from "uplot";
import { useUnits } from "@/components/units/units-context";
import { buttonClass, inputClass } from "@/components/ui/styles";
import { downloadFile, fetchJson } from "@/lib/api/fetcher";
import { limitLines, type Limit } from "@/lib/limits";
import type { SeriesAnswer } from "@/lib/series/chart-data";
import { inDisplayUnits } from "@/lib/units";
import { dayEnd, dayStart, formatInTimeZone } from "@/lib/time-format";
import { chartExportFileName, chartExportTitleLines } from "@/lib/series/chart-export";
import { EnvelopeChart, type ChartEpisode, type ChartEvent, type TimeRange } from "./envelope-chart";
import { ShowAllLimitsSwitch } from "./show-all-limits";
import { ThermalScatter } from "./thermal-scatter";

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const PRESETS = [
  ["24 h", DAY],
  ["7 days", 7 * DAY],
  ["30 days", 30 * DAY],
  ["90 days", 90 * DAY],
  ["1 year", 365 * DAY],
] as const;
const POINTS = 1000;

type Quantity = "stress" | "strain" | "temperature" | "residual";

const seriesUrl = (base: string, quantity: Quantity, range: TimeRange) =>
  `${base}/series?quantity=${quantity}&points=${POINTS}&from=${new Date(range.from).toISOString()}&to=${new Date(range.to).toISOString()}`;

/**
 * A gauge's stress, strain and temperature over a chosen range, with the min/max envelope so a
 * spike always shows, limit lines, alert episodes and zero/replacement events. Dragging across
 * a chart zooms in and fetches finer intervals.
 */
export function GaugeCharts({
  structureCode,
  tag,
  timeZone,
  limits,
  yieldStress,
  episodes,
  events,
  end,
  initialRange,
  compact = false,
  expectedIntervalS,
  structureName,
  residualStd,
}: {
  structureCode: string;
  /** Named in the title of an exported chart. */
  structureName?: string;
  tag: string;
  timeZone: string;
  limits: readonly Limit<string>[];
  yieldStress: number | null;
  episodes: ChartEpisode[];
  events: ChartEvent[];
  /** Where the default range ends: the last reading, so a stale gauge still shows its data. */
  end: number;
  /** The range shown first, when not the week up to `end`. */
  initialRange?: TimeRange;
  /** Stress and strain only, without exports and scatter: for the limits editor and alert pages. */
  compact?: boolean;
  /** Seconds between the gauge's readings: a longer silence breaks the lines. */
  expectedIntervalS?: number | null;
  /** σ of the thermal model's residual, µε, when the gauge has a model: its residual is charted with a ±2σ band. */
  residualStd?: number | null;
}) {
  const units = useUnits();
  const base = `/api/v1/structures/${encodeURIComponent(structureCode)}/gauges/${encodeURIComponent(tag)}`;
  const [range, setRange] = useState<TimeRange>(initialRange ?? { from: end - 7 * DAY, to: end });
  // The ranges zoomed out of, so a double-click steps back one zoom at a time; never drawn, so a ref.
  const zoomedFrom = useRef<TimeRange[]>([]);
  const [showAllLimits, setShowAllLimits] = useState(false);
  const zoomIn = useCallback(
    (next: TimeRange) => {
      zoomedFrom.current.push(range);
      setRange(next);
    },
    [range],
  );
  const zoomOut = useCallback(() => {
    const previous = zoomedFrom.current.pop();
    if (previous) setRange(previous);
  }, []);
  const choose = (next: TimeRange) => {
    zoomedFrom.current = [];
    setRange(next);
  };
  const [charts] = useState(() => new Map<Quantity, uPlot>());
  const [problem, setProblem] = useState<string | null>(null);
  // Previous data stay on screen while a zoomed or new range loads, so a chart is redrawn in place
  // instead of dropping back to its skeleton and being built again.
  const swr = { refreshInterval: 60_000, keepPreviousData: true };
  const stress = useSWR<SeriesAnswer>(seriesUrl(base, "stress", range), fetchJson, swr);
  // The stress chart is on top: its series is asked for alone first, so three queries do not share
  // the server while the page's first chart waits. Strain and temperature follow once it is there.
  const after = stress.data !== undefined || stress.error !== undefined;
  const strain = useSWR<SeriesAnswer>(after ? seriesUrl(base, "strain", range) : null, fetchJson, swr);
  const temperature = useSWR<SeriesAnswer>(after && !compact ? seriesUrl(base, "temperature", range) : null, fetchJson, swr);
  const withResidual = !compact && residualStd != null;
  const residual = useSWR<SeriesAnswer>(after && withResidual ? seriesUrl(base, "residual", range) : null, fetchJson, swr);

  const display = useMemo(() => {
    const shown = (quantity: Exclude<Quantity, "residual">) => ({ toDisplay: (value: number) => inDisplayUnits(units, quantity, value).value, unit: inDisplayUnits(units, quantity, 0).unit });
    // The residual is a strain: µε in every unit system.
    return { stress: shown("stress"), strain: shown("strain"), temperature: shown("temperature"), residual: shown("strain") };
  }, [units]);
  const lines = useMemo(
    () => ({
      stress: limitLines(limits, "stress", display.stress.toDisplay, yieldStress),
      strain: limitLines(limits, "strain", display.strain.toDisplay, yieldStress),
      temperature: [],
      residual: limitLines(limits, "residual", display.strain.toDisplay),
    }),
    [limits, yieldStress, display],
  );
  const local = (ms: number) => formatInTimeZone(ms, timeZone);

  /** Custom days are the structure's days: from its midnight to the midnight ending the last day. */
  function setDay(end: "from" | "to", day: string) {
    if (!/^\d{4}-\d{2}-\d{2}$/.test(day)) return;
    setRange((current) => (end === "from" ? { ...current, from: dayStart(day, timeZone).getTime() } : { ...current, to: dayEnd(day, timeZone).getTime() }));
  }

  async function exportCsv() {
    setProblem(null);
    const query = `from=${new Date(range.from).toISOString()}&to=${new Date(range.to).toISOString()}&header=units`;
    await downloadFile(`${base}/readings?${query}`, "text/csv", `${structureCode}-${tag}-readings.csv`).catch((error: Error) => setProblem(error.message));
  }

  function exportPng() {
    const chart = charts.get("stress");
    if (!chart) return setProblem("The stress chart is not drawn yet.");
    const title = chartExportTitleLines({
      structure: structureName ? `${structureName} (${structureCode})` : structureCode,
      gauge: tag,
      quantity: "Stress",
      unit: display.stress.unit,
      from: range.from,
      to: range.to,
      timeZone,
      formatTime: local,
    });
    const link = document.createElement("a");
    link.href = titledPng(chart.ctx.canvas, title);
    link.download = chartExportFileName(structureCode, tag, "stress", range.from, range.to, timeZone);
    link.click();
  }

  const quantities = [
    ["stress", "Stress", stress],
    ["strain", "Stress-producing strain", strain],
    ...(compact ? [] : ([["temperature", "Temperature", temperature]] as const)),
    ...(withResidual ? ([["residual", "Thermal residual", residual]] as const) : []),
  ] as const;
  const residualBand = useMemo(
    () => (residualStd != null ? { low: -2 * residualStd, high: 2 * residualStd, label: `±2σ of the thermal fit (σ = ${residualStd.toFixed(2)} µε)` } : undefined),
    [residualStd],
  );

  return (
    <div className="space-y-3" data-testid="gauge-charts">
      <div className="flex flex-wrap items-end gap-2">
        {PRESETS.map(([label, span]) => (
          <button key={label} type="button" className={buttonClass("secondary")} onClick={() => choose({ from: end - span, to: end })}>
            {label}
          </button>
        ))}
        <label className="flex flex-col gap-1 text-xs font-medium">
          From
          <input type="date" className={`${inputClass} w-40`} onChange={(e) => setDay("from", e.target.value)} />
        </label>
        <label className="flex flex-col gap-1 text-xs font-medium">
          To
          <input type="date" className={`${inputClass} w-40`} onChange={(e) => setDay("to", e.target.value)} />
        </label>
        {!compact && (
          <>
            <button type="button" className={buttonClass("secondary")} onClick={exportCsv}>
              Export CSV
            </button>
            <button type="button" className={buttonClass("secondary")} onClick={exportPng}>
              Stress chart as PNG
            </button>
          </>
        )}
      </div>
      <p className="text-xs text-slate-600 dark:text-slate-400" data-testid="chart-range">
        {local(range.from)} to {local(range.to)} ({timeZone}). Drag across a chart to zoom in; double-click it to zoom back out.
      </p>
      <ShowAllLimitsSwitch checked={showAllLimits} onChange={setShowAllLimits} />
      {problem && <p className="text-sm text-critical">{problem}</p>}
      {quantities.map(([quantity, title, answer]) => (
        <EnvelopeChart
          key={quantity}
          title={title}
          answer={answer.data}
          error={answer.error}
          unit={display[quantity].unit}
          toDisplay={display[quantity].toDisplay}
          timeZone={timeZone}
          empty="No readings in this period: choose a longer one, or check that the logger is sending."
          lines={lines[quantity]}
          episodes={quantity === "temperature" ? undefined : episodes}
          events={events}
          onZoom={zoomIn}
          onZoomOut={zoomOut}
          showAllLimits={showAllLimits}
          onCreate={(chart) => charts.set(quantity, chart)}
          expectedIntervalS={expectedIntervalS}
          band={quantity === "residual" ? residualBand : undefined}
        />
      ))}
      {!compact && <ThermalScatter strain={strain.data} temperature={temperature.data} temperatureUnit={display.temperature.unit} toDisplayTemperature={display.temperature.toDisplay} />}
    </div>
  );
}

/** Title band height in CSS pixels: two lines of text above the chart. */
const TITLE_BAND = 52;

/** The chart's canvas under a white band with the title, as a PNG data URL, at the canvas's own pixel density. */
function titledPng(canvas: HTMLCanvasElement, [heading, period]: [string, string]): string {
  const scale = canvas.clientWidth > 0 ? canvas.width / canvas.clientWidth : 1;
  const band = Math.round(TITLE_BAND * scale);
  const out = document.createElement("canvas");
  out.width = canvas.width;
  out.height = canvas.height + band;
  const context = out.getContext("2d")!;
  context.fillStyle = "#ffffff";
  context.fillRect(0, 0, out.width, out.height);
  context.textBaseline = "top";
  context.fillStyle = "#0f172a";
  context.font = `600 ${Math.round(15 * scale)}px system-ui, sans-serif`;
  context.fillText(heading, Math.round(12 * scale), Math.round(8 * scale), out.width - 24 * scale);
  context.fillStyle = "#475569";
  context.font = `${Math.round(13 * scale)}px system-ui, sans-serif`;
  context.fillText(period, Math.round(12 * scale), Math.round(29 * scale), out.width - 24 * scale);
  context.drawImage(canvas, 0, band);
  return out.toDataURL("image/png");
}
