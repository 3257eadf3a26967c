import { runRollupMaintenance } from "@/jobs/rollup-maintenance";
import { beforeAll, describe, expect, it } from "vitest";
import * as readingsRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/readings/route";
import * as seriesRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/series/route";
import * as uploadRoute from "@/app/api/v1/structures/[code]/uploads/route";
import { getClient } from "@/db/client";
import { DAY, HOUR, MINUTE } from "@/lib/series";
import { apiRequest, makeUser, params, userToken } from "./helpers";
import { makeIngestStructure, postReadings, rollupMismatches, strainReadings, type Reading } from "./readings-fixtures";

let token: string;
const START = Date.UTC(2026, 0, 5);
const DAYS = 60;
const STEP = 10 * MINUTE;
const SPIKE_AT = START + 17 * DAY + 13 * HOUR + 40 * MINUTE;
const DIP_AT = START + 41 * DAY + 2 * HOUR + 10 * MINUTE;
/** S1's strain is value − 0 (readings-fixtures), so a planted value is the strain seen. */
// The spike and dip stay within a step the structure could make (under the 1 500 µε jump check), so they are readings, not faults.
const valueAt = (time: number) => (time === SPIKE_AT ? 1200 : time === DIP_AT ? -1000 : 50 * Math.sin(time / DAY));

beforeAll(async () => {
  const engineer = await makeUser("engineer");
  token = await userToken(engineer.email);
  await makeIngestStructure("SR", [engineer]);
  await makeIngestStructure("LT", [engineer]);
  const readings = strainReadings(START, (DAYS * DAY) / STEP, STEP, (i) => valueAt(START + i * STEP));
  for (let from = 0; from < readings.length; from += 5000) {
    const { status } = await postReadings("SR", token, { readings: readings.slice(from, from + 5000) });
    expect(status).toBe(200);
  }
});

type Series = { t: number[]; min: number[]; max: number[]; mean: number[]; count: number[]; source: string; bucketWidth: number; unit: string };

async function series(query: string, tag = "S1") {
  const response = await seriesRoute.GET(apiRequest(`/structures/SR/gauges/${tag}/series?${query}`, { token }), params({ code: "SR", tag }));
  return { status: response.status, body: await response.json() };
}

const range = (from: number, to: number) => `from=${new Date(from).toISOString()}&to=${new Date(to).toISOString()}`;

describe("series", () => {
  it("keeps a one-reading spike and dip over 60 days at 1000 points (hourly roll-ups)", async () => {
    const { status, body } = await series(`${range(START, START + DAYS * DAY)}&points=1000&quantity=strain`);
    expect(status).toBe(200);
    const s = body as Series;
    // By hand: 60 days / 1000 = 86.4 min, so the finest nice width that fits is 2 h: 720 buckets.
    expect(s.bucketWidth).toBe(2 * HOUR);
    expect(s.source).toBe("hourly");
    expect(s.t).toHaveLength(720);
    expect(s.unit).toBe("µε");
    const spikeBucket = s.t.indexOf(Math.floor(SPIKE_AT / (2 * HOUR)) * 2 * HOUR);
    expect(s.max[spikeBucket]).toBe(1200);
    expect(Math.max(...s.max)).toBe(1200);
    expect(Math.min(...s.min)).toBe(-1000);
    expect(s.count.reduce((a, b) => a + b, 0)).toBe((DAYS * DAY) / STEP);
  });

  it("keeps them at 50 points too (daily roll-ups), and from raw readings over one day", async () => {
    const coarse = (await series(`${range(START, START + DAYS * DAY)}&points=50`)).body as Series;
    expect(coarse.source).toBe("daily");
    expect(Math.max(...coarse.max)).toBe(1200);
    expect(Math.min(...coarse.min)).toBe(-1000);
    const day = Math.floor(SPIKE_AT / DAY) * DAY;
    const fine = (await series(`${range(day, day + DAY)}&points=1000`)).body as Series;
    expect(fine.source).toBe("raw");
    // By hand: one day / 1000 = 86.4 s, so 2-minute buckets, one reading in every fifth one: 144 readings.
    expect(fine.bucketWidth).toBe(2 * MINUTE);
    expect(fine.t).toHaveLength(144);
    expect(fine.max[fine.t.indexOf(SPIKE_AT)]).toBe(1200);
  });

  it("serves stress and temperature with their units", async () => {
    const stress = (await series(`${range(START, START + DAYS * DAY)}&quantity=stress`)).body as Series;
    expect(stress.unit).toBe("MPa");
    // By hand: 1200 µε × 200 000 MPa × 1e-6 = 240 MPa.
    expect(Math.max(...stress.max)).toBeCloseTo(240, 9);
    const temperature = (await series(`${range(START, START + DAYS * DAY)}&quantity=temperature`)).body as Series;
    expect(temperature.unit).toBe("°C");
    expect(new Set([...temperature.min, ...temperature.max, ...temperature.mean])).toEqual(new Set([20]));
  });

  it("defaults to the last 7 days", async () => {
    const { status, body } = await series("");
    expect(status).toBe(200);
    expect(Date.parse(body.to) - Date.parse(body.from)).toBe(7 * DAY);
    expect(Math.abs(Date.parse(body.to) - Date.now())).toBeLessThan(60_000);
  });

  it("answers 400 saying what to fix for bad parameters, 404 for an unknown gauge", async () => {
    for (const [query, words] of [
      ["points=0", /points/],
      ["points=6000", /points/],
      ["points=ten", /points/],
      ["quantity=force", /quantity/],
      [range(START + DAY, START), /before/],
      ["from=yesterday", /ISO-8601/],
    ] as const) {
      const { status, body } = await series(query);
      expect(status, query).toBe(400);
      expect(body.error.message, query).toMatch(words);
    }
    expect((await series("", "NOPE")).status).toBe(404);
  });
});

