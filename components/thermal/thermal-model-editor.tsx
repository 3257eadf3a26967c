"use client";

import { useMemo, useState } from "react";
import { useRouter } from "next/navigation";
import type uPlot from "uplot";
import { UplotChart } from "@/components/charts/uplot-chart";
import { buttonClass, cardClass, inputClass } from "@/components/ui/styles";
import type { ThermalFitPreview, ThermalModelAnswer } from "@/lib/api/thermal-schemas";
import { dayEnd, dayOf, dayStart } from "@/lib/time-format";

const DAY = 86_400_000;

type Fit = ThermalFitPreview | ThermalModelAnswer;

/** The body PUT and the preview take, or the reason the form cannot make one. */
function requestBody(form: { fromDay: string; toDay: string; lagMode: "fixed" | "auto"; lagHours: string; maxLagHours: string; drift: boolean }, timeZone: string) {
  // The structure's days: from the first day's midnight to the midnight ending the last.
  const from = form.fromDay ? dayStart(form.fromDay, timeZone).getTime() : null;
  const end = form.toDay ? dayEnd(form.toDay, timeZone).getTime() : null;
  if (from === null || end === null) return { problem: "Choose the first and last day of the reference period." };
  const hours = (text: string) => (text.trim() === "" ? undefined : Number(text));
  const lag = hours(form.lagHours);
  const maxLag = hours(form.maxLagHours);
  if (form.lagMode === "fixed" && (lag === undefined || !Number.isFinite(lag) || lag < 0)) return { problem: "Give the lag as 0 or more hours." };
  if (form.lagMode === "auto" && maxLag !== undefined && (!Number.isFinite(maxLag) || maxLag < 0)) return { problem: "Give the longest lag to search as 0 or more hours, or leave it empty." };
  return {
    body: {
      from: new Date(from).toISOString(),
      // The last day is included: up to the millisecond before the next midnight.
      to: new Date(end - 1).toISOString(),
      lagMinutes: form.lagMode === "auto" ? "auto" : Math.round(lag! * 60),
      ...(form.lagMode === "auto" && maxLag !== undefined ? { maxLagMinutes: Math.round(maxLag * 60) } : {}),
      drift: form.drift,
    },
  };
}

