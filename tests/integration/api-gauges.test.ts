import { beforeAll, describe, expect, it } from "vitest";
import * as collection from "@/app/api/v1/structures/[code]/gauges/route";
import * as item from "@/app/api/v1/structures/[code]/gauges/[tag]/route";
import * as zero from "@/app/api/v1/structures/[code]/gauges/[tag]/zero/route";
import * as rosettes from "@/app/api/v1/structures/[code]/rosettes/route";
import { getDb } from "@/db/client";
import { readings } from "@/db/schema";
import { gaugeAuditTrail, replaceGauge, zeroHistory } from "@/lib/services/gauges";
import type { UserActor } from "@/lib/auth/actor";
import { apiRequest, makeStructure, makeUser, params, userToken } from "./helpers";

const tokens: Record<string, string> = {};
let engineer: UserActor;

// A foil quarter-bridge gauge on S355 steel (E = 210 GPa, EN 1993-1-1, from memory) with every documented field.
const quarterBridge = {
  tag: "G1",
  label: "Bottom flange, midspan",
  member: "Main girder 2",
  kind: "foil",
  input: "mV/V",
  bridge: "quarter",
  gaugeFactor: 2.1,
  material: { name: "S355", E: 210000, nu: 0.3, alpha: 12, yield: 355 },
  zero: { value: 0.012, temperature: 14.5, time: "2026-11-30T09:00:00Z" },
  expectedInterval: 600,
};

const vibratingWire = {
  tag: "VW-1",
  kind: "vibrating-wire",
  input: "Hz",
  // 150 mm of steel wire: K = 4·L²·ρ·10⁹ / E = 3.5325 µε per f²/1000 (taut-string physics)
  gaugeFactor: 3.5325,
  material: { E: 30000, nu: 0.2, alpha: 10 },
  zero: { value: 800, temperature: 12, time: "2026-11-30T09:00:00Z" },
};

function at(code: string): { params: Promise<{ code: string }> };
function at(code: string, tag: string): { params: Promise<{ code: string; tag: string }> };
function at(code: string, tag?: string) {
  return params(tag ? { code, tag } : { code });
}

beforeAll(async () => {
  engineer = await makeUser("engineer");
  const technician = await makeUser("technician");
  const owner = await makeUser("owner");
  await makeStructure("BR", [engineer, technician, owner]);
  await makeStructure("OTHER", [engineer]);
  for (const user of [engineer, technician, owner]) tokens[user.role] = await userToken(user.email);
});

const post = (token: string | undefined, body: unknown, code = "BR") =>
  collection.POST(apiRequest(`/structures/${code}/gauges`, { token, body }), at(code));

describe("registering gauges", () => {
  it("lets a technician register a foil gauge and read it back as sent", async () => {
    const response = await post(tokens.technician, quarterBridge);
    expect(response.status).toBe(201);
    const gauge = await response.json();
    // Output times are ISO 8601 in UTC with milliseconds, as the OpenAPI document says.
    const expected = { ...quarterBridge, zero: { ...quarterBridge.zero, time: "2026-11-30T09:00:00.000Z" } };
    expect(gauge).toMatchObject({ ...expected, status: "active", polarity: 1, initialStress: 0, thermal: { method: "none" } });
  });

  // Carbon-steel wire expands about 12.2 µε/°C (handbook value, from memory; steel lies about 11–13); the default is stored
  // with the gauge, so a later change of default never rewrites how its readings convert.
  it("defaults a vibrating-wire gauge to the steel wire's expansion coefficient and stores it", async () => {
    const response = await post(tokens.engineer, vibratingWire);
    expect(response.status).toBe(201);
    expect((await response.json()).thermal).toEqual({ method: "cte", gaugeCte: 12.2 });
    const withoutCoefficient = await post(tokens.engineer, { ...vibratingWire, tag: "VW-2", thermal: { method: "cte" } });
    expect((await withoutCoefficient.json()).thermal).toEqual({ method: "cte", gaugeCte: 12.2 });
  });

  it("answers 409 naming the duplicate tag", async () => {
    const response = await post(tokens.engineer, quarterBridge);
    expect(response.status).toBe(409);
    expect((await response.json()).error.message).toContain('"G1"');
  });

  it("refuses an owner (403) and hides other structures (404)", async () => {
    expect((await post(tokens.owner, { ...quarterBridge, tag: "G9" })).status).toBe(403);
    expect((await post(tokens.technician, { ...quarterBridge, tag: "G9" }, "OTHER")).status).toBe(404);
  });

  it.each([
    [{ ...quarterBridge, tag: "bad tag" }, "tag"],
    [{ ...quarterBridge, tag: "G2", bridge: undefined }, "bridge"],
    [{ ...quarterBridge, tag: "G2", input: "Hz" }, "input"],
    [{ ...quarterBridge, tag: "G2", gaugeFactor: -2 }, "gaugeFactor"],
    [{ ...quarterBridge, tag: "G2", material: { E: 0, nu: 0.3, alpha: 12 } }, "material.E"],
    [{ ...quarterBridge, tag: "G2", thermal: { method: "cte", gaugeCte: 10.8 }, zero: { value: 0 } }, "zero.temperature"],
    [{ ...vibratingWire, tag: "VW-2", bridge: "quarter" }, "bridge"],
  ])("explains what to fix: %#", async (body, field) => {
    const response = await post(tokens.engineer, body);
    expect(response.status).toBe(400);
    const { error } = await response.json();
    expect(error.code).toBe("validation_failed");
    expect(error.details.issues.map((issue: { path: string }) => issue.path)).toContain(field);
  });
});

