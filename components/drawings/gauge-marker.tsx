import Link from "next/link";
import type { GaugeState } from "@/lib/alerting/gauge-state";

/** Each gauge state has its own shape and word, so colour is never the only cue. */
export const MARKER_STATES = ["ok", "watch", "warning", "critical", "stale", "retired"] as const;
export type MarkerState = (typeof MARKER_STATES)[number];

/** The marker for a gauge's state; a gauge without data yet has no state to show. */
export function markerStateOf(state: GaugeState): MarkerState | undefined {
  return state === "no-data" ? undefined : state;
}

const COLOUR: Record<MarkerState | "unassessed", string> = {
  unassessed: "text-slate-500",
  ok: "text-emerald-700",
  watch: "text-watch",
  warning: "text-warning",
  critical: "text-critical",
  stale: "text-slate-600",
  retired: "text-slate-400",
};

export const MARKER_STATE_WORDS: Record<MarkerState | "unassessed", string> = {
  unassessed: "no data yet",
  ok: "within limits",
  watch: "watch",
  warning: "warning",
  critical: "critical",
  stale: "no recent data",
  retired: "retired",
};

// Drawn in a 16 × 16 box centred on the gauge's point.
const SHAPES: Record<MarkerState | "unassessed", React.ReactNode> = {
  unassessed: <circle cx="8" cy="8" r="6" className="fill-white stroke-current" strokeWidth="2" />,
  ok: <circle cx="8" cy="8" r="6" className="fill-current" />,
  watch: <path d="M8 1.5 15 14.5H1Z" className="fill-current" />,
  warning: <path d="M8 0.5 15.5 8 8 15.5 0.5 8Z" className="fill-current" />,
  critical: (
    <>
      <rect x="1" y="1" width="14" height="14" className="fill-current" />
      <path d="M8 3.5v5.5M8 11.3v1.2" className="stroke-white" strokeWidth="2" />
    </>
  ),
  stale: <circle cx="8" cy="8" r="6" className="fill-white stroke-current" strokeWidth="2" strokeDasharray="3 2" />,
  retired: (
    <>
      <circle cx="8" cy="8" r="6" className="fill-white stroke-current" strokeWidth="1.5" />
      <path d="M5 5l6 6M11 5l-6 6" className="stroke-current" strokeWidth="1.5" />
    </>
  ),
};

export function MarkerShape({ state }: { state?: MarkerState }) {
  return (
    <svg viewBox="0 0 16 16" className={`size-4 shrink-0 ${COLOUR[state ?? "unassessed"]}`} aria-hidden>
      {SHAPES[state ?? "unassessed"]}
    </svg>
  );
}

/**
 * A gauge on a drawing, placed by fractions of the drawing's width and height, with its shape's
 * centre on the point; `state` picks the shape and the colour.
 */
export function GaugeMarker({ tag, x, y, href, state, passive }: { tag: string; x: number; y: number; href: string; state?: MarkerState; passive?: boolean }) {
  const word = MARKER_STATE_WORDS[state ?? "unassessed"];
  const common = {
    "data-testid": "gauge-marker",
    "data-state": state ?? "unassessed",
    title: `${tag}: ${word}`,
    style: { left: `${x * 100}%`, top: `${y * 100}%` },
    className: `absolute -ml-2 -mt-2 flex h-4 items-center gap-1 text-slate-800 focus-visible:z-10 dark:text-slate-800 ${passive ? "pointer-events-none" : ""}`,
  };
  const content = (
    <>
      <MarkerShape state={state} />
      <span className="rounded bg-white/90 px-1 font-mono text-xs font-medium leading-4 shadow-sm ring-1 ring-slate-300">{tag}</span>
    </>
  );
  // A passive marker sits inside another link (a drawing's thumbnail): a second link there would be invalid.
  if (passive) {
    return (
      <span {...common} aria-label={`Gauge ${tag}, ${word}`} role="img">
        {content}
      </span>
    );
  }
  return (
    <Link href={href} aria-label={`Gauge ${tag}, ${word}`} {...common}>
      {content}
    </Link>
  );
}

export function MarkerLegend() {
  return (
    <div aria-label="Marker legend" role="group" className="text-xs text-slate-600 dark:text-slate-400">
      <p className="mb-1">Each marker&apos;s shape and colour give the gauge&apos;s state now: open alerts first, then whether data still arrive.</p>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-slate-800 dark:text-slate-200">
        {([undefined, ...MARKER_STATES] as const).map((state) => (
          <li key={state ?? "unassessed"} className="flex items-center gap-1.5">
            <MarkerShape state={state} />
            {MARKER_STATE_WORDS[state ?? "unassessed"]}
          </li>
        ))}
      </ul>
    </div>
  );
}
