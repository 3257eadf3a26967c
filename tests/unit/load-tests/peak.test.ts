import { describe, expect, it } from "vitest";
import { gaugeResponse, readingSpans, strainFromStress, type StrainSpan } from "@/lib/load-tests";
import { uniaxialStress } from "@/lib/mechanics/stress";

const MINUTE = 60_000;
const START = Date.UTC(2026, 5, 2, 9, 0);
const END = START + 30 * MINUTE;

/**
 * A gauge's day around a static load test, made here: a slow thermal drift (linear in time), plus
 * a load that rises as a half sine to `amplitude` µε over the window and falls back. Sampled each
 * minute, so the crest falls on a sample (t = 15 min) and the planted peak is exact.
 */
function syntheticReadings(amplitude: number, { drift = 0.2, offset = 40 }: { drift?: number; offset?: number } = {}) {
  const points: { time: number; strain: number }[] = [];
  for (let time = START - 60 * MINUTE; time < END + 60 * MINUTE; time += MINUTE) {
    const inWindow = time >= START && time < END;
    const load = inWindow ? amplitude * Math.sin((Math.PI * (time - START)) / (END - START)) : 0;
    points.push({ time, strain: offset + drift * ((time - START) / MINUTE) + load });
  }
  return points;
}

function windowOf(points: { time: number; strain: number }[]) {
  const before = points.filter((point) => point.time < START).at(-1)!;
  const inside = points.filter((point) => point.time >= START && point.time < END);
  return { baseline: before, spans: readingSpans(inside) };
}

describe("measured peak of a load test", () => {
  // Common practice in diagnostic load testing: the response is the change from the value just
  // before the load, and the comparison is measured ÷ predicted (a test-to-analysis ratio).
  it("recovers a planted tension peak from a drifting record, change from the last reading before the window", () => {
    const { baseline, spans } = windowOf(syntheticReadings(120, { drift: 0 }));
    const result = gaugeResponse(100, baseline, spans);
    expect(result.state).toBe("measured");
    if (result.state !== "measured") return;
    expect(result.baseline.strain).toBe(40);
    expect(result.peak).toBeCloseTo(120, 9);
    expect(result.ratio).toBeCloseTo(1.2, 9);
    expect(result.peakSpan).toEqual({ start: START + 15 * MINUTE, end: START + 15 * MINUTE });
    expect(result.against).toBe(0);
  });

  it("counts the drift inside the window as response, as the baseline method does (physical: strain adds)", () => {
    // Drift 0.2 µε/min: at the crest (15 min) the record is 3 µε higher than the load alone, and the
    // baseline (1 min before) 0.2 µε lower than the drift at the start, so the peak is 120 + 3 + 0.2.
    const { baseline, spans } = windowOf(syntheticReadings(120));
    const result = gaugeResponse(100, baseline, spans);
    if (result.state !== "measured") throw new Error(result.state);
    const crestOrLater = Math.max(...spans.map((span) => span.high - baseline.strain));
    expect(result.peak).toBeCloseTo(crestOrLater, 9);
    expect(result.peak).toBeGreaterThan(123);
    expect(result.peak).toBeLessThan(123.4);
  });

  it("seeks a compressive prediction's peak in compression and reports the largest tension beside it", () => {
    const points = syntheticReadings(-80, { drift: 0 });
    // A short rebound in tension after the load, as a deck does when an axle leaves the span.
    points.find((point) => point.time === END - 2 * MINUTE)!.strain += 60;
    const { baseline, spans } = windowOf(points);
    const result = gaugeResponse(-100, baseline, spans);
    if (result.state !== "measured") throw new Error(result.state);
    expect(result.direction).toBe("compression");
    expect(result.peak).toBeCloseTo(-80, 9);
    expect(result.ratio).toBeCloseTo(0.8, 9);
    expect(result.against).toBeGreaterThan(0);
    expect(result.against).toBeCloseTo(60 - 80 * Math.sin((Math.PI * 28) / 30), 9);
  });

  it("gives a peak and ratio of 0 when the gauge moved only against the prediction", () => {
    const { baseline, spans } = windowOf(syntheticReadings(-50, { drift: 0 }));
    const result = gaugeResponse(100, baseline, spans);
    if (result.state !== "measured") throw new Error(result.state);
    expect(result.peak).toBe(0);
    expect(result.ratio).toBe(0);
    expect(result.peakSpan).toBeNull();
    expect(result.against).toBeCloseTo(-50, 9);
  });

  it("depends only on the window's extremes: every reading and just the highest and lowest give one answer", () => {
    // Invariant of a maximum: dropping values that are not extreme cannot change it.
    const { baseline, spans } = windowOf(syntheticReadings(95));
    const highest = spans.reduce((a, b) => (b.high > a.high ? b : a));
    const lowest = spans.reduce((a, b) => (b.low < a.low ? b : a));
    for (const predicted of [70, -70]) {
      const all = gaugeResponse(predicted, baseline, spans);
      const extremes = gaugeResponse(predicted, baseline, [highest, lowest]);
      expect({ ...extremes, spans: 0 }).toEqual({ ...all, spans: 0 });
    }
  });

  it("reads a dynamic gauge's summary intervals by their extremes and places the peak at the interval", () => {
    const interval = 10 * MINUTE;
    const spans: StrainSpan[] = [
      { start: START, end: START + interval, low: 38, high: 95 },
      { start: START + interval, end: START + 2 * interval, low: 20, high: 160 },
      { start: START + 2 * interval, end: START + 3 * interval, low: 35, high: 60 },
    ];
    const result = gaugeResponse(150, { time: START - interval, strain: 40 }, spans);
    if (result.state !== "measured") throw new Error(result.state);
    expect(result.peak).toBe(120);
    expect(result.ratio).toBeCloseTo(0.8, 12);
    expect(result.peakSpan).toEqual({ start: START + interval, end: START + 2 * interval });
    expect(result.against).toBe(-20);
  });

  it("says so when the window holds no data, or nothing came before it", () => {
    expect(gaugeResponse(100, { time: START - MINUTE, strain: 0 }, [])).toEqual({ state: "no-data" });
    const { spans } = windowOf(syntheticReadings(100));
    expect(gaugeResponse(100, null, spans)).toEqual({ state: "no-baseline", spans: spans.length });
  });
});

describe("strain of a summary from its stress", () => {
  it("inverts σ = E·ε + σ₀: 200 MPa in steel of E = 200 GPa is 1000 µε (linear elasticity)", () => {
    expect(strainFromStress(200, 200_000, 0)).toBeCloseTo(1000, 9);
    expect(strainFromStress(uniaxialStress(210_000, -345.6, 12), 210_000, 12)).toBeCloseTo(-345.6, 9);
  });
});
