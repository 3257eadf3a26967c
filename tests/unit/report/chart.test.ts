import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { envelopeChart, niceTicks, timeTicks, type ChartInput } from "@/lib/report/chart";
import { MPA_PER_KSI } from "@/lib/units";

const HOUR = 3_600_000;
const FROM = Date.UTC(2026, 9, 1);
const TO = Date.UTC(2026, 10, 1);

/** Hourly buckets over October with these means, each bucket's min and max `spread` either side. */
function input(means: readonly number[], fields: Partial<ChartInput> = {}, spread = 5): ChartInput {
  return {
    series: { t: means.map((_, i) => FROM + i * HOUR), min: means.map((m) => m - spread), max: means.map((m) => m + spread), mean: [...means], bucketWidth: HOUR },
    toDisplay: (value) => value,
    unit: "MPa",
    quantity: "Stress",
    lines: [],
    marks: [],
    from: FROM,
    to: TO,
    timeZone: "UTC",
    expectedIntervalS: 3600,
    width: 500,
    height: 170,
    ...fields,
  };
}

const allPoints = (chart: NonNullable<ReturnType<typeof envelopeChart>>) => [...chart.bands.flat(), ...chart.means.flat()];
const means = fc.array(fc.double({ min: -500, max: 500, noNaN: true }), { minLength: 2, maxLength: 300 });

describe("nice tick values (Heckbert, 'Nice numbers for graph labels', Graphics Gems, 1990)", () => {
  it("steps by 1, 2 or 5 × 10ⁿ and stays inside the range", () => {
    expect(niceTicks(0, 100)).toEqual([0, 20, 40, 60, 80, 100]);
    expect(niceTicks(-42, 263)).toEqual([0, 50, 100, 150, 200, 250]);
    fc.assert(
      fc.property(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: 1e-3, max: 1e4, noNaN: true }), (low, span) => {
        const ticks = niceTicks(low, low + span);
        const step = ticks[1]! - ticks[0]!;
        const mantissa = step / 10 ** Math.floor(Math.log10(step) + 1e-9);
        expect([1, 2, 5].some((nice) => Math.abs(mantissa - nice) < 1e-6)).toBe(true);
        expect(ticks.length).toBeGreaterThanOrEqual(3);
        for (const tick of ticks) expect(tick).toBeGreaterThanOrEqual(low - step * 1e-6);
        for (const tick of ticks) expect(tick).toBeLessThanOrEqual(low + span + step * 1e-6);
      }),
    );
  });
});

