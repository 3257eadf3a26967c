export type SensorFaultCode = "stale" | "flat-line" | "jump" | "out-of-range";

/**
 * A sensor-health alert, never a structural one. A condition that lasts (flat line, out of range)
 * is "raised" once when it begins and "resolved" once when it ends, so each batch does not re-raise
 * it; a jump is raised on its own; staleness is checked against the clock (`checkStale`).
 */
export interface SensorFinding {
  readonly kind: "sensor";
  readonly code: SensorFaultCode;
  readonly event: "raised" | "resolved";
  readonly time: number;
  readonly message: string;
}

/** A raw reading and, where the gauge converts it, its value in the limited quantity's units. */
export interface Sample {
  readonly time: number;
  readonly raw: number;
  readonly value: number;
}

/** One reading's verdict from one detector: `fault` keeps it away from limit evaluation. */
export interface DetectorStep<State> {
  readonly state: State;
  readonly fault: boolean;
  readonly finding: SensorFinding | null;
}

export interface ConditionState {
  readonly active: boolean;
}

/** The finding for a lasting condition at this reading: only when it begins or ends. */
export function conditionStep(
  code: SensorFaultCode,
  wasActive: boolean,
  isActive: boolean,
  time: number,
  messages: { readonly raised: () => string; readonly resolved: string },
): SensorFinding | null {
  if (wasActive === isActive) return null;
  return isActive
    ? { kind: "sensor", code, event: "raised", time, message: messages.raised() }
    : { kind: "sensor", code, event: "resolved", time, message: messages.resolved };
}
