import { describe, expect, it } from "vitest";
import { limitLines, offScaleLines, rangeWithLines, valueAxisRange, type Limit } from "@/lib/limits";
import { mpaToKsi } from "@/lib/units";

const limit = (quantity: string, level: Limit["level"], bounds: { upper?: number; lower?: number }): Limit<string> => ({ quantity, level, hysteresis: 0, persistence: 1, ...bounds });
const asIs = (value: number) => value;

describe("limit lines", () => {
  it("draws each bound of the charted quantity only, labelled with its level and side", () => {
    const limits = [limit("stress", "watch", { upper: 150, lower: -150 }), limit("strain", "warning", { upper: 800 }), limit("stress", "critical", { upper: 250 })];
    expect(limitLines(limits, "stress", asIs)).toEqual([
      { value: 150, level: "watch", text: "watch upper" },
      { value: -150, level: "watch", text: "watch lower" },
      { value: 250, level: "critical", text: "critical upper" },
    ]);
    expect(limitLines(limits, "strain", asIs)).toEqual([{ value: 800, level: "warning", text: "warning upper" }]);
  });

  it("puts utilisation bounds on the stress chart at bound × yield (utilisation = |σ| / yield, the ratio the stress check takes, common practice)", () => {
    const limits = [limit("utilisation", "warning", { upper: 0.6 })];
    expect(limitLines(limits, "stress", asIs, 355)).toEqual([{ value: 213, level: "warning", text: "warning upper (60 % of yield)" }]);
    expect(limitLines(limits, "stress", asIs, null)).toEqual([]);
    expect(limitLines(limits, "strain", asIs, 355)).toEqual([]);
  });

  it("draws a rosette's bounds on its own quantity, converted to the display unit", () => {
    const limits = [limit("vonMises", "watch", { upper: 200 }), limit("sigma1", "critical", { upper: 300 })];
    expect(limitLines(limits, "vonMises", mpaToKsi)).toEqual([{ value: mpaToKsi(200), level: "watch", text: "watch upper" }]);
    // Utilisation belongs to gauges: a yield stress puts nothing extra on a rosette's chart.
    expect(limitLines(limits, "sigma1", asIs, 355)).toEqual([{ value: 300, level: "critical", text: "critical upper" }]);
  });
});

describe("the value range around data and lines", () => {
  const line = (value: number) => ({ value, level: "watch" as const, text: "" });

  it("reaches past the data to every line, padded by 5 % of the span", () => {
    expect(rangeWithLines(10, 50, [line(190)])).toEqual([1, 199]);
    expect(rangeWithLines(10, 50, [line(-90)])).toEqual([-97, 57]);
  });

  it("pads a flat chart by one unit and ignores a missing data extent", () => {
    expect(rangeWithLines(5, 5, [])).toEqual([4, 6]);
    expect(rangeWithLines(Number.NaN, Number.NaN, [line(100)])).toEqual([99, 101]);
  });
});

describe("fitting the value axis to the data", () => {
  const line = (value: number) => ({ value, level: "warning" as const, text: "" });

  // Arithmetic of the rule itself: data 10–50 (span 40), near means within 10 beyond the data.
  it("keeps a near bound in view and leaves a far one off scale, marked on its side", () => {
    const range = valueAxisRange(10, 50, [line(55), line(190), line(-300)], false);
    expect(range).toEqual([7.75, 57.25]);
    expect(offScaleLines([line(55), line(190), line(-300)], range).map(({ value, side }) => [value, side])).toEqual([
      [190, "above"],
      [-300, "below"],
    ]);
  });

  it("shows every line when asked, and then none is off scale", () => {
    const lines = [line(190), line(-300)];
    const range = valueAxisRange(10, 50, lines, true);
    expect(range).toEqual(rangeWithLines(10, 50, lines));
    expect(offScaleLines(lines, range)).toEqual([]);
  });
});
