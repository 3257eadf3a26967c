import { parse } from "csv-parse/sync";
import { beforeAll, describe, expect, it } from "vitest";
import * as burstsRoute from "@/app/api/v1/structures/[code]/bursts/route";
import * as summariesRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/summaries/route";
import * as eventsRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/events/route";
import * as eventRoute from "@/app/api/v1/structures/[code]/events/[id]/route";
import * as readingsRoute from "@/app/api/v1/structures/[code]/readings/route";
import * as limitsRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/limits/route";
import * as gaugeRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/route";
import * as fatigueRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/fatigue/route";
import { GET as openapi } from "@/app/api/v1/openapi.json/route";
import { getClient, getDb } from "@/db/client";
import { eq } from "drizzle-orm";
import { alerts, auditLog, burstSummaries, gauges, mailOutbox } from "@/db/schema";
import { createGauge } from "@/lib/services/gauges";
import { addMember } from "@/lib/services/memberships";
import { createStructure } from "@/lib/services/structures";
import type { UserActor } from "@/lib/auth/actor";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, loggerToken, makeStructure, makeUser, params, userToken } from "./helpers";

// Gauges read microstrain with no compensation on steel of E = 200 000 MPa: stress = 0.2 MPa per µε
// (Hooke's law, σ = E·ε), so every expected stress below is the sent value × 0.2.
const MPA_PER_MICROSTRAIN = 0.2;
const RATE = 100;
const T0 = Date.UTC(2026, 5, 1, 8, 0, 0);
const dynamic = { mode: "dynamic", rateHz: RATE, summaryMinutes: 10, rangeBin: 1, trigger: { above: 20, below: null, preSeconds: 2, postSeconds: 5 } } as const;

const tokens: Record<string, string> = {};
let engineer: UserActor;

beforeAll(async () => {
  engineer = await makeUser("engineer");
  const owner = await makeUser("owner");
  await makeStructure("BR", [engineer, owner]);
  await makeStructure("OTHER", [engineer]);
  for (const tag of ["D1", "D2", "D3", "D4", "D5", "D6", "D7", "D8", "D9", "D10"]) {
    await createGauge(engineer, "BR", { ...microstrainGauge(tag), material: { E: 200000, nu: 0.3, alpha: 12, yield: 355 }, sampling: dynamic });
  }
  await createGauge(engineer, "BR", microstrainGauge("S1"));
  tokens.engineer = await userToken(engineer.email);
  tokens.owner = await userToken(owner.email);
  tokens.logger = await loggerToken("BR");
  tokens.otherLogger = await loggerToken("OTHER");
});

/** Microstrain samples that are exact as 32-bit floats, so JSON and binary carry the same numbers. */
function signal(seconds: number, valueAt: (t: number) => number): number[] {
  return Array.from({ length: seconds * RATE }, (_, i) => Math.fround(valueAt(i / RATE)));
}

// Started at a crest, so the 100 Hz sampling hits both extremes of the 2 Hz swing.
const footfall = (t: number) => 25 * Math.cos(2 * Math.PI * 2 * t) + 5;

async function postJson(bursts: unknown[], token = tokens.logger) {
  const response = await burstsRoute.POST(apiRequest("/structures/BR/bursts", { token, body: { bursts } }), params({ code: "BR" }));
  return { status: response.status, body: await response.json() };
}

async function postBinary(query: Record<string, string | number>, body: Uint8Array, token = tokens.logger, code = "BR") {
  const search = new URLSearchParams(Object.entries(query).map(([k, v]) => [k, String(v)]));
  const request = new Request(`http://localhost/api/v1/structures/${code}/bursts?${search}`, {
    method: "POST",
    headers: { authorization: `Bearer ${token}`, "content-type": "application/octet-stream" },
    body: body as unknown as BodyInit,
  });
  const response = await burstsRoute.POST(request, params({ code }));
  return { status: response.status, body: await response.json() };
}

