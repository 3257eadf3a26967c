import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  FAULT_BITS,
  inspectReadings,
  stepFlatLine,
  stepJump,
  stepSensorRange,
  type CheckedReading,
  type Sample,
  type SensorFinding,
  type SensorHealthState,
  type SensorHealthThresholds,
} from "@/lib/limits";

// Reference: the detectors' own single-step definitions (stepSensorRange, stepJump, stepFlatLine),
// folded one sample at a time as inspectReadings documents: only a sample strictly after the last
// one taken in counts, a raw value outside the sensor's range is not fed to the other detectors,
// and a detector without thresholds does not run; a reading the jump detector holds as a suspect is a
// spike until its jump finding names it. Whatever way the batch computes, it must agree.

type Fold = { state: SensorHealthState; findings: SensorFinding[]; readings: CheckedReading[] };

/** The suspect reading at `time`, if taken in here, is a jump after all. */
function markJump(readings: CheckedReading[], time: number) {
  const index = readings.findIndex((reading) => reading.time === time);
  if (index >= 0) readings[index] = { ...readings[index]!, faultBits: (readings[index]!.faultBits & ~FAULT_BITS.spike) | FAULT_BITS.jump };
}

function foldSingleSteps(thresholds: SensorHealthThresholds, state: SensorHealthState, samples: readonly Sample[]): Fold {
  let current = state;
  const findings: SensorFinding[] = [];
  const readings: CheckedReading[] = [];
  for (const sample of samples) {
    const newer = Number.isFinite(sample.time) && (current.lastTime === null || sample.time > current.lastTime);
    if (!newer) continue;
    current = { ...current, lastTime: sample.time };
    const range = thresholds.range && stepSensorRange(thresholds.range, current.range, sample);
    if (range) current = { ...current, range: range.state };
    if (range?.finding) findings.push(range.finding);
    if (range?.fault) {
      readings.push({ time: sample.time, value: sample.value, fault: true, faultBits: FAULT_BITS["out-of-range"] });
      continue;
    }
    const jump = thresholds.jump && stepJump(thresholds.jump, current.jump, sample);
    const flatLine = thresholds.flatLine && stepFlatLine(thresholds.flatLine, current.flatLine, sample);
    if (jump) current = { ...current, jump: jump.state };
    if (flatLine) current = { ...current, flatLine: flatLine.state };
    for (const step of [jump, flatLine]) if (step?.finding) findings.push(step.finding);
    if (jump?.finding) markJump(readings, jump.finding.time);
    const faultBits = (jump?.fault ? FAULT_BITS.spike : 0) | (flatLine?.fault ? FAULT_BITS["flat-line"] : 0);
    readings.push({ time: sample.time, value: sample.value, fault: faultBits !== 0, faultBits });
  }
  return { state: current, findings, readings };
}

/** The batch cut at the given points, the state returned by one part carried into the next. */
function inspectInParts(thresholds: SensorHealthThresholds, state: SensorHealthState, samples: readonly Sample[], cuts: number[]): Fold {
  const bounds = [0, ...cuts.map((cut) => Math.min(cut, samples.length)).sort((a, b) => a - b), samples.length];
  let current = state;
  const findings: SensorFinding[] = [];
  const readings: CheckedReading[] = [];
  for (let part = 0; part + 1 < bounds.length; part++) {
    const inspection = inspectReadings(thresholds, current, samples.slice(bounds[part], bounds[part + 1]));
    current = inspection.state;
    findings.push(...inspection.findings);
    for (const time of inspection.earlierJumps) markJump(readings, time);
    readings.push(...inspection.readings);
  }
  return { state: current, findings, readings };
}

/** Callers may reuse what they pass in, so any write to it must fail the test. */
function deepFreeze<Value>(value: Value): Value {
  if (typeof value === "object" && value !== null) {
    Object.values(value).forEach(deepFreeze);
    Object.freeze(value);
  }
  return value;
}

const RANGE = { min: -1000, max: 1000 };

const thresholdsArb: fc.Arbitrary<SensorHealthThresholds> = fc.record(
  {
    range: fc.constant(RANGE),
    jump: fc.record({ maxStep: fc.constantFrom(10, 100) }),
    flatLine: fc.record({ readings: fc.integer({ min: 2, max: 6 }), epsilon: fc.constantFrom(0, 0.5, 2) }),
  },
  { requiredKeys: [] },
);

const rawArb = fc.oneof(fc.integer({ min: -1200, max: 1200 }), fc.constantFrom(Number.NaN, Infinity, -Infinity));

/** A stored state as a previous batch may have left it, its flat-line window up to three values over any window size. */
const stateArb: fc.Arbitrary<SensorHealthState> = fc.record({
  lastTime: fc.option(fc.integer({ min: -3, max: 3 }), { nil: null }),
  flatLine: fc.record({ active: fc.boolean(), recent: fc.array(rawArb, { maxLength: 9 }) }),
  jump: fc.record({
    previous: fc.option(rawArb, { nil: null }),
    suspect: fc.option(fc.record({ time: fc.integer({ min: -3, max: 3 }), change: fc.integer({ min: -500, max: 500 }) }), { nil: null }),
  }),
  range: fc.record({ active: fc.boolean() }),
});

/** What each sample does to the raw signal, so that flat runs, jumps and faults all occur often. */
const changeArb = fc.oneof(
  fc.constant({ kind: "repeat" as const }),
  fc.record({ kind: fc.constant("drift" as const), by: fc.constantFrom(-2, -0.5, 0.5, 1, 3) }),
  fc.record({ kind: fc.constant("jump" as const), by: fc.constantFrom(-300, 40, 300) }),
  fc.record({ kind: fc.constant("set" as const), raw: rawArb }),
);

/** Times mostly advance, but repeat, go back or are not a number now and then. */
const gapArb = fc.oneof({ weight: 6, arbitrary: fc.constant(1) }, fc.constantFrom(0, -1, 2), fc.constant(Number.NaN));

const samplesArb: fc.Arbitrary<Sample[]> = fc.array(fc.record({ gap: gapArb, change: changeArb }), { maxLength: 80 }).map((steps) => {
  let time = 0;
  let raw = 0;
  return steps.map(({ gap, change }): Sample => {
    if (change.kind === "drift" || change.kind === "jump") raw += change.by;
    if (change.kind === "set") raw = change.raw;
    const sampleTime = Number.isNaN(gap) ? Number.NaN : (time += gap);
    // The limited quantity differs from the raw value, so a detector reading the wrong one shows.
    return { time: sampleTime, raw, value: raw / 2 };
  });
});

describe("batch inspection", () => {
  it("gives the same state, findings and fault flags as the single-step detectors, however the batch is cut", () => {
    fc.assert(
      fc.property(thresholdsArb, stateArb, samplesArb, fc.array(fc.nat({ max: 80 }), { maxLength: 4 }), (thresholds, state, samples, cuts) => {
        deepFreeze([state, samples]);
        const expected = foldSingleSteps(thresholds, state, samples);
        const actual = inspectInParts(thresholds, state, samples, cuts);
        expect(actual.findings).toEqual(expected.findings);
        expect(actual.readings).toEqual(expected.readings);
        expect(actual.state).toEqual(expected.state);
      }),
      { numRuns: 500 },
    );
  });
});
