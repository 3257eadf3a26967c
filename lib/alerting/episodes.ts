import type { Level, Quantity } from "@/lib/limits";
import type { QuantityEvent } from "./evaluate-gauge";

/** An alert episode as the limits editor lists it: when it opened, how far it rose, when it cleared. */
export type AlertEpisode = { quantity: Quantity; level: Level; openedAt: number; peak: number; clearedAt: number | null };

export function episodesOf(events: readonly QuantityEvent[]): AlertEpisode[] {
  const episodes: AlertEpisode[] = [];
  const open = new Map<Quantity, AlertEpisode>();
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