describe("readings", () => {
  const list = (query: string, headers: Record<string, string> = {}) =>
    readingsRoute.GET(apiRequest(`/structures/SR/gauges/S1/readings?${query}`, { token, headers }), params({ code: "SR", tag: "S1" }));

  it("pages through a range with the cursor, each reading once, in time order", async () => {
    const day = START + 3 * DAY;
    const times: number[] = [];
    let cursor: string | undefined;
    let pages = 0;
    do {
      const response = await list(`${range(day, day + DAY)}&limit=50${cursor ? `&cursor=${cursor}` : ""}`);
      const body = await response.json();
      times.push(...body.readings.map((r: { time: string }) => Date.parse(r.time)));
      cursor = body.nextCursor;
      pages++;
    } while (cursor);
    // By hand: 144 readings a day at 50 a page → 3 pages.
    expect(pages).toBe(3);
    expect(times).toEqual(Array.from({ length: 144 }, (_, i) => day + i * STEP));
    const first = await (await list(`${range(SPIKE_AT, SPIKE_AT + 1)}`)).json();
    expect(first.readings).toEqual([{ time: new Date(SPIKE_AT).toISOString(), value: 1200, temperature: 20, strain: 1200, stress: 240, flags: [] }]);
    expect((await list("cursor=not-ours")).status).toBe(400);
  });

  it("exports the range as CSV", async () => {
    const response = await list(range(START, START + HOUR), { accept: "text/csv" });
    expect(response.headers.get("content-type")).toMatch(/text\/csv/);
    const lines = (await response.text()).trim().split("\n");
    expect(lines[0]).toBe("time,value,temperature,strain,stress,flags");
    expect(lines).toHaveLength(7);
    const [time, value, temperature, strain, stress, flags] = lines[1]!.split(",");
    expect([time, Number(value), Number(temperature), flags]).toEqual([new Date(START).toISOString(), valueAt(START), 20, ""]);
    // The raw values are written with 9 or more decimals, so strain keeps 9 and stress 10 (lib/mechanics/resolution.ts).
    expect(strain).toMatch(/^-?\d+\.\d{9}$/);
    expect(Number(strain)).toBeCloseTo(valueAt(START), 8);
    expect(Number(stress)).toBeCloseTo(0.2 * valueAt(START), 9);
  });
});

