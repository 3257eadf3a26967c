import { describe, expect, it } from "vitest";
import { MATERIALS } from "@/lib/mechanics";
import { DAY, HOUR, MINUTE } from "@/lib/series";
import { syntheticReadings, type SyntheticGauge, type SyntheticOptions, type SyntheticReading } from "@/lib/demo/synthetic-readings";
import { CHECK_STEEL, converted, foilGauge, prepared, vibratingWireGauge } from "../mechanics/fixtures";

const START = Date.UTC(2026, 2, 2); // a Monday
const READINGS_PER_DAY = 144;
const SPIKE = { time: START + 40 * DAY + 3 * HOUR, strain: 900 };
const OFFLINE = { from: START + 20 * DAY + 2 * HOUR, to: START + 20 * DAY + 8 * HOUR };
const PARKED = { from: START + 60 * DAY + 9 * HOUR, to: START + 60 * DAY + 15 * HOUR, strain: 400 };

const GAUGES: SyntheticGauge[] = [
  {
    tag: "TRAFFIC",
    config: foilGauge({ bridge: "quarter", zero: { value: 0.12, temperature: 8 } }),
    story: { trafficAmplitude: 120, spikes: [SPIKE] },
  },
  {
    tag: "DRIFT",
    config: foilGauge({
      input: "microstrain",
      bridge: null,
      loggerGaugeFactor: 2.1,
      thermal: { method: "polynomial", coefficients: [-20, 2.1, -0.05] },
      zero: { value: 15, temperature: 8 },
    }),
    story: { driftPerDay: 1.5, noise: 1 },
  },
  {
    tag: "OFFLINE",
    config: vibratingWireGauge({ material: MATERIALS["normal-weight-concrete-30"], zero: { value: 820, temperature: 8 } }),
    story: { thermalRestraint: 0.6, trafficAmplitude: -40, offline: OFFLINE },
  },
  {
    tag: "PARKED",
    config: vibratingWireGauge({ input: "frequency-squared", zero: { value: 700, temperature: 8 } }),
    story: { sustainedLoad: PARKED },
  },
  {
    tag: "RESTRAINED",
    config: foilGauge({ bridge: "full-axial-poisson", material: CHECK_STEEL, zero: { value: -0.3, temperature: 8 } }),
    story: { thermalRestraint: 1, noise: 0 },
  },
];

function generate(options: Partial<SyntheticOptions> = {}): SyntheticReading[] {
  return [...syntheticReadings({ start: START, seed: 7, gauges: GAUGES, ...options })];
}

const ninetyDays = generate();
const byGauge = (tag: string) => ninetyDays.filter((reading) => reading.gauge === tag);
const strainOf = (tag: string) => {
  const gauge = prepared(GAUGES.find((candidate) => candidate.tag === tag)!.config);
  return (reading: SyntheticReading) => converted(gauge.convert(reading.value, reading.temperature)).strain;
};
const mean = (values: readonly number[]) => values.reduce((a, b) => a + b, 0) / values.length;
const hourOf = (time: number) => (time % DAY) / HOUR;
const isWeekend = (time: number) => [0, 6].includes(new Date(time).getUTCDay());

