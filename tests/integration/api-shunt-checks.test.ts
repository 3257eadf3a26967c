import { beforeAll, describe, expect, it } from "vitest";
import * as collection from "@/app/api/v1/structures/[code]/gauges/route";
import * as shuntRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/shunt-checks/route";
import { getDb } from "@/db/client";
import { auditLog, shuntChecks } from "@/db/schema";
import { shuntableFoilGauge } from "../fixtures/gauges";
import { apiRequest, makeTeam, params } from "./helpers";

let tokens: Awaited<ReturnType<typeof makeTeam>>["tokens"];

const R_GAUGE = 350;
const R_SHUNT = 174_650;

/** The Wheatstone circuit Vout/Vex = R1/(R1+R2) − R4/(R3+R4) (Dally & Riley, Experimental Stress Analysis, bridge chapter), in mV/V. */
const circuit = ([r1, r2, r3, r4]: number[]) => 1000 * (r1! / (r1! + r2!) - r4! / (r3! + r4!));
const parallel = (a: number, b: number) => (a * b) / (a + b);
/** A quarter bridge of 350 Ω arms with the gauge (R1) shunted: the change of output. */
const QUARTER_SHUNTED = circuit([parallel(R_GAUGE, R_SHUNT), R_GAUGE, R_GAUGE, R_GAUGE]) - circuit([R_GAUGE, R_GAUGE, R_GAUGE, R_GAUGE]);

const foil = (tag: string, fields: object = {}) => shuntableFoilGauge(tag, R_GAUGE, fields);

const path = (tag: string) => `/structures/SH/gauges/${tag}/shunt-checks`;
const post = (tag: string, body: unknown, token = tokens.technician) => shuntRoute.POST(apiRequest(path(tag), { token, body }), params({ code: "SH", tag }));
const list = async (tag: string) => (await (await shuntRoute.GET(apiRequest(path(tag), { token: tokens.owner }), params({ code: "SH", tag }))).json()).shuntChecks;
const storedCount = async () => (await getDb().select().from(shuntChecks)).length;

beforeAll(async () => {
  ({ tokens } = await makeTeam("SH"));
  const register = async (body: object) => {
    const response = await collection.POST(apiRequest("/structures/SH/gauges", { token: tokens.engineer, body }), params({ code: "SH" }));
    expect(response.status, JSON.stringify(await response.clone().json())).toBe(201);
  };
  await register(foil("Q1"));
  await register(foil("F-NO-R", { bridge: "full-bending", gaugeResistance: null }));
  await register(foil("US1", { input: "microstrain", bridge: "quarter", loggerGaugeFactor: 2.1 }));
  await register({
    tag: "VW1",
    kind: "vibrating-wire",
    input: "Hz",
    gaugeFactor: 3.5325,
    material: { E: 30_000, nu: 0.2, alpha: 10 },
    zero: { value: 800, temperature: 12, time: "2026-01-01T00:00:00Z" },
  });
});

describe("shunt-calibration checks over the API", () => {
  it("expects the output of the shunted circuit, ΔR/R = −R_g/(R_g + R_shunt) for a shunt across the gauge (common practice), and passes within 1 %", async () => {
    // The relation itself, from the circuit's own resistances: 350 ‖ 174 650 Ω is 0.2 % below 350 Ω.
    expect((parallel(R_GAUGE, R_SHUNT) - R_GAUGE) / R_GAUGE).toBeCloseTo(-R_GAUGE / (R_GAUGE + R_SHUNT), 15);
    const response = await post("Q1", { shuntResistance: R_SHUNT, measuredOutput: QUARTER_SHUNTED * 1.005, note: "after re-bonding" });
    expect(response.status).toBe(201);
    const check = await response.json();
    console.info(`shunt check Q1: expected ${check.expectedOutput.toFixed(6)} mV/V (circuit ${QUARTER_SHUNTED.toFixed(6)}), simulated ${check.simulatedStrain.toFixed(1)} µε`);
    expect(check.expectedOutput).toBeCloseTo(QUARTER_SHUNTED, 12);
    // At GF 2, ΔR/R = −0.002 is −1000 µε (ΔR/R = GF·ε).
    expect(check.simulatedStrain).toBeCloseTo(-1000, 9);
    expect(check).toMatchObject({ unit: "mV/V", tolerancePercent: 1, passed: true, note: "after re-bonding", checkedBy: "technician@test.example" });
    expect(check.differencePercent).toBeCloseTo(0.5, 9);
  });

  it("fails a measured output 3 % short, and passes it against a 5 % tolerance", async () => {
    const failed = await (await post("Q1", { shuntResistance: R_SHUNT, measuredOutput: QUARTER_SHUNTED * 0.97 })).json();
    expect(failed.passed).toBe(false);
    expect(failed.differencePercent).toBeCloseTo(-3, 9);
    const wide = await (await post("Q1", { shuntResistance: R_SHUNT, measuredOutput: QUARTER_SHUNTED * 0.97, tolerancePercent: 5 }, tokens.engineer)).json();
    expect(wide.passed).toBe(true);
  });

  it("lists the gauge's checks newest first for anyone who sees the structure, each with an audit row", async () => {
    const checks = await list("Q1");
    expect(checks.map((check: { passed: boolean; tolerancePercent: number }) => [check.passed, check.tolerancePercent])).toEqual([
      [true, 5],
      [false, 1],
      [true, 1],
    ]);
    const audits = (await getDb().select().from(auditLog)).filter((row) => row.action === "gauge.shunt-check");
    expect(audits).toHaveLength(3);
  });

  it("expects of a microstrain logger the strain it computes with its own gauge factor", async () => {
    // The logger turns the shunted quarter-bridge output into ε = 4Vr / (GF·(1 − 2Vr)) with GF 2.1 (the quarter-bridge relation).
    const vr = QUARTER_SHUNTED / 1000;
    const loggerStrain = ((4 * vr) / (2.1 * (1 - 2 * vr))) * 1e6;
    const check = await (await post("US1", { shuntResistance: R_SHUNT, measuredOutput: loggerStrain })).json();
    expect(check).toMatchObject({ unit: "microstrain", passed: true });
    expect(check.expectedOutput).toBeCloseTo(loggerStrain, 9);
  });

  it("refuses a gauge that is not a foil bridge, and one without its gauge resistance, saying why and storing nothing", async () => {
    const before = await storedCount();
    const wire = await post("VW1", { shuntResistance: R_SHUNT, measuredOutput: -0.5 });
    expect(wire.status).toBe(400);
    expect((await wire.json()).error.message).toMatch(/foil gauge with its bridge/);
    const noResistance = await post("F-NO-R", { shuntResistance: R_SHUNT, measuredOutput: -0.5 });
    expect(noResistance.status).toBe(400);
    expect((await noResistance.json()).error.message).toMatch(/gauge's resistance/);
    expect(await storedCount()).toBe(before);
    expect(await list("VW1")).toEqual([]);
  });

  it("lets an owner read the checks but not record one", async () => {
    const response = await post("Q1", { shuntResistance: R_SHUNT, measuredOutput: QUARTER_SHUNTED }, tokens.owner);
    expect(response.status).toBe(403);
    expect(await list("Q1")).toHaveLength(3);
  });
});
