import { describe, expect, it } from "vitest";
import { backtest, evaluateReadings, initialEpisodeState, replay, type EpisodeState, type Limit, type Reading } from "@/lib/limits";
import { MINUTE, limitSet, series } from "./fixtures";

// Rules under test (common practice of alarm handling): open after `persistence` readings beyond,
// escalate within the episode, clear after `persistence` readings back inside by `hysteresis` (a
// dead band, so a signal hovering at the bound does not chatter).

function eventsOf(limits: Limit[], readings: Reading[]) {
  return evaluateReadings(limits, initialEpisodeState(), readings).events;
}

function summary(limits: Limit[], values: (number | null)[]): string[] {
  return eventsOf(limits, series(values)).map((event) => `${event.type} ${event.level} @${event.time / MINUTE}`);
}

const WATCH_100 = limitSet({ level: "watch", upper: 100 });

describe("opening and persistence", () => {
  it("persistence 1 opens on the first reading beyond the bound, and only strictly beyond", () => {
    expect(eventsOf(WATCH_100, series([100, 101]))).toEqual([
      { type: "opened", level: "watch", time: MINUTE, value: 101, bound: 100, peak: 101, peakAt: MINUTE },
    ]);
  });

  it("persistence 3 ignores shorter runs and opens on the third consecutive reading beyond", () => {
    const limits = limitSet({ level: "watch", upper: 100, persistence: 3 });
    expect(summary(limits, [150, 120, 90, 130, 120])).toEqual([]);
    const events = eventsOf(limits, series([150, 120, 90, 130, 125, 110]));
    // the peak is the run's furthest reading (130 at minute 3), not the one completing the run
    expect(events).toEqual([{ type: "opened", level: "watch", time: 5 * MINUTE, value: 110, bound: 100, peak: 130, peakAt: 3 * MINUTE }]);
  });

  it("a reading that stays beyond raises nothing more", () => {
    expect(summary(WATCH_100, [120, 130, 140, 125, 135])).toEqual(["opened watch @0"]);
  });
});

describe("hysteresis (dead band)", () => {
  const hovering = [99, 101, 99.5, 100.5, 99, 101, 99.8];

  it("without a dead band a value hovering at the bound flaps", () => {
    expect(summary(WATCH_100, hovering)).toEqual([
      "opened watch @1",
      "cleared watch @2",
      "opened watch @3",
      "cleared watch @4",
      "opened watch @5",
      "cleared watch @6",
    ]);
  });

  it("with a dead band the same values open once and clear only below upper − hysteresis", () => {
    const limits = limitSet({ level: "watch", upper: 100, hysteresis: 5 });
    expect(summary(limits, hovering)).toEqual(["opened watch @1"]);
    expect(summary(limits, [...hovering, 95.5, 95])).toEqual(["opened watch @1", "cleared watch @8"]);
  });

  it("clearing needs the lowest level's persistence of consecutive readings inside, a dead-band reading restarts it", () => {
    const limits = limitSet({ level: "watch", upper: 100, hysteresis: 10, persistence: 2 });
    expect(summary(limits, [120, 120, 80, 95, 80, 80])).toEqual(["opened watch @1", "cleared watch @5"]);
  });

  it("reports the clearing reading, the episode's bound and its peak", () => {
    const limits = limitSet({ level: "watch", upper: 100, hysteresis: 10 });
    const cleared = eventsOf(limits, series([130, 150, 90])).at(-1);
    expect(cleared).toEqual({ type: "cleared", level: "watch", time: 2 * MINUTE, value: 90, bound: 100, peak: 150, peakAt: MINUTE });
  });

  it("a new episode may open after clearing", () => {
    expect(summary(WATCH_100, [120, 50, 120])).toEqual(["opened watch @0", "cleared watch @1", "opened watch @2"]);
  });
});

describe("escalation", () => {
  const ladder = limitSet(
    { level: "watch", upper: 100, hysteresis: 5 },
    { level: "warning", upper: 150 },
    { level: "critical", upper: 200 },
  );

  it("rises watch → warning → critical within one episode opened once, and never falls back", () => {
    const values = [120, 160, 210, 230, 120, 160, 97, 94];
    expect(summary(ladder, values)).toEqual([
      "opened watch @0",
      "escalated warning @1",
      "escalated critical @2",
      "cleared critical @7",
    ]);
    const events = eventsOf(ladder, series(values));
    expect(events[2]).toMatchObject({ bound: 200, peak: 210 });
    expect(events[3]).toMatchObject({ bound: 200, peak: 230 });
  });

  it("opens straight at the most severe level whose persistence is met", () => {
    expect(summary(ladder, [250])).toEqual(["opened critical @0"]);
  });

  it("escalation waits for the higher level's own persistence", () => {
    const limits = limitSet({ level: "watch", upper: 100 }, { level: "critical", upper: 200, persistence: 2 });
    expect(summary(limits, [120, 250, 180, 250, 260])).toEqual(["opened watch @0", "escalated critical @4"]);
  });
});

