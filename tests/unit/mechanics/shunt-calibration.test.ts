import { describe, expect, it } from "vitest";
import { expectedShuntOutput, shuntCheckVerdict } from "@/lib/mechanics/shunt-calibration";
import { converted, expectClose, foilGauge, prepared, vibratingWireGauge } from "./fixtures";

/** The Wheatstone circuit Vout/Vex = R1/(R1+R2) − R4/(R3+R4) (Dally & Riley, Experimental Stress Analysis, bridge chapter). */
function bridgeOutput([r1, r2, r3, r4]: readonly number[]): number {
  return r1! / (r1! + r2!) - r4! / (r3! + r4!);
}

const parallel = (a: number, b: number) => (a * b) / (a + b);

function expected(config: Parameters<typeof expectedShuntOutput>[0], shunt: number) {
  const result = expectedShuntOutput(config, shunt);
  if (!result.ok) throw new Error(result.message);
  return result.value;
}

describe("shunt calibration", () => {
  it("gives ΔR/R = −R_g/(R_g + R_shunt) for a shunt across the gauge (common practice): 350 Ω and 174 650 Ω simulate −1000 µε at GF 2", () => {
    const value = expected(foilGauge({ gaugeResistance: 350 }), 174_650);
    expectClose(value.armResistanceChange, -350 / 175_000, 1e-12);
    expectClose(value.equivalentStrain, -1000, 1e-9);
  });

  it("predicts the output of a simulated quarter-bridge circuit with the gauge shunted, derived from the Wheatstone equation", () => {
    const gaugeResistance = 120;
    const shunt = 59_880;
    const circuit = 1000 * (bridgeOutput([parallel(gaugeResistance, shunt), 120, 120, 120]) - bridgeOutput([120, 120, 120, 120]));
    expectClose(expected(foilGauge({ gaugeResistance }), shunt).expectedOutput, circuit, 1e-12);
    // swapped output leads show the same shunt with the opposite sign
    expectClose(expected(foilGauge({ gaugeResistance, polarity: -1 }), shunt).expectedOutput, -circuit, 1e-12);
  });

  it("includes the lead in the gauge's arm of a 3-wire quarter bridge, shunted at the gauge", () => {
    const gaugeResistance = 350;
    const lead = 2;
    const shunt = 100_000;
    const rest = [gaugeResistance + lead, gaugeResistance + lead, gaugeResistance, gaugeResistance];
    const shunted = [parallel(gaugeResistance, shunt) + lead, gaugeResistance + lead, gaugeResistance, gaugeResistance];
    const circuit = 1000 * (bridgeOutput(shunted) - bridgeOutput(rest));
    const value = expected(foilGauge({ gaugeResistance, wiring: "3-wire", leadResistance: lead }), shunt);
    expectClose(value.expectedOutput, circuit, 1e-12);
    // the lead-corrected conversion reads the shunt back as the unleaded shunt strain −R_g/(GF·(R_g + R_s))
    expectClose(value.equivalentStrain, (-gaugeResistance / (2 * (gaugeResistance + shunt))) * 1e6, 1e-9);
  });

  it("shunts one arm of a full bridge: the circuit output is that of one changing arm, read back by the full-bridge relation", () => {
    const shunt = 175_000;
    const circuit = 1000 * (bridgeOutput([parallel(350, shunt), 350, 350, 350]) - bridgeOutput([350, 350, 350, 350]));
    const value = expected(foilGauge({ bridge: "full-bending", gaugeResistance: 350 }), shunt);
    expectClose(value.expectedOutput, circuit, 1e-12);
    // full bending: ε = Vr / GF
    expectClose(value.equivalentStrain, (circuit / 1000 / 2) * 1e6, 1e-12);
  });

  it("expects of a microstrain logger the strain it computes from the shunted output with its own gauge factor", () => {
    // Full bending, GF 2.0 at the gauge, 2.1 set in the logger: the logger reads Vr / 2.1 and the
    // gauge's conversion rescales by 2.1 / 2.0 (ε = ε_logger × GF_logger / GF_gauge), back to Vr / 2.0.
    const shunt = 175_000;
    const vr = bridgeOutput([parallel(350, shunt), 350, 350, 350]) - bridgeOutput([350, 350, 350, 350]);
    const config = foilGauge({ input: "microstrain", bridge: "full-bending", gaugeResistance: 350, gaugeFactor: 2, loggerGaugeFactor: 2.1, zero: { value: 0 } });
    const value = expected(config, shunt);
    expectClose(value.expectedReading, (vr / 2.1) * 1e6, 1e-12);
    expectClose(converted(prepared(config).convert(value.expectedReading)).indicatedStrain, value.equivalentStrain, 1e-12);
    // read in mV/V the expected reading is the bridge output itself
    expect(expected(foilGauge({ gaugeResistance: 350 }), shunt).expectedReading).toBe(expected(foilGauge({ gaugeResistance: 350 }), shunt).expectedOutput);
  });

  it("refuses a gauge that is not a foil bridge, and one without its resistance", () => {
    expect(expectedShuntOutput(vibratingWireGauge(), 100_000)).toMatchObject({ ok: false, code: "not-a-foil-bridge" });
    expect(expectedShuntOutput(foilGauge({ input: "microstrain", bridge: null, gaugeResistance: 350 }), 100_000)).toMatchObject({ ok: false, code: "not-a-foil-bridge" });
    expect(expectedShuntOutput(foilGauge(), 100_000)).toMatchObject({ ok: false, code: "gauge-resistance-required" });
    expect(expectedShuntOutput(foilGauge({ gaugeResistance: 350 }), 0)).toMatchObject({ ok: false, code: "invalid-shunt" });
  });

  it("passes within the tolerance and fails outside it, either side", () => {
    expect(shuntCheckVerdict(-0.496, -0.5, 1)).toMatchObject({ passed: true });
    expect(shuntCheckVerdict(-0.49, -0.5, 1)).toMatchObject({ passed: false });
    expect(shuntCheckVerdict(-0.51, -0.5, 1)).toMatchObject({ passed: false });
    expectClose(shuntCheckVerdict(-0.49, -0.5, 1).deviationPercent, -2, 1e-9);
  });
});
