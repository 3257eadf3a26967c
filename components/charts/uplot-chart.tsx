"use client";

import { useEffect, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";

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
  options: Omit<uPlot.Options, "width" | "height">;
  data: uPlot.AlignedData;
  height?: number;
  label: string;
  onCreate?: (chart: uPlot) => void;
}) {
  const box = useRef<HTMLDivElement>(null);
  const chart = useRef<uPlot | null>(null);

  useEffect(() => {
    const element = box.current;
    if (!element) return;
    const created = new uPlot({ ...options, width: element.clientWidth || 600, height }, data, element);
    chart.current = created;
    onCreate?.(created);
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

/**
 * The time axis in day-first dates like the rest of the app, in the structure's time zone: hours
 * when the ticks are less than a day apart (with the date at midnight), days otherwise.
 */
export function timeAxis(timeZone: string): uPlot.Axis {
  const hours = new Intl.DateTimeFormat("en-GB", { timeZone, hour: "2-digit", minute: "2-digit" });
  const days = new Intl.DateTimeFormat("en-GB", { timeZone, day: "numeric", month: "short" });
  return {
    values: (_chart, splits, _axis, _space, increment) =>
      splits.map((seconds) => {
        const time = seconds * 1000;
        if (increment >= 86_400) return days.format(time);
        const clock = hours.format(time);
        return clock === "00:00" ? days.format(time) : clock;
      }),
  };
}