const floats = (values: readonly number[]) => new Uint8Array(new Float32Array(values).buffer);
const iso = (ms: number) => new Date(ms).toISOString();

async function summaries(tag: string, from = T0 - 3_600_000, to = T0 + 86_400_000) {
  const response = await summariesRoute.GET(apiRequest(`/structures/BR/gauges/${tag}/summaries?from=${iso(from)}&to=${iso(to)}`, { token: tokens.owner }), params({ code: "BR", tag }));
  expect(response.status).toBe(200);
  return response.json();
}

async function storedBursts(tag: string): Promise<number> {
  const result = await getClient().execute({ sql: "SELECT count(*) FROM bursts b JOIN gauges g ON g.id = b.gauge_id WHERE g.tag = ?", args: [tag] });
  return Number(result.rows[0]![0]);
}

describe("POST /bursts", () => {
  it("gives the same summaries from JSON and from binary", async () => {
    const values = signal(60, footfall);
    const json = await postJson([{ gauge: "D1", start: iso(T0), rateHz: RATE, values }]);
    expect(json.status).toBe(200);
    expect(json.body).toMatchObject({ accepted: 6000, bursts: 1, duplicates: 0, rejected: [] });
    const binary = await postBinary({ gauge: "D2", start: iso(T0), rateHz: RATE }, floats(values));
    expect(binary.status).toBe(200);
    expect(binary.body).toMatchObject({ accepted: 6000, bursts: 1, duplicates: 0, rejected: [] });
    const fromJson = await summaries("D1");
    expect(await summaries("D2")).toEqual(fromJson);
    const [interval] = fromJson.intervals;
    expect(fromJson.unit).toBe("MPa");
    expect(interval.samples).toBe(6000);
    expect(interval.start).toBe(iso(T0));
    expect(interval.end).toBe(iso(T0 + 600_000));
    // Physics: a 2 Hz cosine of amplitude 25 µε for 60 s is 120 periods of range 50 µε (10 MPa), RMS 25/√2 µε about its mean.
    expect(interval.max).toBeCloseTo(30 * MPA_PER_MICROSTRAIN, 3);
    expect(interval.min).toBeCloseTo(-20 * MPA_PER_MICROSTRAIN, 3);
    expect(interval.mean).toBeCloseTo(5 * MPA_PER_MICROSTRAIN, 3);
    expect(interval.rms).toBeCloseTo((25 / Math.SQRT2) * MPA_PER_MICROSTRAIN, 3);
    // The last half period stays open in the residue, waiting for the next burst.
    expect(interval.cycles).toBeGreaterThanOrEqual(119);
    expect(interval.cycles).toBeLessThanOrEqual(120);
    expect(interval.maxRange).toBeCloseTo(50 * MPA_PER_MICROSTRAIN, 3);
  });

  it("counts a resent burst as a duplicate and stores nothing again", async () => {
    const before = await summaries("D1");
    const again = await postJson([{ gauge: "D1", start: iso(T0), rateHz: RATE, values: signal(60, footfall) }]);
    expect(again.body).toMatchObject({ accepted: 0, bursts: 0, duplicates: 1, rejected: [] });
    expect(await summaries("D1")).toEqual(before);
    expect(await storedBursts("D1")).toBe(1);
  });

  it("rejects a burst overlapping a stored one, and one for a static gauge", async () => {
    const { body } = await postJson([
      { gauge: "D1", start: iso(T0 + 30_000), rateHz: RATE, values: signal(60, footfall) },
      { gauge: "S1", start: iso(T0), rateHz: RATE, values: [1, 2, 3] },
    ]);
    expect(body.rejected.map((r: { index: number; code: string }) => [r.index, r.code])).toEqual([
      [0, "overlap"],
      [1, "not-dynamic"],
    ]);
    expect(body.rejected[1].message).toMatch(/static/);
    expect(await storedBursts("D1")).toBe(1);
  });

  it("merges the next burst into the same interval and carries the rainflow residue across", async () => {
    const next = signal(60, (t) => footfall(t + 60));
    const { body } = await postJson([{ gauge: "D1", start: iso(T0 + 60_000), rateHz: RATE, values: next }]);
    expect(body).toMatchObject({ accepted: 6000, bursts: 1 });
    const [interval] = (await summaries("D1")).intervals;
    expect(interval.samples).toBe(12_000);
    // 240 periods over the joined two minutes: with the residue carried, only the last half period is open.
    expect(interval.cycles).toBeGreaterThanOrEqual(239);
    expect(interval.cycles).toBeLessThanOrEqual(240);
  });

  it("takes in a late burst older than the residue on its own", async () => {
    const late = signal(60, footfall);
    const { body } = await postJson([{ gauge: "D1", start: iso(T0 - 120_000), rateHz: RATE, values: late }]);
    expect(body).toMatchObject({ accepted: 6000, bursts: 1, rejected: [] });
    const intervals = (await summaries("D1")).intervals;
    expect(intervals.map((i: { start: string; samples: number }) => [i.start, i.samples])).toEqual([
      [iso(T0 - 600_000), 6000],
      [iso(T0), 12_000],
    ]);
    // Counted on its own and closed at its end: 240 half cycles from crest to trough and back.
    expect(intervals[0].cycles).toBe(120);
  });

  it("stores each burst once, with the joined signal's cycles, when two requests for a gauge arrive together", async () => {
    // Summaries are worked out before the write transaction: whichever request commits second
    // finds its basis changed and counts again against what the first stored.
    const first = signal(60, footfall);
    const second = signal(60, (t) => footfall(t + 60));
    const [alone, both] = await Promise.all([
      postJson([{ gauge: "D7", start: iso(T0), rateHz: RATE, values: first }]),
      postJson([
        { gauge: "D7", start: iso(T0), rateHz: RATE, values: first },
        { gauge: "D7", start: iso(T0 + 60_000), rateHz: RATE, values: second },
      ]),
    ]);
    expect([alone.status, both.status]).toEqual([200, 200]);
    expect(alone.body.bursts + both.body.bursts).toBe(2);
    expect(alone.body.duplicates + both.body.duplicates).toBe(1);
    expect(await storedBursts("D7")).toBe(2);
    await postJson([
      { gauge: "D8", start: iso(T0), rateHz: RATE, values: first },
      { gauge: "D8", start: iso(T0 + 60_000), rateHz: RATE, values: second },
    ]);
    const [together] = (await summaries("D7")).intervals;
    expect(together).toEqual((await summaries("D8")).intervals[0]);
    // Physics: 120 s of a 2 Hz cosine is 240 periods; the last half period waits in the residue.
    expect(together.samples).toBe(12_000);
    expect(together.cycles).toBeGreaterThanOrEqual(239);
    expect(together.cycles).toBeLessThanOrEqual(240);
  });
});

