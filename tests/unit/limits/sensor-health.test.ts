import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  checkStale,
  FAULT_BITS,
  evaluateReadings,
  initialEpisodeState,
  initialSensorHealthState,
  inspectReadings,
  stepFlatLine,
  stepJump,
  stepSensorRange,
  type DetectorStep,
  type FlatLineState,
  type FlatLineThresholds,
  type JumpState,
  type Sample,
  type SensorFinding,
  type SensorHealthThresholds,
} from "@/lib/limits";
import { MINUTE, limitSet } from "./fixtures";

// The four sensor faults monitoring practice looks for (common practice):
// no data for too long, a flat line, a jump no structure can make, a reading outside the sensor's range.
// Thresholds here are examples chosen for the tests, not recommendations.

function samples(raws: readonly number[], start = 0): Sample[] {
  return raws.map((raw, index) => ({ time: start + index * MINUTE, raw, value: raw }));
}

/** Runs one detector over samples from its initial state, collecting findings and fault flags. */
function scan<State>(step: (state: State, sample: Sample) => DetectorStep<State>, initial: State, raws: number[]) {
  let state = initial;
  const findings: string[] = [];
  const faults: boolean[] = [];
  for (const sample of samples(raws)) {
    const result = step(state, sample);
    state = result.state;
    faults.push(result.fault);
    // At the reading it is about: a jump is found at its suspect, one reading before the reading that shows it.
    if (result.finding) findings.push(`${result.finding.code} ${result.finding.event} @${result.finding.time / MINUTE}`);
  }
  return { findings, faults };
}

describe("stale data", () => {
  const thresholds = { expectedIntervalMs: 10 * MINUTE, intervals: 3 };

  it("tolerates silence up to k × the expected interval", () => {
    expect(checkStale(thresholds, 0, 30 * MINUTE)).toBeNull();
  });

  it("is raised beyond it, saying how long and that values are not current", () => {
    const finding = checkStale(thresholds, 0, 30 * MINUTE + 1);
    expect(finding).toMatchObject({ kind: "sensor", code: "stale", event: "raised", time: 30 * MINUTE + 1 });
    expect(finding!.message).toContain("No reading for 30 minutes, more than 3 × the expected interval of 10 minutes");
    expect(finding!.message).toContain("not current");
  });

  it("describes long silences in days", () => {
    expect(checkStale(thresholds, 0, 3 * 24 * 60 * MINUTE)!.message).toContain("No reading for 3 days");
  });
});

describe("flat line", () => {
  const flatLine = (thresholds: FlatLineThresholds) => (state: FlatLineState, sample: Sample) => stepFlatLine(thresholds, state, sample);
  const identical = flatLine({ readings: 4, epsilon: 0 });
  const initial: FlatLineState = { active: false, recent: [] };

  it("is raised once after N identical raw values and resolved when they vary again", () => {
    const { findings, faults } = scan(identical, initial, [5, 7, 7, 7, 7, 7, 7, 8, 8]);
    expect(findings).toEqual(["flat-line raised @4", "flat-line resolved @7"]);
    expect(faults).toEqual([false, false, false, false, true, true, true, false, false]);
  });

  it("N − 1 identical values are not a flat line", () => {
    expect(scan(identical, initial, [7, 7, 7, 8, 8, 8]).findings).toEqual([]);
  });

  it("with an epsilon, a range at most epsilon over the window counts as flat", () => {
    expect(scan(flatLine({ readings: 3, epsilon: 1 }), initial, [100, 100.5, 101, 102, 105]).findings).toEqual(["flat-line raised @2", "flat-line resolved @3"]);
  });

  it("keeps no more raw values than the window", () => {
    const { state } = stepFlatLine({ readings: 3, epsilon: 0 }, { active: false, recent: [1, 2, 3] }, samples([4])[0]!);
    expect(state.recent).toEqual([2, 3, 4]);
  });

  it("cuts a stored window longer than the thresholds now ask for (they were lowered) to the window", () => {
    const { state } = stepFlatLine({ readings: 3, epsilon: 0 }, { active: false, recent: [1, 2, 3, 4, 5, 6] }, samples([7])[0]!);
    expect(state.recent).toEqual([5, 6, 7]);
  });

  it("is flat exactly when the full window's max − min is at most epsilon, non-finite values included (its definition above)", () => {
    const rawArb = fc.oneof(fc.integer({ min: -3, max: 3 }), fc.constantFrom(Number.NaN, Infinity, -Infinity));
    fc.assert(
      fc.property(fc.array(rawArb, { maxLength: 6 }), rawArb, fc.constantFrom(0, 1, 2, Infinity), (recent, raw, epsilon) => {
        const thresholds = { readings: 4, epsilon };
        const window = [...recent, raw].slice(-thresholds.readings);
        const flat = window.length === thresholds.readings && Math.max(...window) - Math.min(...window) <= epsilon;
        const { state, fault } = stepFlatLine(thresholds, { active: false, recent }, { time: 0, raw, value: raw });
        expect(state).toEqual({ active: flat, recent: window });
        expect(fault).toBe(flat);
      }),
    );
  });
});

