"use client";

import { useEffect, useEffectEvent, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import { legendTime, timeTickLabels } from "@/lib/series/time-labels";
import { zoneWallClock } from "@/lib/time-format";
import { formatInUnit, type DisplayUnit } from "@/lib/units";

/**
 * A uPlot chart that follows its container's width. uPlot draws on canvas outside React, so the
 * chart is created in an effect, fed new data with setData, and destroyed on unmount.
 */
export function UplotChart({
  options,
  data,
  height = 240,
  label,
  onCreate,
}: {
  options: ChartOptions;
  data: uPlot.AlignedData;
  height?: number;
  label: string;
  onCreate?: (chart: uPlot) => void;
}) {
  const box = useRef<HTMLDivElement>(null);
  const chart = useRef<uPlot | null>(null);
  // Read when the chart is built, not watched: later data goes through setData, and a parent's new
  // onCreate function is no reason to rebuild the chart.
  const dataAtBuild = useEffectEvent(() => data);
  const announceBuilt = useEffectEvent((created: uPlot) => onCreate?.(created));

  useEffect(() => {
    const element = box.current;
    if (!element) return;
    const created = new uPlot({ ...options, width: element.clientWidth || 600, height }, dataAtBuild(), element);
    chart.current = created;
    announceBuilt(created);
    const resize = new ResizeObserver(() => created.setSize({ width: element.clientWidth, height }));
    resize.observe(element);
    return () => {
      resize.disconnect();
      created.destroy();
      chart.current = null;
    };
    // Options are rebuilt by the parent when what they draw changes; data alone goes through setData.
  }, [options, height]);

  useEffect(() => {
    chart.current?.setData(data);
  }, [data]);

  return <div ref={box} role="img" aria-label={label} className="w-full" data-testid="chart" />;
}

type ChartOptions = Omit<uPlot.Options, "width" | "height">;

/**
 * The options every chart of values over time shares, around its own value axis and series: ticks
 * placed at the structure's midnights and hours and labelled day-first, the legend's time on the
 * structure's clock, and every legend value rounded with its unit (all series of a chart share one).
 */
export function timeChartOptions(
  timeZone: string,
  unit: DisplayUnit,
  { valueAxis, series, ...rest }: Omit<ChartOptions, "axes" | "series" | "tzDate"> & { valueAxis: uPlot.Axis; series: uPlot.Series[] },
): ChartOptions {
  return {
    ...rest,
    tzDate: (seconds) => zoneWallClock(seconds * 1000, timeZone),
    axes: [{ values: (_chart, splits, _axis, _space, increment) => timeTickLabels(splits, increment, timeZone) }, valueAxis],
    series: [
      { label: "Time", value: (_chart, seconds) => legendTime(seconds, timeZone) },
      ...series.map((line) => ({ ...line, value: (_chart: uPlot, value: number | null) => formatInUnit(value, unit) })),
    ],
  };
}
