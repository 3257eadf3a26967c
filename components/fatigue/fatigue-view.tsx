"use client";

import { useState } from "react";
import useSWR from "swr";
import { EmptyState } from "@/components/ui/empty-state";
import { buttonClass, cardClass, inputClass } from "@/components/ui/styles";
import { DETAIL_CATEGORY_VALUES, formatScientific, snCurveLimits } from "@/lib/fatigue";
import type { GaugeFatigue } from "@/lib/services/fatigue";
import { dayEnd, dayOf, dayStart, formatInTimeZone } from "@/lib/time-format";
import { RainflowHistogram } from "./rainflow-histogram";

const DAY_MS = 86_400_000;
const PRESETS = [
  ["30", "Last 30 days"],
  ["90", "Last 90 days"],
  ["365", "Last year"],
  ["custom", "Custom period"],
] as const;
type Preset = (typeof PRESETS)[number][0];

const count = (value: number) => value.toLocaleString("en-US", { maximumFractionDigits: 1 });

/** Days of the structure's time zone: from the first day's midnight to the midnight after the last day. */
function customPeriod(fromDay: string, toDay: string, timeZone: string) {
  if (!fromDay || !toDay || fromDay > toDay) return null;
  return { from: dayStart(fromDay, timeZone), to: dayEnd(toDay, timeZone) };
}

async function fetchFatigue(url: string): Promise<GaugeFatigue> {
  const response = await fetch(url);
  const body = await response.json();
  if (!response.ok) throw new Error(body?.error?.message ?? `The server answered ${response.status}.`);
  return body;
}

const DAY_S = 86_400;

/** What the rate divides by: the time readings cover, with the outages left out said so. */
function rateBasis(fatigue: GaugeFatigue): string {
  const covered = `over ${count(fatigue.coveredSeconds / DAY_S)} days covered by ${fatigue.source === "bursts" ? "burst samples" : "readings"}`;
  if (fatigue.gapsLeftOut === 0) return covered;
  const gaps = fatigue.gapsLeftOut === 1 ? "1 gap" : `${count(fatigue.gapsLeftOut)} gaps`;
  return `${covered}; ${gaps} longer than ${count(fatigue.longestCoveredIntervalSeconds / 60)} min (${count(fatigue.gapSeconds / DAY_S)} days in all) left out`;
}

function lifeText(fatigue: GaugeFatigue): string {
  if (fatigue.damageRatePerYear === 0) return "∞ — no damaging cycles at this rate";
  if (fatigue.yearsToDamageOne === null) return "— (too few readings for a rate)";
  return `${fatigue.yearsToDamageOne.toLocaleString("en-US", { maximumSignificantDigits: 3 })} years`;
}

type Props = { apiPath: string; gaugeCategory: number | null; timeZone: string };

/** Period and category controls, then the fatigue figures and histogram the API computes for them. */
export function FatigueView({ apiPath, gaugeCategory, timeZone }: Props) {
  // Presets end at the moment they were chosen, so the request (and SWR's cache key) stays put.
  const [now, setNow] = useState(() => Date.now());
  const [preset, setPreset] = useState<Preset>("30");
  const [fromDay, setFromDay] = useState("");
  const [toDay, setToDay] = useState("");
  const [category, setCategory] = useState(gaugeCategory === null ? "" : String(gaugeCategory));

  function choosePreset(value: Preset) {
    if (value === "custom" && preset !== "custom") {
      setFromDay(dayOf(now - Number(preset) * DAY_MS, timeZone));
      setToDay(dayOf(now, timeZone));
    }
    setNow(Date.now());
    setPreset(value);
  }

  const period = preset === "custom" ? customPeriod(fromDay, toDay, timeZone) : { from: new Date(now - Number(preset) * DAY_MS), to: new Date(now) };
  const query = period && category ? new URLSearchParams({ from: period.from.toISOString(), to: period.to.toISOString(), category }) : null;
  const { data, error, isLoading, isValidating } = useSWR(query ? `${apiPath}?${query}` : null, fetchFatigue, {
    revalidateOnFocus: false,
    keepPreviousData: true,
  });

  return (
    <div className="space-y-6">
      <section className={`${cardClass} grid gap-4 p-4 sm:grid-cols-2`} aria-label="Period and category">
        <div className="space-y-1">
          <label htmlFor="fatigue-period" className="block text-sm font-medium">
            Period
          </label>
          <select id="fatigue-period" className={inputClass} value={preset} onChange={(event) => choosePreset(event.target.value as Preset)}>
            {PRESETS.map(([value, text]) => (
              <option key={value} value={value}>
                {text}
              </option>
            ))}
          </select>
        </div>
        <div className="space-y-1">
          <label htmlFor="fatigue-category" className="block text-sm font-medium">
            Detail category <span className="font-normal text-slate-500 dark:text-slate-400">(Δσ_C at 2×10⁶ cycles, MPa)</span>
          </label>
          <select id="fatigue-category" className={inputClass} value={category} onChange={(event) => setCategory(event.target.value)}>
            {gaugeCategory === null && <option value="">Choose a category…</option>}
            {DETAIL_CATEGORY_VALUES.map((value) => (
              <option key={value} value={value}>
                {value} MPa{value === gaugeCategory ? " (this gauge's)" : ""}
              </option>
            ))}
          </select>
        </div>
        {preset === "custom" && (
          <div className="grid grid-cols-2 gap-3 sm:col-span-2">
            <DayInput id="fatigue-from" label="First day" value={fromDay} onChange={setFromDay} />
            <DayInput id="fatigue-to" label="Last day" value={toDay} onChange={setToDay} />
            <p className="col-span-2 text-xs text-slate-500 dark:text-slate-400">
              Whole days in the structure&apos;s time ({timeZone}), the last day included.
              {!period && <span className="ml-1 font-medium text-critical">Choose both days, the first not after the last.</span>}
            </p>
          </div>
        )}
      </section>

      {!category ? (
        <EmptyState title="Choose a detail category">
          This gauge has no fatigue detail category in its registry entry. Choose the category of the detail at the gauge above, or set it
          on the gauge so that everyone starts from the same one.
        </EmptyState>
      ) : error ? (
        <p role="alert" className="rounded-md bg-red-50 px-3 py-2 text-sm text-critical dark:bg-red-950/50 dark:text-red-200">
          {error.message}
        </p>
      ) : isLoading || !data ? (
        period && (
          <p role="status" aria-busy="true" className={`${cardClass} animate-pulse p-6 text-sm text-slate-500`}>
            Counting cycles over the period…
          </p>
        )
      ) : (
        <div className={isValidating ? "opacity-60 transition-opacity" : undefined} aria-busy={isValidating}>
          <FatigueResults fatigue={data} timeZone={timeZone} csvUrl={`${apiPath}?${new URLSearchParams({ from: data.from, to: data.to, category: String(data.category), format: "csv" })}`} />
        </div>
      )}
    </div>
  );
}

