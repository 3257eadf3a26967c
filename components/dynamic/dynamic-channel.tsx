"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import useSWR from "swr";
import type uPlot from "uplot";
import { UplotChart, timeChartOptions } from "@/components/charts/uplot-chart";
import { EmptyState } from "@/components/ui/empty-state";
import { buttonClass, cardClass, inputClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import { fetchJson } from "@/lib/api/fetcher";
import type { BurstSummaries, EventDetail, EventList } from "@/lib/services/dynamic-data";
import { WaveformChart, instantText, useStressDisplay } from "./waveform-chart";

const DAY_MS = 86_400_000;

type Props = {
  apiBase: string;
  /** `/api/v1/structures/{code}`, for the event endpoint. */
  structureApi: string;
  timeZone: string;
  /** Epoch ms the charts end at: the gauge's last data, so an idle gauge still shows its last days. */
  end: number;
  canLabel: boolean;
  rateHz: number;
  summaryMinutes: number;
  /** The event to show first (from an alert's link) instead of the newest. */
  initialEvent: number | null;
};

/** A dynamic gauge's summaries over the last days, its events, and the waveform of the chosen one. */
export function DynamicChannel({ apiBase, structureApi, timeZone, end, canLabel, rateHz, summaryMinutes, initialEvent }: Props) {
  const [range] = useState(() => ({ from: new Date(end - 7 * DAY_MS).toISOString(), to: new Date(end + 60_000).toISOString() }));
  const query = new URLSearchParams(range).toString();
  const summaries = useSWR<BurstSummaries>(`${apiBase}/summaries?${query}`, fetchJson, { revalidateOnFocus: false });
  const events = useSWR<EventList>(`${apiBase}/events?${query}`, fetchJson, { revalidateOnFocus: false });
  const [chosen, setChosen] = useState<number | null>(initialEvent);
  const selected = chosen ?? events.data?.events[0]?.id ?? null;

  return (
    <section className="mb-6 space-y-4" aria-labelledby="dynamic">
      <h2 id="dynamic" className="text-lg font-semibold">
        Dynamic channel <span className="text-sm font-normal text-slate-500">({rateHz} Hz, summarised every {summaryMinutes} min)</span>
      </h2>
      <p className="text-sm text-slate-600 dark:text-slate-400">
        Samples are kept as {summaryMinutes}-minute summaries and rainflow histograms; full waveforms only around events that crossed the trigger.
        The last 7 days up to the gauge&apos;s last data; times on the structure&apos;s clock ({timeZone}).
      </p>
      <SummaryCharts answer={summaries.data} error={summaries.error} timeZone={timeZone} />
      <div className="grid gap-4 lg:grid-cols-2">
        <EventTable list={events.data} error={events.error} timeZone={timeZone} selected={selected} onSelect={setChosen} />
        {selected !== null && <EventViewer key={selected} url={`${structureApi}/events/${selected}`} timeZone={timeZone} canLabel={canLabel} onLabelled={() => events.mutate()} />}
      </div>
    </section>
  );
}

function SummaryCharts({ answer, error, timeZone }: { answer: BurstSummaries | undefined; error: Error | undefined; timeZone: string }) {
  const stress = useStressDisplay();
  const columns = useMemo(() => {
    if (!answer) return null;
    const t = answer.intervals.map((i) => Date.parse(i.start) / 1000);
    const pick = (key: "min" | "max" | "mean" | "rms") => answer.intervals.map((i) => stress.toDisplay(i[key]));
    return { envelope: [t, pick("min"), pick("max"), pick("mean"), pick("rms")] as uPlot.AlignedData, cycles: [t, answer.intervals.map((i) => i.cycles)] as uPlot.AlignedData };
  }, [answer, stress]);
  const envelopeOptions = useMemo(
    () =>
      timeChartOptions(timeZone, stress.unit, {
        legend: { show: true },
        valueAxis: { label: `Stress (${stress.unit})`, size: 70 },
        series: [
          { label: "min", stroke: "#7aa7ad", width: 1, points: { show: false } },
          { label: "max", stroke: "#7aa7ad", width: 1, points: { show: false } },
          { label: "mean", stroke: "#17565d", width: 1.5, points: { show: false } },
          { label: "RMS about the mean", stroke: "#8a6d00", width: 1.5, points: { show: false } },
        ],
        bands: [{ series: [2, 1], fill: "rgba(31,111,120,0.15)" }],
      }),
    [timeZone, stress.unit],
  );
  const cycleOptions = useMemo(() => {
    const base = timeChartOptions(timeZone, "MPa", {
      legend: { show: true },
      valueAxis: { label: "Cycles per interval", size: 70 },
      series: [{ label: "cycles", stroke: "#17565d", width: 1.5, points: { show: false } }],
    });
    // Cycles are counts, not stresses: the legend shows them without a stress unit.
    base.series[1] = { ...base.series[1], value: (_c: uPlot, v: number | null) => (v === null ? "—" : `${v.toLocaleString("en-US", { maximumFractionDigits: 1 })} cycles`) };
    return base;
  }, [timeZone]);
  if (error) return <p role="alert" className="text-sm text-critical">{error.message}</p>;
  if (!columns) return <div className="h-60 animate-pulse rounded bg-slate-100 dark:bg-slate-800" aria-label="Loading summaries" />;
  if (columns.envelope[0].length === 0) {
    return (
      <EmptyState title="No bursts in the last 7 days">
        <p>Summaries appear once the logger sends bursts to /bursts.</p>
      </EmptyState>
    );
  }
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <section className={`${cardClass} p-3`} aria-label="Summary envelope chart">
        <h3 className="mb-1 text-sm font-semibold">
          Stress per interval <span className="font-normal text-slate-500">({stress.unit}; band = min to max, line = mean, RMS about the mean)</span>
        </h3>
        <UplotChart options={envelopeOptions} data={columns.envelope} label="Stress summaries over time" />
      </section>
      <section className={`${cardClass} p-3`} aria-label="Cycles chart">
        <h3 className="mb-1 text-sm font-semibold">
          Rainflow cycles per interval <span className="font-normal text-slate-500">(half cycles as ½)</span>
        </h3>
        <UplotChart options={cycleOptions} data={columns.cycles} label="Cycles per interval over time" />
      </section>
    </div>
  );
}