describe("synthetic readings", () => {
  it("gives 144 readings a day for 90 days per gauge, less the offline window", () => {
    expect(byGauge("TRAFFIC")).toHaveLength(90 * READINGS_PER_DAY);
    expect(byGauge("OFFLINE")).toHaveLength(90 * READINGS_PER_DAY - 6 * 6);
    expect(ninetyDays).toHaveLength(GAUGES.length * 90 * READINGS_PER_DAY - 36);
    expect(generate({ days: 2, interval: 5 * MINUTE, gauges: GAUGES.slice(0, 1) })).toHaveLength(2 * 288);
  });

  it("has no reading while the logger was offline, and readings on both sides of it", () => {
    const times = byGauge("OFFLINE").map((reading) => reading.time);
    expect(times.filter((time) => time >= OFFLINE.from && time < OFFLINE.to)).toEqual([]);
    expect(times).toContain(OFFLINE.from - 10 * MINUTE);
    expect(times).toContain(OFFLINE.to);
  });

  // Physical invariant: each raw value converts back to the strain its story intended.
  it("sends raw values that convert back to the intended mechanical strain", () => {
    for (const { tag } of GAUGES) {
      const strain = strainOf(tag);
      for (const reading of byGauge(tag)) expect(Math.abs(strain(reading) - reading.mechanicalStrain)).toBeLessThanOrEqual(1e-6);
    }
  });

  it("is the same for the same seed and different for another", () => {
    const twoWeeks = generate({ days: 14 });
    expect(generate({ days: 14 })).toEqual(twoWeeks);
    const reseeded = generate({ days: 14, seed: 8 });
    expect(reseeded.filter((reading, i) => reading.value !== twoWeeks[i]!.value).length).toBeGreaterThan(twoWeeks.length / 2);
  });

  it("leaves the other readings unchanged when a gauge is added or a gap is removed", () => {
    const month = generate({ days: 30 });
    const ofGauge = (readings: SyntheticReading[], tag: string) => readings.filter((reading) => reading.gauge === tag);
    const trafficAlone = generate({ days: 30, gauges: [GAUGES[0]!] });
    expect(ofGauge(month, "TRAFFIC")).toEqual(trafficAlone);
    const noGap = { ...GAUGES[2]!, story: { ...GAUGES[2]!.story, offline: undefined } };
    const gapless = generate({ days: 30, gauges: [noGap] });
    expect(gapless).toHaveLength(30 * READINGS_PER_DAY);
    expect(gapless.filter((reading) => reading.time < OFFLINE.from || reading.time >= OFFLINE.to)).toEqual(ofGauge(month, "OFFLINE"));
  });

  it("shows the planted spike as the gauge's largest strain, at its time", () => {
    const readings = byGauge("TRAFFIC");
    const strains = readings.map(strainOf("TRAFFIC"));
    const peak = strains.indexOf(Math.max(...strains));
    expect(readings[peak]!.time).toBe(SPIKE.time);
    expect(strains[peak]).toBeGreaterThan(SPIKE.strain - 10);
    expect(strains.filter((strain) => strain > 200)).toHaveLength(1);
  });

  // Invented traffic pattern: weekday rush hours busy, nights quiet, weekend mornings in between.
  it("loads the span most at weekday rush hours", () => {
    const readings = byGauge("TRAFFIC");
    const strain = strainOf("TRAFFIC");
    const meanStrain = (keep: (time: number) => boolean) => mean(readings.filter((r) => keep(r.time)).map(strain));
    const weekdayRush = meanStrain((time) => !isWeekend(time) && Math.abs(hourOf(time) - 8) <= 0.5);
    const weekendMorning = meanStrain((time) => isWeekend(time) && Math.abs(hourOf(time) - 8) <= 0.5);
    const night = meanStrain((time) => hourOf(time) >= 1 && hourOf(time) < 4);
    expect(weekdayRush).toBeGreaterThan(2 * weekendMorning);
    expect(weekendMorning).toBeGreaterThan(2 * night);
  });

  it("drifts the flagged gauge by its daily rate", () => {
    const strains = byGauge("DRIFT").map(strainOf("DRIFT"));
    const firstDay = mean(strains.slice(0, READINGS_PER_DAY));
    const lastDay = mean(strains.slice(-READINGS_PER_DAY));
    expect(lastDay - firstDay).toBeCloseTo(1.5 * 89, 0);
  });

  it("holds the planted load over its window, above every other reading", () => {
    const readings = byGauge("PARKED");
    const strain = strainOf("PARKED");
    const inWindow = (r: SyntheticReading) => r.time >= PARKED.from && r.time < PARKED.to;
    const parked = readings.filter(inWindow).map(strain);
    expect(parked).toHaveLength(36);
    expect(Math.min(...parked)).toBeGreaterThan(Math.max(...readings.filter((r) => !inWindow(r)).map(strain)));
  });

  // Linear thermoelasticity (any strength-of-materials text): a fully restrained bar heated by ΔT carries σ = −E·α·ΔT
  // (−48 MPa for steel heated 20 °C).
  it("stresses a fully restrained member by −E·α·ΔT", () => {
    const gauge = prepared(GAUGES[4]!.config);
    for (const reading of byGauge("RESTRAINED")) {
      const expected = -CHECK_STEEL.E * CHECK_STEEL.alpha * 1e-6 * (reading.temperature - 8);
      expect(Math.abs(converted(gauge.convert(reading.value, reading.temperature)).stress - expected)).toBeLessThanOrEqual(1e-9);
    }
  });

  // Invented climate: warm afternoons, cool dawns, and spring warming from March to May.
  it("swings temperature by day and by season", () => {
    const temperatures = byGauge("TRAFFIC");
    const meanTemperature = (keep: (r: SyntheticReading) => boolean) => mean(temperatures.filter(keep).map((r) => r.temperature));
    expect(meanTemperature((r) => hourOf(r.time) >= 14 && hourOf(r.time) < 16)).toBeGreaterThan(
      meanTemperature((r) => hourOf(r.time) >= 2 && hourOf(r.time) < 4) + 5,
    );
    expect(mean(temperatures.slice(-10 * READINGS_PER_DAY).map((r) => r.temperature))).toBeGreaterThan(
      mean(temperatures.slice(0, 10 * READINGS_PER_DAY).map((r) => r.temperature)) + 5,
    );
  });

  it("refuses options that cannot make a schedule", () => {
    expect(() => generate({ interval: 0 })).toThrow(RangeError);
    expect(() => generate({ days: -1 })).toThrow(RangeError);
  });
});

describe("continuing the story", () => {
  it("sends from `from` to `until` exactly the readings a run from the start sends there", () => {
    const options = { start: START, seed: 7, gauges: GAUGES };
    const from = START + 2 * DAY + 5 * MINUTE;
    const until = START + 3 * DAY;
    const whole = [...syntheticReadings({ ...options, days: 3 })].filter((reading) => reading.time >= from);
    const continued = [...syntheticReadings({ ...options, from, until })];
    expect(continued).toEqual(whole);
    // By hand: from 2 days 5 minutes to 3 days at 10-minute steps is 143 steps (the 2-day step is before `from`).
    expect(new Set(continued.map((reading) => reading.time)).size).toBe(READINGS_PER_DAY - 1);
  });

  it("goes on past the seeded days on the same grid", () => {
    const options = { start: START, seed: 7, gauges: GAUGES.slice(0, 1) };
    const later = [...syntheticReadings({ ...options, from: START + 100 * DAY, until: START + 100 * DAY + HOUR })];
    expect(later.map((reading) => reading.time)).toEqual(Array.from({ length: 6 }, (_, i) => START + 100 * DAY + i * 10 * MINUTE));
  });
});
