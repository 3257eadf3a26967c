import type { GaugeCondition } from "@/lib/alerting/condition";
import { STATE_LOOK, conditionText, type ShownState } from "@/lib/alerting/condition-display";
import { ConditionShape } from "./condition-shape";

/** A gauge's (or a structure's worst) condition in a word and a shape as well as a colour. */
export function ConditionBadge({ condition, retired = false }: { condition: Pick<GaugeCondition, "state" | "faults" | "stale">; retired?: boolean }) {
  const shown: ShownState = retired ? "retired" : condition.state;
  return (
    <span
      className={`inline-flex items-center gap-1 rounded border px-2 py-0.5 text-xs font-semibold ${STATE_LOOK[shown].badge}`}
      data-state={shown}
      data-testid="condition-badge"
    >
      <ConditionShape state={shown} className="size-3" />
      {conditionText(condition, retired)}
    </span>
  );
}