function EventTable({ list, error, timeZone, selected, onSelect }: { list: EventList | undefined; error: Error | undefined; timeZone: string; selected: number | null; onSelect: (id: number) => void }) {
  const stress = useStressDisplay();
  return (
    <section className={`${cardClass} p-3`} aria-labelledby="events-heading">
      <h3 id="events-heading" className="mb-2 text-sm font-semibold">
        Events <span className="font-normal text-slate-500">(newest first)</span>
      </h3>
      {error ? (
        <p role="alert" className="text-sm text-critical">{error.message}</p>
      ) : !list ? (
        <div className="h-24 animate-pulse rounded bg-slate-100 dark:bg-slate-800" aria-label="Loading events" />
      ) : list.events.length === 0 ? (
        <p className="text-sm text-slate-600">No sample crossed the trigger in the last 7 days.</p>
      ) : (
        <div className="max-h-96 overflow-auto">
          <table className={tableClass} aria-label="Events">
            <thead>
              <tr>
                <th className={thClass}>Start</th>
                <th className={thClass}>Peak</th>
                <th className={thClass}>Label</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
              {list.events.map((event) => (
                <tr key={event.id} data-testid="event-row" className={event.id === selected ? "bg-slate-100 dark:bg-slate-800" : undefined}>
                  <td className={tdClass}>
                    <button type="button" className="text-left text-accent underline" onClick={() => onSelect(event.id)} aria-pressed={event.id === selected}>
                      {instantText(event.start, timeZone)}
                    </button>
                  </td>
                  <td className={`${tdClass} tabular-nums`}>
                    {stress.text(event.peak)} <span className="text-xs text-slate-500">({event.trigger} {stress.text(event.triggerLevel)})</span>
                  </td>
                  <td className={tdClass}>{event.label ?? <span className="text-slate-500">—</span>}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}

function EventViewer({ url, timeZone, canLabel, onLabelled }: { url: string; timeZone: string; canLabel: boolean; onLabelled: () => void }) {
  const stress = useStressDisplay();
  const { data: event, error, mutate } = useSWR<EventDetail>(url, fetchJson, { revalidateOnFocus: false });
  const [label, setLabel] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  if (error) return <p role="alert" className="text-sm text-critical">{error.message}</p>;
  if (!event) return <div className="h-72 animate-pulse rounded bg-slate-100 dark:bg-slate-800" aria-label="Loading the waveform" />;
  const seconds = (Date.parse(event.end) - Date.parse(event.start)) / 1000;
  async function save(text: string) {
    setSaving(true);
    setProblem(null);
    const response = await fetch(url, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ label: text.trim() || null }) });
    setSaving(false);
    if (!response.ok) return setProblem((await response.json().catch(() => null))?.error?.message ?? `The server answered ${response.status}.`);
    await mutate(await response.json(), { revalidate: false });
    onLabelled();
  }
  return (
    <section className={`${cardClass} space-y-2 p-3`} aria-label="Waveform viewer" data-testid="waveform-viewer">
      <h3 className="text-sm font-semibold">Event {event.id} on {event.gauge}</h3>
      <p className="text-xs text-slate-600 dark:text-slate-400" data-testid="event-facts">
        From {instantText(event.start, timeZone)}, {seconds.toFixed(2)} s at {event.rateHz} Hz · peak {stress.text(event.peak)} at {instantText(event.peakAt, timeZone)} · trigger {event.trigger}{" "}
        {stress.text(event.triggerLevel)}
        {event.truncated && " · cut at the longest waveform kept"}
      </p>
      <WaveformChart event={event} />
      {event.alerts.length > 0 && (
        <p className="text-sm" data-testid="event-alerts">
          Raised{" "}
          {event.alerts.map((alert, i) => (
            <span key={alert.id}>
              {i > 0 && ", "}
              <Link className="text-accent underline" href={`/alerts/${alert.id}`}>
                {alert.level} alert {alert.id}
              </Link>{" "}
              (opened {instantText(alert.openedAt, timeZone)})
            </span>
          ))}
        </p>
      )}
      {canLabel ? (
        <form
          className="flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            void save(label ?? event.label ?? "");
          }}
        >
          <div className="space-y-1">
            <label htmlFor="event-label" className="block text-sm font-medium">
              What was it?
            </label>
            <input id="event-label" className={inputClass} maxLength={100} placeholder="e.g. heavy vehicle, false trigger" value={label ?? event.label ?? ""} onChange={(e) => setLabel(e.target.value)} />
          </div>
          <button type="submit" className={buttonClass("secondary")} disabled={saving}>
            {saving ? "Saving…" : "Save label"}
          </button>
          {problem && <p role="alert" className="w-full text-sm text-critical">{problem}</p>}
        </form>
      ) : (
        <p className="text-sm">Label: {event.label ?? "none"}</p>
      )}
    </section>
  );
}
