import { clearBand, crossedBound, distanceOutside, isInside, type ClearBand } from "./bounds";
import { byLevel, levelRank, type Level, type Limit } from "./limit";
import { isNewer } from "./time-order";

/**
 * One gauge's readings of one quantity, in time order. `fault` marks a reading the sensor-health
 * checks rejected: it is skipped as if never taken, so it neither breaks nor extends a persistence
 * run. A dead channel must not page anyone, and a single glitch inside a real exceedance must not
 * restart the count either.
 */
export interface Reading {
  readonly time: number;
  readonly value: number;
  readonly fault?: boolean;
}

export type EpisodeEventType = "opened" | "escalated" | "cleared";

/**
 * `bound` is the bound crossed for "opened" and "escalated", and for "cleared" the bound of the
 * level the episode had reached. `peak` is the most extreme value of the episode so far, counting
 * the readings of the persistence run that opened it.
 */
export interface EpisodeEvent {
  readonly type: EpisodeEventType;
  readonly level: Level;
  readonly time: number;
  readonly value: number;
  readonly bound: number;
  readonly peak: number;
  readonly peakAt: number;
}

export interface OpenEpisode {
  readonly level: Level;
  readonly openedAt: number;
  readonly bound: number;
}

/**
 * Everything the machine remembers between batches; plain JSON, stored by the caller per gauge and
 * quantity. `lastTime` is the time of the last reading taken in, fault or not: anything at or
 * before it is ignored, which makes re-posted batches harmless (see `replay` for late readings).
 */
export interface EpisodeState {
  readonly lastTime: number | null;
  /** Consecutive usable readings beyond each level's bounds. */
  readonly beyondRuns: Readonly<Record<Level, number>>;
  /** Consecutive usable readings inside the clear band. */
  readonly insideRun: number;
  /** Most extreme value since the current excursion began; null when there is none. */
  readonly peak: number | null;
  /** Time of the reading that gave `peak`. */
  readonly peakAt: number | null;
  readonly episode: OpenEpisode | null;
}

export interface Evaluation {
  readonly state: EpisodeState;
  readonly events: EpisodeEvent[];
}

export function initialEpisodeState(): EpisodeState {
  return { lastTime: null, beyondRuns: { watch: 0, warning: 0, critical: 0 }, insideRun: 0, peak: null, peakAt: null, episode: null };
}

interface Ladder {
  /** Mildest level first. */
  readonly limits: readonly Limit<string>[];
  readonly band: ClearBand;
  /** Clearing needs as many readings back inside as the lowest level needs to open. */
  readonly clearPersistence: number;
}

type MutableState = { -readonly [Key in keyof EpisodeState]: EpisodeState[Key] } & { beyondRuns: Record<Level, number> };

/**
 * Feeds a batch to the machine. `limits` are one quantity's validated limits (`validateLimits`).
 * The state passed in is not modified. When the limits change, start again from
 * `initialEpisodeState()` or replay from a checkpoint: an open episode keeps the level it reached.
 */
export function evaluateReadings(limits: readonly Limit<string>[], state: EpisodeState, readings: Iterable<Reading>): Evaluation {
  const ladder = toLadder(limits);
  const current: MutableState = { ...state, beyondRuns: { ...state.beyondRuns } };
  const events: EpisodeEvent[] = [];
  // A local, stored once at the end: a time written to the state per reading would be boxed each time.
  let lastTime = state.lastTime;
  for (const reading of readings) {
    if (!isNewer(lastTime, reading.time)) continue;
    lastTime = reading.time;
    if (reading.fault || !Number.isFinite(reading.value) || ladder.limits.length === 0) continue;
    const event = advance(ladder, current, reading);
    if (event) events.push(event);
  }
  current.lastTime = lastTime;
  return { state: current, events };
}

function toLadder(limits: readonly Limit<string>[]): Ladder {
  const sorted = byLevel(limits);
  return { limits: sorted, band: clearBand(sorted), clearPersistence: sorted[0]?.persistence ?? 1 };
}

function advance(ladder: Ladder, state: MutableState, reading: Reading): EpisodeEvent | null {
  countRuns(ladder, state, reading);
  if (state.episode === null) return open(ladder, state, reading);
  return escalate(ladder, state, reading) ?? clear(ladder, state, reading);
}

function countRuns(ladder: Ladder, state: MutableState, { value, time }: Reading): void {
  let beyondAny = false;
  for (const limit of ladder.limits) {
    const beyond = crossedBound(limit, value) !== null;
    state.beyondRuns[limit.level] = beyond ? state.beyondRuns[limit.level] + 1 : 0;
    beyondAny ||= beyond;
  }
  state.insideRun = isInside(ladder.band, value) ? state.insideRun + 1 : 0;
  if (!beyondAny && state.episode === null) {
    state.peak = null;
    state.peakAt = null;
  } else if (state.peak === null || distanceOutside(ladder.band, value) > distanceOutside(ladder.band, state.peak)) {
    state.peak = value;
    state.peakAt = time;
  }
}

/** The most severe limit whose persistence run is complete, above `aboveRank`. */
function confirmedLimit(ladder: Ladder, state: MutableState, aboveRank: number): Limit<string> | null {
  for (let index = ladder.limits.length - 1; index >= 0; index--) {
    const limit = ladder.limits[index]!;
    if (levelRank(limit.level) <= aboveRank) return null;
    if (state.beyondRuns[limit.level] >= limit.persistence) return limit;
  }
  return null;
}

function open(ladder: Ladder, state: MutableState, reading: Reading): EpisodeEvent | null {
  const limit = confirmedLimit(ladder, state, -1);
  return limit && enterLevel("opened", limit, state, reading, reading.time);
}

function escalate(ladder: Ladder, state: MutableState, reading: Reading): EpisodeEvent | null {
  const episode = state.episode!;
  const limit = confirmedLimit(ladder, state, levelRank(episode.level));
  return limit && enterLevel("escalated", limit, state, reading, episode.openedAt);
}

function enterLevel(type: "opened" | "escalated", limit: Limit<string>, state: MutableState, reading: Reading, openedAt: number): EpisodeEvent {
  // a complete run includes this reading, so it is beyond this limit
  const bound = crossedBound(limit, reading.value)!;
  state.episode = { level: limit.level, openedAt, bound };
  return { type, level: limit.level, time: reading.time, value: reading.value, bound, peak: state.peak!, peakAt: state.peakAt! };
}

function clear(ladder: Ladder, state: MutableState, reading: Reading): EpisodeEvent | null {
  if (state.insideRun < ladder.clearPersistence) return null;
  const { level, bound } = state.episode!;
  const event: EpisodeEvent = { type: "cleared", level, time: reading.time, value: reading.value, bound, peak: state.peak!, peakAt: state.peakAt! };
  state.episode = null;
  state.peak = null;
  state.peakAt = null;
  return event;
}
