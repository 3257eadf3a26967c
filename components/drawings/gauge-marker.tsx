import Link from "next/link";
import { ConditionShape } from "@/components/alerts/condition-shape";
import { SHOWN_STATES, STATE_LOOK, type ShownState } from "@/lib/alerting/condition-display";

/**
 * A gauge on a drawing, placed by fractions of the drawing's width and height, with its shape's
 * centre on the point; `state` picks the shape and the colour, `text` is the condition in words.
 */
export function GaugeMarker({
  tag,
  x,
  y,
  href,
  state,
  text,
  passive,
  labelSlot = 0,
}: {
  tag: string;
  x: number;
  y: number;
  href: string;
  state: ShownState;
  text: string;
  passive?: boolean;
  /** The line its tag goes on (lib/drawings/label-slots): 0 beside the marker, 1, 2, … stacked below. */
  labelSlot?: number;
}) {
  const common = {
    "data-testid": "gauge-marker",
    "data-state": state,
    title: `${tag}: ${text}`,
    style: { left: `${x * 100}%`, top: `${y * 100}%` },
    className: `absolute -ml-2 -mt-2 flex h-4 items-center gap-1 text-slate-800 focus-visible:z-10 dark:text-slate-800 ${passive ? "pointer-events-none" : ""}`,
  };
  const content = (
    <>
      <span className="rounded-sm bg-white/90">
        <ConditionShape state={state} />
      </span>
      <span
        className="rounded bg-white/90 px-1 font-mono text-xs font-medium leading-4 shadow-sm ring-1 ring-slate-300"
        style={labelSlot ? { transform: `translateY(${labelSlot * 1.15}rem)` } : undefined}
        data-label-slot={labelSlot}
      >
        {tag}
      </span>
    </>
  );
  // A passive marker sits inside another link (a drawing's thumbnail): a second link there would be invalid.
  if (passive) {
    return (
      <span {...common} aria-label={`Gauge ${tag}, ${text}`} role="img">
        {content}
      </span>
    );
  }
  return (
    <Link href={href} aria-label={`Gauge ${tag}, ${text}`} {...common}>
      {content}
    </Link>
  );
}

export function MarkerLegend() {
  return (
    <div aria-label="Marker legend" role="group" className="text-xs text-slate-600 dark:text-slate-400" data-testid="marker-legend">
      <p className="mb-1">Each marker&apos;s shape and colour give the gauge&apos;s condition now, the same as in the gauge table: open alerts first, then sensor faults, then whether data still arrive.</p>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-slate-800 dark:text-slate-200">
        {SHOWN_STATES.map((state) => (
          <li key={state} className="flex items-center gap-1.5" data-state={state}>
            <ConditionShape state={state} />
            {STATE_LOOK[state].word}
          </li>
        ))}
      </ul>
    </div>
  );
}
