"use client";

import { useMemo, useState, useTransition } from "react";
import { FormMessage } from "@/components/ui/form-message";
import { buttonClass, cardClass, inputClass } from "@/components/ui/styles";
import type { ActionState } from "@/lib/actions/action-state";
import type { AlertEpisode } from "@/lib/alerting/episodes";
import { LEVELS, type Limit } from "@/lib/limits";
import { boundText, formatLimitValue, limitScale, type LimitScale } from "@/lib/limits/display-scale";
import type { UnitSystem } from "@/lib/units";
import { useUnits } from "@/components/units/units-context";
import { GaugeCharts } from "@/components/charts/gauge-charts";
import { RosetteLimitChart } from "@/components/charts/rosette-charts";
import { formatInTimeZone } from "@/lib/time-format";

/** A gauge's quantities and their units; a rosette passes its own. */
export const GAUGE_QUANTITY_UNITS: Readonly<Record<string, string>> = { stress: "MPa", strain: "µε", utilisation: "fraction of yield" };
const DAY = 86_400_000;

type ScaledField = "upper" | "lower" | "hysteresis";
const SCALED_FIELDS: readonly ScaledField[] = ["upper", "lower", "hysteresis"];

/**
 * A limit as typed, bounds in the person's units. `stored` keeps each saved SI value with the text it
 * was shown as, so a bound nobody touched is saved exactly as it was, not re-converted from a
 * rounded ksi or % figure.
 */
type Row = {
  quantity: string;
  level: string;
  upper: string;
  lower: string;
  hysteresis: string;
  persistence: string;
  stored: Partial<Record<ScaledField, { text: string; value: number; quantity: string }>>;
};

type Scales = (quantity: string) => LimitScale;

function rowOf(limit: Limit<string>, scaleOf: Scales): Row {
  const scale = scaleOf(limit.quantity);
  const row: Row = { quantity: limit.quantity, level: limit.level, upper: "", lower: "", hysteresis: "", persistence: String(limit.persistence), stored: {} };
  for (const field of SCALED_FIELDS) {
    const value = limit[field];
    if (value == null) continue;
    row[field] = boundText(value, scale);
    row.stored[field] = { text: row[field], value, quantity: limit.quantity };
  }
  return row;
}

function numberOrText(text: string): number | string | undefined {
  const trimmed = text.trim().replace(",", ".");
  if (trimmed === "") return undefined;
  return Number.isFinite(Number(trimmed)) ? Number(trimmed) : trimmed;
}

/** A bound in the API's unit: the saved value when untouched, else the typed one converted. */
function storedBound(row: Row, field: ScaledField, scaleOf: Scales): number | string | undefined {
  const kept = row.stored[field];
  if (kept && kept.text === row[field] && kept.quantity === row.quantity) return kept.value;
  const typed = numberOrText(row[field]);
  return typeof typed === "number" ? scaleOf(row.quantity).fromDisplay(typed) : typed;
}

const payloadOf = (rows: Row[], scaleOf: Scales) => ({
  limits: rows.map((row) => ({
    quantity: row.quantity,
    level: row.level,
    upper: storedBound(row, "upper", scaleOf),
    lower: storedBound(row, "lower", scaleOf),
    hysteresis: storedBound(row, "hysteresis", scaleOf),
    persistence: numberOrText(row.persistence),
  })),
});

/** The bounds as typed so far, in the API's units for drawing: rows that are not numbers yet are left out. */
function proposedLimits(rows: Row[], scaleOf: Scales): Limit<string>[] {
  return rows.flatMap((row) => {
    const upper = storedBound(row, "upper", scaleOf);
    const lower = storedBound(row, "lower", scaleOf);
    const bounds = { ...(typeof upper === "number" ? { upper } : {}), ...(typeof lower === "number" ? { lower } : {}) };
    if (Object.keys(bounds).length === 0) return [];
    return [{ quantity: row.quantity, level: row.level as Limit["level"], hysteresis: 0, persistence: 1, ...bounds }];
  });
}

function scalesFor(quantities: Readonly<Record<string, string>>, system: UnitSystem): Scales {
  return (quantity) => limitScale(quantities[quantity] ?? "", system);
}

type Backtest = { readingsChecked: number; episodes: AlertEpisode<string>[] } | { error: string };

/** Bounds far too tight can raise thousands of episodes; a page listing them all is unreadable. */
const LISTED_EPISODES = 50;

function levelCounts(episodes: readonly AlertEpisode<string>[]): string {
  const counts = new Map<string, number>();
  for (const { level } of episodes) counts.set(level, (counts.get(level) ?? 0) + 1);
  return [...counts].map(([level, count]) => `${level} ${count.toLocaleString("en-US")}`).join(", ");
}

type LimitsEditorProps = {
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
};

/**
 * The engineer's limit set, with a check of what the limits would have raised before they are
 * saved, and the last 30 days charted with the bounds as typed drawn across them. Bounds are shown
 * in the person's units: a change of units starts the form again from the saved limits.
 */
export function LimitsEditor(props: LimitsEditorProps) {
  const system = useUnits();
  return <UnitsLimitsEditor key={system} system={system} {...props} />;
}

