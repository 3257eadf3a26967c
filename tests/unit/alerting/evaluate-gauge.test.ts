import { describe, expect, it } from "vitest";
import { episodesOf } from "@/lib/alerting/episodes";
import { defaultHealthThresholds, evaluateGauge, initialGaugeEvaluationState, quantityValue, type EvaluatedReading } from "@/lib/alerting/evaluate-gauge";
import { Flag } from "@/lib/mechanics";
import type { Limit } from "@/lib/limits";

const MINUTE = 60_000;
const stressLimits: Limit[] = [
  { quantity: "stress", level: "watch", upper: 100, hysteresis: 5, persistence: 1 },
  { quantity: "stress", level: "critical", upper: 200, hysteresis: 5, persistence: 1 },
];
// A raw value that changes with stress, as a healthy gauge's does (a flat raw line is a sensor fault).
const reading = (i: number, stress: number, flags = 0): EvaluatedReading => ({ time: i * 10 * MINUTE, raw: 0.001 * i, strain: stress * 5, stress, flags, residual: null });
const setup = { limits: stressLimits, yieldStress: 355, health: defaultHealthThresholds("mV/V") };

describe("one gauge's alert evaluation", () => {
  it("opens, escalates and clears one episode (dead band and persistence: common practice)", () => {
    const history = [50, 120, 250, 150, 97, 90].map((stress, i) => reading(i, stress));
    const { events } = evaluateGauge(setup, initialGaugeEvaluationState(), history);
    expect(events.map((e) => [e.type, e.level, e.quantity])).toEqual([
      ["opened", "watch", "stress"],
      ["escalated", "critical", "stress"],
      ["cleared", "critical", "stress"],
    ]);
    // 97 MPa is inside 100 but not by the 5 MPa dead band; 90 MPa is: the clearing reading is the last one.
    expect(events.at(-1)!.time).toBe(5 * 10 * MINUTE);
    expect(episodesOf(events)).toEqual([{ quantity: "stress", level: "critical", openedAt: 10 * MINUTE, peak: 250, clearedAt: 50 * MINUTE }]);
  });

  it("does not raise a structural alert on a reading outside the sensor's rated range", () => {
    const history = [reading(0, 50), reading(1, 300, Flag.outOfRange | Flag.outsideLinearRange), reading(2, 60)];
    const { events, faultTimes } = evaluateGauge(setup, initialGaugeEvaluationState(), history);
    expect(events).toEqual([]);
    expect(faultTimes).toEqual([10 * MINUTE]);
  });

  it("tells a stuck channel from a structural event: a flat raw line is a sensor finding", () => {
    const stuck = Array.from({ length: 40 }, (_, i) => ({ ...reading(i, 20), raw: 1.234 }));
    const { findings, events, faultTimes } = evaluateGauge(setup, initialGaugeEvaluationState(), stuck);
    expect(findings.map((f) => [f.code, f.event])).toEqual([["flat-line", "raised"]]);
    expect(events).toEqual([]);
    // 36 identical raw values make a flat line (defaultHealthThresholds): readings 35 to 39 are faults.
    expect(faultTimes).toEqual([35, 36, 37, 38, 39].map((i) => i * 10 * MINUTE));
  });

  it("gives the same events whether readings arrive in one batch or several", () => {
    const history = [50, 120, 130, 250, 260, 80, 70, 150, 40].map((stress, i) => reading(i, stress));
    const whole = evaluateGauge(setup, initialGaugeEvaluationState(), history).events;
    let state = initialGaugeEvaluationState();
    const pieces = [];
    for (const slice of [history.slice(0, 2), history.slice(2, 5), history.slice(5)]) {
      const step = evaluateGauge(setup, JSON.parse(JSON.stringify(state)), slice);
      state = step.state;
      pieces.push(...step.events);
    }
    expect(pieces).toEqual(whole);
  });

  it("sees a time repeated within a batch with its last reading's values, and skips it if any of its readings is out of range", () => {
    const repeated = [reading(0, 50), reading(1, 50), reading(2, 60), reading(1, 150)];
    expect(evaluateGauge(setup, initialGaugeEvaluationState(), repeated).events.map((e) => [e.type, e.time, e.value])).toEqual([
      ["opened", 10 * MINUTE, 150],
      ["cleared", 20 * MINUTE, 60],
    ]);
    const flagged = [reading(0, 50), reading(1, 150), reading(1, 150, Flag.outOfRange), reading(2, 60)];
    expect(evaluateGauge(setup, initialGaugeEvaluationState(), flagged).events).toEqual([]);
  });

  it("computes utilisation as |σ| / yield (common practice)", () => {
    expect(quantityValue(reading(0, -177.5), "utilisation", 355)).toBeCloseTo(0.5, 12);
    expect(Number.isNaN(quantityValue(reading(0, 10), "utilisation", null))).toBe(true);
  });
});
