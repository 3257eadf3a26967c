"use client";

import { useMemo, useState } from "react";
import useSWR from "swr";
import type uPlot from "uplot";
import { useUnits } from "@/components/units/units-context";
import { buttonClass, cardClass, inputClass } from "@/components/ui/styles";
import { downloadFile, fetchJson } from "@/lib/api/fetcher";
import type { Limit } from "@/lib/limits";
import { chartColumns, type SeriesAnswer } from "@/lib/series/chart-data";
import { inDisplayUnits, type DisplayUnit } from "@/lib/units";
import { startOfDayIn } from "@/lib/ingest/reading-time";
import { ThermalScatter } from "./thermal-scatter";
import { UplotChart, timeChartOptions } from "./uplot-chart";

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

/** "2026-11-01" → "2026-11-02", by the calendar, whatever the clocks do that night. */
const nextDay = (day: string) => new Date(Date.parse(`${day}T00:00:00Z`) + DAY).toISOString().slice(0, 10);
const LEVEL_COLOUR: Record<string, string> = { watch: "#8a6d00", warning: "#b45309", critical: "#b42318" };

export type ChartEvent = { time: number; label: string };
export type ChartEpisode = { openedAt: number; clearedAt: number | null; level: string };

type Quantity = "stress" | "strain" | "temperature";
type Range = { from: number; to: number };

const seriesUrl = (base: string, quantity: Quantity, range: Range) =>
  `${base}/series?quantity=${quantity}&points=${POINTS}&from=${new Date(range.from).toISOString()}&to=${new Date(range.to).toISOString()}`;

/** Horizontal lines for the limits of a quantity, in display units. */
function limitLines(limits: readonly Limit[], quantity: Quantity, yieldStress: number | null, toDisplay: (v: number) => number) {
  const lines: { value: number; level: string; text: string }[] = [];
  for (const limit of limits) {
    const inStress = limit.quantity === "utilisation" && quantity === "stress" && yieldStress;
    if (limit.quantity !== quantity && !inStress) continue;
    for (const side of ["upper", "lower"] as const) {
      const bound = limit[side];
      if (bound === undefined) continue;
      const value = toDisplay(inStress ? bound * yieldStress : bound);
      lines.push({ value, level: limit.level, text: `${limit.level} ${side}${inStress ? ` (${Math.round(bound * 100)} % of yield)` : ""}` });
    }
  }
  return lines;
}

/**
 * Limit lines, alert episodes and events, drawn on the canvas after the series. The lines actually
 * stroked are listed in `data-limit-lines` (canvas pixel row included), so tests and assistive
 * tooling can tell which limits are in view without reading pixels blindly.
 */