describe("editing, zeroing and retiring", () => {
  const patch = (token: string, tag: string, body: unknown) =>
    item.PATCH(apiRequest(`/structures/BR/gauges/${tag}`, { token, body, method: "PATCH" }), at("BR", tag));

  it("edits a field, re-checks the whole gauge and records old → new in the audit trail", async () => {
    const response = await patch(tokens.engineer!, "G1", { gaugeFactor: 2.05, polarity: -1 });
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ gaugeFactor: 2.05, polarity: -1 });
    const [latest] = await gaugeAuditTrail(engineer, "BR", "G1");
    expect(latest).toMatchObject({ action: "gauge.update", before: { gaugeFactor: 2.1, polarity: 1 }, after: { gaugeFactor: 2.05, polarity: -1 } });

    const refused = await patch(tokens.engineer!, "G1", { input: "frequency-squared" });
    expect(refused.status).toBe(400);
  });

  it("keeps the coefficient an older wire gauge was stored with when it is edited after the default changed", async () => {
    // 12 µε/°C: the default such a gauge was created with before; an edit must not swap in today's.
    expect((await post(tokens.engineer, { ...vibratingWire, tag: "VW-OLD", thermal: { method: "cte", gaugeCte: 12 } })).status).toBe(201);
    const response = await patch(tokens.engineer!, "VW-OLD", { gaugeFactor: 3.6 });
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ gaugeFactor: 3.6, thermal: { method: "cte", gaugeCte: 12 } });
  });

  it("records the wiring and excitation of a technician's gauge, audited, and answers a wiring on a full bridge on its field", async () => {
    const created = await post(tokens.technician, { ...quarterBridge, tag: "G-WIRED", leadResistance: 1.8, gaugeResistance: 120 });
    // recorded before the wiring was asked for: no wiring, no excitation, the lead taken as the arm's
    expect(await created.json()).toMatchObject({ wiring: null, excitationVoltage: null, leadResistance: 1.8 });
    const response = await patch(tokens.technician!, "G-WIRED", { wiring: "3-wire", excitationVoltage: 2.5 });
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ wiring: "3-wire", excitationVoltage: 2.5 });
    const [latest] = await gaugeAuditTrail(engineer, "BR", "G-WIRED");
    expect(latest).toMatchObject({ action: "gauge.update", before: { wiring: null, excitationVoltage: null }, after: { wiring: "3-wire", excitationVoltage: 2.5 } });

    const refused = await patch(tokens.technician!, "G-WIRED", { bridge: "full-bending", excitationVoltage: 2500 });
    expect(refused.status).toBe(400);
    const { error } = await refused.json();
    expect(error.details.issues.map((issue: { path: string }) => issue.path)).toContain("excitationVoltage");
    const wiredFull = await patch(tokens.technician!, "G-WIRED", { bridge: "full-bending" });
    expect((await wiredFull.json()).error.details.issues.map((issue: { path: string }) => issue.path)).toContain("wiring");
  });

  it("sets a typed zero and keeps the previous one in the history", async () => {
    const response = await zero.POST(
      apiRequest("/structures/BR/gauges/G1/zero", { token: tokens.technician, body: { value: 0.02, temperature: 9, time: "2026-12-01T07:00:00Z", reason: "after bearing repair" } }),
      at("BR", "G1"),
    );
    expect(response.status).toBe(200);
    expect((await response.json()).zero).toEqual({ value: 0.02, temperature: 9, time: "2026-12-01T07:00:00.000Z" });
    const history = await zeroHistory(engineer, "BR", "G1");
    expect(history.map((z) => z.value)).toEqual([0.02, 0.012]);
    expect(history[0]).toMatchObject({ reason: "after bearing repair", source: "typed", setByLabel: "technician@test.example" });
  });

  it("sets a zero from the average of the last N readings", async () => {
    const [gauge] = await (await collection.GET(apiRequest("/structures/BR/gauges", { token: tokens.engineer }), at("BR"))).json().then((b) => b.gauges.filter((g: { tag: string }) => g.tag === "VW-1"));
    expect(gauge).toBeDefined();
    const { resolveGauge } = await import("@/lib/services/gauges");
    const { gauge: row } = await resolveGauge(engineer, "BR", "VW-1", "structure:view");
    await getDb()
      .insert(readings)
      .values([800, 810, 820, 830].map((value, i) => ({ gaugeId: row.id, time: Date.UTC(2026, 11, 1, i), value, temperature: 10 + i, strain: 0, stress: 0 })));
    const tooMany = await zero.POST(apiRequest("/structures/BR/gauges/VW-1/zero", { token: tokens.engineer, body: { fromReadings: 9 } }), at("BR", "VW-1"));
    expect(tooMany.status).toBe(400);
    const response = await zero.POST(apiRequest("/structures/BR/gauges/VW-1/zero", { token: tokens.engineer, body: { fromReadings: 3 } }), at("BR", "VW-1"));
    expect(response.status).toBe(200);
    // Mean of the last three raw values (810, 820, 830) and temperatures (11, 12, 13), by hand.
    expect((await response.json()).zero).toEqual({ value: 820, temperature: 12, time: "2026-12-01T03:00:00.000Z" });
  });

  it("replaces a failed gauge with a linked one and retires the old", async () => {
    const replacement = await replaceGauge(engineer, "BR", "G1", { ...quarterBridge, tag: "G1b", polarity: 1, initialStress: 0 } as never, "lead cut by mower");
    expect(replacement).toMatchObject({ tag: "G1b", replaces: "G1", status: "active" });
    const old = await (await item.GET(apiRequest("/structures/BR/gauges/G1", { token: tokens.owner }), at("BR", "G1"))).json();
    expect(old).toMatchObject({ status: "retired", replacedBy: "G1b" });
    const trail = await gaugeAuditTrail(engineer, "BR", "G1b");
    expect(trail.map((entry) => entry.action)).toEqual(expect.arrayContaining(["gauge.replace", "gauge.retire", "gauge.update", "gauge.zero", "gauge.create"]));
  });

  it("retires with DELETE, keeps the record and refuses later edits", async () => {
    const response = await item.DELETE(apiRequest("/structures/BR/gauges/VW-1", { token: tokens.engineer, method: "DELETE" }), at("BR", "VW-1"));
    expect(response.status).toBe(200);
    expect((await response.json()).status).toBe("retired");
    expect((await patch(tokens.engineer!, "VW-1", { gaugeFactor: 3.3 })).status).toBe(409);
  });

  it("answers 404 for an unknown gauge", async () => {
    const response = await item.GET(apiRequest("/structures/BR/gauges/NOPE", { token: tokens.owner }), at("BR", "NOPE"));
    expect(response.status).toBe(404);
  });
});

describe("rosettes", () => {
  it("groups three gauges of the structure", async () => {
    for (const tag of ["R-a", "R-b", "R-c"]) expect((await post(tokens.engineer, { ...quarterBridge, tag })).status).toBe(201);
    const create = (body: unknown) => rosettes.POST(apiRequest("/structures/BR/rosettes", { token: tokens.engineer, body }), at("BR"));
    const response = await create({ tag: "R1", layout: "rectangular", gauges: ["R-a", "R-b", "R-c"] });
    expect(response.status).toBe(201);
    expect(await response.json()).toMatchObject({ tag: "R1", layout: "rectangular", gauges: ["R-a", "R-b", "R-c"] });
    expect((await create({ tag: "R2", layout: "delta", gauges: ["R-a", "R-a", "R-c"] })).status).toBe(400);
    expect((await create({ tag: "R3", layout: "delta", gauges: ["R-a", "R-b", "missing"] })).status).toBe(400);
    expect((await create({ tag: "R1", layout: "delta", gauges: ["R-a", "R-b", "R-c"] })).status).toBe(409);
  });
});