function DayInput({ id, label, value, onChange }: { id: string; label: string; value: string; onChange: (day: string) => void }) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <input id={id} type="date" className={inputClass} value={value} onChange={(event) => onChange(event.target.value)} />
    </div>
  );
}

/** Damage per day of the structure's zone as bars, with the figures in a table for reading them exactly. */
function DamagePerDay({ days, timeZone }: { days: GaugeFatigue["damagePerDay"]; timeZone: string }) {
  const highest = Math.max(...days.map((d) => d.damage), Number.MIN_VALUE);
  const width = 600;
  const bar = width / days.length;
  return (
    <figure className={`${cardClass} space-y-2 p-4`} data-testid="damage-per-day">
      <figcaption className="font-semibold">
        Damage per day <span className="text-xs font-normal text-slate-500">(Miner sum of each day&apos;s histograms, days in {timeZone}; tallest bar {formatScientific(highest)})</span>
      </figcaption>
      <svg viewBox={`0 0 ${width} 120`} className="h-32 w-full" role="img" aria-label="Damage per day">
        {days.map((d, i) => {
          const height = (d.damage / highest) * 110;
          return (
            <rect key={d.day} x={i * bar + 1} y={115 - height} width={Math.max(1, bar - 2)} height={height} fill="#1f6f78">
              <title>{`${d.day}: ${formatScientific(d.damage)}`}</title>
            </rect>
          );
        })}
      </svg>
      <details className="text-sm">
        <summary className="cursor-pointer text-accent">Figures by day</summary>
        <ul className="mt-1 grid grid-cols-2 gap-x-4 font-mono text-xs sm:grid-cols-4">
          {days.map((d) => (
            <li key={d.day}>
              {d.day}: {formatScientific(d.damage)}
            </li>
          ))}
        </ul>
      </details>
    </figure>
  );
}

