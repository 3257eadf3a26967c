"use client";

import { useEffect, useMemo, useRef } from "react";
import { cardClass } from "@/components/ui/styles";
import { leastSquaresSlope, pairByTime, type SeriesAnswer } from "@/lib/series/chart-data";

const SIZE = { width: 640, height: 300, margin: 48 };

/**
 * Stress-producing strain against temperature, one dot per interval: a tight sloping cloud means
 * the signal follows temperature (restraint of thermal movement); loading shows as scatter off it.
 */
export function ThermalScatter({
  strain,
  temperature,
  temperatureUnit,
  toDisplayTemperature,
}: {
  strain: SeriesAnswer | undefined;
  temperature: SeriesAnswer | undefined;
  temperatureUnit: string;
  toDisplayTemperature: (celsius: number) => number;
}) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const points = useMemo(() => {
    if (!strain || !temperature) return null;
    const paired = pairByTime(temperature, strain);
    return { x: paired.x.map(toDisplayTemperature), y: paired.y };
  }, [strain, temperature, toDisplayTemperature]);
  const slope = points ? leastSquaresSlope(points.x, points.y) : null;

  useEffect(() => {
    const context = canvas.current?.getContext("2d");
    if (!context || !points || points.x.length === 0) return;
    const { width, height, margin } = SIZE;
    const [xMin, xMax] = [Math.min(...points.x), Math.max(...points.x)];
    const [yMin, yMax] = [Math.min(...points.y), Math.max(...points.y)];
    const sx = (x: number) => margin + ((x - xMin) / (xMax - xMin || 1)) * (width - 2 * margin);
    const sy = (y: number) => height - margin - ((y - yMin) / (yMax - yMin || 1)) * (height - 2 * margin);
    context.clearRect(0, 0, width, height);
    context.strokeStyle = "#94a3b8";
    context.strokeRect(margin, margin, width - 2 * margin, height - 2 * margin);
    context.fillStyle = "rgba(23,86,93,0.45)";
    points.x.forEach((x, i) => context.fillRect(sx(x) - 1.5, sy(points.y[i]!) - 1.5, 3, 3));
    context.fillStyle = "#475569";
    context.font = "12px sans-serif";
    context.fillText(`${xMin.toFixed(1)}`, margin, height - margin + 16);
    context.fillText(`${xMax.toFixed(1)} ${temperatureUnit}`, width - margin - 50, height - margin + 16);
    context.fillText(`${yMax.toFixed(0)} µε`, 4, margin + 4);
    context.fillText(`${yMin.toFixed(0)} µε`, 4, height - margin);
  }, [points, temperatureUnit]);

  return (
    <section className={`${cardClass} p-3`} aria-label="Strain against temperature">
      <h3 className="mb-1 text-sm font-semibold">
        Strain against temperature <span className="font-normal text-slate-500">(µε against {temperatureUnit}, one dot per interval)</span>
      </h3>
      {!points ? (
        <div className="h-40 animate-pulse rounded bg-slate-100 dark:bg-slate-800" />
      ) : points.x.length === 0 ? (
        <p className="p-6 text-sm text-slate-600">No readings with a temperature in this period.</p>
      ) : (
        <>
          <canvas ref={canvas} width={SIZE.width} height={SIZE.height} className="h-auto w-full max-w-2xl" role="img" aria-label="Scatter of strain against temperature" data-testid="thermal-scatter" />
          <p className="text-sm" data-testid="thermal-slope">
            {slope === null ? "Too little temperature change to tell the thermal part." : `Trend: ${slope.toFixed(2)} µε per ${temperatureUnit} — the share of the signal that follows temperature.`}
          </p>
        </>
      )}
    </section>
  );
}
