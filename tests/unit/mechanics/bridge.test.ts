import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { BRIDGES, prepareGauge, type Bridge } from "@/lib/mechanics";
import { converted, expectClose, foilGauge, prepared } from "./fixtures";

/**
 * Output ratio Vout/Vex of a Wheatstone bridge from its four arm resistances, as Dally & Riley
 * (Experimental Stress Analysis, bridge chapter) write the circuit: Vout/Vex = R1/(R1+R2) − R4/(R3+R4).
 */
function bridgeOutput([r1, r2, r3, r4]: readonly number[]): number {
  return r1! / (r1! + r2!) - r4! / (r3! + r4!);
}

/**
 * Relative arm resistances for a strain ε of the primary gauge whose resistance change is
 * x = GF·ε, primary gauge in R1 (each arm changes by GF·ε of its own gauge). A transverse
 * (Poisson) gauge sees −ν·ε; in bending the opposite face sees −ε; unstrained arms stay 1.
 */
const ARMS: Record<Bridge, (x: number, nu: number) => number[]> = {
  quarter: (x) => [1 + x, 1, 1, 1],
  "half-bending": (x) => [1 + x, 1 - x, 1, 1],
  "half-poisson": (x, nu) => [1 + x, 1 - nu * x, 1, 1],
  "full-bending": (x) => [1 + x, 1 - x, 1 + x, 1 - x],
  // top axial, bottom axial, bottom transverse, top transverse
  "full-poisson": (x, nu) => [1 + x, 1 - x, 1 + nu * x, 1 - nu * x],
  "full-axial-poisson": (x, nu) => [1 + x, 1 - nu * x, 1 + x, 1 - nu * x],
};

/** The logger's mV/V for a known strain; swapped output leads (polarity −1) reverse the output. */
function simulatedMillivoltsPerVolt(bridge: Bridge, microstrain: number, gaugeFactor: number, nu: number, polarity: 1 | -1 = 1): number {
  return polarity * 1000 * bridgeOutput(ARMS[bridge](gaugeFactor * microstrain * 1e-6, nu));
}

