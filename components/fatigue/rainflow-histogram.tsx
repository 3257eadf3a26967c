"use client";

import { useEffect, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import type { RangeBin } from "@/lib/fatigue";

const HEIGHT_PX = 260;
// Mid-grey reads on the light and the dark theme alike; the canvas cannot follow CSS classes.
const AXIS_COLOUR = "#64748b";
const GRID_COLOUR = "rgba(100, 116, 139, 0.2)";
const BAR_COLOUR = "#1f6f78";

/**
 * Every bin from the first to the last occupied one, empty bins as null: uPlot sizes bars from the
 * spacing of x, and a log scale has no place for a count of zero.
 */
function denseBins(bins: readonly RangeBin[], binWidth: number): [number[], (number | null)[]] {
  if (bins.length === 0) return [[], []];
  const first = Math.round(bins[0]!.range / binWidth);
  const last = Math.round(bins.at(-1)!.range / binWidth);
  const edges = Array.from({ length: last - first + 1 }, (_, i) => (first + i) * binWidth);
  const counts = new Map(bins.map((bin) => [Math.round(bin.range / binWidth), bin.count]));
  return [edges, edges.map((_, i) => counts.get(first + i) ?? null)];
}

/** Rainflow histogram: cycles per stress-range bin on a log scale, each bar spanning its bin (edge − width, edge]. */
export function RainflowHistogram({ bins, binWidth }: { bins: readonly RangeBin[]; binWidth: number }) {
  const container = useRef<HTMLDivElement>(null);

  useEffect(() => {
    const element = container.current;
    if (!element) return;
    const chart = new uPlot(
      {
        width: element.clientWidth,
        height: HEIGHT_PX,
        legend: { show: false },
        cursor: { y: false },
        scales: {
          x: { time: false, range: (_, min, max) => [min - binWidth, max] },
          // Whole decades, so a lone half cycle (0.5) still shows as a bar above the axis floor.
          y: { distr: 3, log: 10, range: (_, min, max) => uPlot.rangeLog(min, max, 10, true) },
        },
        axes: [
          { label: "Stress range Δσ (MPa)", stroke: AXIS_COLOUR, grid: { stroke: GRID_COLOUR } },
          { label: "Cycles (log scale)", stroke: AXIS_COLOUR, grid: { stroke: GRID_COLOUR }, size: 60 },
        ],
        series: [
          {},
          {
            label: "Cycles",
            stroke: BAR_COLOUR,
            fill: BAR_COLOUR,
            points: { show: false },
            paths: uPlot.paths.bars!({ align: -1, size: [1, Infinity] }),
          },
        ],
      },
      denseBins(bins, binWidth),
      element,
    );
    const resize = new ResizeObserver(() => chart.setSize({ width: element.clientWidth, height: HEIGHT_PX }));
    resize.observe(element);
    return () => {
      resize.disconnect();
      chart.destroy();
    };
  }, [bins, binWidth]);

  // The canvas carries the axis labels as pixels; screen readers get them from the label instead.
  return (
    <div
      ref={container}
      role="img"
      aria-label="Rainflow histogram: cycles (log scale) against stress range Δσ in MPa"
      className="w-full"
      data-testid="rainflow-histogram"
    />
  );
}
