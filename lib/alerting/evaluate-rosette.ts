import { evaluateReadings, initialEpisodeState, type EpisodeEvent, type EpisodeState, type Limit, type Reading, type RosetteLimitQuantity } from "@/lib/limits";
import { analyseRosette, isOutOfRange, type Material } from "@/lib/mechanics";
import { EVALUATION_STATE_VERSION } from "./evaluation-state";

/**
 * One rosette's limit evaluation over the instants at which its three gauges all have a reading.
 * Live ingestion (in time or replayed from a checkpoint) and the limits editor's backtest both run
 * exactly this.
 */

/** Per quantity, as the machine left it; `lastTime` is the last matched instant taken in. */
export type RosetteEvaluationState = { version: typeof EVALUATION_STATE_VERSION; lastTime: number | null; episodes: Partial<Record<RosetteLimitQuantity, EpisodeState>> };

export type RosetteQuantityEvent = EpisodeEvent & { quantity: RosetteLimitQuantity };

export type RosetteAlertSetup = {
  layout: string;
  /** Gauge a's, as for the rosette's series. */
  material: Material;
  limits: readonly Limit<RosetteLimitQuantity>[];
};

/** The three gauges' stored readings at one instant, gauge a first: strains µε and mechanics flags. */
export type MatchedInstant = { time: number; strains: [number, number, number]; flags: [number, number, number] };

/** For gauges a, b and c, the times of readings their sensor health took as faults. */
export type FaultTimesOfGauges = readonly [ReadonlySet<number>, ReadonlySet<number>, ReadonlySet<number>];

export function initialRosetteEvaluationState(): RosetteEvaluationState {
  return { version: EVALUATION_STATE_VERSION, lastTime: null, episodes: {} };
}

/** A principal stress from a faulty strain is no measurement: the instant is skipped as the gauge skips the reading. */
function isFaulty(instant: MatchedInstant, faultTimes: FaultTimesOfGauges): boolean {
  for (let gauge = 0; gauge < 3; gauge++) {
    if (isOutOfRange(instant.flags[gauge]!) || faultTimes[gauge]!.has(instant.time)) return true;
  }
  return false;
}

/** `instants` in time order; those at or before `state.lastTime` are skipped, as the episode machine does. */
export function evaluateRosette(
  setup: RosetteAlertSetup,
  state: RosetteEvaluationState,
  instants: readonly MatchedInstant[],
  faultTimes: FaultTimesOfGauges,
): { state: RosetteEvaluationState; events: RosetteQuantityEvent[] } {
  const analyses = instants.map((instant) => ({
    time: instant.time,
    fault: isFaulty(instant, faultTimes),
    analysis: analyseRosette(setup.layout, instant.strains, setup.material),
  }));
  const episodes = { ...state.episodes };
  const events: RosetteQuantityEvent[] = [];
  for (const quantity of new Set(setup.limits.map((limit) => limit.quantity))) {
    // an instant the analysis refuses (a non-finite strain) is skipped as a faulty reading would be
    const readings: Reading[] = analyses.map(({ time, fault, analysis }) =>
      analysis.ok ? { time, value: analysis[quantity], fault } : { time, value: Number.NaN, fault: true },
    );
    const evaluation = evaluateReadings(
      setup.limits.filter((limit) => limit.quantity === quantity),
      episodes[quantity] ?? initialEpisodeState(),
      readings,
    );
    episodes[quantity] = evaluation.state;
    events.push(...evaluation.events.map((event) => ({ ...event, quantity })));
  }
  events.sort((a, b) => a.time - b.time);
  const last = instants.at(-1)?.time ?? null;
  const lastTime = last !== null && (state.lastTime === null || last > state.lastTime) ? last : state.lastTime;
  return { state: { version: EVALUATION_STATE_VERSION, lastTime, episodes }, events };
}
