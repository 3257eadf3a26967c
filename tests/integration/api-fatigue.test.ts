import { parse } from "csv-parse/sync";
import { beforeAll, describe, expect, it } from "vitest";
import * as fatigueRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/fatigue/route";
import * as item from "@/app/api/v1/structures/[code]/gauges/[tag]/route";
import { getDb } from "@/db/client";
import { readings } from "@/db/schema";
import type { UserActor } from "@/lib/auth/actor";
import { Flag } from "@/lib/mechanics";
import { parseWith } from "@/lib/validation";
import { gaugeInput } from "@/lib/gauges/schema";
import { gaugeFatigue, type GaugeFatigue } from "@/lib/services/fatigue";
import { createGauge } from "@/lib/services/gauges";
import { apiRequest, makeStructure, makeUser, params, userToken } from "./helpers";

const tokens: Record<string, string> = {};
let engineer: UserActor;

const MINUTE_MS = 60_000;
const T0 = Date.parse("2026-01-01T00:00:00Z");
const FROM = "2026-01-01T00:00:00Z";
const TO = "2026-01-08T00:00:00Z";

// ASTM E1049-85 (2017) 5.4.4 example, −2, 1, −3, 5, −1, 3, −4, 4, −2, read as 10 MPa per unit about
// a 40 MPa dead-load stress (the mean moves no range), repeated REPEATS times, one reading a minute.
const ASTM_EXAMPLE = [-2, 1, -3, 5, -1, 3, -4, 4, -2];
const REPEATS = 1000;
const stressAt = (unit: number) => 40 + 10 * unit;

const gauge = (tag: string, detailCategory: number | null) =>
  parseWith(gaugeInput, {
    tag,
    kind: "foil",
    input: "microstrain",
    gaugeFactor: 2.1,
    material: { name: "S355", E: 210000, nu: 0.3, alpha: 12, yield: 355 },
    zero: { value: 0, time: "2025-12-01T00:00:00Z" },
    detailCategory,
  });

type Row = typeof readings.$inferInsert;
// The raw value follows the stress, as a live channel does: sensor health reads a constant raw value as a flat line.
const row = (gaugeId: number, time: number, stress: number, flags = 0): Row => ({ gaugeId, time, value: stress, strain: 0, stress, flags });

async function insertReadings(rows: Row[]) {
  // SQLite allows 32 766 bound parameters per statement; a reading binds 7.
  const chunk = Math.floor(32_766 / 7);
  for (let i = 0; i < rows.length; i += chunk) await getDb().insert(readings).values(rows.slice(i, i + chunk));
}

const at = (code: string, tag: string) => params({ code, tag });
const get = (query: string, token = tokens.engineer, init: { headers?: Record<string, string>; code?: string; tag?: string } = {}) => {
  const code = init.code ?? "FB";
  const tag = init.tag ?? "G1";
  return fatigueRoute.GET(apiRequest(`/structures/${code}/gauges/${tag}/fatigue?${query}`, { token, headers: init.headers }), at(code, tag));
};

beforeAll(async () => {
  engineer = await makeUser("engineer");
  const owner = await makeUser("owner");
  const outsider = await makeUser("owner", "outsider@test.example");
  await makeStructure("FB", [engineer, owner]);
  await makeStructure("OTHER", [engineer, outsider]);
  for (const user of [engineer, owner, outsider]) tokens[user === outsider ? "outsider" : user.role] = await userToken(user.email);

  const g1 = await createGauge(engineer, "FB", gauge("G1", 71));
  await createGauge(engineer, "FB", gauge("UNRATED", null));
  await createGauge(engineer, "FB", gauge("QUIET", 71));
  const ids = await getDb().query.gauges.findMany({ columns: { id: true, tag: true } });
  const id = (tag: string) => ids.find((g) => g.tag === tag)!.id;
  expect(g1.detailCategory).toBe(71);

  const history = Array.from({ length: REPEATS }, () => ASTM_EXAMPLE).flat();
  await insertReadings([
    ...history.map((unit, i) => row(id("G1"), T0 + i * MINUTE_MS, stressAt(unit))),
    // Halfway up from −3 to 5 in the first repeat: real stress flagged past the linear range, not a reversal.
    row(id("G1"), T0 + 2 * MINUTE_MS + 30_000, stressAt(1), Flag.outsideLinearRange),
    // A reading beyond the gauge's rated range is a sensor condition: left out, or it would add a 900 MPa spike.
    row(id("G1"), T0 + 94 * MINUTE_MS + 30_000, 900, Flag.outOfRange | Flag.outsideLinearRange),
    // Just outside [from, to): neither may count.
    row(id("G1"), T0 - MINUTE_MS, 900),
    row(id("G1"), Date.parse(TO), 900),
    // 5 MPa ranges, under the category-71 cut-off of 28.7 MPa: cycles, but no damage.
    ...Array.from({ length: 100 }, (_, i) => row(id("QUIET"), T0 + i * MINUTE_MS, 40 + 5 * (i % 2))),
  ]);
});