describe("jump", () => {
  const jump = (state: JumpState, sample: Sample) => stepJump({ maxStep: 100 }, state, sample);
  const initial: JumpState = { previous: null, suspect: null };

  it("holds a change larger than the plausible maximum as a suspect, not one equal to it, and finds the jump when the next reading stays", () => {
    const { findings, faults } = scan(jump, initial, [0, 100, 201, 205]);
    expect(findings).toEqual(["jump raised @2"]);
    expect(faults).toEqual([false, false, true, false]);
  });

  // Common practice: a lone value far from both neighbours is a spike (noise on the channel), a
  // fault of that reading alone; a change of level that stays is a step (a jump of the sensor or the structure).
  it("takes a lone spike, out and straight back, for a fault of that reading alone, with no jump", () => {
    const { findings, faults } = scan(jump, initial, [0, 500, 0, 10]);
    expect(findings).toEqual([]);
    expect(faults).toEqual([false, true, false, false]);
  });

  it("after a lasting offset the new level becomes the reference", () => {
    expect(scan(jump, initial, [0, 500, 510, 520]).findings).toEqual(["jump raised @1"]);
  });

  it("states the change and the threshold in its message, rounded and in µε", () => {
    const suspect = stepJump({ maxStep: 100 }, { previous: 20, suspect: null }, { time: 0, raw: 0, value: -230.2770717615213 });
    const { finding } = stepJump({ maxStep: 100 }, suspect.state, { time: 1, raw: 0, value: -231 });
    expect(finding).toMatchObject({ time: 0 });
    expect(finding!.message).toContain("changed by -250 µε from one reading to the next and stayed there, more than the 100 µε");
  });

  it("gives a raw value outside the sensor's range its unit", () => {
    const { finding } = stepSensorRange({ min: -5, max: 5, unit: "mV/V" }, { active: false }, { time: 0, raw: 12.345678912, value: 0 });
    expect(finding!.message).toContain("The raw reading 12.3457 mV/V is outside the sensor's range of -5 to 5 mV/V");
  });
});

describe("out of sensor range", () => {
  const range = (state: { active: boolean }, sample: Sample) => stepSensorRange({ min: -5, max: 5 }, state, sample);

  it("is raised once while raw values stay outside, resolved when back, and every reading outside is a fault", () => {
    const { findings, faults } = scan(range, { active: false }, [0, 5, 6, -7, -5, 0]);
    expect(findings).toEqual(["out-of-range raised @2", "out-of-range resolved @4"]);
    expect(faults).toEqual([false, false, true, true, false, false]);
  });

  it("treats a non-finite raw value as outside the range", () => {
    expect(scan(range, { active: false }, [Number.NaN]).faults).toEqual([true]);
  });
});

describe("inspecting a batch", () => {
  const thresholds: SensorHealthThresholds = {
    range: { min: -1000, max: 1000 },
    jump: { maxStep: 100 },
    flatLine: { readings: 5, epsilon: 0 },
  };

  function codes(findings: SensorFinding[]): string[] {
    return findings.map((finding) => `${finding.code} ${finding.event} @${finding.time / MINUTE}`);
  }

  it("does not feed a reading outside the sensor's range to the jump detector", () => {
    const { findings, readings } = inspectReadings(thresholds, initialSensorHealthState(), samples([0, 9999, 10]));
    expect(codes(findings)).toEqual(["out-of-range raised @1", "out-of-range resolved @2"]);
    expect(readings.map((reading) => reading.fault)).toEqual([false, true, false]);
  });

  it("skips detectors whose thresholds are not given", () => {
    const { findings } = inspectReadings({}, initialSensorHealthState(), samples([0, 9999, 0, 0, 0, 0, 0]));
    expect(findings).toEqual([]);
  });

  it("ignores repeated and late samples, as limit evaluation does", () => {
    const first = inspectReadings(thresholds, initialSensorHealthState(), samples([0, 10]));
    const again = inspectReadings(thresholds, first.state, [...samples([0, 10]), { time: 30_000, raw: 500, value: 500 }]);
    expect(again).toEqual({ state: first.state, findings: [], readings: [], earlierJumps: [] });
  });

  it("finds the same faults whatever the batch sizes, with the state stored as JSON between batches", () => {
    const rawArb = fc.array(fc.constantFrom(0, 0, 0, 50, 200, 5000), { maxLength: 60 });
    fc.assert(
      fc.property(rawArb, fc.integer({ min: 1, max: 10 }), (raws, size) => {
        const all = samples(raws);
        const whole = inspectReadings(thresholds, initialSensorHealthState(), all);
        let stored = JSON.stringify(initialSensorHealthState());
        const findings: SensorFinding[] = [];
        for (let start = 0; start < all.length; start += size) {
          const batch = inspectReadings(thresholds, JSON.parse(stored), all.slice(start, start + size));
          findings.push(...batch.findings);
          stored = JSON.stringify(batch.state);
        }
        expect(findings).toEqual(whole.findings);
      }),
    );
  });

  it("keeps a spike no structure can make from opening a structural alert, and holds nothing after it", () => {
    const health = inspectReadings(thresholds, initialSensorHealthState(), samples([20, 30, 800, 25, 30]));
    const limits = limitSet({ level: "watch", upper: 150 });
    expect(codes(health.findings)).toEqual([]);
    expect(health.readings.map((reading) => reading.faultBits)).toEqual([0, 0, FAULT_BITS.spike, 0, 0]);
    expect(evaluateReadings(limits, initialEpisodeState(), health.readings).events).toEqual([]);
  });

  it("marks a suspect a jump once the next reading stays away, in the same batch or a later one", () => {
    const whole = inspectReadings(thresholds, initialSensorHealthState(), samples([20, 800, 810]));
    expect(whole.readings.map((reading) => reading.faultBits)).toEqual([0, FAULT_BITS.jump, 0]);
    expect(codes(whole.findings)).toEqual(["jump raised @1"]);
    const first = inspectReadings(thresholds, initialSensorHealthState(), samples([20, 800]));
    expect(first.readings.map((reading) => reading.faultBits)).toEqual([0, FAULT_BITS.spike]);
    const next = inspectReadings(thresholds, first.state, samples([810], 2 * MINUTE));
    expect(next.earlierJumps).toEqual([MINUTE]);
    expect(codes(next.findings)).toEqual(["jump raised @1"]);
  });
});
