import { inputUnit } from "@/lib/gauges/labels";
import {
  evaluateReadings,
  FAULT_BITS,
  initialEpisodeState,
  inspectReadings,
  type CheckedReading,
  type EpisodeEvent,
  type EpisodeState,
  type Limit,
  type Quantity,
  type SensorFinding,
  type SensorHealthThresholds,
} from "@/lib/limits";
import { isOutOfRange } from "@/lib/mechanics";
import type { FaultHold, GaugeEvaluationState } from "./evaluation-state";

export { initialGaugeEvaluationState, type GaugeEvaluationState } from "./evaluation-state";

/**
 * One gauge's alert evaluation over converted readings: sensor health first (a faulty reading
 * must not raise a structural alert), then each limited quantity's episode machine. Live
 * ingestion and the limits editor's backtest both run exactly this.
 */

/**
 * A stored reading: raw value in the gauge's input unit, strain µε, stress MPa, mechanics flags,
 * and the thermal residual in µε (null without a thermal model or a lagged temperature).
 */
export type EvaluatedReading = { time: number; raw: number; strain: number; stress: number; flags: number; residual: number | null };

export type QuantityEvent = EpisodeEvent & { quantity: Quantity };

export type GaugeAlertSetup = {
  limits: readonly Limit[];
  /** MPa; utilisation is |σ| / yield. */
  yieldStress: number | null;
  health: SensorHealthThresholds;
};

export function quantityValue(reading: EvaluatedReading, quantity: Quantity, yieldStress: number | null): number {
  switch (quantity) {
    case "stress":
      return reading.stress;
    case "strain":
      return reading.strain;
    case "utilisation":
      return yieldStress ? Math.abs(reading.stress) / yieldStress : Number.NaN;
    case "residual":
      // Not a number: the machine passes over it, as it does utilisation without a yield.
      return reading.residual ?? Number.NaN;
  }
}

/** Raw ranges no healthy gauge of each input reports (example values, common practice from memory). */
const RAW_RANGE: Record<string, { min: number; max: number }> = {
  "mV/V": { min: -10, max: 10 },
  microstrain: { min: -15_000, max: 15_000 },
  Hz: { min: 300, max: 6_000 },
  "frequency-squared": { min: 90, max: 36_000 },
};

/**
 * Example sensor-health thresholds: six hours of identical raw values at 10-minute intervals is
 * a stuck channel; 1 500 µε between two readings is more than a structure in service moves.
 * They are defaults only, like the limits themselves.
 */
export function defaultHealthThresholds(input: string): SensorHealthThresholds {
  const unit = inputUnit(input);
  const range = RAW_RANGE[input];
  return { flatLine: { readings: 36, epsilon: 0, unit }, jump: { maxStep: 1_500 }, range: range && { ...range, unit } };
}

/** A stored gauge's setup, the same for live ingestion, the backtests and the rosettes on it. */
export function gaugeAlertSetup(gauge: { input: string; material: { yield?: number | null } }, limits: readonly Limit[]): GaugeAlertSetup {
  return { limits, yieldStress: gauge.material.yield ?? null, health: defaultHealthThresholds(gauge.input) };
}

function quantitiesOf(limits: readonly Limit[]): Quantity[] {
  return [...new Set(limits.map((limit) => limit.quantity))];
}

export type GaugeEvaluation = {
  state: GaugeEvaluationState;
  events: QuantityEvent[];
  findings: SensorFinding[];
  /** Times of the readings limit evaluation skipped as faults, in order: a rosette on this gauge skips its instants too. */
  faultTimes: number[];
  /**
   * By reading time, the sensor-health verdict (FAULT_BITS) of each faulty reading taken in, and of
   * an earlier reading this batch showed to be a jump; healthy ones are absent.
   */
  verdicts: Map<number, number>;
};

export function evaluateGauge(setup: GaugeAlertSetup, state: GaugeEvaluationState, readings: readonly EvaluatedReading[]): GaugeEvaluation {
  const inspection = inspectReadings(
    setup.health,
    state.health,
    readings.map((reading) => ({ time: reading.time, raw: reading.raw, value: reading.strain })),
  );
  const held = holdAfterJump(state.hold, inspection.readings, inspection.earlierJumps);
  const taken = takenIn(readings, held.readings);
  const { episodes, events } = evaluateQuantities(setup, state.episodes, held.readings, taken);
  const faultTimes: number[] = [];
  for (let index = 0; index < taken.faults.length; index++) if (taken.faults[index]) faultTimes.push(held.readings[index]!.time);
  const verdicts = new Map<number, number>();
  // A suspect of an earlier batch judged a jump by this one: its stored verdict changes too.
  for (const time of inspection.earlierJumps) verdicts.set(time, FAULT_BITS.jump);
  for (const reading of held.readings) if (reading.faultBits !== 0) verdicts.set(reading.time, reading.faultBits);
  return { state: { ...state, episodes, health: inspection.state, hold: held.hold }, events, findings: inspection.findings, faultTimes, verdicts };
}

