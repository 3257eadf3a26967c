import { evaluateReadings, initialEpisodeState, type EpisodeEvent, type EpisodeState, type Evaluation, type Reading } from "./episode-machine";
import type { Level, Limit } from "./limit";

/**
 * Late readings. The live machine ignores any reading at or before `state.lastTime`, so a late
 * reading never corrupts the stored state, and duplicates cost nothing. To take a late reading into
 * account, the caller keeps checkpoints (the state saved after each batch, with its `lastTime`),
 * stores the late reading, and replays every stored reading after the newest checkpoint older than
 * it; the replayed events replace those recorded since that checkpoint. Readings are sorted here
 * (stably, so of two readings with the same time the first given is kept), hence a replay over the
 * same data gives exactly what live evaluation gave when the data arrived in order.
 */
export function replay(limits: readonly Limit<string>[], readings: readonly Reading[], checkpoint: EpisodeState = initialEpisodeState()): Evaluation {
  // the machine ignores readings without a finite time; leaving them out keeps the comparator consistent
  const inTimeOrder = readings.filter((reading) => Number.isFinite(reading.time)).sort((a, b) => a.time - b.time);
  return evaluateReadings(limits, checkpoint, inTimeOrder);
}

/** One alert episode as a backtest shows it; `clearedAt` null when still open at the end. */
export interface Episode {
  readonly openedAt: number;
  readonly level: Level;
  readonly peak: number;
  readonly clearedAt: number | null;
}

export interface Backtest extends Evaluation {
  readonly episodes: Episode[];
}

/** What proposed limits would have raised over past readings, by the same machine as live ingestion. */
export function backtest(limits: readonly Limit<string>[], readings: readonly Reading[]): Backtest {
  const evaluation = replay(limits, readings);
  return { ...evaluation, episodes: episodesOf(evaluation) };
}

function episodesOf({ events, state }: Evaluation): Episode[] {
  const episodes: Episode[] = [];
  for (const event of events) {
    if (event.type === "opened") episodes.push({ openedAt: event.time, level: event.level, peak: event.peak, clearedAt: null });
    else episodes[episodes.length - 1] = endOf(episodes.at(-1)!, event);
  }
  const last = episodes.at(-1);
  // the peak of a still-open episode may have grown since its last event
  if (last && last.clearedAt === null && state.peak !== null) episodes[episodes.length - 1] = { ...last, peak: state.peak };
  return episodes;
}

function endOf(episode: Episode, event: EpisodeEvent): Episode {
  return { ...episode, level: event.level, peak: event.peak, clearedAt: event.type === "cleared" ? event.time : null };
}
