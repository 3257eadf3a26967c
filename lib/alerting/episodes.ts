import type { EpisodeEvent, Level, Quantity } from "@/lib/limits";

/** An alert episode as the limits editor lists it: when it opened, how far it rose, when it cleared. */
export type AlertEpisode<Q extends string = Quantity> = { quantity: Q; level: Level; openedAt: number; peak: number; clearedAt: number | null };

/** A gauge's or a rosette's events, all quantities together in time order. */
export function episodesOf<Q extends string>(events: readonly (EpisodeEvent & { quantity: Q })[]): AlertEpisode<Q>[] {
  const episodes: AlertEpisode<Q>[] = [];
  const open = new Map<Q, AlertEpisode<Q>>();
  for (const event of events) {
    const current = open.get(event.quantity);
    if (event.type === "opened") {
      const episode = { quantity: event.quantity, level: event.level, openedAt: event.time, peak: event.peak, clearedAt: null };
      episodes.push(episode);
      open.set(event.quantity, episode);
    } else if (current) {
      current.level = event.type === "escalated" ? event.level : current.level;
      current.peak = event.peak;
      if (event.type === "cleared") {
        current.clearedAt = event.time;
        open.delete(event.quantity);
      }
    }
  }
  return episodes;
}
