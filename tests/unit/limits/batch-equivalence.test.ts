import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  LEVELS,
  backtest,
  evaluateReadings,
  initialEpisodeState,
  levelRank,
  validateLimits,
  type EpisodeEvent,
  type EpisodeState,
  type Limit,
  type LimitInput,
  type Reading,
} from "@/lib/limits";

// An engineer trusts a backtest only if it raises what live ingestion would: the two must agree on the
// same data, whatever the batch sizes and however often the state is stored and read back.

const levelArb = fc.record({
  side: fc.constantFrom("upper", "lower", "both"),
  step: fc.integer({ min: 0, max: 80 }),
  hysteresis: fc.integer({ min: 0, max: 20 }),
  persistence: fc.integer({ min: 1, max: 3 }),
});

/** Each present level sits `step` further out than the milder one, so the set escalates outward. */
const limitsArb = fc
  .tuple(fc.subarray([...LEVELS], { minLength: 1 }), fc.array(levelArb, { minLength: 3, maxLength: 3 }))
  .map(([levels, shapes]) => {
    let reach = 100;
    return levels.map((level, index): LimitInput => {
      const shape = shapes[index]!;
      reach += shape.step;
      return {
        quantity: "stress",
        level,
        upper: shape.side === "lower" ? undefined : reach,
        lower: shape.side === "upper" ? undefined : -reach,
        hysteresis: shape.hysteresis,
        persistence: shape.persistence,
      };
    });
  })
  .map(validateLimits)
  .filter((result) => result.ok)
  .map((result) => (result.ok ? result.limits : []));

/** Times never go back but may repeat, as when a batch is posted twice. */
const readingsArb = fc
  .array(
    fc.record({
      gap: fc.integer({ min: 0, max: 3 }),
      value: fc.integer({ min: -350, max: 350 }),
      fault: fc.boolean(),
    }),
    { maxLength: 200 },
  )
  .map((steps) => {
    let time = 0;
    return steps.map(({ gap, value, fault }): Reading => ({ time: (time += gap), value, fault: fault && value % 5 === 0 }));
  });

function liveInBatches(limits: Limit[], readings: Reading[], sizes: number[]) {
  let stored = JSON.stringify(initialEpisodeState());
  const events: EpisodeEvent[] = [];
  for (let start = 0, batch = 0; start < readings.length; batch++) {
    const end = start + sizes[batch % sizes.length]!;
    const result = evaluateReadings(limits, JSON.parse(stored) as EpisodeState, readings.slice(start, end));
    events.push(...result.events);
    stored = JSON.stringify(result.state);
    start = end;
  }
  return { events, state: JSON.parse(stored) as EpisodeState };
}

describe("live evaluation in batches and backtest", () => {
  it("raise exactly the same events and end in the same state", () => {
    const sizesArb = fc.array(fc.integer({ min: 1, max: 25 }), { minLength: 1, maxLength: 10 });
    fc.assert(
      fc.property(limitsArb, readingsArb, sizesArb, (limits, readings, sizes) => {
        const live = liveInBatches(limits, readings, sizes);
        const preview = backtest(limits, readings);
        expect(live.events).toEqual(preview.events);
        expect(live.state).toEqual(preview.state);
      }),
      { numRuns: 300 },
    );
  });

  it("produce well-formed episodes: opened, then only rising escalations, then at most one clearing", () => {
    fc.assert(
      fc.property(limitsArb, readingsArb, (limits, readings) => {
        let open: EpisodeEvent | null = null;
        for (const event of backtest(limits, readings).events) {
          if (event.type === "opened") expect(open).toBeNull();
          else expect(open).not.toBeNull();
          if (event.type === "escalated") expect(levelRank(event.level)).toBeGreaterThan(levelRank(open!.level));
          open = event.type === "cleared" ? null : event;
        }
      }),
      { numRuns: 300 },
    );
  });
});