async function callApi(url: string, method: string, body?: unknown) {
  const response = await fetch(url, { method, headers: { "content-type": "application/json", accept: "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });
  const answer = response.status === 204 ? null : await response.json().catch(() => null);
  if (!response.ok) throw new Error(answer?.error?.message ?? `The server answered ${response.status}.`);
  return answer;
}

/**
 * The engineer's thermal model of one gauge: choose a reference period, a lag (fixed, or the
 * best fit up to a bound) and drift; Fit shows the coefficients and the scatter of strain against
 * lagged temperature with the fitted line; Save stores it and recomputes the residuals.
 */
export function ThermalModelEditor({
  structureCode,
  tag,
  timeZone,
  current,
  canEdit,
  end,
}: {
  structureCode: string;
  tag: string;
  timeZone: string;
  current: ThermalModelAnswer | null;
  canEdit: boolean;
  /** Where the default period ends: the last reading. */
  end: number;
}) {
  const router = useRouter();
  const api = `/api/v1/structures/${encodeURIComponent(structureCode)}/gauges/${encodeURIComponent(tag)}/thermal-model`;
  const [form, setForm] = useState({
    fromDay: current ? dayOf(Date.parse(current.from), timeZone) : dayOf(end - 14 * DAY, timeZone),
    toDay: current ? dayOf(Date.parse(current.to), timeZone) : dayOf(end, timeZone),
    lagMode: (current?.lagSearch ?? "auto") as "fixed" | "auto",
    lagHours: current?.lagSearch === "fixed" ? String(current.lagMinutes / 60) : "0",
    maxLagHours: current?.maxLagMinutes !== undefined ? String(current.maxLagMinutes / 60) : "",
    drift: current?.drift !== undefined,
  });
  const [preview, setPreview] = useState<ThermalFitPreview | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const set = <K extends keyof typeof form>(key: K, value: (typeof form)[K]) => setForm((previous) => ({ ...previous, [key]: value }));

  async function run(action: "fit" | "save" | "remove") {
    setProblem(null);
    setMessage(null);
    const made = action === "remove" ? { body: undefined } : requestBody(form, timeZone);
    if ("problem" in made) return setProblem(made.problem ?? null);
    setBusy(true);
    try {
      if (action === "fit") setPreview((await callApi(`${api}/fit`, "POST", made.body)) as ThermalFitPreview);
      if (action === "save") {
        await callApi(api, "PUT", made.body);
        // The model in force (refreshed from the server) is shown from now on, not the preview.
        setPreview(null);
        setMessage("Saved. The residual of every stored reading was recomputed with this model.");
        router.refresh();
      }
      if (action === "remove") {
        await callApi(api, "DELETE");
        setPreview(null);
        setMessage("Removed. The gauge has no thermal residual any more.");
        router.refresh();
      }
    } catch (error) {
      setProblem((error as Error).message);
    } finally {
      setBusy(false);
    }
  }

  const shown: Fit | null = preview ?? current;
  return (
    <div className="space-y-4" data-testid="thermal-model-editor">
      <section className={`${cardClass} space-y-3 p-4`} aria-labelledby="fit-heading">
        <h2 id="fit-heading" className="font-semibold">
          Fit over a reference period
        </h2>
        <p className="text-sm text-slate-600 dark:text-slate-400">
          Stress-producing strain = a + b·T(t − lag) (+ c·days with drift), by ordinary least squares over the period&apos;s healthy readings. Choose a
          period with a good temperature swing and no loading events: at least 24 readings with a temperature and 3 °C of range. Days are the structure&apos;s
          ({timeZone}).
        </p>
        <div className="flex flex-wrap items-end gap-3">
          <label className="flex flex-col gap-1 text-sm font-medium">
            First day
            <input type="date" className={`${inputClass} w-44`} value={form.fromDay} onChange={(e) => set("fromDay", e.target.value)} />
          </label>
          <label className="flex flex-col gap-1 text-sm font-medium">
            Last day (included)
            <input type="date" className={`${inputClass} w-44`} value={form.toDay} onChange={(e) => set("toDay", e.target.value)} />
          </label>
          <fieldset className="flex flex-col gap-1 text-sm">
            <legend className="font-medium">Lag of the member&apos;s temperature</legend>
            <div className="flex flex-wrap items-center gap-3">
              <label className="flex items-center gap-1">
                <input type="radio" name="lag-mode" checked={form.lagMode === "auto"} onChange={() => set("lagMode", "auto")} /> best fit
              </label>
              <label className="flex items-center gap-1">
                <input type="radio" name="lag-mode" checked={form.lagMode === "fixed"} onChange={() => set("lagMode", "fixed")} /> fixed
              </label>
            </div>
          </fieldset>
          {form.lagMode === "fixed" ? (
            <label className="flex flex-col gap-1 text-sm font-medium">
              Lag (h)
              <input type="number" min={0} step="any" inputMode="decimal" className={`${inputClass} w-28`} value={form.lagHours} onChange={(e) => set("lagHours", e.target.value)} />
            </label>
          ) : (
            <label className="flex flex-col gap-1 text-sm font-medium">
              Search up to (h)
              <input
                type="number"
                min={0}
                step="any"
                inputMode="decimal"
                placeholder="24 or half the period"
                className={`${inputClass} w-44`}
                value={form.maxLagHours}
                onChange={(e) => set("maxLagHours", e.target.value)}
              />
            </label>
          )}
          <label className="flex items-center gap-2 text-sm font-medium">
            <input type="checkbox" checked={form.drift} onChange={(e) => set("drift", e.target.checked)} /> Linear drift term
          </label>
        </div>
        <div className="flex flex-wrap gap-2">
          <button type="button" className={buttonClass("secondary")} disabled={busy} onClick={() => run("fit")}>
            Fit
          </button>
          {canEdit && (
            <button type="button" className={buttonClass("primary")} disabled={busy || !preview} onClick={() => run("save")} title={preview ? undefined : "Fit first, then save"}>
              Save as the gauge&apos;s model
            </button>
          )}
          {canEdit && current && (
            <button type="button" className={buttonClass("secondary")} disabled={busy} onClick={() => run("remove")}>
              Remove the model
            </button>
          )}
        </div>
        {!canEdit && <p className="text-sm text-slate-600 dark:text-slate-400">Only engineers save or remove a thermal model; you may fit to look.</p>}
        {problem && (
          <p className="text-sm text-critical" role="alert" data-testid="thermal-problem">
            {problem}
          </p>
        )}
        {message && (
          <p className="text-sm text-emerald-800 dark:text-emerald-300" role="status">
            {message}
          </p>
        )}
      </section>
      {shown ? (
        <FitResult fit={shown} title={preview ? "Fit (not saved yet)" : `Model in force, saved by ${current!.fittedBy}`} />
      ) : (
        <p className="text-sm text-slate-600 dark:text-slate-400">No thermal model yet: choose a reference period and press Fit.</p>
      )}
      {preview && <FitScatter fit={preview} />}
    </div>
  );
}

function FitResult({ fit, title }: { fit: Fit; title: string }) {
  const rows: [string, string][] = [
    ["Intercept a", `${fit.intercept.toFixed(2)} µε`],
    ["Thermal coefficient b", `${fit.slope.toFixed(3)} µε/°C`],
    ["Lag", `${(fit.lagMinutes / 60).toFixed(2)} h (${fit.lagMinutes} min)`],
    ...(fit.drift !== undefined ? ([["Drift c", `${fit.drift.toFixed(3)} µε/day`]] as [string, string][]) : []),
    ["R²", fit.r2.toFixed(4)],
    ["Residual σ", `${fit.residualStd.toFixed(2)} µε`],
    ["Readings fitted", fit.readings.toLocaleString("en-US")],
    ["Temperature range", `${fit.temperatureRange.min.toFixed(1)} to ${fit.temperatureRange.max.toFixed(1)} °C`],
  ];
  return (
    <section className={`${cardClass} p-4`} aria-label="Thermal fit" data-testid="thermal-fit">
      <h2 className="mb-2 font-semibold">{title}</h2>
      <dl className="grid grid-cols-1 gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
        {rows.map(([label, value]) => (
          <div key={label} className="flex justify-between gap-4 border-b border-slate-100 py-1 dark:border-slate-800">
            <dt>{label}</dt>
            <dd className="text-right font-mono" data-testid={`fit-${label}`}>
              {value}
            </dd>
          </div>
        ))}
      </dl>
    </section>
  );
}

/** Strain against lagged temperature, one dot per fitted reading, and the fitted line through them (uPlot, x sorted by temperature). */
function FitScatter({ fit }: { fit: ThermalFitPreview }) {
  const data = useMemo<uPlot.AlignedData>(() => {
    const points = [...fit.scatter].sort((a, b) => a.temperature - b.temperature);
    const x = points.map((point) => point.temperature);
    // With drift the line is a + b·T at the period's start; the dots sit off it by the drift since.
    return [x, points.map((point) => point.strain), x.map((t) => fit.intercept + fit.slope * t)];
  }, [fit]);
  const options = useMemo<Omit<uPlot.Options, "width" | "height">>(
    () => ({
      scales: { x: { time: false } },
      legend: { show: true },
      axes: [
        { label: "Lagged temperature (°C)", stroke: "#475569" },
        { label: "Stress-producing strain (µε)", stroke: "#475569", size: 70 },
      ],
      series: [
        { label: "°C" },
        { label: "reading", stroke: "rgba(23,86,93,0.55)", paths: () => null, points: { show: true, size: 4, fill: "rgba(23,86,93,0.45)" } },
        { label: "fitted line", stroke: "#b45309", width: 2, points: { show: false } },
      ],
      hooks: {
        draw: [
          (chart: uPlot) => {
            chart.root.dataset.fittedLine = JSON.stringify({ slope: fit.slope, intercept: fit.intercept, points: chart.data[0].length });
          },
        ],
      },
    }),
    [fit],
  );
  return (
    <section className={`${cardClass} p-3`} aria-label="Strain against lagged temperature" data-testid="thermal-scatter-fit">
      <h3 className="mb-1 text-sm font-semibold">
        Strain against lagged temperature{" "}
        <span className="font-normal text-slate-500">(µε against °C; dots: readings fitted{fit.drift !== undefined ? ", drift not removed" : ""}; line: the fit{fit.drift !== undefined ? " at the period's start" : ""})</span>
      </h3>
      <UplotChart options={options} data={data} height={300} label="Scatter of strain against lagged temperature with the fitted line" />
    </section>
  );
}
