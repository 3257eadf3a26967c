/**
 * The one rule for late and repeated readings, shared by limit evaluation and sensor health: only a
 * reading strictly after the last one taken in counts. Re-posted batches are therefore harmless,
 * and late readings wait for a replay from a checkpoint.
 */
export function isNewer(lastTime: number | null, time: number): boolean {
  return Number.isFinite(time) && (lastTime === null || time > lastTime);
}