describe("fatigue of a gauge over a period", () => {
  it("counts the repeated example and sums Miner damage as worked by hand", async () => {
    // Counting by hand (ASTM E1049 5.4.4): the first repeat gives ½×3, ½×4, 1×4, ½×8 (the example
    // without its residue); every later repeat finds the stack at 5, −4, 4, −2 and closes one each of
    // 3, 7, 4 and two halves of 9, ending at the same stack; the residue then gives ½ each of 9, 8, 6.
    // For 1000 repeats, in MPa: 30 ×999.5, 40 ×1000.5, 60 ×0.5, 70 ×999, 80 ×1, 90 ×999.5 (4000 cycles).
    // EN 1993-1-9 curve (from memory), category 71: Δσ_D = 71·0.4^(1/3) = 52.313, Δσ_L = 0.5493·Δσ_D = 28.735 MPa.
    // N(30) = 5×10⁶·(52.313/30)⁵ = 80.62×10⁶     → 999.5/N  = 12.398×10⁻⁶
    // N(40) = 5×10⁶·(52.313/40)⁵ = 19.131×10⁶    → 1000.5/N = 52.299×10⁻⁶
    // N(60) = 2×10⁶·(71/60)³ = 3.3141×10⁶        → 0.5/N    = 0.151×10⁻⁶
    // N(70) = 2×10⁶·(71/70)³ = 2.0869×10⁶        → 999/N    = 478.691×10⁻⁶
    // N(80) = 2×10⁶·(71/80)³ = 1.3981×10⁶        → 1/N      = 0.715×10⁻⁶
    // N(90) = 2×10⁶·(71/90)³ = 0.98193×10⁶       → 999.5/N  = 1017.899×10⁻⁶
    // D = 1562.15×10⁻⁶.
    const response = await get(`from=${FROM}&to=${TO}`);
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body.cycles).toEqual([
      { range: 30, count: 999.5 },
      { range: 40, count: 1000.5 },
      { range: 60, count: 0.5 },
      { range: 70, count: 999 },
      { range: 80, count: 1 },
      { range: 90, count: 999.5 },
    ]);
    expect(body.damage / 1562.15e-6).toBeCloseTo(1, 4);
    expect(body).toMatchObject({
      category: 71,
      cyclesCounted: 4000,
      readingsUsed: 9001,
      readingsOutsideLinearRange: 1,
      readingsSkipped: 1,
      rangeBinWidth: 1,
      from: "2026-01-01T00:00:00.000Z",
      to: "2026-01-08T00:00:00.000Z",
      periodSeconds: 7 * 86_400,
      firstReading: "2026-01-01T00:00:00.000Z",
      lastReading: new Date(T0 + 8999 * MINUTE_MS).toISOString(),
      observedSeconds: 8999 * 60,
    });
    // Observed over 539 940 s = 0.017110 Julian years (31 557 600 s): 1562.15×10⁻⁶ / 0.017110 = 0.091303 per year,
    // so D = 1 in 1 / 0.091303 = 10.953 years.
    expect(body.damageRatePerYear).toBeCloseTo(0.091303, 5);
    expect(body.yearsToDamageOne).toBeCloseTo(10.953, 2);
  });

  it("takes the category from the query over the gauge's own", async () => {
    // Category 36: Δσ_D = 26.5 MPa, below every range here, so all use m = 3 (EN 1993-1-9, from memory):
    // D = Σ n·Δσ³ / (2×10⁶·36³) = (999.5·30³ + 1000.5·40³ + 0.5·60³ + 999·70³ + 1·80³ + 999.5·90³) / 9.3312×10¹⁰
    //   = 1.162931×10⁹ / 9.3312×10¹⁰ = 0.0124628.
    const body = await (await get(`from=${FROM}&to=${TO}&category=36`)).json();
    expect(body.category).toBe(36);
    expect(body.damage).toBeCloseTo(0.0124628, 6);
  });

  it("gives the same result in pages of 7 readings as in one page", async () => {
    const query = { from: new Date(FROM), to: new Date(TO) };
    const whole = await gaugeFatigue(engineer, "FB", "G1", query);
    const paged = await gaugeFatigue(engineer, "FB", "G1", query, { pageSize: 7 });
    // Sums of floats differ in the last digit when grouped differently; everything else is exact.
    const exact = ({ damage, damageRatePerYear, yearsToDamageOne, ...rest }: GaugeFatigue) => rest;
    expect(exact(paged.fatigue)).toEqual(exact(whole.fatigue));
    expect(paged.fatigue.damage).toBeCloseTo(whole.fatigue.damage, 15);
    expect(paged.matrix).toEqual(whole.matrix);
  });

  it("reports cycles but no damage, and no finite life, when every range is under the cut-off", async () => {
    const body = await (await get(`from=${FROM}&to=${TO}`, tokens.engineer, { tag: "QUIET" })).json();
    expect(body.cyclesCounted).toBeGreaterThan(0);
    expect(body).toMatchObject({ damage: 0, damageRatePerYear: 0, yearsToDamageOne: null, cycles: [{ range: 5 }] });
  });

  it("says so when the period holds no readings", async () => {
    const body = await (await get("from=2025-06-01T00:00:00Z&to=2025-07-01T00:00:00Z")).json();
    expect(body).toMatchObject({ cycles: [], damage: 0, cyclesCounted: 0, readingsUsed: 0, firstReading: null, damageRatePerYear: null, yearsToDamageOne: null });
  });
});

