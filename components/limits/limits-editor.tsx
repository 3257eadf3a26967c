"use client";

import { useMemo, useState, useTransition } from "react";
import { FormMessage } from "@/components/ui/form-message";
import { buttonClass, cardClass, inputClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import type { ActionState } from "@/lib/actions/action-state";
import type { AlertEpisode } from "@/lib/alerting/episodes";
import { LEVELS, type Limit } from "@/lib/limits";
import { GaugeCharts } from "@/components/charts/gauge-charts";
import { RosetteLimitChart } from "@/components/charts/rosette-charts";

/** A gauge's quantities and their units; a rosette passes its own. */
export const GAUGE_QUANTITY_UNITS: Readonly<Record<string, string>> = { stress: "MPa", strain: "µε", utilisation: "fraction of yield" };
const DAY = 86_400_000;

type Row = { quantity: string; level: string; upper: string; lower: string; hysteresis: string; persistence: string };

const rowOf = (limit: Limit<string>): Row => ({
  quantity: limit.quantity,
  level: limit.level,
  upper: limit.upper?.toString() ?? "",
  lower: limit.lower?.toString() ?? "",
  hysteresis: String(limit.hysteresis),
  persistence: String(limit.persistence),
});

function numberOrText(text: string): number | string | undefined {
  const trimmed = text.trim().replace(",", ".");
  if (trimmed === "") return undefined;
  return Number.isFinite(Number(trimmed)) ? Number(trimmed) : trimmed;
}

const payloadOf = (rows: Row[]) => ({
  limits: rows.map((row) => ({
    quantity: row.quantity,
    level: row.level,
    upper: numberOrText(row.upper),
    lower: numberOrText(row.lower),
    hysteresis: numberOrText(row.hysteresis),
    persistence: numberOrText(row.persistence),
  })),
});

/** The bounds as typed so far, for drawing: rows that are not numbers yet are left out. */
function proposedLimits(rows: Row[]): Limit<string>[] {
  return rows.flatMap((row) => {
    const upper = Number(row.upper);
    const lower = Number(row.lower);
    const bounds = { ...(row.upper.trim() && Number.isFinite(upper) ? { upper } : {}), ...(row.lower.trim() && Number.isFinite(lower) ? { lower } : {}) };
    if (Object.keys(bounds).length === 0) return [];
    return [{ quantity: row.quantity, level: row.level as Limit["level"], hysteresis: 0, persistence: 1, ...bounds }];
  });
}

type Backtest = { readingsChecked: number; episodes: AlertEpisode<string>[] } | { error: string };

/** Bounds far too tight can raise thousands of episodes; a page listing them all is unreadable. */
const LISTED_EPISODES = 50;

function levelCounts(episodes: readonly AlertEpisode<string>[]): string {
  const counts = new Map<string, number>();
  for (const { level } of episodes) counts.set(level, (counts.get(level) ?? 0) + 1);
  return [...counts].map(([level, count]) => `${level} ${count.toLocaleString("en-US")}`).join(", ");
}

/**
 * The engineer's limit set, with a check of what the limits would have raised before they are
 * saved, and the last 30 days charted with the bounds as typed drawn across them.
 */
export function LimitsEditor({
  structureCode,
  tag,
  timeZone,
  initial,
  canEdit,
  save,
  quantities = GAUGE_QUANTITY_UNITS,
  unitsNote = "Bounds in the quantity's unit: stress MPa (including the initial stress), strain µε, utilisation as a fraction of yield (0.6 = 60 %).",
  gauge,
  rosette,
}: {
  structureCode: string;
  tag: string;
  timeZone: string;
  initial: Limit<string>[];
  canEdit: boolean;
  save: (payload: unknown) => Promise<ActionState>;
  /** The quantities a limit may bound, with their units, in the order offered. */
  quantities?: Readonly<Record<string, string>>;
  unitsNote?: string;
  gauge?: {
    /** MPa, to draw utilisation bounds on the stress chart. */
    yieldStress: number | null;
    /** The last reading's time, or null when the gauge has none yet. */
    lastReading: number | null;
  };
  rosette?: {
    /** Where its 30 days end: the last reading of its gauges. */
    end: number;
  };
}) {
  const names = Object.keys(quantities);
  const [rows, setRows] = useState<Row[]>(initial.map(rowOf));
  const [state, setState] = useState<ActionState>({ status: "idle" });
  const [days, setDays] = useState("30");
  const [backtest, setBacktest] = useState<Backtest | null>(null);
  const [pending, startTransition] = useTransition();
  // Kept while the rows are unchanged, so a chart is not built again on every other state change.
  const drawn = useMemo(() => proposedLimits(rows), [rows]);
  const errors = state.fieldErrors ?? {};
  const local = (ms: number) => new Intl.DateTimeFormat("en-GB", { timeZone, dateStyle: "medium", timeStyle: "short" }).format(ms);

  const update = (index: number, field: keyof Row, value: string) => setRows((all) => all.map((row, i) => (i === index ? { ...row, [field]: value } : row)));

  async function runBacktest() {
    const to = Date.now();
    const owner = gauge ? "gauges" : "rosettes";
    const response = await fetch(`/api/v1/structures/${structureCode}/${owner}/${encodeURIComponent(tag)}/limits/backtest`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ ...payloadOf(rows), from: new Date(to - Number(days) * DAY).toISOString(), to: new Date(to).toISOString() }),
    });
    const body = await response.json();
    setBacktest(response.ok ? body : { error: body.error?.message ?? "The check failed." });
  }

  function submit() {
    startTransition(async () => setState(await save(payloadOf(rows))));
  }

  const chart = gauge
    ? gauge.lastReading !== null && (
        <GaugeCharts
          structureCode={structureCode}
          tag={tag}
          timeZone={timeZone}
          limits={drawn}
          yieldStress={gauge.yieldStress}
          episodes={[]}
          events={[]}
          end={gauge.lastReading}
          initialRange={{ from: gauge.lastReading - 30 * DAY, to: gauge.lastReading }}
          compact
        />
      )
    : rosette && <RosetteLimitChart structureCode={structureCode} tag={tag} timeZone={timeZone} limits={drawn} range={{ from: rosette.end - 30 * DAY, to: rosette.end }} />;

  const cell = (index: number, field: keyof Row, label: string) => {
    const problem = errors[`limits.${index}.${field}`];
    return (
      <td className={tdClass}>
        <input
          aria-label={`${label}, limit ${index + 1}`}
          className={`${inputClass} w-24`}
          inputMode="decimal"
          value={rows[index]![field]}
          disabled={!canEdit}
          aria-invalid={problem ? true : undefined}
          onChange={(event) => update(index, field, event.target.value)}
        />
        {problem && <p className="mt-1 max-w-48 text-xs text-critical">{problem.join(" ")}</p>}
      </td>
    );
  };

  return (
    <div className="space-y-6">
      <div className={`${cardClass} overflow-x-auto`}>
        <table className={tableClass} aria-label="Limits">
          <thead>
            <tr>
              <th className={thClass}>Quantity</th>
              <th className={thClass}>Level</th>
              <th className={thClass}>Upper</th>
              <th className={thClass}>Lower</th>
              <th className={thClass}>Dead band</th>
              <th className={thClass}>Readings in a row</th>
              <th className={thClass}>
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
            {rows.map((row, index) => (
              <tr key={index} data-testid="limit-row">
                <td className={tdClass}>
                  <select aria-label={`Quantity, limit ${index + 1}`} className={inputClass} value={row.quantity} disabled={!canEdit} onChange={(e) => update(index, "quantity", e.target.value)}>
                    {names.map((quantity) => (
                      <option key={quantity} value={quantity}>
                        {quantity} ({quantities[quantity]})
                      </option>
                    ))}
                  </select>
                </td>
                <td className={tdClass}>
                  <select aria-label={`Level, limit ${index + 1}`} className={inputClass} value={row.level} disabled={!canEdit} onChange={(e) => update(index, "level", e.target.value)}>
                    {LEVELS.map((level) => (
                      <option key={level}>{level}</option>
                    ))}
                  </select>
                  {errors[`limits.${index}.level`] && <p className="mt-1 max-w-48 text-xs text-critical">{errors[`limits.${index}.level`]!.join(" ")}</p>}
                </td>
                {cell(index, "upper", "Upper bound")}
                {cell(index, "lower", "Lower bound")}
                {cell(index, "hysteresis", "Dead band")}
                {cell(index, "persistence", "Readings in a row")}
                <td className={tdClass}>
                  {canEdit && (
                    <button type="button" className="text-sm text-critical underline" onClick={() => setRows((all) => all.filter((_, i) => i !== index))}>
                      Remove
                    </button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        {rows.length === 0 && (
          <p className="p-4 text-sm text-slate-600">
            {gauge ? "No limits: this gauge raises no limit alerts (sensor faults are still reported)." : "No limits: this rosette raises no limit alerts."}
          </p>
        )}
      </div>
      <p className="text-xs text-slate-600 dark:text-slate-400">
        {unitsNote} An alert opens after the given number of readings in a row beyond a bound and clears after as many back inside it by the dead band.
      </p>
      {canEdit && (
        <div className="flex flex-wrap items-center gap-3">
          <button
            type="button"
            className={buttonClass("secondary")}
            onClick={() => setRows((all) => [...all, { quantity: names[0]!, level: LEVELS[Math.min(all.length, 2)]!, upper: "", lower: "", hysteresis: "0", persistence: "1" }])}
          >
            Add a limit
          </button>
          <button type="button" className={buttonClass()} onClick={submit} disabled={pending}>
            {pending ? "Saving…" : "Save limits"}
          </button>
          <FormMessage state={state} />
        </div>
      )}
      {chart && (
        <section aria-label="The last 30 days with these bounds">
          <h2 className="mb-2 font-semibold">The last 30 days with these bounds</h2>
          {chart}
        </section>
      )}
      <section className={`${cardClass} space-y-3 p-4`} aria-labelledby="backtest-heading">
        <h2 id="backtest-heading" className="font-semibold">
          What these limits would have raised
        </h2>
        <div className="flex flex-wrap items-end gap-3">
          <label className="flex flex-col gap-1 text-sm font-medium">
            Over the last
            <select className={`${inputClass} w-36`} value={days} onChange={(e) => setDays(e.target.value)}>
              <option value="7">7 days</option>
              <option value="30">30 days</option>
              <option value="90">90 days</option>
              <option value="365">year</option>
            </select>
          </label>
          <button type="button" className={buttonClass("secondary")} onClick={runBacktest}>
            Check against stored data
          </button>
        </div>
        <div aria-live="polite" data-testid="backtest-result">
          {backtest && "error" in backtest && <p className="text-sm text-critical">{backtest.error}</p>}
          {backtest && "episodes" in backtest && (
            <>
              <p className="text-sm">
                {backtest.episodes.length} alert episode{backtest.episodes.length === 1 ? "" : "s"} over {backtest.readingsChecked.toLocaleString("en-US")}{" "}
                {gauge ? "readings" : "instants with a reading of all three gauges"}.
              </p>
              {backtest.episodes.length > LISTED_EPISODES && (
                <p className="text-sm text-slate-500 dark:text-slate-400">
                  By level: {levelCounts(backtest.episodes)}. The first {LISTED_EPISODES} are listed; {(backtest.episodes.length - LISTED_EPISODES).toLocaleString("en-US")} more
                  follow.
                </p>
              )}
              <ul className="mt-2 space-y-1 text-sm">
                {backtest.episodes.slice(0, LISTED_EPISODES).map((episode) => (
                  <li key={`${episode.quantity}-${episode.openedAt}`}>
                    {episode.level} on {episode.quantity}: opened {local(episode.openedAt)}, peak {episode.peak.toFixed(episode.quantity === "utilisation" ? 3 : 1)} {quantities[episode.quantity]},{" "}
                    {episode.clearedAt ? `cleared ${local(episode.clearedAt)}` : "still open at the end"}
                  </li>
                ))}
              </ul>
            </>
          )}
        </div>
      </section>
    </div>
  );
}
