import type { GaugeState } from "@/lib/alerting/gauge-state";

const STYLE: Record<GaugeState, { symbol: string; text: string; className: string }> = {
  critical: { symbol: "■", text: "Critical", className: "bg-critical text-white" },
  warning: { symbol: "▲", text: "Warning", className: "bg-warning text-white" },
  watch: { symbol: "◆", text: "Watch", className: "bg-watch text-white" },
  stale: { symbol: "◌", text: "Stale data", className: "border border-dashed border-slate-500 text-slate-700 dark:text-slate-200" },
  "no-data": { symbol: "○", text: "No data yet", className: "border border-slate-300 text-slate-600 dark:text-slate-300" },
  ok: { symbol: "●", text: "Within limits", className: "bg-emerald-700 text-white" },
  retired: { symbol: "×", text: "Retired", className: "bg-slate-200 text-slate-600 dark:bg-slate-800 dark:text-slate-400" },
};

/** A state in a word and a shape as well as a colour. */
export function GaugeStateBadge({ state }: { state: GaugeState }) {
  const style = STYLE[state];
  return (
    <span className={`inline-flex items-center gap-1 rounded px-2 py-0.5 text-xs font-semibold ${style.className}`} data-state={state}>
      <span aria-hidden>{style.symbol}</span>
      {style.text}
    </span>
  );
}
