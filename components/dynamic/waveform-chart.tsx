"use client";

import { useMemo } from "react";
import type uPlot from "uplot";
import { UplotChart } from "@/components/charts/uplot-chart";
import { useUnits } from "@/components/units/units-context";
import { formatInTimeZone } from "@/lib/time-format";
import { displayUnits, formatInUnit, stressIn, type StressUnit } from "@/lib/units";
import type { EventDetail } from "@/lib/services/dynamic-data";

/** Stresses arrive in MPa; they are drawn and written in the person's unit, like the static charts. */
export interface StressDisplay {
  unit: StressUnit;
  toDisplay(mpa: number): number;
  /** A stored MPa value as the person reads it: "14.0 MPa", "2.03 ksi". */
  text(mpa: number | null | undefined): string;
}

export function useStressDisplay(): StressDisplay {
  const units = useUnits();
  return useMemo(() => {
    const unit = displayUnits(units).stress;
    const toDisplay = (mpa: number) => stressIn(unit, mpa);
    return { unit, toDisplay, text: (mpa) => formatInUnit(mpa == null ? mpa : toDisplay(mpa), unit) };
  }, [units]);
}

/** "2026-07-01 13:00:05.120 BST": an event's instant on the structure's clock, to the millisecond. */
export const instantText = (iso: string, timeZone: string) => formatInTimeZone(new Date(iso), timeZone, { precision: "millisecond" });

/**
 * Trigger level and peak drawn over the waveform. What was drawn is listed in `data-overlays`
 * (canvas pixel positions included), so a test can check the chart without reading pixels.
 */
function drawOverlays(chart: uPlot, event: EventDetail, peakSeconds: number, stress: StressDisplay) {
  const { ctx, bbox } = chart;
  ctx.save();
  const y = chart.valToPos(stress.toDisplay(event.triggerLevel), "y", true);
  ctx.strokeStyle = "#b45309";
  ctx.fillStyle = "#b45309";
  ctx.setLineDash([6 * devicePixelRatio, 4 * devicePixelRatio]);
  ctx.lineWidth = 1.5 * devicePixelRatio;
  ctx.beginPath();
  ctx.moveTo(bbox.left, y);
  ctx.lineTo(bbox.left + bbox.width, y);
  ctx.stroke();
  ctx.font = `${11 * devicePixelRatio}px sans-serif`;
  ctx.fillText(`trigger ${event.trigger} ${stress.text(event.triggerLevel)}`, bbox.left + 4, y - 4);
  const px = chart.valToPos(peakSeconds, "x", true);
  const py = chart.valToPos(stress.toDisplay(event.peak), "y", true);
  ctx.setLineDash([]);
  ctx.fillStyle = "#b42318";
  ctx.beginPath();
  ctx.arc(px, py, 4 * devicePixelRatio, 0, 2 * Math.PI);
  ctx.fill();
  ctx.fillText(`peak ${stress.text(event.peak)}`, px + 6 * devicePixelRatio, py);
  ctx.restore();
  chart.root.dataset.overlays = JSON.stringify({
    unit: stress.unit,
    trigger: { value: stress.toDisplay(event.triggerLevel), y: Math.round(y) },
    peak: { value: stress.toDisplay(event.peak), x: Math.round(px), y: Math.round(py) },
  });
}

/** A captured waveform: stress in the person's unit against seconds from the event's first sample. */
export function WaveformChart({ event }: { event: EventDetail }) {
  const stress = useStressDisplay();
  const startMs = Date.parse(event.start);
  const peakSeconds = (Date.parse(event.peakAt) - startMs) / 1000;
  const data = useMemo<uPlot.AlignedData>(() => [event.stress.map((_, i) => i / event.rateHz), event.stress.map(stress.toDisplay)], [event, stress]);
  const options = useMemo(() => {
    const trigger = stress.toDisplay(event.triggerLevel);
    // A margin of about 1 MPa in either unit, so the trigger line never sits on the frame.
    const margin = stress.toDisplay(1);
    return {
      cursor: { drag: { x: true, y: false } },
      legend: { show: true },
      scales: { x: { time: false }, y: { range: (_c: uPlot, min: number, max: number) => [Math.min(min, trigger) - margin, Math.max(max, trigger) + margin] as [number, number] } },
      axes: [{ label: "Seconds from the first sample kept (s)" }, { label: `Stress (${stress.unit})`, size: 70 }],
      series: [
        { label: "t", value: (_c: uPlot, seconds: number | null) => (seconds === null ? "—" : `${seconds.toFixed(3)} s`) },
        { label: "stress", stroke: "#17565d", width: 1.5, points: { show: false }, value: (_c: uPlot, v: number | null) => formatInUnit(v, stress.unit) },
      ],
      hooks: { draw: [(chart: uPlot) => drawOverlays(chart, event, peakSeconds, stress)] },
    };
  }, [event, peakSeconds, stress]);
  return <UplotChart options={options} data={data} height={260} label={`Waveform of event ${event.id}, stress in ${stress.unit}`} />;
}