describe("bad bursts: a clear error or rejection, nothing stored half, never a 500", () => {
  it("answers 400 to a binary body that is not a whole number of floats", async () => {
    const { status, body } = await postBinary({ gauge: "D3", start: iso(T0), rateHz: RATE }, new Uint8Array(10));
    expect(status).toBe(400);
    expect(body.error.message).toMatch(/whole number of 4-byte floats/);
    expect(await storedBursts("D3")).toBe(0);
  });

  it("answers 400 naming a missing query parameter of a binary body", async () => {
    const { status, body } = await postBinary({ gauge: "D3", start: iso(T0) }, floats([1, 2]));
    expect(status).toBe(400);
    expect(body.error.message).toMatch(/rateHz/);
  });

  it("rejects a wrong rate, non-finite samples, an empty burst and a start without a zone", async () => {
    const values = signal(10, footfall);
    const { status, body } = await postJson([
      { gauge: "D3", start: iso(T0), rateHz: 50, values },
      { gauge: "D3", start: iso(T0), rateHz: RATE, values: [1, null, 3] },
      { gauge: "D3", start: iso(T0), rateHz: RATE, values: [] },
      { gauge: "D3", start: "2026-06-01T08:00:00", rateHz: RATE, values },
      { gauge: "D3", start: iso(T0), rateHz: RATE, values: [1, "2", 3] },
    ]);
    expect(status).toBe(200);
    expect(body.rejected.map((r: { code: string }) => r.code)).toEqual(["wrong-rate", "not-finite", "empty-burst", "invalid-time", "not-finite"]);
    expect(body.rejected[0].message).toMatch(/100 Hz/);
    expect(body.rejected[1].message).toMatch(/Sample 1/);
    expect(body.rejected[3].message).toMatch(/offset/);
    expect(body.accepted).toBe(0);
    expect(await storedBursts("D3")).toBe(0);
  });

  it("refuses a binary burst holding NaN whole, as JSON does", async () => {
    const values = new Float32Array(signal(10, footfall));
    values[500] = Number.NaN;
    const { status, body } = await postBinary({ gauge: "D3", start: iso(T0), rateHz: RATE }, new Uint8Array(values.buffer));
    expect(status).toBe(200);
    expect(body.rejected).toEqual([{ index: 0, code: "not-finite", message: expect.stringMatching(/Sample 500 is NaN/) }]);
    expect(await storedBursts("D3")).toBe(0);
    expect((await summaries("D3")).intervals).toEqual([]);
  });

  it("answers 413 past 2 000 000 samples, storing nothing", async () => {
    const binary = await postBinary({ gauge: "D3", start: iso(T0), rateHz: RATE }, new Uint8Array(4 * 2_000_001));
    expect(binary.status).toBe(413);
    const json = await postJson([
      { gauge: "D3", start: iso(T0), rateHz: RATE, values: new Array(1_000_000).fill(1) },
      { gauge: "D3", start: iso(T0 + 3_600_000 * 4), rateHz: RATE, values: new Array(1_000_001).fill(1) },
    ]);
    expect(json.status).toBe(413);
    expect(json.body.error.message).toMatch(/2,000,000 samples/);
    expect(await storedBursts("D3")).toBe(0);
  });

  it("answers 415 to another content type and 404 to another structure's logger token", async () => {
    const request = new Request("http://localhost/api/v1/structures/BR/bursts", { method: "POST", headers: { authorization: `Bearer ${tokens.logger}`, "content-type": "text/csv" }, body: "x" });
    expect((await burstsRoute.POST(request, params({ code: "BR" }))).status).toBe(415);
    const other = await postBinary({ gauge: "D3", start: iso(T0), rateHz: RATE }, floats([1, 2]), tokens.otherLogger);
    expect([403, 404]).toContain(other.status);
    expect(await storedBursts("D3")).toBe(0);
  });
});

