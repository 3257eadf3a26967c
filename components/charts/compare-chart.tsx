"use client";

import { useMemo, useState } from "react";
import useSWR from "swr";
import type uPlot from "uplot";
import { useUnits } from "@/components/units/units-context";
import { buttonClass, cardClass, inputClass } from "@/components/ui/styles";
import { fetchJson } from "@/lib/api/fetcher";
import type { SeriesAnswer } from "@/lib/series/chart-data";
import { inDisplayUnits } from "@/lib/units";
import { UplotChart, timeChartOptions } from "./uplot-chart";

export const MAX_COMPARED = 6;
const DAY = 86_400_000;
const COLOURS = ["#17565d", "#b45309", "#6d28d9", "#0369a1", "#be123c", "#4d7c0f"];
type Quantity = "stress" | "strain" | "temperature";

/** Aligns several gauges' bucket means on one time axis (uPlot's aligned data), gaps as null. */
function alignMeans(answers: SeriesAnswer[], toDisplay: (v: number) => number): uPlot.AlignedData {
  const times = [...new Set(answers.flatMap((a) => a.t))].sort((a, b) => a - b);
  const index = new Map(times.map((t, i) => [t, i]));
  const columns = answers.map((answer) => {
    const column: (number | null)[] = new Array(times.length).fill(null);
    answer.t.forEach((t, i) => (column[index.get(t)!] = toDisplay(answer.mean[i]!)));
    return column;
  });
  return [times.map((t) => t / 1000), ...columns];
}

/** Up to six gauges of a structure on one chart, same quantity and range. */
export function CompareChart({ structureCode, tags, allTags, end, timeZone }: { structureCode: string; tags: string[]; allTags: string[]; end: number; timeZone: string }) {
  const units = useUnits();
  const [chosen, setChosen] = useState<string[]>(tags.slice(0, MAX_COMPARED));
  const [quantity, setQuantity] = useState<Quantity>("stress");
  const [days, setDays] = useState(7);
  const range = { from: new Date(end - days * DAY).toISOString(), to: new Date(end).toISOString() };
  const key = chosen.length
    ? chosen.map((tag) => `/api/v1/structures/${encodeURIComponent(structureCode)}/gauges/${encodeURIComponent(tag)}/series?quantity=${quantity}&points=800&from=${range.from}&to=${range.to}`)
    : null;
  const { data, error } = useSWR<SeriesAnswer[]>(key, (urls: string[]) => Promise.all(urls.map((url) => fetchJson<SeriesAnswer>(url))), { refreshInterval: 60_000 });
  const unit = inDisplayUnits(units, quantity, 0).unit;
  const aligned = useMemo(() => (data ? alignMeans(data, (v) => inDisplayUnits(units, quantity, v).value) : null), [data, units, quantity]);
  const options = useMemo(
    () =>
      timeChartOptions(timeZone, unit, {
        valueAxis: { label: `${quantity} (${unit})`, size: 70 },
        series: chosen.map((tag, i) => ({ label: tag, stroke: COLOURS[i], width: 1.5, points: { show: false }, spanGaps: false })),
      }),
    [chosen, quantity, unit, timeZone],
  );
  const toggle = (tag: string) =>
    setChosen((current) => (current.includes(tag) ? current.filter((t) => t !== tag) : current.length >= MAX_COMPARED ? current : [...current, tag]));
  return (
    <div className="space-y-3">
      <fieldset className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
        <legend className="mb-1 text-sm font-medium">Gauges (up to {MAX_COMPARED})</legend>
        {allTags.map((tag) => (
          <label key={tag} className="flex items-center gap-1.5 font-mono">
            <input type="checkbox" checked={chosen.includes(tag)} onChange={() => toggle(tag)} disabled={!chosen.includes(tag) && chosen.length >= MAX_COMPARED} />
            {tag}
          </label>
        ))}
      </fieldset>
      <div className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1 text-xs font-medium">
          Quantity
          <select className={`${inputClass} w-40`} value={quantity} onChange={(e) => setQuantity(e.target.value as Quantity)}>
            <option value="stress">stress</option>
            <option value="strain">strain</option>
            <option value="temperature">temperature</option>
          </select>
        </label>
        {[1, 7, 30, 90].map((span) => (
          <button key={span} type="button" className={buttonClass(days === span ? "primary" : "secondary")} onClick={() => setDays(span)}>
            {span === 1 ? "24 h" : `${span} days`}
          </button>
        ))}
      </div>
      <section className={`${cardClass} p-3`}>
        {chosen.length === 0 ? (
          <p className="p-6 text-sm text-slate-600">Choose the gauges to compare.</p>
        ) : error ? (
          <p className="p-6 text-sm text-critical">{error.message}</p>
        ) : !aligned ? (
          <div className="h-72 animate-pulse rounded bg-slate-100 dark:bg-slate-800" />
        ) : (
          <UplotChart options={options} data={aligned} height={320} label={`${quantity} of ${chosen.join(", ")}`} />
        )}
      </section>
    </div>
  );
}