function FatigueResults({ fatigue, csvUrl, timeZone }: { fatigue: GaugeFatigue; csvUrl: string; timeZone: string }) {
  const when = (iso: string) => formatInTimeZone(new Date(iso), timeZone);
  const fromBursts = fatigue.source === "bursts";
  if (fromBursts ? !fatigue.samplesCounted : fatigue.readingsUsed === 0) {
    return (
      <EmptyState title="No readings in this period">
        Nothing was stored for this gauge between {when(fatigue.from)} and {when(fatigue.to)}{fromBursts && " (no bursts)"}
        {fatigue.readingsSkipped > 0 && ` except ${count(fatigue.readingsSkipped)} readings beyond the gauge's rated range, which are left out`}. Choose
        another period.
      </EmptyState>
    );
  }
  const cutOff = snCurveLimits(fatigue.category).cutOffLimit;
  const figures: [string, string, string][] = [
    ["Damage in the period", formatScientific(fatigue.damage), "Miner sum D; D = 1 is the nominal end of fatigue life"],
    ["Damage rate", fatigue.damageRatePerYear === null ? "—" : `${formatScientific(fatigue.damageRatePerYear)} per year`, rateBasis(fatigue)],
    ["Life at that rate", lifeText(fatigue), "years for the rate to reach D = 1; damage before monitoring began is unknown"],
    [
      "Cycles counted",
      count(fatigue.cyclesCounted),
      fromBursts ? `rainflow histograms of ${count(fatigue.samplesCounted ?? 0)} burst samples, half cycles as ½` : `rainflow, half cycles as ½; from ${count(fatigue.readingsUsed)} readings`,
    ],
    [
      "Equivalent range Δσ_E",
      `${fatigue.equivalentRange.toLocaleString("en-US", { maximumFractionDigits: 1 })} MPa`,
      `constant range doing the same damage in 2×10⁶ cycles (m = 3), beside the detail category Δσ_C = ${fatigue.category} MPa`,
    ],
  ];
  return (
    <div className="space-y-6">
      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5" data-testid="fatigue-figures">
        {figures.map(([label, value, note]) => (
          <div key={label} className={`${cardClass} p-4`}>
            <dt className="text-sm text-slate-500 dark:text-slate-400">{label}</dt>
            <dd className="mt-1 text-2xl font-semibold tabular-nums" data-testid={label === "Damage in the period" ? "fatigue-damage" : undefined}>
              {value}
            </dd>
            <dd className="mt-1 text-xs text-slate-500 dark:text-slate-400">{note}</dd>
          </div>
        ))}
      </dl>
      <CountingNote fromBursts={fromBursts} />
      {(fatigue.readingsOutsideLinearRange > 0 || fatigue.readingsSkipped > 0 || fatigue.zeroEpochs > 1) && (
        <ul className="space-y-1 rounded-md bg-amber-50 px-4 py-3 text-sm text-amber-950 dark:bg-amber-950/40 dark:text-amber-100">
          {fatigue.readingsOutsideLinearRange > 0 && (
            <li>
              {count(fatigue.readingsOutsideLinearRange)} readings beyond the linear-elastic range were counted. The S-N approach assumes elastic stress
              ranges: read the estimate with more care.
            </li>
          )}
          {fatigue.zeroEpochs > 1 && (
            <li>
              The gauge was zeroed again in the period: its {fatigue.zeroEpochs} stretches between zero readings were counted one by one, so the step
              of a new zero is not counted as a stress range.
            </li>
          )}
          {fatigue.readingsSkipped > 0 && (
            <li>
              {count(fatigue.readingsSkipped)} faulty readings were left out: beyond the gauge&apos;s rated range, or found faulty by sensor health (a
              jump or spike, a flat line, or held after a jump until an engineer resolves it).
            </li>
          )}
        </ul>
      )}
      {fromBursts && fatigue.damagePerDay.length > 0 && <DamagePerDay days={fatigue.damagePerDay} timeZone={timeZone} />}
      <figure className={`${cardClass} space-y-3 p-4`}>
        <figcaption className="flex flex-wrap items-baseline justify-between gap-2">
          <span className="font-semibold">Rainflow histogram</span>
          <span className="text-xs text-slate-500 dark:text-slate-400">
            {when(fatigue.firstReading!)} to {when(fatigue.lastReading!)} · Δσ_C = {fatigue.category} MPa · {fatigue.rangeBinWidth} MPa bins · ranges under
            Δσ_L = {cutOff.toFixed(1)} MPa do no damage
          </span>
        </figcaption>
        {fatigue.cycles.length > 0 ? (
          <RainflowHistogram bins={fatigue.cycles} binWidth={fatigue.rangeBinWidth} />
        ) : (
          <p className="text-sm text-slate-500">The stress did not change in the period: no cycles.</p>
        )}
        <a href={csvUrl} download className={buttonClass("secondary")}>
          Download the rainflow matrix (CSV)
        </a>
      </figure>
    </div>
  );
}

/** What the stress history counted here can and cannot see: a dynamic channel's bursts, or readings minutes apart. */
function CountingNote({ fromBursts }: { fromBursts: boolean }) {
  if (fromBursts) {
    return (
      <p data-testid="fatigue-source" className="rounded-md bg-slate-100 px-4 py-3 text-sm text-slate-700 dark:bg-slate-800 dark:text-slate-200">
        Counted from the dynamic channel: the rainflow histograms stored from every burst, so traffic, footfall and wind cycles within the bursts
        are in. Ranges are taken at their bin&apos;s upper edge, on the safe side; time between bursts is not seen.
      </p>
    );
  }
  return (
    <p data-testid="fatigue-source" className="rounded-md bg-slate-100 px-4 py-3 text-sm text-slate-700 dark:bg-slate-800 dark:text-slate-200">
      Counted from readings minutes apart, which see only daily and seasonal cycles (temperature, slowly changing loads). The cycles of
      traffic, wind or machinery last seconds and fall between readings, so the damage here can be far below the real damage and the life
      far above it.
    </p>
  );
}
