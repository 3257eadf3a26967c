import { beforeAll, describe, expect, it } from "vitest";
import { GET as openapi } from "@/app/api/v1/openapi.json/route";
import { getClient, writeTransaction } from "@/db/client";
import { REJECTION_CODES } from "@/lib/ingest/rejections";
import type { UserActor } from "@/lib/auth/actor";
import { loggerToken, makeUser, userToken } from "./helpers";
import { makeIngestStructure, postReadings, rollupMismatches, storedCount, strainReadings } from "./readings-fixtures";

const tokens: Record<string, string> = {};
let engineer: UserActor;
const T0 = Date.UTC(2026, 2, 1, 12, 0, 0);
const at = (minutes: number) => new Date(T0 + minutes * 60_000).toISOString();

beforeAll(async () => {
  engineer = await makeUser("engineer");
  const technician = await makeUser("technician");
  const owner = await makeUser("owner");
  await makeIngestStructure("BR", [engineer, technician, owner], "Europe/London");
  await makeIngestStructure("OTHER", [engineer]);
  for (const user of [engineer, technician, owner]) tokens[user.role] = await userToken(user.email);
  tokens.logger = await loggerToken("BR");
  tokens.otherLogger = await loggerToken("OTHER");
});

async function post(body: unknown, token = tokens.logger, headers: Record<string, string> = {}, query = "") {
  const response = await postReadings("BR", token, body, headers, query);
  return { status: response.status, body: await response.json() };
}

describe("request-level errors: a clear status and message, never a 500", () => {
  it("answers 400 invalid_json to malformed JSON", async () => {
    const { status, body } = await post('{"readings": [');
    expect(status).toBe(400);
    expect(body.error.code).toBe("invalid_json");
  });

  it("answers 400 to a body that is not an object", async () => {
    const { status, body } = await post([{ gauge: "S1", time: at(0), value: 1 }]);
    expect(status).toBe(400);
    expect(body.error.message).toMatch(/JSON object/);
  });

  it("answers 400 naming readings when it is not an array", async () => {
    const { status, body } = await post({ readings: { gauge: "S1" } });
    expect(status).toBe(400);
    expect(body.error.message).toMatch(/readings/);
  });

  it("answers 415 to a content type it does not read", async () => {
    const { status, body } = await post("gauge=S1", tokens.logger, { "content-type": "application/x-www-form-urlencoded" });
    expect(status).toBe(415);
    expect(body.error.code).toBe("unsupported_media_type");
  });

  it("answers 413 past 50 000 readings, storing nothing", async () => {
    const readings = strainReadings(T0, 50_001, 1000, () => 1);
    const { status, body } = await post({ readings });
    expect(status).toBe(413);
    expect(body.error.message).toMatch(/50,000/);
    expect(await storedCount("BR")).toBe(0);
  });

  it("answers 413 past 10 MB", async () => {
    const padding = "x".repeat(10_000_001);
    const { status } = await post(`{"readings": [], "pad": "${padding}"}`);
    expect(status).toBe(413);
  });

  it("answers 401 without a token, 403 to an owner, 404 to another structure's logger", async () => {
    const body = { readings: [{ gauge: "S1", time: at(0), value: 1 }] };
    expect((await post(body, "")).status).toBe(401);
    expect((await post(body, tokens.owner)).status).toBe(403);
    expect((await post(body, tokens.otherLogger)).status).toBe(404);
    expect(await storedCount("BR")).toBe(0);
  });
});