describe("rainflow matrix as CSV", () => {
  async function csvOf(response: Response) {
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(response.headers.get("content-disposition")).toBe('attachment; filename="FB-G1-rainflow-2026-01-01-to-2026-01-08.csv"');
    // Read by csv-parse, as a spreadsheet or script would read it, not by splitting on commas.
    return parse(await response.text(), { record_delimiter: "\r\n" }) as string[][];
  }

  it("has a row per range bin and a column per mean bin, with every counted cycle in it", async () => {
    const [header, ...rows] = await csvOf(await get(`from=${FROM}&to=${TO}&format=csv`));
    expect(header![0]).toBe("range bin upper edge (MPa) \\ mean bin centre (MPa)");
    // Ranges 30 to 90 MPa in 1 MPa bins: 61 rows. The cycles worked by hand above have means of
    // −1 to 1 units, 30 to 50 MPa; 35 and 45 lie on 10 MPa bin boundaries and go up: centres 30, 40, 50.
    expect(rows.map((cells) => Number(cells[0]))).toEqual(Array.from({ length: 61 }, (_, i) => 30 + i));
    expect(header!.slice(1).map(Number)).toEqual([30, 40, 50]);
    for (const cells of rows) expect(cells).toHaveLength(header!.length);
    const total = rows.flatMap((cells) => cells.slice(1).map(Number)).reduce((a, b) => a + b, 0);
    expect(total).toBe(4000);
  });

  it("is also what Accept: text/csv asks for", async () => {
    const viaAccept = await csvOf(await get(`from=${FROM}&to=${TO}`, tokens.engineer, { headers: { accept: "text/csv" } }));
    expect(viaAccept).toEqual(await csvOf(await get(`from=${FROM}&to=${TO}&format=csv`)));
  });
});

describe("parameters and permissions", () => {
  it.each([
    ["from=yesterday", "from"],
    [`from=${TO}&to=${FROM}`, "from must be earlier than to"],
    [`from=${FROM}&to=${FROM}`, "from must be earlier than to"],
    ["category=-71", "greater than zero"],
    ["category=seventy", "category is Δσ_C in MPa"],
    ["format=xml", 'format is "json" or "csv"'],
  ])("answers 400 saying what to fix for %s", async (query, fix) => {
    const response = await get(query);
    expect(response.status).toBe(400);
    expect((await response.json()).error.message).toContain(fix);
  });

  it("asks for a category when neither the query nor the gauge has one", async () => {
    const response = await get(`from=${FROM}&to=${TO}`, tokens.engineer, { tag: "UNRATED" });
    expect(response.status).toBe(400);
    expect((await response.json()).error.message).toMatch(/choose one with category=/);
    expect((await get(`from=${FROM}&to=${TO}&category=71`, tokens.engineer, { tag: "UNRATED" })).status).toBe(200);
  });

  it("lets an owner of the structure read it, hides it from others and from the signed-out", async () => {
    expect((await get(`from=${FROM}&to=${TO}`, tokens.owner)).status).toBe(200);
    expect((await get(`from=${FROM}&to=${TO}`, tokens.outsider)).status).toBe(404);
    expect((await get(`from=${FROM}&to=${TO}`, tokens.engineer, { code: "OTHER" })).status).toBe(404);
    expect((await get(`from=${FROM}&to=${TO}`, tokens.engineer, { tag: "NOPE" })).status).toBe(404);
    expect((await get(`from=${FROM}&to=${TO}`, "not-a-token")).status).toBe(401);
  });
});

describe("detail category in the gauge registry", () => {
  const patch = (body: unknown) =>
    item.PATCH(apiRequest("/structures/FB/gauges/QUIET", { token: tokens.engineer, body, method: "PATCH" }), at("FB", "QUIET"));

  it("takes one of the usual categories or null, and refuses others", async () => {
    expect((await (await patch({ detailCategory: 90 })).json()).detailCategory).toBe(90);
    const refused = await patch({ detailCategory: 72 });
    expect(refused.status).toBe(400);
    expect((await refused.json()).error.message).toContain("Choose a detail category");
    expect((await (await patch({ detailCategory: null })).json()).detailCategory).toBeNull();
  });
});