describe("the report chart's geometry", () => {
  it("geometric invariant: the highest value is the topmost point, the lowest the bottommost, and everything lies in the plot", () => {
    fc.assert(
      fc.property(means, (values) => {
        const chart = envelopeChart(input(values))!;
        const points = allPoints(chart);
        const ys = points.map((point) => point.y);
        const { plot } = chart;
        const yOfMax = chart.plot.top + ((chart.range.high - (Math.max(...values) + 5)) / (chart.range.high - chart.range.low)) * plot.height;
        expect(Math.min(...ys)).toBeCloseTo(yOfMax, 6);
        for (const point of points) {
          expect(point.x).toBeGreaterThanOrEqual(plot.left - 1e-9);
          expect(point.x).toBeLessThanOrEqual(plot.left + plot.width + 1e-9);
          expect(point.y).toBeGreaterThanOrEqual(plot.top - 1e-9);
          expect(point.y).toBeLessThanOrEqual(plot.top + plot.height + 1e-9);
        }
        // The axis range holds the data with 5 % of its span either side (lib/limits rangeWithLines).
        const span = Math.max(...values) - Math.min(...values) + 10;
        expect(chart.range.high).toBeCloseTo(Math.max(...values) + 5 + 0.05 * span, 6);
      }),
    );
  });

  it("physical invariant: the same stresses read in ksi draw the same chart, only the tick labels change (NIST SP 811: 1 ksi = 6.894757 MPa)", () => {
    fc.assert(
      fc.property(means, (values) => {
        const inMpa = envelopeChart(input(values, { lines: [{ value: 300, level: "warning", text: "warning upper" }] }))!;
        const inKsi = envelopeChart(
          input(values, { toDisplay: (mpa) => mpa / MPA_PER_KSI, unit: "ksi", lines: [{ value: 300 / MPA_PER_KSI, level: "warning", text: "warning upper" }] }),
        )!;
        const a = allPoints(inMpa);
        const b = allPoints(inKsi);
        b.forEach((point, i) => {
          expect(point.x).toBeCloseTo(a[i]!.x, 6);
          expect(point.y).toBeCloseTo(a[i]!.y, 6);
        });
        expect(inKsi.limits.map((line) => line.y)).toEqual(inMpa.limits.map((line) => expect.closeTo(line.y, 6)));
        expect(inKsi.valueLabel).toBe("Stress (ksi)");
      }),
    );
  });

  it("maps time linearly: the period's start to the plot's left edge, its end to the right, the middle to the middle", () => {
    const chart = envelopeChart(input([10, 20]))!;
    const { plot } = chart;
    expect(chart.means[0]![0]!.x).toBeCloseTo(plot.left, 9);
    const mark = envelopeChart(input([10, 20], { marks: [{ from: (FROM + TO) / 2, to: null, level: "watch" }] }))!.marks[0]!;
    expect(mark.left).toBeCloseTo(plot.left + plot.width / 2, 9);
    // Still open: shaded to the end of the period.
    expect(mark.right).toBeCloseTo(plot.left + plot.width, 9);
  });

  it("draws a limit at the data's peak on the same row as the peak, and marks a far one at the edge instead", () => {
    const values = [0, 40, 100, 30];
    const chart = envelopeChart(input(values, { lines: [{ value: 105, level: "warning", text: "warning upper" }, { value: 5_000, level: "critical", text: "critical upper" }] }))!;
    const peak = Math.min(...chart.bands.flat().map((point) => point.y));
    expect(chart.limits).toEqual([{ y: expect.closeTo(peak, 9), level: "warning", text: "warning upper" }]);
    expect(chart.offScale.map((line) => [line.level, line.side])).toEqual([["critical", "above"]]);
    expect(chart.offScale[0]!.label).toBe("critical upper 5,000.0 MPa above the chart");
  });

  it("breaks the envelope where readings stopped for longer than one and a half intervals (the page's rule), and has nothing to draw without readings", () => {
    const series = { t: [FROM, FROM + HOUR, FROM + 5 * HOUR, FROM + 6 * HOUR], min: [0, 0, 0, 0], max: [1, 1, 1, 1], mean: [0.5, 0.5, 0.5, 0.5], bucketWidth: HOUR };
    expect(envelopeChart({ ...input([]), series })!.bands).toHaveLength(2);
    expect(envelopeChart(input([]))).toBeNull();
  });
});

describe("time ticks", () => {
  it("fall on the structure's midnights over a month, at most eight of them", () => {
    // In October 2026 London is on BST (UTC+1) until the 25th: midnight there is 23:00 UTC the day before.
    const { times, stepS } = timeTicks(FROM, TO, "Europe/London");
    expect(stepS).toBe(7 * 86_400);
    expect(times.map((time) => new Date(time).toISOString())).toEqual([
      "2026-10-01T23:00:00.000Z",
      "2026-10-08T23:00:00.000Z",
      "2026-10-15T23:00:00.000Z",
      "2026-10-22T23:00:00.000Z",
      "2026-10-30T00:00:00.000Z",
    ]);
  });

  it("fall every few hours over a day", () => {
    const { times, stepS } = timeTicks(FROM, FROM + 24 * HOUR, "UTC");
    expect(stepS).toBe(3 * 3600);
    expect(times).toHaveLength(8);
    expect(times[0]).toBe(FROM);
  });
});
