import { beforeAll, describe, expect, it } from "vitest";
import type { UserActor } from "@/lib/auth/actor";
import { gaugeFatigue } from "@/lib/services/fatigue";
import { createGauge, recordZero } from "@/lib/services/gauges";
import { ingestJson } from "@/lib/services/ingest";
import { microstrainGauge } from "../fixtures/gauges";
import { makeStructure, makeUser } from "./helpers";

let engineer: UserActor;
const T0 = Date.UTC(2026, 2, 2);
const STEP = 600_000;
const DAY = 86_400_000;
// ASTM E1049-85 (2017) 5.4.4 example. The gauges read microstrain on E = 200 000 MPa steel, so
// 50 µε is 10 MPa (Hooke's law: 200 000 MPa × 50×10⁻⁶): one unit of the example is 10 MPa.
const ASTM_EXAMPLE = [-2, 1, -3, 5, -1, 3, -4, 4, -2];
const MICROSTRAIN_PER_UNIT = 50;
// Its counts (½ × 3, 1½ × 4, ½ × 6, 1 × 8, ½ × 9 units) in 1 MPa bins labelled by their upper edge.
const EXAMPLE_BINS = [
  { range: 30, count: 0.5 },
  { range: 40, count: 1.5 },
  { range: 60, count: 0.5 },
  { range: 80, count: 1 },
  { range: 90, count: 0.5 },
];

const reading = (tag: string, time: number, unit: number) => ({ gauge: tag, time: new Date(time).toISOString(), value: MICROSTRAIN_PER_UNIT * unit, temperature: 10 });
const series = (tag: string, start: number, units: readonly number[]) => units.map((unit, i) => reading(tag, start + i * STEP, unit));

async function ingest(readings: unknown[]) {
  const result = await ingestJson(engineer, "FT", readings);
  expect(result.rejected).toEqual([]);
}

const fatigueOf = async (tag: string) =>
  (await gaugeFatigue(engineer, "FT", tag, { from: new Date(T0 - DAY), to: new Date(T0 + 30 * DAY) })).fatigue;

beforeAll(async () => {
  engineer = await makeUser("engineer");
  await makeStructure("FT", [engineer]);
  for (const tag of ["RZ", "SP", "SK", "GAP"]) await createGauge(engineer, "FT", microstrainGauge(tag, { detailCategory: 71, expectedInterval: 600 }));

  // RZ: the example, a re-zero that moves later strains up by 500 µε (100 MPa), the example again.
  await ingest(series("RZ", T0, ASTM_EXAMPLE));
  await recordZero(engineer, "FT", "RZ", { value: -500, temperature: 10, time: new Date(T0 + 9 * STEP).toISOString(), reason: "re-bonded after repair" });
  await ingest(series("RZ", T0 + 9 * STEP, ASTM_EXAMPLE));

  // SP: the start of the example, then a step of 3 050 µε (610 MPa), more than the 1 500 µε a
  // structure moves between readings, and the strain stays up there: a jump. The readings after it
  // are each plausible, but they are held as faulty until an engineer says whether the step was real.
  await ingest(series("SP", T0, [-2, 1, -3, 5, -1, 60, 59, 63, 56, 64, 58]));
  // SK: the example with one spike of 3 050 µε put in, straight back the next reading: that reading alone is left out.
  await ingest(series("SK", T0, [-2, 1, -3, 5, -1, 60, 3, -4, 4, -2]));

  // GAP: the example, five days of logger outage, the example again.
  await ingest([...series("GAP", T0, ASTM_EXAMPLE), ...series("GAP", T0 + 5 * DAY, ASTM_EXAMPLE)]);
});

describe("fatigue counts only what happened", () => {
  it("restarts rainflow at a re-zero: the 100 MPa step is not a stress range", async () => {
    const fatigue = await fatigueOf("RZ");
    expect(fatigue.zeroEpochs).toBe(2);
    expect(fatigue.cycles).toEqual(EXAMPLE_BINS.map(({ range, count }) => ({ range, count: 2 * count })));
    expect(fatigue.cyclesCounted).toBe(8);
  });

  it("leaves out a jump and every reading held after it, as their stored verdicts say", async () => {
    const fatigue = await fatigueOf("SP");
    expect(fatigue.readingsSkipped).toBe(6);
    expect(fatigue.readingsUsed).toBe(5);
    // By hand, ASTM E1049-85 (2017) 5.4.4 on -2, 1, -3, 5, -1: half cycles of 3 and 4 units as the
    // start point moves on, then the residue 8 and 6 units as half cycles.
    expect(fatigue.cycles).toEqual([
      { range: 30, count: 0.5 },
      { range: 40, count: 0.5 },
      { range: 60, count: 0.5 },
      { range: 80, count: 0.5 },
    ]);
    expect(fatigue.cyclesCounted).toBe(2);
  });

  it("leaves out a lone spike only: the readings after it count, and the example's own cycles come out", async () => {
    const fatigue = await fatigueOf("SK");
    expect(fatigue.readingsSkipped).toBe(1);
    expect(fatigue.readingsUsed).toBe(9);
    // ASTM E1049-85 (2017) worked example: ranges 3 ×0.5, 4 ×1.5, 6 ×0.5, 8 ×1.0, 9 ×0.5 (units of 10 MPa).
    expect(fatigue.cycles).toEqual(EXAMPLE_BINS);
  });

  it("divides the damage by the time covered by readings, not by a span that includes an outage", async () => {
    const fatigue = await fatigueOf("GAP");
    // By hand: 8 intervals of 600 s in each block are covered (9 600 s); the silence between the
    // blocks, 5 days − 80 minutes = 427 200 s, is longer than 3 × 600 s and is left out.
    expect(fatigue).toMatchObject({ coveredSeconds: 9_600, gapsLeftOut: 1, gapSeconds: 427_200, longestCoveredIntervalSeconds: 1_800, observedSeconds: 436_800 });
    expect(fatigue.damage).toBeGreaterThan(0);
    // Rate per Julian year of 31 557 600 s (from memory) over the covered time.
    expect(fatigue.damageRatePerYear! / (fatigue.damage / (9_600 / 31_557_600))).toBeCloseTo(1, 12);
  });
});
