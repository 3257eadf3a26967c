import { createRainflowCounter, type Cycle } from "./rainflow";

/**
 * One gauge's stress history as fatigue counting takes it: readings in time order, faulty ones
 * already left out, split into zero epochs. A new zero reading moves every later stress by a
 * step the structure never made, so each epoch is a history of its own: its residue counts as
 * half cycles when it ends (ASTM E1049-85 (2017), 5.4.4) and is never joined to the next epoch's.
 *
 * Alongside, the time the readings cover: the sum of the intervals between consecutive readings
 * no longer than `maxGapMs`. A longer silence is a logger outage whose cycles nobody saw, so a
 * damage rate divided by the covered time is not diluted by it.
 */
export interface FatigueHistory {
  push(time: number, stress: number): void;
  /** Cycles counted so far, handed over and forgotten (see RainflowCounter.takeCounted). */
  takeCounted(): Cycle[];
  /** Ends the last epoch: its remaining cycles and residue. */
  finish(): Cycle[];
  coverage(): HistoryCoverage;
}

export interface HistoryCoverage {
  /** Sum of the intervals between readings no longer than the allowed gap. */
  coveredMs: number;
  /** Intervals longer than the allowed gap, left out of `coveredMs`. */
  gaps: number;
  gapMs: number;
  /** Zero epochs that held readings: each was counted on its own. */
  epochs: number;
}

/** `epochStarts`: times from which a new zero reading applies, in any order. */
export function createFatigueHistory(epochStarts: readonly number[], maxGapMs: number): FatigueHistory {
  if (!(maxGapMs > 0)) throw new RangeError(`The longest interval counted as covered must be positive, got ${maxGapMs}`);
  const starts = [...epochStarts].sort((a, b) => a - b);
  const counter = createRainflowCounter();
  let pending: Cycle[] = [];
  let nextStart = 0;
  let previousTime: number | null = null;
  const coverage: HistoryCoverage = { coveredMs: 0, gaps: 0, gapMs: 0, epochs: 0 };

  function enterEpochOf(time: number) {
    let crossed = false;
    while (nextStart < starts.length && starts[nextStart]! <= time) {
      nextStart++;
      crossed = true;
    }
    if (previousTime === null) coverage.epochs = 1;
    else if (crossed) {
      pending = pending.concat(counter.finish());
      coverage.epochs++;
    }
  }

  return {
    push(time, stress) {
      if (previousTime !== null && time <= previousTime) throw new RangeError(`Readings must come in time order: ${time} after ${previousTime}`);
      enterEpochOf(time);
      if (previousTime !== null) {
        const interval = time - previousTime;
        if (interval <= maxGapMs) coverage.coveredMs += interval;
        else {
          coverage.gaps++;
          coverage.gapMs += interval;
        }
      }
      previousTime = time;
      counter.push(stress);
    },
    takeCounted() {
      const taken = pending.concat(counter.takeCounted());
      pending = [];
      return taken;
    },
    finish() {
      const taken = pending.concat(counter.finish());
      pending = [];
      return taken;
    },
    coverage: () => ({ ...coverage }),
  };
}
