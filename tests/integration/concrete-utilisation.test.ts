import { beforeAll, describe, expect, it } from "vitest";
import * as collection from "@/app/api/v1/structures/[code]/gauges/route";
import * as readingsRoute from "@/app/api/v1/structures/[code]/readings/route";
import * as reportRoute from "@/app/api/v1/structures/[code]/report/route";
import { getDb } from "@/db/client";
import { CONCRETE_CAUTION, concreteOfClass } from "@/lib/mechanics";
import { gaugeStatuses } from "@/lib/services/status";
import { apiRequest, makeStructure, makeUser, params, userToken } from "./helpers";

// C30/37 of EN 1992-1-1: f_ck = 30 MPa, E_cm = 22·(38/10)^0.3 GPa (Table 3.1 relation).
const C30 = concreteOfClass("C30/37");
const at = (code: string) => params({ code });
let token: string;

/** A microstrain gauge whose logger gauge factor is its own, so the value sent is the strain (µε). */
const strainGauge = (tag: string, material: object) => ({
  tag,
  kind: "foil",
  input: "microstrain",
  gaugeFactor: 2,
  material,
  zero: { value: 0, temperature: 10, time: "2026-10-01T00:00:00Z" },
});

async function post(path: string, body: unknown) {
  const route = path.endsWith("/readings") ? readingsRoute : collection;
  return route.POST(apiRequest(path, { token, body }), at(path.split("/")[2]!));
}

beforeAll(async () => {
  const engineer = await makeUser("engineer");
  await makeStructure("DECK", [engineer]);
  await makeStructure("FRAME", [engineer]);
  token = await userToken(engineer.email);
  expect((await post("/structures/DECK/gauges", strainGauge("C1", C30))).status).toBe(201);
  expect((await post("/structures/DECK/gauges", strainGauge("C2", C30))).status).toBe(201);
  expect((await post("/structures/FRAME/gauges", strainGauge("S1", { E: 210_000, nu: 0.3, alpha: 12, yield: 355 }))).status).toBe(201);
  // C1: −12 MPa of compression at its worst, then back to a little tension; C2 only in tension.
  const toStrain = (stress: number) => (stress / C30.E) * 1e6;
  const send = (gauge: string, stresses: number[]) =>
    post("/structures/DECK/readings", {
      readings: stresses.map((stress, i) => ({ gauge, time: new Date(Date.UTC(2026, 9, 10, i)).toISOString(), value: toStrain(stress), temperature: 10 })),
    });
  expect((await send("C1", [-3, -12, -6, 0.8])).status).toBe(200);
  expect((await send("C2", [0.5, 1.2])).status).toBe(200);
  await post("/structures/FRAME/readings", { readings: [{ gauge: "S1", time: "2026-10-10T00:00:00Z", value: -500, temperature: 10 }] });
});

describe("concrete utilisation", () => {
  it("stores and answers the concrete's compressive strength, and leaves a metal without one", async () => {
    const listed = await (await collection.GET(apiRequest("/structures/DECK/gauges", { token }), at("DECK"))).json();
    expect(listed.gauges[0].material).toMatchObject({ compressiveStrength: 30, yield: null, nu: 0.2, alpha: 10 });
    const steel = await getDb().query.gauges.findFirst({ where: (row, { eq }) => eq(row.tag, "S1") });
    // A metal's stored material keeps its old shape: no compressive strength key is written.
    expect(Object.keys(steel!.material).sort()).toEqual(["E", "alpha", "nu", "yield"]);
  });

  it("refuses a material with both a yield and a compressive strength, naming the field, and stores nothing", async () => {
    const response = await post("/structures/DECK/gauges", strainGauge("BOTH", { ...C30, yield: 500 }));
    expect(response.status).toBe(400);
    const body = await response.json();
    expect(JSON.stringify(body.error)).toContain("material.compressiveStrength");
    expect(body.error.message + JSON.stringify(body.error.details)).toMatch(/not both/);
    const listed = await (await collection.GET(apiRequest("/structures/DECK/gauges", { token }), at("DECK"))).json();
    expect(listed.gauges.map((gauge: { tag: string }) => gauge.tag)).toEqual(["C1", "C2"]);
  });

  it("rates the latest reading: tension not rated; the steel against its yield", async () => {
    const [deck] = await getDb().query.structures.findMany({ where: (row, { eq }) => eq(row.code, "DECK") });
    const statuses = await gaugeStatuses(deck!, Date.UTC(2026, 9, 11));
    // Latest reading of C1 is +0.8 MPa: concrete in tension is not rated.
    expect(statuses.find((status) => status.tag === "C1")!.latest!.rating).toEqual({ basis: "compressive-strength", strength: 30, ratio: null });
    const [frame] = await getDb().query.structures.findMany({ where: (row, { eq }) => eq(row.code, "FRAME") });
    const [steel] = await gaugeStatuses(frame!, Date.UTC(2026, 9, 11));
    // −500 µε × 210 000 MPa = −105 MPa (Hooke's law); |σ| / yield = 105 / 355.
    expect(steel!.latest!.rating!.ratio).toBeCloseTo(105 / 355, 9);
  });

  it("reports the peak compression over f_ck, tension-only as not rated, with the concrete caution", async () => {
    const response = await reportRoute.GET(apiRequest("/structures/DECK/report?month=2026-10", { token }), at("DECK"));
    expect(response.status).toBe(200);
    const report = await response.json();
    const byTag = Object.fromEntries(report.gauges.map((gauge: { tag: string; utilisationPeak: unknown }) => [gauge.tag, gauge.utilisationPeak]));
    // Largest compression 12 MPa on f_ck = 30 MPa: 0.4 (compressive stress ÷ f_ck).
    expect(byTag.C1).toEqual({ basis: "compressive-strength", ratio: expect.closeTo(0.4, 9), compressiveStrength: 30 });
    expect(byTag.C2).toEqual({ basis: "compressive-strength", ratio: null, compressiveStrength: 30 });
    expect(report.cautions).toContain(CONCRETE_CAUTION);
    const steel = await (await reportRoute.GET(apiRequest("/structures/FRAME/report?month=2026-10", { token }), at("FRAME"))).json();
    expect(steel.gauges[0].utilisationPeak).toEqual({ basis: "yield", ratio: expect.closeTo(105 / 355, 9), yield: 355 });
    expect(steel.cautions).not.toContain(CONCRETE_CAUTION);
  });
});