function evaluateQuantities(
  setup: GaugeAlertSetup,
  from: GaugeEvaluationState["episodes"],
  checked: readonly CheckedReading[],
  taken: { sources: EvaluatedReading[]; faults: boolean[] },
): { episodes: Partial<Record<Quantity, EpisodeState>>; events: QuantityEvent[] } {
  const episodes: Partial<Record<Quantity, EpisodeState>> = { ...from };
  const events: QuantityEvent[] = [];
  for (const quantity of quantitiesOf(setup.limits)) {
    const limits = setup.limits.filter((limit) => limit.quantity === quantity);
    const evaluation = evaluateReadings(
      limits,
      episodes[quantity] ?? initialEpisodeState(),
      checked.map((reading, index) => ({
        time: reading.time,
        value: quantityValue(taken.sources[index]!, quantity, setup.yieldStress),
        fault: taken.faults[index]!,
      })),
    );
    episodes[quantity] = evaluation.state;
    events.push(...evaluation.events.map((event) => ({ ...event, quantity })));
  }
  events.sort((a, b) => a.time - b.time);
  return { episodes, events };
}

/**
 * A jump may be a real step (a crack, a bearing slipping) or the gauge's reference moving (a
 * debonding foil): the readings cannot tell, so every reading after it is quarantined until an
 * engineer says which. A lone spike holds nothing. `earlierJumps`: jumps at readings of earlier
 * batches, found by this one's first reading.
 */
function holdAfterJump(hold: FaultHold | null, readings: readonly CheckedReading[], earlierJumps: readonly number[]): { hold: FaultHold | null; readings: CheckedReading[] } {
  let current = hold ?? (earlierJumps.length > 0 ? { since: earlierJumps[0]! } : null);
  const marked = readings.map((reading) => {
    if (current !== null && reading.time > current.since) {
      const faultBits = reading.faultBits | FAULT_BITS["after-jump"];
      return { ...reading, fault: true, faultBits };
    }
    if (current === null && (reading.faultBits & FAULT_BITS.jump) !== 0) current = { since: reading.time };
    return reading;
  });
  return { hold: current, readings: marked };
}

/** A stored reading with its stored verdict, as an engineer's resolution of a jump reads it back. */
export type StoredVerdictReading = EvaluatedReading & { faultBits: number };

/** The verdict bits an accepted step takes back: the jump and the quarantine after it. */
const STEP_BITS = FAULT_BITS.jump | FAULT_BITS["after-jump"];

/**
 * The engineer accepts the jump as a real change: the quarantined readings (from the jump on,
 * in time order) are evaluated against the limits as if never set aside. Faulty readings skip the
 * machines without changing them, so the machines stand where they stood before the jump except for
 * which readings they have seen; that is rewound to just before it (times are whole milliseconds).
 */
export function acceptStep(setup: GaugeAlertSetup, state: GaugeEvaluationState, readings: readonly StoredVerdictReading[]) {
  const since = state.hold?.since ?? readings[0]?.time ?? null;
  if (since === null) return { state: { ...state, hold: null }, events: [] as QuantityEvent[], verdicts: new Map<number, number>() };
  const rewound: Partial<Record<Quantity, EpisodeState>> = {};
  for (const [quantity, episode] of Object.entries(state.episodes) as [Quantity, EpisodeState][]) rewound[quantity] = { ...episode, lastTime: since - 1 };
  const verdicts = new Map<number, number>();
  const checked: CheckedReading[] = readings.map((reading) => {
    const faultBits = reading.faultBits & ~STEP_BITS;
    verdicts.set(reading.time, faultBits);
    return { time: reading.time, value: reading.strain, fault: faultBits !== 0, faultBits };
  });
  const taken = takenIn(readings, checked);
  const { episodes, events } = evaluateQuantities(setup, rewound, checked, taken);
  // Readings older than the rewind that the machines had not yet seen stay unseen; the later lastTime of the two holds.
  for (const [quantity, episode] of Object.entries(episodes) as [Quantity, EpisodeState][]) {
    const before = state.episodes[quantity]?.lastTime ?? null;
    if (before !== null && (episode.lastTime === null || episode.lastTime < before)) episodes[quantity] = { ...episode, lastTime: before };
  }
  return { state: { ...state, episodes, hold: null }, events, verdicts };
}

/**
 * For each reading sensor health took in (`checked`), the stored reading whose values the limits
 * see, and whether limit evaluation must skip it: a sensor fault, or outside the gauge's rated
 * range. A time repeated within the batch is seen with its last reading's values and is skipped if
 * any of its readings is out of range.
 */
function takenIn(readings: readonly EvaluatedReading[], checked: readonly CheckedReading[]): { sources: EvaluatedReading[]; faults: boolean[] } {
  const sources: EvaluatedReading[] = [];
  const faults: boolean[] = [];
  for (const reading of readings) {
    const outOfRange = isOutOfRange(reading.flags);
    // Readings taken in come back in order, each the first reading of its time in the batch.
    const next = checked[sources.length];
    if (next !== undefined && next.time === reading.time) {
      sources.push(reading);
      faults.push(next.fault || outOfRange);
      continue;
    }
    const repeated = indexOfTime(checked, sources.length, reading.time);
    if (repeated === -1) continue;
    sources[repeated] = reading;
    faults[repeated] ||= outOfRange;
  }
  return { sources, faults };
}

/** Where `time` is among the first `count` readings, whose times strictly increase; -1 if absent. */
function indexOfTime(readings: readonly CheckedReading[], count: number, time: number): number {
  let low = 0;
  let high = count - 1;
  while (low <= high) {
    const middle = (low + high) >> 1;
    const at = readings[middle]!.time;
    if (at === time) return middle;
    if (at < time) low = middle + 1;
    else high = middle - 1;
  }
  return -1;
}
