import { isStale } from "./gauge-state";

/**
 * A gauge's condition now, decided from facts alone so that every surface (tables, drawings,
 * overview, report, e-mail, API) tells the same story. The states are listed in their order of
 * precedence: the first that holds is the gauge's state.
 */
export const CONDITION_STATES = ["critical", "warning", "watch", "sensor-fault", "no-data", "within-limits", "no-limits"] as const;
export type ConditionState = (typeof CONDITION_STATES)[number];

const LIMIT_LEVELS = ["critical", "warning", "watch"] as const;

/**
 * Sensor alerts that mean the readings themselves cannot be believed. A "stale" sensor alert is
 * the notice that data stopped, which the condition already tells by `stale` from the last
 * reading's time.
 */
const NOT_A_FAULT = new Set(["stale"]);

export type ConditionFacts = {
  /** Open limit alerts of the gauge: level and when each opened (epoch ms). */
  openLimitAlerts: readonly { level: string; openedAt: number }[];
  /** Open sensor alerts of the gauge: code (jump, flat-line, out-of-range, stale…) and when each opened. */
  openSensorAlerts: readonly { code: string | null; openedAt: number }[];
  firstReadingAt: number | null;
  lastReadingAt: number | null;
  /** When the last limit alert of the gauge cleared, if any did. */
  lastLimitClearedAt: number | null;
  expectedIntervalS: number | null;
  hasLimits: boolean;
  /** When the gauge was registered: a gauge that never sent data has had none since then. */
  registeredAt: number;
  now: number;
};

export type GaugeCondition = {
  state: ConditionState;
  /** Since when the state holds (epoch ms); null when it cannot be told. */
  since: number | null;
  /** Codes of the open sensor faults, oldest first. */
  faults: string[];
  /** No reading for several expected intervals: whatever the state, the data are old. */
  stale: boolean;
};

const earliest = (times: readonly number[]) => (times.length ? Math.min(...times) : null);

export function gaugeCondition(facts: ConditionFacts): GaugeCondition {
  const faultAlerts = [...facts.openSensorAlerts].filter((alert) => !NOT_A_FAULT.has(alert.code ?? "")).sort((a, b) => a.openedAt - b.openedAt);
  const faults = [...new Set(faultAlerts.map((alert) => alert.code ?? "sensor"))];
  const stale = isStale(facts.lastReadingAt, facts.expectedIntervalS, facts.now);
  const common = { faults, stale };
  for (const level of LIMIT_LEVELS) {
    const open = facts.openLimitAlerts.filter((alert) => alert.level === level).map((alert) => alert.openedAt);
    if (open.length) return { state: level, since: earliest(open), ...common };
  }
  if (faultAlerts.length) return { state: "sensor-fault", since: faultAlerts[0]!.openedAt, ...common };
  // Old data are never an all clear: a silent gauge has no current data, whatever it last said.
  if (facts.lastReadingAt === null) return { state: "no-data", since: facts.registeredAt, ...common };
  if (stale) return { state: "no-data", since: facts.lastReadingAt, ...common };
  if (!facts.hasLimits) return { state: "no-limits", since: facts.firstReadingAt, ...common };
  return { state: "within-limits", since: Math.max(facts.lastLimitClearedAt ?? 0, facts.firstReadingAt ?? 0) || null, ...common };
}

/**
 * How bad a state is for a set of gauges, worst first. It differs from the precedence in one
 * place: a structure is within limits only when every gauge is, so a gauge without limits ranks
 * worse than one within them.
 */
const SEVERITY: readonly ConditionState[] = ["critical", "warning", "watch", "sensor-fault", "no-data", "no-limits", "within-limits"];

export function worstCondition(states: readonly ConditionState[]): ConditionState {
  if (states.length === 0) return "no-data";
  return states.reduce((worst, state) => (SEVERITY.indexOf(state) < SEVERITY.indexOf(worst) ? state : worst));
}

export function bySeverity(a: ConditionState, b: ConditionState): number {
  return SEVERITY.indexOf(a) - SEVERITY.indexOf(b);
}
