/**
 * Limit evaluation and sensor health for one gauge. Pure functions over plain JSON state, no I/O.
 *
 *   const checked = validateLimits(proposed);                  // refuse with checked.problems
 *   const health = inspectReadings(thresholds, healthState, samples);
 *   const limits = checked.limits.filter((limit) => limit.quantity === "stress");
 *   const { state, events } = evaluateReadings(limits, episodeState, health.readings);
 *   // store both states with the readings; raise alerts for events and health.findings
 *
 * `backtest(limits, history)` runs the same machine over past readings for the limits editor.
 * Late readings: see `replay`.
 */
export { LEVELS, QUANTITIES, ROSETTE_LIMIT_QUANTITIES, levelRank, type Level, type Limit, type LimitInput, type Quantity, type RosetteLimitQuantity } from "./limit";
export { limitLines, offScaleLines, rangeWithLines, valueAxisRange, type LimitLine, type OffScaleLine } from "./limit-lines";
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
export type { DetectorStep, FaultName, Sample, SensorFaultCode, SensorFinding } from "./sensor-health/finding";
export { FAULT_BITS, faultNames } from "./sensor-health/finding";
export { checkStale, type StaleThresholds } from "./sensor-health/stale";
export { stepFlatLine, type FlatLineState, type FlatLineThresholds } from "./sensor-health/flat-line";
export { stepJump, type JumpState, type JumpThresholds } from "./sensor-health/jump";
export { stepSensorRange, type SensorRangeThresholds } from "./sensor-health/sensor-range";
export {
  initialSensorHealthState,
  inspectReadings,
  type CheckedReading,
  type Inspection,
  type SensorHealthState,
  type SensorHealthThresholds,
} from "./sensor-health/inspect-readings";
