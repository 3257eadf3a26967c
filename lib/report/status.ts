import type { ConditionState } from "@/lib/alerting/condition";
import { STATE_LOOK } from "@/lib/alerting/condition-display";

/** How the period went, worst first: a structural alert level reached, all clear, or nothing to judge by. */
export const PERIOD_LEVELS = ["critical", "warning", "watch", "all-clear", "no-data"] as const;
export type PeriodLevel = (typeof PERIOD_LEVELS)[number];

const ALERT_LEVELS = ["critical", "warning", "watch"] as const;

/** The period's level in the condition code of badges and markers: an all clear reads as within limits. */
const STATE_OF_LEVEL: Record<PeriodLevel, ConditionState> = { critical: "critical", warning: "warning", watch: "watch", "all-clear": "within-limits", "no-data": "no-data" };

export const periodState = (level: PeriodLevel): ConditionState => STATE_OF_LEVEL[level];

/** "Within limits", "Warning", "No current data": the period's level in the words of the condition code. */
export const periodLevelText = (level: PeriodLevel): string => STATE_LOOK[periodState(level)].word;

/**
 * The worst structural level of the limit alerts open at any time in the period. Sensor alerts
 * are no structural level and do not count here. Without a single reading there is nothing to
 * call all clear: silence may be a dead logger.
 */
export function periodLevel(limitAlertLevels: readonly string[], readingsReceived: number): PeriodLevel {
  for (const level of ALERT_LEVELS) if (limitAlertLevels.includes(level)) return level;
  return readingsReceived > 0 ? "all-clear" : "no-data";
}

/**
 * What an all clear rests on, gauge by gauge over the period: gauges with limits that sent
 * readings (the ones checked), gauges that sent readings but have no limits (never checked),
 * gauges with faulty sensor readings (part of what they sent was not checked), gauges silent all
 * period. A faulty gauge is also counted in the first two by its limits.
 */
export type CheckedGauges = { withLimits: number; withoutLimits: number; faulty: number; silent: number };

const gauges = (n: number) => `${n} ${n === 1 ? "gauge" : "gauges"}`;

/** The gauges the all clear does not cover, each as a clause; none when every gauge was checked. */
function uncheckedClauses({ withoutLimits, faulty, silent }: CheckedGauges): string[] {
  return [
    withoutLimits > 0 ? `${gauges(withoutLimits)} ${withoutLimits === 1 ? "has" : "have"} no limits and ${withoutLimits === 1 ? "was" : "were"} not checked` : null,
    faulty > 0 ? `${gauges(faulty)} had sensor faults, whose faulty readings were not checked` : null,
    silent > 0 ? `${gauges(silent)} sent no readings` : null,
  ].filter((clause) => clause !== null);
}

/** One sentence for the top of the report; an all clear names the gauges it covers and those it does not. */
export function periodHeadline(level: PeriodLevel, completeness: number | null, checked: CheckedGauges): string {
  switch (level) {
    case "no-data":
      return "No readings were received in this period: the report cannot say whether the structure stayed within its limits.";
    case "all-clear": {
      const share = completeness === null ? "" : ` (${formatPercent(completeness)} of the expected readings were received)`;
      const covered =
        checked.withLimits > 0
          ? `No limit was crossed on the ${gauges(checked.withLimits)} with limits that sent readings${share}`
          : `No gauge with limits sent readings, so no limit was checked${share}`;
      return `${[covered, ...uncheckedClauses(checked)].join("; ")}.`;
    }
    default:
      return `At least one limit was crossed: the highest level reached was ${level}.`;
  }
}

/** "98.3 %": one decimal, as a data share a tenth of a percent off still matters over a month. */
export function formatPercent(ratio: number): string {
  return `${(ratio * 100).toFixed(1)} %`;
}
