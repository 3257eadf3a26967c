import { describe, expect, it } from "vitest";
import { describeChange } from "@/lib/audit/describe-change";

describe("audit trail in words", () => {
  it("lists only the fields that changed, by name, old → new, with units", () => {
    const before = { label: "Diagonal D3", gaugeFactor: 2.08, kind: "foil", input: "mV/V", material: { E: 210000, nu: 0.3, alpha: 12, yield: 355 } };
    const after = { label: "Diagonal D3, west face", gaugeFactor: 2.09, kind: "foil", input: "mV/V", material: { E: 200000, nu: 0.3, alpha: 12, yield: 355 } };
    expect(describeChange(before, after)).toEqual([
      { field: "Location", from: "Diagonal D3", to: "Diagonal D3, west face" },
      { field: "Gauge factor", from: "2.08", to: "2.09" },
      { field: "Young's modulus E", from: "210,000 MPa", to: "200,000 MPa" },
    ]);
  });

  it("gives a new zero reading the unit of the gauge's input", () => {
    const changes = describeChange(
      { input: "frequency-squared", zero: { value: 640, temperature: 12, time: "2026-01-01T00:00:00.000Z" } },
      { input: "frequency-squared", zero: { value: 655.5, temperature: 9.5, time: "2026-02-01T00:00:00.000Z" }, reason: "after repair" },
    );
    expect(changes).toContainEqual({ field: "Zero reading", from: "640 f²/1000", to: "655.5 f²/1000" });
    expect(changes).toContainEqual({ field: "Temperature at zero", from: "12 °C", to: "9.5 °C" });
    expect(changes).toContainEqual({ field: "Why", from: "—", to: "after repair" });
  });

  it("reads a shunt check in words, its outputs in the gauge's input unit", () => {
    const changes = describeChange(undefined, {
      shuntCheck: { unit: "mV/V", shuntResistance: 174_650, measuredOutput: 0.4963, expectedOutput: 0.499215, tolerancePercent: 1, result: "passed" },
    });
    expect(changes).toContainEqual({ field: "Shunt resistance", from: "—", to: "174,650 Ω" });
    expect(changes).toContainEqual({ field: "Measured output", from: "—", to: "0.4963 mV/V" });
    expect(changes).toContainEqual({ field: "Expected output", from: "—", to: "0.499215 mV/V" });
    expect(changes).toContainEqual({ field: "Result", from: "—", to: "passed" });
  });

  it("reads a change of sampling mode in words, not as stored JSON", () => {
    const [change] = describeChange(
      { sampling: { mode: "static" } },
      { sampling: { mode: "dynamic", rateHz: 100, summaryMinutes: 10, rangeBin: 0.5, trigger: { above: 40, preSeconds: 2, postSeconds: 5 } } },
    );
    expect(change).toEqual({
      field: "Sampling",
      from: "static (readings one at a time)",
      to: "dynamic, 100 Hz, summaries every 10 min, range bins 0.5 MPa, trigger above 40 MPa (2 s before, 5 s after)",
    });
  });

  it("reads a limit set as sentences, utilisation in % of yield", () => {
    const [change] = describeChange(
      { limits: [] },
      {
        limits: [
          { quantity: "utilisation", level: "critical", upper: 0.8, hysteresis: 0.05, persistence: 2 },
          { quantity: "stress", level: "watch", upper: 70, lower: -20, hysteresis: 8, persistence: 3 },
        ],
      },
    );
    expect(change).toEqual({
      field: "Limits",
      from: "none",
      to: "stress watch: above 70 MPa, below -20 MPa, dead band 8 MPa, 3 readings in a row; utilisation critical: above 80 % of yield, dead band 5 % of yield, 2 readings in a row",
    });
  });

  it("names a vibrating wire's factors in its own terms and the polarity in words", () => {
    const changes = describeChange(
      { kind: "vibrating-wire", gaugeFactor: 3.5, calibrationFactor: null, polarity: 1 },
      { kind: "vibrating-wire", gaugeFactor: 3.5325, calibrationFactor: 0.97, polarity: -1 },
    );
    expect(changes).toEqual([
      { field: "Gauge factor", from: "3.5 µε per f²/1000", to: "3.5325 µε per f²/1000" },
      { field: "Calibration multiplier, 1 if none", from: "—", to: "0.97" },
      { field: "Polarity", from: "normal (+1)", to: "reversed (−1)" },
    ]);
  });

  it("lists what a creation set, and keeps a field it has no wording for readable", () => {
    const changes = describeChange(null, { tag: "G1", thermal: { method: "cte", gaugeCte: 12 }, somethingNew: 4 });
    expect(changes).toEqual([
      { field: "Tag", from: "—", to: "G1" },
      { field: "Temperature compensation", from: "—", to: "expansion coefficient 12 µε/°C" },
      { field: "something new", from: "—", to: "4" },
    ]);
  });
});
