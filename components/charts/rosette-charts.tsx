"use client";

import { useMemo, useState } from "react";
import useSWR from "swr";
import { useUnits } from "@/components/units/units-context";
import { buttonClass } from "@/components/ui/styles";
import { fetchJson } from "@/lib/api/fetcher";
import { limitLines, ROSETTE_LIMIT_QUANTITIES, type Limit, type RosetteLimitQuantity } from "@/lib/limits";
import type { SeriesAnswer } from "@/lib/series/chart-data";
import { inDisplayUnits } from "@/lib/units";
import { EnvelopeChart, type ChartEpisode, type ChartEvent, type TimeRange } from "./envelope-chart";
import { ShowAllLimitsSwitch } from "./show-all-limits";

const DAY = 86_400_000;
const POINTS = 800;
const NO_LIMITS: readonly Limit<string>[] = [];
const NONE: readonly never[] = [];

/** An alert episode of one of the rosette's quantities, drawn on that quantity's chart. */
export type RosetteEpisode = ChartEpisode & { quantity: string };

type ChartedQuantity = RosetteLimitQuantity | "theta";
const TITLE: Record<ChartedQuantity, string> = {
  sigma1: "Principal stress σ1",
  sigma2: "Principal stress σ2",
  vonMises: "von Mises stress",
  theta: "Principal angle θ (gauge a to σ1)",
};
const CHARTED: readonly ChartedQuantity[] = ["sigma1", "sigma2", "vonMises", "theta"];
/** The principal angle is shown as computed, in degrees, whatever the person's unit system. */
const AS_ANGLE = { unit: "°", toDisplay: (degrees: number) => degrees } as const;

/** Which rosette, in which zone, and what is drawn over its series: its limits (each on the quantity it bounds), episodes and events. */
type RosetteChartProps<Episode> = {
  structureCode: string;
  tag: string;
  timeZone: string;
  limits?: readonly Limit<string>[];
  episodes?: readonly Episode[];
  events?: readonly ChartEvent[];
};

/** One quantity of a rosette over a range, computed on request from its three gauges, with the bounds of any limits on it. */
function RosetteChart({
  structureCode,
  tag,
  quantity,
  range,
  timeZone,
  limits = NO_LIMITS,
  episodes = NONE,
  events = NONE,
  showAllLimits = false,
}: RosetteChartProps<ChartEpisode> & { quantity: ChartedQuantity; range: TimeRange; showAllLimits?: boolean }) {
  const units = useUnits();
  const url =
    `/api/v1/structures/${encodeURIComponent(structureCode)}/rosettes/${encodeURIComponent(tag)}/series` +
    `?quantity=${quantity}&points=${POINTS}&from=${new Date(range.from).toISOString()}&to=${new Date(range.to).toISOString()}`;
  const { data, error } = useSWR<SeriesAnswer>(url, fetchJson, { refreshInterval: 60_000 });
  const display = useMemo(
    () => (quantity === "theta" ? AS_ANGLE : { unit: inDisplayUnits(units, "stress", 0).unit, toDisplay: (mpa: number) => inDisplayUnits(units, "stress", mpa).value }),
    [units, quantity],
  );
  const lines = useMemo(() => limitLines(limits, quantity, display.toDisplay), [limits, quantity, display]);
  return (
    <EnvelopeChart
      title={TITLE[quantity]}
      answer={data}
      error={error}
      unit={display.unit}
      toDisplay={display.toDisplay}
      timeZone={timeZone}
      empty="No instants with a reading of all three gauges in this period."
      lines={lines}
      episodes={episodes}
      events={events}
      showAllLimits={showAllLimits}
    />
  );
}

/** The plane stress state at a rosette over time: principal stresses, von Mises and principal angle. */
export function RosetteCharts({ end, episodes = NONE, ...shared }: RosetteChartProps<RosetteEpisode> & { end: number }) {
  const [days, setDays] = useState(7);
  const [showAllLimits, setShowAllLimits] = useState(false);
  const range = { from: end - days * DAY, to: end };
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2">
        {[1, 7, 30, 90].map((span) => (
          <button key={span} type="button" className={buttonClass(days === span ? "primary" : "secondary")} onClick={() => setDays(span)}>
            {span === 1 ? "24 h" : `${span} days`}
          </button>
        ))}
      </div>
      <ShowAllLimitsSwitch checked={showAllLimits} onChange={setShowAllLimits} />
      {CHARTED.map((quantity) => (
        <RosetteChart
          key={quantity}
          {...shared}
          quantity={quantity}
          range={range}
          episodes={episodes.filter((episode) => episode.quantity === quantity)}
          showAllLimits={showAllLimits}
        />
      ))}
    </div>
  );
}

/**
 * Proposed rosette limits drawn on one of the quantities they may bound, for the limits editor:
 * the quantity of the first bound typed, until the engineer picks another.
 */
export function RosetteLimitChart({
  structureCode,
  tag,
  range,
  timeZone,
  limits,
}: {
  structureCode: string;
  tag: string;
  range: TimeRange;
  timeZone: string;
  limits: readonly Limit<string>[];
}) {
  const [chosen, setChosen] = useState<RosetteLimitQuantity | null>(null);
  const shown = chosen ?? ROSETTE_LIMIT_QUANTITIES.find((quantity) => quantity === limits[0]?.quantity) ?? ROSETTE_LIMIT_QUANTITIES[0];
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2" role="group" aria-label="Quantity charted">
        {ROSETTE_LIMIT_QUANTITIES.map((quantity) => (
          <button key={quantity} type="button" aria-pressed={quantity === shown} className={buttonClass(quantity === shown ? "primary" : "secondary")} onClick={() => setChosen(quantity)}>
            {TITLE[quantity]}
          </button>
        ))}
      </div>
      <RosetteChart structureCode={structureCode} tag={tag} quantity={shown} range={range} timeZone={timeZone} limits={limits} />
    </div>
  );
}
