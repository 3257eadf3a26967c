export type SensorFaultCode = "stale" | "flat-line" | "jump" | "out-of-range";

/**
 * A reading's sensor-health verdict as bits, stored with the reading (0: healthy). `after-jump`
 * marks the readings that follow an unresolved jump: their reference may have moved, so they are
 * quarantined until an engineer accepts the step or records a new zero. `spike` marks a lone
 * reading far from its neighbours (and a step not yet judged by the next reading): set aside on
 * its own, holding nothing after it.
 */
export const FAULT_BITS = { jump: 1, "flat-line": 2, "out-of-range": 4, "after-jump": 8, spike: 16 } as const;
export type FaultName = keyof typeof FAULT_BITS;

/** The names of a verdict's bits, in a fixed order. */
export function faultNames(bits: number): FaultName[] {
  return (Object.keys(FAULT_BITS) as FaultName[]).filter((name) => (bits & FAULT_BITS[name]) !== 0);
}

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

/**
 * A detector's one rule, shared by batch inspection and the single-step functions. `advance` takes
 * a reading into `work`, a private copy of the stored state that it changes in place, appends its
 * finding if the reading gives one and says whether the reading is a fault: over a batch the
 * detectors allocate nothing per reading while nothing is found. The stored state is built back
 * from `work` once, at the end.
 */
export interface Detector<Thresholds, State, Work> {
  readonly begin: (state: State) => Work;
  readonly advance: (thresholds: Thresholds, work: Work, sample: Sample, findings: SensorFinding[]) => boolean;
  readonly end: (work: Work) => State;
}

/** One reading through a detector's rule. */
export function stepOnce<Thresholds, State, Work>(detector: Detector<Thresholds, State, Work>, thresholds: Thresholds, state: State, sample: Sample): DetectorStep<State> {
  const work = detector.begin(state);
  const findings: SensorFinding[] = [];
  const fault = detector.advance(thresholds, work, sample, findings);
  return { state: detector.end(work), fault, finding: findings[0] ?? null };
}

/**
 * A lasting condition gives a finding only at the reading where it begins or ends, so each batch
 * does not re-raise it; detectors compare before calling, so the message is built only then.
 */
/** A number in a finding's message: six significant figures at most and its unit ("2,598.28 µε"). */
export function messageNumber(value: number, unit = ""): string {
  const shown = value.toLocaleString("en-US", { maximumSignificantDigits: 6 });
  return unit ? `${shown} ${unit}` : shown;
}

export function conditionFinding(code: SensorFaultCode, isActive: boolean, time: number, message: string): SensorFinding {
  return { kind: "sensor", code, event: isActive ? "raised" : "resolved", time, message };
}
