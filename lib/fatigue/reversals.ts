/**
 * Streaming reduction of a sampled history to its reversals (peaks and valleys), the input that
 * rainflow counting expects (ASTM E1049-85 (2017), 3.1 and 5.4.1). Repeated values and points
 * on a monotone run are dropped; the first and last samples count as reversals because the
 * history is not assumed to continue beyond them.
 */
export interface ReversalFilter {
  push(value: number): void;
  /** Emits the last sample, which only the end of the history confirms as a reversal. */
  flush(): void;
  /** Where the filter stands, so a history cut into blocks can go on where the last block stopped. */
  state(): ReversalFilterState;
}

/** The newest extreme of the current run (null before the first sample) and the run's direction (−1, 0, 1). */
export interface ReversalFilterState {
  candidate: number | null;
  direction: number;
}

export function createReversalFilter(onReversal: (value: number) => void, resume?: ReversalFilterState): ReversalFilter {
  // The newest extreme of the current run: it becomes a reversal once the signal turns back.
  let candidate: number | undefined = resume?.candidate ?? undefined;
  let direction = resume?.direction ?? 0;

  return {
    push(value) {
      if (!Number.isFinite(value)) throw new RangeError(`Rainflow input must be finite, got ${value}`);
      if (candidate === undefined) {
        candidate = value;
        return;
      }
      const step = Math.sign(value - candidate);
      if (step === 0) return;
      if (step !== direction) {
        onReversal(candidate);
        direction = step;
      }
      candidate = value;
    },
    flush() {
      // A history that never moved has no range, so its single level is not a reversal.
      if (candidate !== undefined && direction !== 0) onReversal(candidate);
      candidate = undefined;
      direction = 0;
    },
    state: () => ({ candidate: candidate ?? null, direction }),
  };
}
