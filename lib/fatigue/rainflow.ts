import { createReversalFilter, type ReversalFilterState } from "./reversals";

/** One counted cycle (count 1) or half cycle (count 0.5), in the units of the history. */
export interface Cycle {
  range: number;
  mean: number;
  count: number;
}

export interface RainflowCounter {
  push(value: number): void;
  /**
   * Hands over the cycles counted so far and forgets them, so a caller paging through a long
   * history can aggregate page by page and keep memory bounded.
   */
  takeCounted(): Cycle[];
  /**
   * Ends the history: returns the cycles not yet taken, followed by the residue as half cycles.
   * The counter is then empty and may count a new history.
   */
  finish(): Cycle[];
  /** Reversals waiting for a match: the only state that grows with the history. */
  readonly unmatchedReversals: number;
}

function cycleBetween(from: number, to: number, count: number): Cycle {
  return { range: Math.abs(to - from), mean: (from + to) / 2, count };
}

/**
 * What a counter carries from one block of a history to the next: the unmatched reversals (the
 * residue, oldest first) and the reversal filter's state. Counting block after block from it
 * gives the cycles of the joined history.
 */
export interface RainflowResidue extends ReversalFilterState {
  reversals: number[];
}

/** A cycle handed over as its two ends, so a caller binning millions of them allocates nothing. */
export type CycleSink = (from: number, to: number, count: number) => void;

export interface RainflowStream {
  push(value: number): void;
  /** The state to resume from with the next block; the stream may go on being used. */
  residue(): RainflowResidue;
  /** Ends the history: the residue goes to the sink as half cycles and the stream is empty again. */
  finish(): void;
  readonly unmatchedReversals: number;
}

/**
 * Rainflow counting per ASTM E1049-85 (reapproved 2017), 5.4.4, for a history not assumed to be
 * periodic. The stack holds the unmatched reversals; its bottom is the starting point S.
 * Memory is the stack, never the samples.
 */
export function createRainflowStream(onCycle: CycleSink, resume?: RainflowResidue): RainflowStream {
  // A plain array used with its own length: closing a cycle moves two numbers instead of splicing,
  // which would allocate the removed elements on every cycle of a noisy kHz signal.
  const stack: number[] = resume ? [...resume.reversals] : [];
  let size = stack.length;

  function countAgainstStack(reversal: number) {
    stack[size++] = reversal;
    while (size >= 3) {
      const yStart = stack[size - 3]!;
      const yEnd = stack[size - 2]!;
      const xEnd = stack[size - 1]!;
      // Step 3: while X < Y, a later, larger range may still enclose Y, so Y waits.
      if (Math.abs(xEnd - yEnd) < Math.abs(yEnd - yStart)) break;
      if (size === 3) {
        // Step 5: Y holds S, so only its first half is closed; S moves to Y's second point.
        onCycle(yStart, yEnd, 0.5);
        stack[0] = yEnd;
        stack[1] = xEnd;
        size = 2;
      } else {
        // Step 4: Y is enclosed by X, a full cycle.
        onCycle(yStart, yEnd, 1);
        stack[size - 3] = xEnd;
        size -= 2;
      }
    }
  }

  const reversals = createReversalFilter(countAgainstStack, resume);

  return {
    push: reversals.push,
    residue: () => ({ reversals: stack.slice(0, size), ...reversals.state() }),
    finish() {
      reversals.flush();
      // Step 6: every range left between unmatched reversals is a half cycle.
      for (let i = 1; i < size; i++) onCycle(stack[i - 1]!, stack[i]!, 0.5);
      size = 0;
    },
    get unmatchedReversals() {
      return size;
    },
  };
}

/** A rainflow stream that collects its cycles as objects, for histories of readings minutes apart. */
export function createRainflowCounter(): RainflowCounter {
  let counted: Cycle[] = [];
  const stream = createRainflowStream((from, to, count) => counted.push(cycleBetween(from, to, count)));

  function takeCounted(): Cycle[] {
    const taken = counted;
    counted = [];
    return taken;
  }

  return {
    push: stream.push,
    takeCounted,
    finish() {
      stream.finish();
      return takeCounted();
    },
    get unmatchedReversals() {
      return stream.unmatchedReversals;
    },
  };
}

/** Counts a whole history at once; the values are read one at a time, never stored. */
export function rainflow(values: Iterable<number>): Cycle[] {
  const counter = createRainflowCounter();
  for (const value of values) counter.push(value);
  return counter.finish();
}