describe("per-reading validation", () => {
  it("rejects each bad reading with its index and stores the valid ones exactly once", async () => {
    const readings: unknown[] = [
      { gauge: "S1", time: at(0), value: 10, temperature: 20 }, // 0 valid
      { gauge: "S1", time: at(1), value: "12.5" }, // 1 number in a string
      { gauge: "S1", time: at(2), value: "NaN" }, // 2 NaN cannot be a JSON number
      { gauge: 7, time: at(3), value: 1 }, // 3 wrong type of gauge
      { gauge: "S1", time: 1772366400000, value: 1 }, // 4 epoch number instead of ISO
      { gauge: "S1", time: "12:30:00Z", value: 1 }, // 5 no date
      { gauge: "S1", time: "2026-03-01T12:30:00", value: 1 }, // 6 no offset in JSON
      { gauge: "S1", time: "2999-01-01T00:00:00Z", value: 1 }, // 7 far future
      { gauge: "NOPE", time: at(4), value: 1 }, // 8 unknown gauge
      { gauge: "OLD", time: at(5), value: 1 }, // 9 retired gauge
      { gauge: "VW", time: at(6), value: 801 }, // 10 temperature needed for the wire's compensation
      { gauge: "VW", time: at(7), value: -5, temperature: 12 }, // 11 negative frequency
      { gauge: "S1", time: at(0), value: 99 }, // 12 same gauge and time as 0: duplicate
      "S1,2026-03-01,1", // 13 not an object
      { gauge: "S1", time: at(8), value: 1, temperature: "warm" }, // 14 temperature not a number
      { gauge: "S1", value: 1 }, // 15 no time
      { gauge: "S1", time: at(9) }, // 16 no value
      { gauge: "VW", time: at(10), value: 805, temperature: 13 }, // 17 valid
      { gauge: "S1", time: "2026-02-30T12:00:00Z", value: 1 }, // 18 no such day
    ];
    const { status, body } = await post({ readings });
    expect(status).toBe(200);
    expect(body.accepted).toBe(2);
    expect(body.duplicates).toBe(1);
    expect(body.alerts).toEqual({ opened: 0, escalated: 0, cleared: 0 });
    const codes = Object.fromEntries(body.rejected.map((r: { index: number; code: string }) => [r.index, r.code]));
    expect(codes).toEqual({
      1: "not-finite",
      2: "not-finite",
      3: "missing-gauge",
      4: "invalid-time",
      5: "invalid-time",
      6: "invalid-time",
      7: "time-in-future",
      8: "unknown-gauge",
      9: "retired-gauge",
      10: "temperature-required",
      11: "non-positive-frequency",
      13: "invalid-reading",
      14: "not-finite",
      15: "missing-time",
      16: "missing-value",
      18: "invalid-time",
    });
    for (const rejection of body.rejected) expect(rejection.message.length).toBeGreaterThan(20);
    expect(body.rejected.find((r: { index: number }) => r.index === 1).message).toMatch(/JSON number/);
    expect(body.rejected.find((r: { index: number }) => r.index === 6).message).toMatch(/offset/);
    expect(await storedCount("BR", "S1")).toBe(1);
    expect(await storedCount("BR", "VW")).toBe(1);
    // The first of two readings at one time is kept: value 10, not 99.
    const stored = await getClient().execute("SELECT value, strain, stress FROM readings r JOIN gauges g ON g.id = r.gauge_id WHERE g.tag = 'S1'");
    // By hand: strain = value − zero = 10 µε; stress = 200 000 MPa × 10e-6 = 2 MPa.
    expect(stored.rows.map((r) => [r.value, r.strain, r.stress])).toEqual([[10, 10, 2]]);
  });

  it("treats a resent batch as duplicates only (idempotent)", async () => {
    const readings = strainReadings(T0 + 3_600_000, 500, 60_000, (i) => i % 50);
    const first = await post({ readings });
    expect(first.body).toMatchObject({ accepted: 500, duplicates: 0, rejected: [] });
    const again = await post({ readings });
    expect(again.body).toMatchObject({ accepted: 0, duplicates: 500, rejected: [] });
    expect(await rollupMismatches()).toEqual([]);
  });

  it("accepts offsets other than Z and stores UTC", async () => {
    const { body } = await post({ readings: [{ gauge: "S1", time: "2026-03-02T13:00:00.250+01:00", value: 3 }] });
    expect(body.accepted).toBe(1);
    const row = await getClient().execute({ sql: "SELECT t FROM readings WHERE t = ?", args: [Date.UTC(2026, 2, 2, 12, 0, 0, 250)] });
    expect(row.rows).toHaveLength(1);
  });
});

