import { describe, expect, it } from "vitest";
import { acceptStep, defaultHealthThresholds, evaluateGauge, type EvaluatedReading } from "@/lib/alerting/evaluate-gauge";
import { initialGaugeEvaluationState, parseGaugeEvaluationState, restartAtNewZero } from "@/lib/alerting/evaluation-state";
import { FAULT_BITS, type Limit } from "@/lib/limits";

const MINUTE = 60_000;
const strainLimits: Limit[] = [{ quantity: "strain", level: "watch", upper: 500, hysteresis: 0, persistence: 1 }];
const setup = { limits: strainLimits, yieldStress: 355, health: defaultHealthThresholds("microstrain") };
// Steel, E = 200 GPa: σ = E·ε (Hooke's law).
const reading = (i: number, strain: number): EvaluatedReading => ({ time: i * 10 * MINUTE, raw: strain + 0.01 * i, strain, stress: strain * 0.2, flags: 0, residual: null });

describe("stored evaluation state", () => {
  it("is read back only in the shape and version this build writes", () => {
    const state = evaluateGauge(setup, initialGaugeEvaluationState(), [reading(0, 100), reading(1, 600)]).state;
    expect(parseGaugeEvaluationState(JSON.parse(JSON.stringify(state)))).toEqual(state);
    expect(parseGaugeEvaluationState({ ...state, version: 1 })).toBeNull();
    expect(parseGaugeEvaluationState({ episodes: {}, health: state.health })).toBeNull();
    expect(parseGaugeEvaluationState({ ...state, episodes: { strain: { lastTime: "yesterday" } } })).toBeNull();
    expect(parseGaugeEvaluationState(null)).toBeNull();
  });
});

describe("a jump", () => {
  // 1 900 µε between two readings is more than the 1 500 µε default check (a structure in service does not move that fast: common practice).
  const readings = [reading(0, 100), reading(1, 100), reading(2, 2000), reading(3, 2010), reading(4, 2020)];

  it("holds every later reading as a fault until resolved, so no limit alert opens", () => {
    const result = evaluateGauge(setup, initialGaugeEvaluationState(), readings);
    expect(result.events).toEqual([]);
    expect(result.state.hold).toEqual({ since: 20 * MINUTE });
    expect([...result.verdicts]).toEqual([
      [20 * MINUTE, FAULT_BITS.jump],
      [30 * MINUTE, FAULT_BITS["after-jump"]],
      [40 * MINUTE, FAULT_BITS["after-jump"]],
    ]);
    const later = evaluateGauge(setup, result.state, [reading(5, 2030)]);
    expect(later.verdicts.get(50 * MINUTE)).toBe(FAULT_BITS["after-jump"]);
  });

  it("accepted as a real step, replays the held readings against the limits from the jump on", () => {
    const held = evaluateGauge(setup, initialGaugeEvaluationState(), readings).state;
    const stored = readings.slice(2).map((r, i) => ({ ...r, faultBits: i === 0 ? FAULT_BITS.jump : FAULT_BITS["after-jump"] }));
    const accepted = acceptStep(setup, held, stored);
    expect(accepted.events.map((e) => [e.type, e.time, e.peak])).toEqual([["opened", 20 * MINUTE, 2000]]);
    expect(accepted.state.hold).toBeNull();
    expect([...accepted.verdicts.values()]).toEqual([0, 0, 0]);
    expect(accepted.state.episodes.strain!.peak).toBe(2020);
  });

  it("after a new zero, the change of reference is not a jump", () => {
    const before = evaluateGauge(setup, initialGaugeEvaluationState(), [reading(0, 2000), reading(1, 2001)]).state;
    // The same raw level read against a zero 2 000 µε higher: 1 µε.
    const after = evaluateGauge(setup, restartAtNewZero(before, ["strain"]), [reading(2, 1)]);
    expect(after.findings).toEqual([]);
    expect(after.verdicts.size).toBe(0);
  });
});
