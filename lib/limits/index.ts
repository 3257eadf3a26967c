/**
 * Limit evaluation and sensor health for one gauge. Pure functions over plain JSON state, no I/O.
 *
 *   const checked = validateLimits(proposed);                  // refuse with checked.problems
 *   const limits = checked.limits.filter((limit) => limit.quantity === "stress");
 *   const { state, events } = evaluateReadings(limits, episodeState, readings);
 *   // store the state with the readings; raise alerts for events
 *
 * `backtest(limits, history)` runs the same machine over past readings for the limits editor.
 * Late readings: see `replay`.
 */
export { LEVELS, QUANTITIES, levelRank, type Level, type Limit, type LimitInput, type Quantity } from "./limit";
export { validateLimits, type LimitField, type LimitProblem, type LimitProblemCode, type LimitSetValidation } from "./validate-limits";
export { clearBand, type ClearBand } from "./bounds";
export {
  evaluateReadings,
  initialEpisodeState,
  type EpisodeEvent,
  type EpisodeEventType,
  type EpisodeState,
  type Evaluation,
  type OpenEpisode,
  type Reading,
} from "./episode-machine";
export { backtest, replay, type Backtest, type Episode } from "./backtest";
