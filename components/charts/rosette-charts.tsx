"use client";

import { useMemo, useState } from "react";
import useSWR from "swr";
import { useUnits } from "@/components/units/units-context";
import { buttonClass, cardClass } from "@/components/ui/styles";
import { fetchJson } from "@/lib/api/fetcher";
import { chartColumns, type SeriesAnswer } from "@/lib/series/chart-data";
import { inDisplayUnits, type DisplayUnit } from "@/lib/units";
import { UplotChart, timeChartOptions } from "./uplot-chart";

const DAY = 86_400_000;
const QUANTITIES = [
  ["sigma1", "Principal stress σ1"],
  ["sigma2", "Principal stress σ2"],
  ["vonMises", "von Mises stress"],
  ["theta", "Principal angle θ (gauge a to σ1)"],
] as const;

function RosetteChart({ url, title, isAngle, timeZone }: { url: string; title: string; isAngle: boolean; timeZone: string }) {
  const units = useUnits();
  const { data, error } = useSWR<SeriesAnswer>(url, fetchJson, { refreshInterval: 60_000 });
  const unit: DisplayUnit = isAngle ? "°" : inDisplayUnits(units, "stress", 0).unit;
  const columns = useMemo(() => (data ? chartColumns(data, (v) => (isAngle ? v : inDisplayUnits(units, "stress", v).value)) : null), [data, units, isAngle]);
  const options = useMemo(
    () =>
      timeChartOptions(timeZone, unit, {
        valueAxis: { label: `${title} (${unit})`, size: 70 },
        series: [
          { label: "min", stroke: "#7aa7ad", points: { show: false } },
          { label: "max", stroke: "#7aa7ad", points: { show: false } },
          { label: "mean", stroke: "#17565d", width: 1.5, points: { show: false } },
        ],
        bands: [{ series: [2, 1], fill: "rgba(31,111,120,0.15)" }],
      }),
    [title, unit, timeZone],
  );
  return (
    <section className={`${cardClass} p-3`}>
      <h3 className="mb-1 text-sm font-semibold">
        {title} <span className="font-normal text-slate-500">({unit})</span>
      </h3>
      {error ? (
        <p className="p-6 text-sm text-critical">{error.message}</p>
      ) : !columns ? (
        <div className="h-60 animate-pulse rounded bg-slate-100 dark:bg-slate-800" />
      ) : columns[0].length === 0 ? (
        <p className="p-6 text-sm text-slate-600">No readings of all three gauges at the same time in this period.</p>
      ) : (
        <UplotChart options={options} data={columns} label={`${title} over time`} />
      )}
    </section>
  );
}

/** The plane stress state at a rosette over time: principal stresses, von Mises and principal angle. */
export function RosetteCharts({ structureCode, tag, end, timeZone }: { structureCode: string; tag: string; end: number; timeZone: string }) {
  const [days, setDays] = useState(7);
  const range = `from=${new Date(end - days * DAY).toISOString()}&to=${new Date(end).toISOString()}`;
  const base = `/api/v1/structures/${encodeURIComponent(structureCode)}/rosettes/${encodeURIComponent(tag)}/series?points=800&${range}`;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2">
        {[1, 7, 30, 90].map((span) => (
          <button key={span} type="button" className={buttonClass(days === span ? "primary" : "secondary")} onClick={() => setDays(span)}>
            {span === 1 ? "24 h" : `${span} days`}
          </button>
        ))}
      </div>
      {QUANTITIES.map(([quantity, title]) => (
        <RosetteChart key={quantity} url={`${base}&quantity=${quantity}`} title={title} isAngle={quantity === "theta"} timeZone={timeZone} />
      ))}
    </div>
  );
}