describe("events and limits on dynamic gauges", () => {
  /** 60 s at 5 µε (1 MPa) with a 0.3 s passage of 150 µε (30 MPa) from 20 s, peaking at 200 µε (40 MPa). */
  const passage = (t: number) => (t >= 20 && t < 20.3 ? (Math.abs(t - 20.1) < 0.001 ? 200 : 150) : 5);
  // Recent, so its alert e-mails go out at once (readings over a day old wait for the digest).
  const START = Math.floor((Date.now() - 2 * 3_600_000) / 3_600_000) * 3_600_000;

  it("captures an event with its seconds before and after, opens an alert on the 0.3 s peak, clears it, and queues the e-mails", async () => {
    const limits = await limitsRoute.PUT(
      apiRequest("/structures/BR/gauges/D4/limits", { token: tokens.engineer, method: "PUT", body: { limits: [{ quantity: "stress", level: "warning", upper: 25 }] } }),
      params({ code: "BR", tag: "D4" }),
    );
    expect(limits.status).toBe(200);
    const mailsBefore = (await getDb().select().from(mailOutbox)).length;
    const first = await postBinary({ gauge: "D4", start: iso(START), rateHz: RATE }, floats(signal(60, passage)));
    expect(first.body).toMatchObject({ accepted: 6000, events: 1, alerts: { opened: 1 } });
    // Limits see the burst's extremes and its last sample at their instants: the peak at 20.1 s
    // opens the alert, the last sample back inside the bound clears it (persistence 1, no dead band).
    expect(first.body.alerts.cleared).toBe(1);
    const mails = (await getDb().select().from(mailOutbox)).slice(mailsBefore);
    // One e-mail to each of the structure's engineer and owner for the opening, and one each for the clearing.
    expect(mails.map((mail) => mail.kind)).toEqual(["alert", "alert", "alert", "alert"]);

    const list = await eventsRoute.GET(apiRequest(`/structures/BR/gauges/D4/events?from=${iso(START)}&to=${iso(START + 3_600_000)}`, { token: tokens.owner }), params({ code: "BR", tag: "D4" }));
    const { events } = await list.json();
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ gauge: "D4", start: iso(START + 18_000), trigger: "above", triggerLevel: 20, truncated: false, label: null });
    expect(events[0].peak).toBeCloseTo(40, 4);
    expect(events[0].peakAt).toBe(iso(START + 20_100));

    const detail = await (await eventRoute.GET(apiRequest(`/structures/BR/events/${events[0].id}`, { token: tokens.owner }), params({ code: "BR", id: String(events[0].id) }))).json();
    expect(detail.rateHz).toBe(RATE);
    expect(detail.unit).toBe("MPa");
    // 2 s before the first sample beyond 20 MPa, the 0.3 s passage, 5 s after the last: 730 samples.
    expect(detail.stress).toHaveLength(200 + 30 + 500);
    expect(detail.stress[199]).toBeCloseTo(1, 5);
    expect(detail.stress[200]).toBeCloseTo(30, 4);
    expect(detail.stress[229]).toBeCloseTo(30, 4);
    expect(detail.stress[230]).toBeCloseTo(1, 5);
    expect(detail.end).toBe(iso(START + 25_300));
    // The waveform names the alert its peak opened, so the engineer can go from one to the other.
    const [alert] = await getDb()
      .select({ id: alerts.id, openedAt: alerts.openedAt })
      .from(alerts)
      .innerJoin(gauges, eq(gauges.id, alerts.gaugeId))
      .where(eq(gauges.tag, "D4"));
    expect(detail.alerts).toEqual([{ id: alert!.id, level: "warning", openedAt: alert!.openedAt.toISOString() }]);
    expect(Date.parse(detail.alerts[0].openedAt)).toBeGreaterThanOrEqual(Date.parse(detail.start));
    expect(Date.parse(detail.alerts[0].openedAt)).toBeLessThanOrEqual(Date.parse(detail.end));
  });

  it("lets an engineer label an event, audited, and not an owner", async () => {
    const { events } = await (await eventsRoute.GET(apiRequest(`/structures/BR/gauges/D4/events?from=${iso(START)}&to=${iso(START + 3_600_000)}`, { token: tokens.owner }), params({ code: "BR", tag: "D4" }))).json();
    const id = String(events[0].id);
    const byOwner = await eventRoute.PATCH(apiRequest(`/structures/BR/events/${id}`, { token: tokens.owner, method: "PATCH", body: { label: "heavy vehicle" } }), params({ code: "BR", id }));
    expect(byOwner.status).toBe(403);
    const byEngineer = await eventRoute.PATCH(apiRequest(`/structures/BR/events/${id}`, { token: tokens.engineer, method: "PATCH", body: { label: "heavy vehicle" } }), params({ code: "BR", id }));
    expect(byEngineer.status).toBe(200);
    expect((await byEngineer.json()).label).toBe("heavy vehicle");
    const audit = (await getDb().select().from(auditLog)).filter((row) => row.action === "event.label");
    expect(audit.at(-1)).toMatchObject({ entityKey: `BR/${id}`, before: { label: null }, after: { label: "heavy vehicle" } });
    const missing = await eventRoute.GET(apiRequest("/structures/OTHER/events/" + id, { token: tokens.engineer }), params({ code: "OTHER", id }));
    expect(missing.status).toBe(404);
  });

  it("opens an alert on a peak between static readings of the same gauge's history", async () => {
    await limitsRoute.PUT(
      apiRequest("/structures/BR/gauges/D5/limits", { token: tokens.engineer, method: "PUT", body: { limits: [{ quantity: "stress", level: "critical", upper: 25 }] } }),
      params({ code: "BR", tag: "D5" }),
    );
    // The gauge was static, with readings ten minutes apart well inside the bound; made dynamic, its history stays.
    await gaugeRoute.PATCH(apiRequest("/structures/BR/gauges/D5", { token: tokens.engineer, method: "PATCH", body: { sampling: { mode: "static" } } }), params({ code: "BR", tag: "D5" }));
    const readings = [0, 10].map((minutes) => ({ gauge: "D5", time: iso(START + minutes * 60_000), value: 5 }));
    const stored = await readingsRoute.POST(apiRequest("/structures/BR/readings", { token: tokens.logger, body: { readings } }), params({ code: "BR" }));
    expect((await stored.json()).alerts.opened).toBe(0);
    const patched = await gaugeRoute.PATCH(apiRequest("/structures/BR/gauges/D5", { token: tokens.engineer, method: "PATCH", body: { sampling: dynamic } }), params({ code: "BR", tag: "D5" }));
    expect((await patched.json()).sampling).toMatchObject({ mode: "dynamic", rateHz: RATE });
    const burst = await postBinary({ gauge: "D5", start: iso(START + 20 * 60_000), rateHz: RATE }, floats(signal(60, passage)));
    expect(burst.body.alerts.opened).toBe(1);
    const count = await getClient().execute({ sql: "SELECT count(*) FROM readings r JOIN gauges g ON g.id = r.gauge_id WHERE g.tag = 'D5'", args: [] });
    // The two static readings kept, and the burst's extremes and last sample beside them.
    expect(Number(count.rows[0]![0])).toBe(5);
  });
});