describe("foil gauge read in mV/V", () => {
  // Each relation below is the circuit above solved for ε (derived in lib/mechanics/bridge.ts),
  // evaluated by hand; Vr = (reading − zero)/1000, GF 2, ν 0.3.
  it.each([
    // quarter: Vr = 0.0005: 0.002 / (2 × (1 − 0.001)) = 1001.001 µε
    ["quarter", 0.5, 1001.001001001],
    // half-bending: 2 × 0.001 / 2 = 1000 µε
    ["half-bending", 1, 1000],
    // half-poisson: 0.0052 / (2 × (1.3 − 2 × 0.0013 × 0.7)) = 0.0052 / 2.59636 = 2002.804 µε
    ["half-poisson", 1.3, 2002.8039254957],
    // full-bending: 0.001 / 2 = 500 µε
    ["full-bending", 1, 500],
    // full-poisson: 2 × 0.0013 / (2 × 1.3) = 1000 µε
    ["full-poisson", 1.3, 1000],
    // full-axial-poisson: 0.0026 / (2 × (1.3 − 0.0013 × 0.7)) = 0.0026 / 2.59818 = 1000.700 µε
    ["full-axial-poisson", 1.3, 1000.7004903432],
  ] as const)("%s bridge: a positive output change is tension", (bridge, reading, expected) => {
    const gauge = prepared(foilGauge({ bridge, zero: { value: 0.2, temperature: 20 } }));
    expectClose(converted(gauge.convert(reading + 0.2, 20)).strain, expected, 1e-10);
  });

  it("recovers the strain a simulated Wheatstone bridge was loaded with, for every arrangement and either lead order", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...BRIDGES),
        fc.double({ min: -5000, max: 5000, noNaN: true }),
        fc.double({ min: 1.8, max: 3.2, noNaN: true }),
        fc.double({ min: 0.1, max: 0.45, noNaN: true }),
        fc.constantFrom<1 | -1>(1, -1),
        fc.double({ min: -2, max: 2, noNaN: true }),
        (bridge, microstrain, gaugeFactor, nu, polarity, zero) => {
          const gauge = prepared(
            foilGauge({ bridge, gaugeFactor, polarity, material: { E: 200_000, nu, alpha: 12 }, thermal: { method: "none" }, zero: { value: zero } }),
          );
          const reading = zero + simulatedMillivoltsPerVolt(bridge, microstrain, gaugeFactor, nu, polarity);
          expectClose(converted(gauge.convert(reading)).strain, microstrain, 1e-9, 1e-6);
        },
      ),
    );
  });

  it("quarter bridge tends to 4Vr/GF as Vr → 0 (the circuit's small-signal form)", () => {
    const gauge = prepared(foilGauge({ gaugeFactor: 2.1 }));
    for (const vr of [1e-3, 1e-4, 1e-5, 1e-6]) {
      const linear = (4 * vr) / 2.1;
      const ratio = converted(gauge.convert(vr * 1000)).strain / (linear * 1e6);
      // the non-linear factor is 1/(1 − 2Vr), so the ratio departs from 1 by about 2Vr
      expect(Math.abs(ratio - 1)).toBeLessThanOrEqual(2.1 * vr);
    }
  });

  it("corrects a quarter bridge for lead resistance, matching a simulated three-wire circuit", () => {
    // three-wire quarter bridge: one lead in the gauge arm, one in the adjacent arm (common practice)
    const gaugeResistance = 350;
    const leadResistance = 2.5;
    const microstrain = 1500;
    const gaugeArm = gaugeResistance * (1 + 2 * microstrain * 1e-6) + leadResistance;
    const reading = 1000 * bridgeOutput([gaugeArm, gaugeResistance + leadResistance, gaugeResistance, gaugeResistance]);
    const corrected = prepared(foilGauge({ leadResistance, gaugeResistance }));
    const uncorrected = prepared(foilGauge());
    expectClose(converted(corrected.convert(reading)).strain, microstrain, 1e-9);
    // without the correction the lead dilutes the reading by R_G/(R_G + R_L)
    expectClose(converted(uncorrected.convert(reading)).strain, (microstrain * 350) / 352.5, 1e-9);
  });

  it("with the wiring recorded, takes the lead resistance per lead: one in the arm for 3-wire, two for 2-wire", () => {
    const gaugeResistance = 120;
    const oneLead = 1.8;
    const microstrain = 800;
    const strainedGauge = gaugeResistance * (1 + 2 * microstrain * 1e-6);
    // 3-wire: one lead in the gauge arm, one in the adjacent arm; balanced at rest (common practice)
    const threeWire = 1000 * bridgeOutput([strainedGauge + oneLead, gaugeResistance + oneLead, gaugeResistance, gaugeResistance]);
    const threeWireGauge = prepared(foilGauge({ wiring: "3-wire", leadResistance: oneLead, gaugeResistance }));
    expectClose(converted(threeWireGauge.convert(threeWire)).strain, microstrain, 1e-9);
    // 2-wire: both leads in the gauge arm, completion resistor R_G beside it, so the bridge rests off
    // balance and the zero reading takes that offset; the correction is then exact to first order
    const rest = 1000 * bridgeOutput([gaugeResistance + 2 * oneLead, gaugeResistance, gaugeResistance, gaugeResistance]);
    const twoWire = 1000 * bridgeOutput([strainedGauge + 2 * oneLead, gaugeResistance, gaugeResistance, gaugeResistance]);
    const twoWireGauge = prepared(foilGauge({ wiring: "2-wire", leadResistance: oneLead, gaugeResistance, zero: { value: rest } }));
    expectClose(converted(twoWireGauge.convert(twoWire)).strain, microstrain, 2e-3);
    // the same resistance read as one lead of a 3-wire gauge would leave half the dilution in place
    const misread = prepared(foilGauge({ wiring: "3-wire", leadResistance: oneLead, gaugeResistance, zero: { value: rest } }));
    expect(converted(misread.convert(twoWire)).strain).toBeLessThan(microstrain * (1 - 0.5 * oneLead / gaugeResistance));
  });

  it("applies the lead correction only to a quarter bridge (lead resistance sits in the gauge's own arm)", () => {
    const gauge = prepared(foilGauge({ bridge: "half-bending", leadResistance: 12, gaugeResistance: 120 }));
    expectClose(converted(gauge.convert(1)).strain, 1000);
  });

  it("refuses an output no bridge of the arrangement can produce", () => {
    // 1 − 2Vr ≤ 0 needs Vr ≥ 0.5 V/V = 500 mV/V; a quarter bridge never exceeds Vr = 0.5
    expect(prepared(foilGauge()).convert(600)).toMatchObject({ ok: false, code: "impossible-bridge-output" });
    expect(prepared(foilGauge({ polarity: -1 })).convert(-600)).toMatchObject({ ok: false, code: "impossible-bridge-output" });
  });

  it("refuses an unknown bridge and a mV/V gauge without one", () => {
    const unknown = prepareGauge(foilGauge({ bridge: "third-bridge" as Bridge }));
    expect(unknown).toMatchObject({ ok: false, code: "unknown-bridge" });
    expect(prepareGauge(foilGauge({ bridge: null }))).toMatchObject({ ok: false, code: "unknown-bridge" });
  });

  it("refuses a non-positive gauge factor", () => {
    expect(prepareGauge(foilGauge({ gaugeFactor: 0 }))).toMatchObject({ ok: false, code: "invalid-gauge-factor" });
  });
});

describe("foil gauge read in microstrain", () => {
  it("rescales from the logger's gauge factor to the gauge's: ε = ε_logger·GF_logger/GF_gauge, since ΔR/R = GF·ε (Dally & Riley)", () => {
    // logger assumed GF 2.00, gauge is 2.10: 1050 µε reported → 1050 × 2.00 / 2.10 = 1000 µε
    const gauge = prepared(
      foilGauge({ input: "microstrain", bridge: null, gaugeFactor: 2.1, loggerGaugeFactor: 2, zero: { value: 40 } }),
    );
    expectClose(converted(gauge.convert(1090)).strain, 1000);
  });

  it("uses the reported value as is when the logger's gauge factor is not given", () => {
    const gauge = prepared(foilGauge({ input: "microstrain", bridge: null, zero: { value: -15 } }));
    expectClose(converted(gauge.convert(85)).strain, 100);
  });

  it("refuses an input a foil gauge does not have", () => {
    expect(prepareGauge(foilGauge({ input: "Hz" }))).toMatchObject({ ok: false, code: "unknown-input" });
  });
});
