import { STATE_LOOK } from "@/lib/alerting/condition-display";
import type { AlertView } from "@/lib/services/alerts";
import { ConditionShape } from "./condition-shape";
import { formatLimitedValue } from "@/lib/units";

/** Level as a word and the shape the gauge's condition takes at that level, so it reads without colour. */
export function LevelBadge({ level }: { level: string }) {
  const state = level === "critical" || level === "warning" ? level : "watch";
  return (
    <span className={`inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-xs font-semibold ${STATE_LOOK[state].badge}`}>
      <ConditionShape state={state} className="size-3" />
      {level}
    </span>
  );
}

export function alertStateOf(alert: Pick<AlertView, "clearedAt" | "acknowledgedAt">): "open" | "acknowledged" | "cleared" {
  if (alert.clearedAt) return "cleared";
  return alert.acknowledgedAt ? "acknowledged" : "open";
}

export function StateBadge({ alert }: { alert: Pick<AlertView, "clearedAt" | "acknowledgedAt"> }) {
  const state = alertStateOf(alert);
  const className =
    state === "open"
      ? "bg-slate-900 text-white dark:bg-white dark:text-slate-900"
      : state === "acknowledged"
        ? "bg-slate-200 text-slate-800 dark:bg-slate-700 dark:text-slate-100"
        : "text-slate-500";
  return <span className={`rounded px-1.5 py-0.5 text-xs font-medium ${className}`}>{state}</span>;
}

/** Where the alert is: its gauge, or for a rosette quantity the rosette (its gauge a alone would mislead). */
export function alertPlaceLabel(alert: Pick<AlertView, "gauge" | "rosette">): string {
  return alert.rosette ? `${alert.rosette} (rosette)` : alert.gauge;
}

/** What crossed what: "stress reached 231.4 MPa (bound 200.0 MPa)", rounded as the e-mails round it, or the sensor finding. */
export function alertSummary(alert: Pick<AlertView, "kind" | "quantity" | "peak" | "bound" | "code" | "message">): string {
  if (alert.kind === "sensor") return `Sensor: ${alert.code}${alert.message ? ` — ${alert.message}` : ""}`;
  const quantity = alert.quantity ?? "";
  const shown = (value: number | null) => (value === null ? "—" : formatLimitedValue(quantity, value));
  return `${quantity} reached ${shown(alert.peak)} (bound ${shown(alert.bound)})`;
}