describe("fatigue from the stored histograms", () => {
  const DAY = 86_400_000;
  const START = T0 + 14 * DAY;
  /** 1 Hz swing of ±250 µε about 5 µε: stress range 100 MPa per period (Hooke's law, σ = E·ε). */
  const swing = (t: number) => 5 + 250 * Math.cos(2 * Math.PI * t);

  async function fatigue(tag: string, from: number, to: number) {
    const response = await fatigueRoute.GET(
      apiRequest(`/structures/BR/gauges/${tag}/fatigue?from=${iso(from)}&to=${iso(to)}&category=71`, { token: tokens.owner }),
      params({ code: "BR", tag }),
    );
    expect(response.status).toBe(200);
    return response.json();
  }

  it("sums a dynamic gauge's histograms: Miner damage, equivalent range and damage per day match the sum by hand", async () => {
    await postBinary({ gauge: "D6", start: iso(START), rateHz: RATE }, floats(signal(60, swing)));
    await postBinary({ gauge: "D6", start: iso(START + DAY), rateHz: RATE }, floats(signal(60, swing)));
    const result = await fatigue("D6", START, START + 2 * DAY);
    expect(result.source).toBe("bursts");
    // ASTM E1049-85 5.4.4 by hand: the first burst gives 120 reversals (a crest or trough every half
    // period, the last sample still rising), of which 118 close as half cycles of 100 MPa (the last two
    // wait in the residue); the second burst goes on rising to its first crest and adds 120 more
    // reversals, closing 120 half cycles. 238 half cycles: 119 cycles.
    expect(result.cycles).toEqual([{ range: 100, count: 119 }]);
    // By hand: EN 1993-1-9 slope 3 above Δσ_D = 0.737·71 = 52 MPa, so N = 2×10⁶·(71/100)³ per cycle;
    // Δσ_E = (Σ n·Δσ³ / 2×10⁶)^(1/3).
    const endurance = 2e6 * (71 / 100) ** 3;
    expect(result.damage).toBeCloseTo(119 / endurance, 12);
    expect(result.equivalentRange).toBeCloseTo(((119 * 100 ** 3) / 2e6) ** (1 / 3), 9);
    const day = (ms: number) => iso(ms).slice(0, 10);
    expect(result.damagePerDay.map((d: { day: string }) => d.day)).toEqual([day(START), day(START + DAY)]);
    expect(result.damagePerDay[0].damage).toBeCloseTo(59 / endurance, 12);
    expect(result.damagePerDay[1].damage).toBeCloseTo(60 / endurance, 12);
  });

  it("gives damage per day of the structure's zone: two bursts of one UTC day fall on two days in Tokyo (UTC+9 all year, IANA data from memory)", async () => {
    await createStructure(null, { code: "TKY", name: "Structure TKY", timezone: "Asia/Tokyo" });
    await addMember(null, engineer.email, "TKY");
    await createGauge(engineer, "TKY", { ...microstrainGauge("D1"), material: { E: 200000, nu: 0.3, alpha: 12, yield: 355 }, sampling: dynamic });
    const logger = await loggerToken("TKY");
    // 14:30 UTC is 23:30 in Tokyo; 15:30 UTC is 00:30 the next day there.
    const evening = Date.UTC(2026, 5, 20, 14, 30);
    const afterMidnight = Date.UTC(2026, 5, 20, 15, 30);
    for (const start of [evening, afterMidnight]) expect((await postBinary({ gauge: "D1", start: iso(start), rateHz: RATE }, floats(signal(60, swing)), logger, "TKY")).status).toBe(200);
    const response = await fatigueRoute.GET(
      apiRequest(`/structures/TKY/gauges/D1/fatigue?from=${iso(evening - DAY)}&to=${iso(afterMidnight + DAY)}&category=71`, { token: tokens.engineer }),
      params({ code: "TKY", tag: "D1" }),
    );
    expect(response.status).toBe(200);
    expect((await response.json()).damagePerDay.map((d: { day: string }) => d.day)).toEqual(["2026-06-20", "2026-06-21"]);
  });

  async function rainflowCsv(tag: string, from: number, to: number): Promise<string[][]> {
    const response = await fatigueRoute.GET(
      apiRequest(`/structures/BR/gauges/${tag}/fatigue?from=${iso(from)}&to=${iso(to)}&category=71&format=csv`, { token: tokens.owner }),
      params({ code: "BR", tag }),
    );
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    return parse(await response.text(), { record_delimiter: "\r\n" }) as string[][];
  }

  it("exports counts per range bin and mean bin as CSV, each cycle's mean that of its two extremes", async () => {
    // Two bursts a day apart, each a 1 Hz swing of ±250 µε: ±50 MPa (Hooke's law, σ = E·ε), first about
    // 1 MPa (5 µε), then about 21 MPa (105 µε). ASTM E1049-85: a cycle's mean is (peak + valley) / 2.
    await postBinary({ gauge: "D9", start: iso(START), rateHz: RATE }, floats(signal(60, swing)));
    await postBinary({ gauge: "D9", start: iso(START + DAY), rateHz: RATE }, floats(signal(60, (t) => swing(t) + 100)));
    const [header, ...rows] = await rainflowCsv("D9", START, START + 2 * DAY);
    expect(header![0]).toBe("range bin upper edge (MPa) \\ mean bin centre (MPa)");
    const means = header!.slice(1).map(Number);
    const cell = (range: number, mean: number) => Number(rows.find((cells) => Number(cells[0]) === range)![1 + means.indexOf(mean)]);
    // ASTM E1049-85 5.4.4 by hand: the first burst closes 118 half cycles of 100 MPa about 1 MPa and
    // leaves its last crest (51) and trough (−49) in the residue. The second goes on rising to its
    // first crest, 71 MPa: that range of 120 exceeds the 100 before it, which closes as a half cycle
    // about 1 MPa (step 5), while −49 → 71 waits as the new start. Each later trough and crest, −29
    // and 71, closes a full cycle of 100 MPa about 21 MPa (step 4): 59, the last trough waiting.
    expect(cell(100, 1)).toBe(59.5);
    expect(cell(100, 21)).toBe(59);
    expect(rows.at(-1)![0]).toBe("100");
    expect(header).not.toContain("mean not recorded");
    // Every cycle of the JSON answer is in the matrix once.
    const total = rows.flatMap((cells) => cells.slice(1).map(Number)).reduce((a, b) => a + b, 0);
    expect(total).toBe((await fatigue("D9", START, START + 2 * DAY)).cyclesCounted);
  });

  it("says mean not recorded for the cycles of intervals stored before means were kept, and keeps them when a burst lands there", async () => {
    // An interval as an earlier release stored it (histogram format 1, written out by hand): bin
    // width 1 MPa as a little-endian float64, then bin 40 (LEB128 gap 40) holding 7 cycles (14 halves).
    const old = Buffer.alloc(10);
    old.writeDoubleLE(1, 0);
    old.set([40, 14], 8);
    const [gauge] = await getDb().select({ id: gauges.id }).from(gauges).where(eq(gauges.tag, "D10"));
    await getDb().insert(burstSummaries).values({ gaugeId: gauge!.id, start: START, length: 600_000, samples: 3_000, min: -20, max: 20, mean: 0, m2: 1, maxRange: 40, cycles: 7, histogram: old });
    expect(await rainflowCsv("D10", START, START + DAY)).toEqual([
      ["range bin upper edge (MPa) \\ mean bin centre (MPa)", "mean not recorded"],
      ["40", "7"],
    ]);
    // A burst in the same interval: its cycles come with their means, the old ones stay unrecorded.
    await postBinary({ gauge: "D10", start: iso(START + 60_000), rateHz: RATE }, floats(signal(60, swing)));
    const [header, ...rows] = await rainflowCsv("D10", START, START + DAY);
    expect(header).toEqual(["range bin upper edge (MPa) \\ mean bin centre (MPa)", "1", "mean not recorded"]);
    expect(rows[0]).toEqual(["40", "0", "7"]);
    expect(rows.at(-1)).toEqual(["100", "59", "0"]);
    expect(rows).toHaveLength(61);
    expect((await fatigue("D10", START, START + DAY)).cycles).toEqual([
      { range: 40, count: 7 },
      { range: 100, count: 59 },
    ]);
  });

  it("keeps the readings path for a static gauge, saying so", async () => {
    const result = await fatigue("S1", START, START + DAY);
    expect(result.source).toBe("readings");
    expect(result.equivalentRange).toBe(0);
    expect(result.damagePerDay).toEqual([]);
  });
});

describe("the OpenAPI document", () => {
  it("describes the bursts endpoint in JSON and binary, with the non-finite decision and every rejection code", async () => {
    const doc = await openapi().json();
    const post = doc.paths["/structures/{code}/bursts"].post;
    expect(Object.keys(post.requestBody.content)).toEqual(["application/json", "application/octet-stream"]);
    expect(post.description).toMatch(/refused whole \(`not-finite`\), in JSON and binary alike/);
    for (const code of ["overlap", "not-dynamic", "wrong-rate", "empty-burst"]) expect(post.description).toContain(`\`${code}\``);
    expect(post.parameters.map((p: { name: string }) => p.name)).toEqual(["code", "gauge", "start", "rateHz", "temperature"]);
    expect(doc.paths["/structures/{code}/events/{id}"].patch.responses["403"]).toBeDefined();
    expect(doc.paths["/structures/{code}/gauges/{tag}/summaries"].get.responses["200"]).toBeDefined();
  });
});