describe("late and out-of-order readings", () => {
  it("merge into their roll-ups as if they had come in order", async () => {
    const all: Reading[] = strainReadings(START, 3 * 144, STEP, (i) => ((i * 37) % 101) - 50);
    const shuffled = [...all].sort((a, b) => ((all.indexOf(a) * 7919) % 433) - ((all.indexOf(b) * 7919) % 433));
    // Day 3 first, then days 1–2 shuffled, then a resend of a mix: late, out of order and duplicated.
    await postReadings("LT", token, { readings: all.slice(288) });
    await postReadings("LT", token, { readings: shuffled.filter((r) => all.indexOf(r) < 288).slice(0, 200) });
    const last = await (await postReadings("LT", token, { readings: shuffled })).json();
    expect(last.accepted).toBe(all.length - 144 - 200);
    expect(last.duplicates).toBe(144 + 200);
    expect(await rollupMismatches()).toEqual([]);
    // By hand: hour 0 holds readings i = 0…5, values (37i mod 101) − 50 = −50, −13, 24, −40, −3, 34.
    const hour = await getClient().execute({
      sql: "SELECT count, strain_min, strain_max, strain_sum FROM rollups r JOIN gauges g ON g.id = r.gauge_id JOIN structures s ON s.id = g.structure_id WHERE s.code = 'LT' AND r.resolution = ? AND r.bucket = ?",
      args: [HOUR, START],
    });
    expect({ ...hour.rows[0] }).toEqual({ count: 6, strain_min: -50, strain_max: 34, strain_sum: -48 });
  });
});

describe("logger-file upload", () => {
  const upload = (text: string, query = "", contentType = "text/csv") =>
    uploadRoute.POST(
      apiRequest(`/structures/LT/uploads${query}`, { method: "POST", token, body: text, headers: { "content-type": contentType } }),
      params({ code: "LT" }),
    );

  it("stores a file in batches, streams progress and reports bad rows by line", async () => {
    const rows = Array.from({ length: 12_000 }, (_, i) => `S1,${new Date(Date.UTC(2025, 5, 1) + i * MINUTE).toISOString().slice(0, 19)},${i % 90},18.5`);
    rows[99] = "S1,2025-06-01 01:39:00,NaN,18.5";
    rows[7000] = "GHOST,2025-06-05T20:40:00Z,1,18";
    const response = await upload(`gauge,time,value,temperature\n${rows.join("\n")}\n`, "?timezone=UTC");
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toMatch(/ndjson/);
    const lines = (await response.text()).trim().split("\n").map((line) => JSON.parse(line));
    expect(lines[0]).toEqual({ type: "start", timezone: "UTC" });
    // By hand: 12 000 rows in batches of 5 000 → progress after 5 000, 10 000 and 12 000 rows.
    expect(lines.filter((l) => l.type === "progress").map((l) => l.rows)).toEqual([5000, 10000, 12000]);
    const done = lines[lines.length - 1];
    expect(done).toMatchObject({ type: "done", rows: 12_000, accepted: 11_998, duplicates: 0, rejected: 2, rejectionsTruncated: false });
    // The header is line 1, so row index 99 sits on line 101.
    expect(done.rejections.map((r: { line: number; code: string }) => [r.line, r.code])).toEqual([
      [101, "not-finite"],
      [7002, "unknown-gauge"],
    ]);
    // Per gauge: S1's 11 998 stored readings, one a minute from 1 June 2025 00:00 to 11 999 minutes later
    // (8 days 7 h 59 min), the two rejected rows lying inside that span.
    expect(done.gauges).toEqual([{ gauge: "S1", readings: 11_998, from: "2025-06-01T00:00:00.000Z", to: "2025-06-09T07:59:00.000Z" }]);
    const again = (await (await upload(`gauge,time,value,temperature\n${rows.join("\n")}\n`, "?timezone=UTC")).text()).trim().split("\n");
    expect(JSON.parse(again[again.length - 1]!)).toMatchObject({ accepted: 0, duplicates: 11_998, rejected: 2, gauges: [] });
  });

  it("refuses a wrong header with a 400 and a non-CSV body with a 415 before streaming", async () => {
    const missing = await upload("gauge,value\nS1,1\n");
    expect(missing.status).toBe(400);
    expect((await missing.json()).error.message).toMatch(/"time"/);
    expect((await upload("{}", "", "application/json")).status).toBe(415);
    expect((await upload("gauge,time,value\n", "?timezone=Nowhere/Else")).status).toBe(400);
  });
});

describe("nightly roll-up maintenance", () => {
  it("rebuilds a day's roll-ups so they agree with the readings again after a change that bypassed ingestion", async () => {
    await getClient().execute({ sql: "UPDATE readings SET strain = strain + 1000 WHERE t >= ? AND t < ?", args: [START, START + HOUR] });
    expect((await rollupMismatches()).length).toBeGreaterThan(0);
    const summary = await runRollupMaintenance(START + 86_400_000 + HOUR);
    expect(summary).toMatch(/roll-up rows rebuilt/);
    expect(await rollupMismatches()).toEqual([]);
  });
});