function drawOverlays(chart: uPlot, lines: ReturnType<typeof limitLines>, episodes: readonly ChartEpisode[], events: readonly ChartEvent[]) {
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

function QuantityChart(props: {
  quantity: Quantity;
  title: string;
  answer: SeriesAnswer | undefined;
  error: Error | undefined;
  unit: DisplayUnit;
  toDisplay: (v: number) => number;
  lines: ReturnType<typeof limitLines>;
  episodes: readonly ChartEpisode[];
  events: readonly ChartEvent[];
  timeZone: string;
  onZoom: (range: Range) => void;
  onChart: (quantity: Quantity, chart: uPlot) => void;
}) {
  const { answer, toDisplay, lines, episodes, events, unit } = props;
  const data = useMemo(() => (answer ? chartColumns(answer, toDisplay) : null), [answer, toDisplay]);
  const options = useMemo(
    () =>
      timeChartOptions(props.timeZone, unit, {
        cursor: { drag: { x: true, y: false } },
        legend: { show: true },
        scales: {
          y: {
            // Keep every limit line in view, not only the data.
            range: (_chart, min, max) => {
              const values = [min, max, ...lines.map((line) => line.value)].filter(Number.isFinite);
              const low = Math.min(...values);
              const high = Math.max(...values);
              const pad = (high - low) * 0.05 || 1;
              return [low - pad, high + pad];
            },
          },
        },
        valueAxis: { label: `${props.title} (${unit})`, size: 70 },
        series: [
          { label: "min", stroke: "#7aa7ad", width: 1, points: { show: false } },
          { label: "max", stroke: "#7aa7ad", width: 1, points: { show: false } },
          { label: "mean", stroke: "#17565d", width: 1.5, points: { show: false } },
        ],
        bands: [{ series: [2, 1], fill: "rgba(31,111,120,0.15)" }],
        hooks: {
          draw: [(chart) => drawOverlays(chart, lines, episodes, events)],
          setSelect: [
            (chart) => {
              if (chart.select.width < 5) return;
              const from = chart.posToVal(chart.select.left, "x") * 1000;
              const to = chart.posToVal(chart.select.left + chart.select.width, "x") * 1000;
              chart.setSelect({ left: 0, top: 0, width: 0, height: 0 }, false);
              props.onZoom({ from: Math.round(from), to: Math.round(to) });
            },
          ],
        },
      }),
    [lines, episodes, events, unit, props.timeZone],
  );
  return (
    <section className={`${cardClass} p-3`} aria-label={`${props.title} chart`}>
      <h3 className="mb-1 text-sm font-semibold">
        {props.title} <span className="font-normal text-slate-500">({unit}; band = min to max in each interval, line = mean)</span>
      </h3>
      {props.error ? (
        <p className="p-6 text-sm text-critical">{props.error.message}</p>
      ) : !data ? (
        <div className="h-60 animate-pulse rounded bg-slate-100 dark:bg-slate-800" aria-label="Loading" />
      ) : data[0].length === 0 ? (
        <p className="p-6 text-sm text-slate-600">No readings in this period.</p>
      ) : (
        <UplotChart options={options} data={data} label={`${props.title} over time`} onCreate={(chart) => props.onChart(props.quantity, chart)} />
      )}
    </section>
  );
}

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
}: {
  structureCode: string;
  tag: string;
  timeZone: string;
  limits: Limit[];
  yieldStress: number | null;
  episodes: ChartEpisode[];
  events: ChartEvent[];
  /** Where the default range ends: the last reading, so a stale gauge still shows its data. */
  end: number;
  /** The range shown first, when not the week up to `end`. */
  initialRange?: { from: number; to: number };
  /** Stress and strain only, without exports and scatter: for the limits editor and alert pages. */
  compact?: boolean;
}) {
  const units = useUnits();
  const base = `/api/v1/structures/${encodeURIComponent(structureCode)}/gauges/${encodeURIComponent(tag)}`;
  const [range, setRange] = useState<Range>(initialRange ?? { from: end - 7 * DAY, to: end });
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

  const display = useMemo(() => {
    const shown = (quantity: Quantity) => ({ toDisplay: (value: number) => inDisplayUnits(units, quantity, value).value, unit: inDisplayUnits(units, quantity, 0).unit });
    return { stress: shown("stress"), strain: shown("strain"), temperature: shown("temperature") };
  }, [units]);
  const lines = useMemo(
    () => ({
      stress: limitLines(limits, "stress", yieldStress, display.stress.toDisplay),
      strain: limitLines(limits, "strain", yieldStress, display.strain.toDisplay),
      temperature: [],
    }),
    [limits, yieldStress, display],
  );
  const local = (ms: number) => new Intl.DateTimeFormat("en-GB", { timeZone, dateStyle: "medium", timeStyle: "short" }).format(ms);
  const onChart = (quantity: Quantity, chart: uPlot) => charts.set(quantity, chart);

  /** Custom days are the structure's days: from its midnight to the midnight ending the last day. */
  function setDay(end: "from" | "to", day: string) {
    const midnight = day ? startOfDayIn(day, timeZone) : null;
    if (midnight === null) return;
    setRange((current) => (end === "from" ? { ...current, from: midnight } : { ...current, to: startOfDayIn(nextDay(day), timeZone) ?? midnight + DAY }));
  }

  async function exportCsv() {
    setProblem(null);
    const query = `from=${new Date(range.from).toISOString()}&to=${new Date(range.to).toISOString()}`;
    await downloadFile(`${base}/readings?${query}`, "text/csv", `${structureCode}-${tag}-readings.csv`).catch((error: Error) => setProblem(error.message));
  }

  function exportPng() {
    const chart = charts.get("stress");
    if (!chart) return setProblem("The stress chart is not drawn yet.");
    const link = document.createElement("a");
    link.href = chart.ctx.canvas.toDataURL("image/png");
    link.download = `${structureCode}-${tag}-stress.png`;
    link.click();
  }

  const quantities = [
    ["stress", "Stress", stress],
    ["strain", "Stress-producing strain", strain],
    ...(compact ? [] : ([["temperature", "Temperature", temperature]] as const)),
  ] as const;

  return (
    <div className="space-y-3" data-testid="gauge-charts">
      <div className="flex flex-wrap items-end gap-2">
        {PRESETS.map(([label, span]) => (
          <button key={label} type="button" className={buttonClass("secondary")} onClick={() => setRange({ from: end - span, to: end })}>
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
        {local(range.from)} to {local(range.to)} ({timeZone}). Drag across a chart to zoom in.
      </p>
      {problem && <p className="text-sm text-critical">{problem}</p>}
      {quantities.map(([quantity, title, answer]) => (
        <QuantityChart
          key={quantity}
          quantity={quantity}
          title={title}
          answer={answer.data}
          error={answer.error}
          unit={display[quantity].unit}
          toDisplay={display[quantity].toDisplay}
          lines={lines[quantity]}
          episodes={quantity === "temperature" ? [] : episodes}
          events={events}
          timeZone={timeZone}
          onZoom={setRange}
          onChart={onChart}
        />
      ))}
      {!compact && <ThermalScatter strain={strain.data} temperature={temperature.data} temperatureUnit={display.temperature.unit} toDisplayTemperature={display.temperature.toDisplay} />}
    </div>
  );
}