function UnitsLimitsEditor({
  structureCode,
  tag,
  timeZone,
  initial,
  canEdit,
  save,
  quantities = GAUGE_QUANTITY_UNITS,
  unitsNote = "Bounds in the quantity's unit: stress including the initial stress, strain in µε, utilisation in % of yield (60 = 60 % of the yield stress).",
  gauge,
  rosette,
  system,
}: LimitsEditorProps & { system: UnitSystem }) {
  const names = Object.keys(quantities);
  const scaleOf = useMemo(() => scalesFor(quantities, system), [quantities, system]);
  const [rows, setRows] = useState<Row[]>(() => initial.map((limit) => rowOf(limit, scaleOf)));
  const [state, setState] = useState<ActionState>({ status: "idle" });
  const [days, setDays] = useState("30");
  const [backtest, setBacktest] = useState<Backtest | null>(null);
  const [pending, startTransition] = useTransition();
  // Kept while the rows are unchanged, so a chart is not built again on every other state change.
  const drawn = useMemo(() => proposedLimits(rows, scaleOf), [rows, scaleOf]);
  const errors = state.fieldErrors ?? {};
  const local = (ms: number) => formatInTimeZone(ms, timeZone);

  const update = (index: number, field: keyof Row, value: string) => setRows((all) => all.map((row, i) => (i === index ? { ...row, [field]: value } : row)));

  async function runBacktest() {
    const to = Date.now();
    const owner = gauge ? "gauges" : "rosettes";
    const response = await fetch(`/api/v1/structures/${structureCode}/${owner}/${encodeURIComponent(tag)}/limits/backtest`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ ...payloadOf(rows, scaleOf), from: new Date(to - Number(days) * DAY).toISOString(), to: new Date(to).toISOString() }),
    });
    const body = await response.json();
    setBacktest(response.ok ? body : { error: body.error?.message ?? "The check failed." });
  }

  function submit() {
    startTransition(async () => setState(await save(payloadOf(rows, scaleOf))));
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

  const field = (index: number, name: Exclude<keyof Row, "stored" | "quantity" | "level">, label: string, unit: string) => {
    const problem = errors[`limits.${index}.${name}`];
    const id = `limit-${index}-${name}`;
    return (
      <div className="min-w-0">
        <label htmlFor={id} className="block text-xs font-medium text-slate-600 dark:text-slate-400">
          {label}
          {unit && <span className="font-normal"> ({unit})</span>}
        </label>
        <input
          id={id}
          aria-label={`${label}, limit ${index + 1}`}
          className={inputClass}
          inputMode="decimal"
          value={rows[index]![name]}
          disabled={!canEdit}
          aria-invalid={problem ? true : undefined}
          onChange={(event) => update(index, name, event.target.value)}
        />
        {problem && <p className="mt-1 text-xs text-critical">{problem.join(" ")}</p>}
      </div>
    );
  };

  const choice = (index: number, name: "quantity" | "level", label: string, options: [string, string][]) => (
    <div className="min-w-0">
      <label htmlFor={`limit-${index}-${name}`} className="block text-xs font-medium text-slate-600 dark:text-slate-400">
        {label}
      </label>
      <select
        id={`limit-${index}-${name}`}
        aria-label={`${label}, limit ${index + 1}`}
        className={inputClass}
        value={rows[index]![name]}
        disabled={!canEdit}
        onChange={(e) => update(index, name, e.target.value)}
      >
        {options.map(([value, text]) => (
          <option key={value} value={value}>
            {text}
          </option>
        ))}
      </select>
      {errors[`limits.${index}.${name}`] && <p className="mt-1 text-xs text-critical">{errors[`limits.${index}.${name}`]!.join(" ")}</p>}
    </div>
  );

  return (
    <div className="space-y-6">
      <div className="space-y-3" role="list" aria-label="Limits">
        {rows.map((row, index) => {
          const unit = scaleOf(row.quantity).unit;
          return (
            <div
              key={index}
              role="listitem"
              data-testid="limit-row"
              className={`${cardClass} grid grid-cols-2 items-end gap-3 p-3 sm:grid-cols-3 lg:grid-cols-[minmax(11rem,1.4fr)_minmax(8rem,1fr)_repeat(4,minmax(6rem,1fr))_auto]`}
            >
              {choice(index, "quantity", "Quantity", names.map((quantity) => [quantity, `${quantity} (${scaleOf(quantity).unit})`]))}
              {choice(index, "level", "Level", LEVELS.map((level) => [level, level]))}
              {field(index, "upper", "Upper bound", unit)}
              {field(index, "lower", "Lower bound", unit)}
              {field(index, "hysteresis", "Dead band", unit)}
              {field(index, "persistence", "Readings in a row", "")}
              <div className="pb-2">
                {canEdit && (
                  <button type="button" className="text-sm text-critical underline" onClick={() => setRows((all) => all.filter((_, i) => i !== index))}>
                    Remove<span className="sr-only"> limit {index + 1}</span>
                  </button>
                )}
              </div>
            </div>
          );
        })}
        {rows.length === 0 && (
          <p className={`${cardClass} p-4 text-sm text-slate-600 dark:text-slate-400`}>
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
            onClick={() => setRows((all) => [...all, { quantity: names[0]!, level: LEVELS[Math.min(all.length, 2)]!, upper: "", lower: "", hysteresis: "0", persistence: "1", stored: {} }])}
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
                    {episode.level} on {episode.quantity}: opened {local(episode.openedAt)}, peak {formatLimitValue(episode.peak, scaleOf(episode.quantity))},{" "}
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
