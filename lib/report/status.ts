/** How the period went, worst first: a structural alert level reached, all clear, or nothing to judge by. */
export const PERIOD_LEVELS = ["critical", "warning", "watch", "all-clear", "no-data"] as const;
export type PeriodLevel = (typeof PERIOD_LEVELS)[number];

const ALERT_LEVELS = ["critical", "warning", "watch"] as const;

/**
 * The worst structural level of the limit alerts open at any time in the period. Sensor alerts
 * are no structural level and do not count here. Without a single reading there is nothing to
 * call all clear: silence may be a dead logger.
 */
export function periodLevel(limitAlertLevels: readonly string[], readingsReceived: number): PeriodLevel {
  for (const level of ALERT_LEVELS) if (limitAlertLevels.includes(level)) return level;
  return readingsReceived > 0 ? "all-clear" : "no-data";
}

/** One sentence for the top of the report. */
export function periodHeadline(level: PeriodLevel, completeness: number | null): string {
  switch (level) {
    case "no-data":
      return "No readings were received in this period: the report cannot say whether the structure stayed within its limits.";
    case "all-clear": {
      const share = completeness === null ? "" : ` (${formatPercent(completeness)} of the expected readings were received)`;
      return `No limit was crossed on the readings received${share}.`;
    }
    default:
      return `At least one limit was crossed: the highest level reached was ${level}.`;
  }
}

/** "98.3 %": one decimal, as a data share a tenth of a percent off still matters over a month. */
export function formatPercent(ratio: number): string {
  return `${(ratio * 100).toFixed(1)} %`;
}
