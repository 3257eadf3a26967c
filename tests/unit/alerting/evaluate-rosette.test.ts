import { describe, expect, it } from "vitest";
import { evaluateRosette, initialRosetteEvaluationState, type MatchedInstant } from "@/lib/alerting/evaluate-rosette";
import { Flag } from "@/lib/mechanics";

const MINUTE = 60_000;
const setup = {
  layout: "rectangular",
  material: { E: 200_000, nu: 0.3, alpha: 12 },
  limits: [{ quantity: "vonMises" as const, level: "watch" as const, upper: 100, hysteresis: 0, persistence: 2 }],
};
// εa = 500, εb = 300, εc = −100 µε on steel: σvm = 101.81 MPa, worked by hand in
// tests/integration/rosette-limits.test.ts (von Mises plane stress, common practice).
const above = (i: number, flagsOfA = 0): MatchedInstant => ({ time: i * 10 * MINUTE, strains: [500, 300, -100], flags: [flagsOfA, 0, 0] });
const none = new Set<number>();

describe("one rosette's alert evaluation", () => {
  it("opens once the persistence run is complete", () => {
    const { events, state } = evaluateRosette(setup, initialRosetteEvaluationState(), [above(0), above(1)], [none, none, none]);
    expect(events.map((e) => [e.type, e.time, e.quantity])).toEqual([["opened", 10 * MINUTE, "vonMises"]]);
    expect(events[0]!.value).toBeCloseTo(101.81, 2);
    expect(state.lastTime).toBe(10 * MINUTE);
  });

  it("skips an instant with a faulty gauge reading without breaking the run, whether sensor health or the rated range says so", () => {
    const byHealth = evaluateRosette(setup, initialRosetteEvaluationState(), [above(0), above(1), above(2)], [none, none, new Set([10 * MINUTE])]);
    expect(byHealth.events.map((e) => e.time)).toEqual([20 * MINUTE]);
    const byFlags = evaluateRosette(setup, initialRosetteEvaluationState(), [above(0), above(1, Flag.outOfRange), above(2)], [none, none, none]);
    expect(byFlags.events.map((e) => e.time)).toEqual([20 * MINUTE]);
  });

  it("skips instants at or before the last one taken in", () => {
    const first = evaluateRosette(setup, initialRosetteEvaluationState(), [above(0), above(1)], [none, none, none]);
    const again = evaluateRosette(setup, first.state, [above(1)], [none, none, none]);
    expect(again.events).toEqual([]);
    expect(again.state.lastTime).toBe(10 * MINUTE);
  });
});