describe("CSV", () => {
  const csv = (text: string, query = "") => post(text, tokens.technician, { "content-type": "text/csv" }, query);

  it("reads a BOM, times without an offset in the structure's zone, and rejects bad rows with their row index", async () => {
    // BR's zone is Europe/London: 1 July is summer time (UTC+1), 1 February winter (UTC+0).
    const text =
      "\uFEFFgauge,time,value,temperature\n" +
      "S1,2025-07-01 12:00:00,5,20\n" +
      "S1,2025-02-01T12:00:00,6,\n" +
      "S1,2025-02-01T12:10:00,6,5,20\n" + // decimal comma, unquoted: one field too many
      'S1,2025-02-01T12:20:00,"6,5",20\n' + // decimal comma, quoted
      "S1,2025-02-01T12:30:00Z,NaN,20\n" +
      "\n" +
      "S1,2025-02-01T12:40:00+02:00,7,20\n";
    const { status, body } = await csv(text);
    expect(status).toBe(200);
    expect(body.accepted).toBe(3);
    expect(body.rejected.map((r: { index: number; code: string }) => [r.index, r.code])).toEqual([
      [2, "wrong-column-count"],
      [3, "not-finite"],
      [4, "not-finite"],
    ]);
    expect(body.rejected[0].message).toMatch(/decimal comma/);
    expect(body.rejected[1].message).toMatch(/point/);
    const times = await getClient().execute({ sql: "SELECT t FROM readings WHERE t < ? ORDER BY t", args: [Date.UTC(2026, 0, 1)] });
    expect(times.rows.map((r) => r.t)).toEqual([Date.UTC(2025, 1, 1, 10, 40), Date.UTC(2025, 1, 1, 12, 0), Date.UTC(2025, 6, 1, 11, 0)]);
  });

  it("reads times without an offset in the zone given by ?timezone=", async () => {
    const { body } = await csv("gauge,time,value\nS1,2025-03-01 09:00,1\n", "?timezone=America/New_York");
    expect(body.accepted).toBe(1);
    // New York is UTC−5 on 1 March 2025 (daylight time starts 9 March).
    const row = await getClient().execute({ sql: "SELECT t FROM readings WHERE t = ?", args: [Date.UTC(2025, 2, 1, 14, 0)] });
    expect(row.rows).toHaveLength(1);
    expect((await csv("gauge,time,value\n", "?timezone=Mars/Olympus")).status).toBe(400);
  });

  it("refuses a semicolon-separated file, a missing column and an unknown column with a 400 that says what to fix", async () => {
    const semicolons = await csv("gauge;time;value;temperature\nS1;2025-03-01 09:00;1,5;20\n");
    expect(semicolons.status).toBe(400);
    expect(semicolons.body.error.message).toMatch(/semicolons.*commas/);
    const missing = await csv("gauge,time,temperature\nS1,2025-03-01 09:00,20\n");
    expect(missing.status).toBe(400);
    expect(missing.body.error.message).toMatch(/"value"/);
    const unknown = await csv("gauge,time,value,temprature\n");
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.message).toMatch(/"temprature"/);
    const empty = await csv("");
    expect(empty.status).toBe(400);
  });

  it("refuses a quote left open with a 400 and stores nothing of the request", async () => {
    const before = await storedCount("BR");
    const { status } = await csv('gauge,time,value\nS1,2025-04-01T00:00:00Z,1\nS1,"2025-04-01T00:10:00Z,1\n');
    expect(status).toBe(400);
    expect(await storedCount("BR")).toBe(before);
  });
});

describe("concurrent requests", () => {
  it("stores every reading of parallel requests exactly once, without SQLITE_BUSY", async () => {
    const fresh = await loggerToken("BR");
    const start = Date.UTC(2026, 0, 10);
    const batches = Array.from({ length: 8 }, (_, b) => strainReadings(start + b * 1000 * 60_000, 1000, 60_000, (i) => (i * 7) % 300));
    // Each batch overlaps the next by half, so half the readings race to be stored twice.
    const overlapping = batches.map((batch, b) => (b + 1 < batches.length ? [...batch, ...batches[b + 1]!.slice(0, 500)] : batch));
    const results = await Promise.all(overlapping.map((readings) => post({ readings }, fresh)));
    for (const result of results) expect(result.status).toBe(200);
    const accepted = results.reduce((sum, r) => sum + r.body.accepted, 0);
    const duplicates = results.reduce((sum, r) => sum + r.body.duplicates, 0);
    expect(accepted).toBe(8000);
    expect(duplicates).toBe(7 * 500);
    const stored = await getClient().execute({
      sql: "SELECT count(*) AS n FROM readings WHERE t >= ? AND t < ?",
      args: [start, start + 8000 * 60_000],
    });
    expect(stored.rows[0]!.n).toBe(8000);
    expect(await rollupMismatches()).toEqual([]);
  });

  it("notes a token's first use without stalling while an ingestion transaction is open", async () => {
    const fresh = await loggerToken("BR");
    let release!: () => void;
    const held = writeTransaction(() => new Promise<void>((resolve) => (release = resolve)));
    await new Promise((resolve) => setTimeout(resolve, 20));
    const answer = postReadings("BR", fresh, { readings: [] });
    setTimeout(() => release(), 50);
    await held;
    // A write beside the open transaction would wait for SQLite's lock and answer 500 (SQLITE_BUSY).
    expect((await answer).status).toBe(200);
  });
});

describe("OpenAPI document", () => {
  it("documents JSON and CSV bodies and every rejection code of the readings endpoint", async () => {
    const post = (await openapi().json()).paths["/structures/{code}/readings"].post;
    expect(Object.keys(post.requestBody.content)).toEqual(["application/json", "text/csv"]);
    for (const code of Object.keys(REJECTION_CODES)) expect(post.description).toContain(`\`${code}\``);
    // The machine API contract names these codes, spelt so: one code for any number that is not finite.
    expect(Object.keys(REJECTION_CODES)).toEqual(expect.arrayContaining(["not-finite", "before-zero", "temperature-out-of-range"]));
    expect(Object.keys(REJECTION_CODES).filter((code) => code.startsWith("non-finite"))).toEqual([]);
    expect(Object.keys(post.responses)).toEqual(expect.arrayContaining(["200", "400", "413", "415"]));
  });
});