describe("lower bounds", () => {
  const compression = limitSet({ level: "watch", lower: -100, hysteresis: 10 }, { level: "critical", lower: -200 });

  it("open below the lower bound, escalate further down, clear at lower + hysteresis", () => {
    const events = eventsOf(compression, series([-120, -250, -95, -90]));
    expect(events.map((event) => [event.type, event.level, event.bound, event.peak])).toEqual([
      ["opened", "watch", -100, -120],
      ["escalated", "critical", -200, -250],
      ["cleared", "critical", -200, -250],
    ]);
    expect(events[2]!.time).toBe(3 * MINUTE);
  });

  it("a set bounding both sides opens on either", () => {
    const both = limitSet({ level: "watch", upper: 100, lower: -100 });
    expect(summary(both, [0, -150, 0, 150])).toEqual(["opened watch @1", "cleared watch @2", "opened watch @3"]);
  });
});

describe("sensor-fault readings", () => {
  const persistent = limitSet({ level: "watch", upper: 100, persistence: 3 });

  it("neither break nor extend a persistence run", () => {
    expect(summary(persistent, [120, null, 120, 120])).toEqual(["opened watch @3"]);
    expect(summary(persistent, [120, null, null, 120])).toEqual([]);
  });

  it("do not clear an open episode, whatever their value", () => {
    const limits = limitSet({ level: "watch", upper: 100 });
    const readings: Reading[] = [
      { time: 0, value: 120 },
      { time: 1, value: 0, fault: true },
      { time: 2, value: Number.NaN },
    ];
    expect(eventsOf(limits, readings).map((event) => event.type)).toEqual(["opened"]);
  });
});

describe("late and repeated readings", () => {
  const limits = limitSet({ level: "watch", upper: 100, persistence: 2 });

  it("the live machine ignores a re-posted batch and readings at or before the last one", () => {
    const first = evaluateReadings(limits, initialEpisodeState(), series([120, 130]));
    expect(first.events).toHaveLength(1);
    const again = evaluateReadings(limits, first.state, [...series([120, 130]), { time: 30_000, value: 50 }]);
    expect(again).toEqual({ state: first.state, events: [] });
  });

  it("replay from a checkpoint takes a late reading into account", () => {
    const stored = [{ time: 0, value: 120 }, { time: 2 * MINUTE, value: 120 }];
    const live = evaluateReadings(limits, initialEpisodeState(), stored);
    expect(live.events.map((event) => event.type)).toEqual(["opened"]);
    const late = { time: MINUTE, value: 50 };
    expect(evaluateReadings(limits, live.state, [late]).events).toEqual([]);
    // the late reading broke the run: recomputed over the window, no episode opened
    expect(replay(limits, [...stored, late], initialEpisodeState()).events).toEqual([]);
  });

  it("replay continues from a saved state as if the readings had come in one batch", () => {
    const readings = series([120, 120, 40, 40, 130, 130]);
    const checkpoint = evaluateReadings(limits, initialEpisodeState(), readings.slice(0, 3)).state;
    const rest = replay(limits, [...readings.slice(3)].reverse(), checkpoint);
    expect([...eventsOf(limits, readings.slice(0, 3)), ...rest.events]).toEqual(eventsOf(limits, readings));
  });
});

describe("state", () => {
  it("is plain JSON and is not modified by evaluation", () => {
    const frozen: EpisodeState = deepFreeze(evaluateReadings(WATCH_100, initialEpisodeState(), series([120])).state);
    const next = evaluateReadings(WATCH_100, frozen, series([50], MINUTE)).state;
    expect(JSON.parse(JSON.stringify(frozen))).toEqual(frozen);
    expect(frozen.episode).toEqual({ level: "watch", openedAt: 0, bound: 100 });
    expect(next.episode).toBeNull();
  });
});

describe("backtest", () => {
  it("lists each episode with the level reached, its peak and when it cleared", () => {
    const limits = limitSet({ level: "watch", upper: 100 }, { level: "warning", upper: 150 });
    const { episodes } = backtest(limits, series([120, 90, 130, 170, 160, 50, 110, 140]));
    expect(episodes).toEqual([
      { openedAt: 0, level: "watch", peak: 120, clearedAt: MINUTE },
      { openedAt: 2 * MINUTE, level: "warning", peak: 170, clearedAt: 5 * MINUTE },
      { openedAt: 6 * MINUTE, level: "watch", peak: 140, clearedAt: null },
    ]);
  });
});

function deepFreeze<Value>(value: Value): Value {
  if (value && typeof value === "object") Object.values(value).forEach(deepFreeze);
  return Object.freeze(value);
}
