import { beforeAll, describe, expect, it } from "vitest";
import * as limitsRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/limits/route";
import * as backtestRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/limits/backtest/route";
import * as alertsRoute from "@/app/api/v1/structures/[code]/alerts/route";
import * as acknowledgeRoute from "@/app/api/v1/alerts/[id]/acknowledge/route";
import { getDb, writeTransaction } from "@/db/client";
import { alerts, mailOutbox, readings } from "@/db/schema";
import { runStaleWatch } from "@/jobs/stale-watch";
import { runDailyDigest } from "@/jobs/daily-digest";
import { setAlertMailMode } from "@/lib/services/memberships";
import type { EvaluatedReading } from "@/lib/alerting/evaluate-gauge";
import { evaluateInsertedReadings } from "@/lib/services/alert-raising";
import { createGauge, resolveGauge } from "@/lib/services/gauges";
import type { UserActor } from "@/lib/auth/actor";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, makeStructure, makeUser, userToken } from "./helpers";

const tokens: Record<string, string> = {};
let engineer: UserActor;
let owner: UserActor;
const HOUR = 3_600_000;
const DAY = 86_400_000;
// Recent readings: events about readings more than a day old are left to the digest rather than mailed at once.
const T0 = Math.floor(Date.now() / HOUR) * HOUR - 20 * HOUR;
const TEN_MINUTES = 600_000;

const at = { params: Promise.resolve({ code: "BR", tag: "G1" }) };

const limitSet = [
  { quantity: "stress", level: "watch", upper: 100, hysteresis: 5 },
  { quantity: "stress", level: "critical", upper: 200, hysteresis: 5 },
];

beforeAll(async () => {
  engineer = await makeUser("engineer");
  const technician = await makeUser("technician");
  owner = await makeUser("owner");
  await makeStructure("BR", [engineer, technician, owner]);
  for (const user of [engineer, technician, owner]) tokens[user.role] = await userToken(user.email);
  await createGauge(engineer, "BR", microstrainGauge("G1"));
});

const put = (token: string, body: unknown) => limitsRoute.PUT(apiRequest("/structures/BR/gauges/G1/limits", { token, body, method: "PUT" }), at);

/** Stores readings as ingestion does and evaluates them in the same transaction. */
async function ingest(stresses: number[], startIndex: number) {
  const { gauge } = await resolveGauge(engineer, "BR", "G1", "structure:view");
  const rows: EvaluatedReading[] = stresses.map((stress, i) => ({
    time: T0 + (startIndex + i) * TEN_MINUTES,
    raw: stress * 5 + i * 0.01,
    strain: stress * 5,
    stress,
    flags: 0,
    residual: null,
  }));
  return writeTransaction(async (tx) => {
    await tx.insert(readings).values(rows.map((r) => ({ gaugeId: gauge.id, time: r.time, value: r.raw, temperature: 10, strain: r.strain, stress: r.stress, flags: 0 })));
    return (await evaluateInsertedReadings(tx, [{ gauge, readings: rows }])).counts;
  });
}

async function alertList(state: string, token = tokens.owner!) {
  const response = await alertsRoute.GET(apiRequest(`/structures/BR/alerts?state=${state}`, { token }), { params: Promise.resolve({ code: "BR" }) });
  expect(response.status).toBe(200);
  return (await response.json()).alerts as { id: number; level: string; peak: number; clearedAt: string | null; acknowledgedBy: string | null }[];
}

describe("limits", () => {
  it("refuses levels out of order and lower ≥ upper, naming the limit and field", async () => {
    const response = await put(tokens.engineer!, {
      limits: [
        { quantity: "stress", level: "watch", upper: 100, lower: 150 },
        { quantity: "strain", level: "watch", upper: 500, hysteresis: -1 },
      ],
    });
    expect(response.status).toBe(400);
    const paths = (await response.json()).error.details.issues.map((issue: { path: string }) => issue.path);
    expect(paths).toEqual(expect.arrayContaining(["limits.0.lower", "limits.1.hysteresis"]));
  });

  it("does not let a technician change limits", async () => {
    expect((await put(tokens.technician!, { limits: limitSet })).status).toBe(403);
  });

  it("replaces the set for an engineer and reads it back with defaults", async () => {
    const response = await put(tokens.engineer!, { limits: limitSet });
    expect(response.status).toBe(200);
    const got = await (await limitsRoute.GET(apiRequest("/structures/BR/gauges/G1/limits", { token: tokens.owner }), at)).json();
    expect(got.limits).toEqual(limitSet.map((limit) => ({ ...limit, persistence: 1 })));
  });
});

describe("alerts raised on ingest", () => {
  it("opens one alert, escalates it, ignores a resend and clears it", async () => {
    const first = await ingest([50, 120, 130], 0);
    expect(first).toEqual({ opened: 1, escalated: 0, cleared: 0 });
    const second = await ingest([250, 240], 3);
    expect(second).toEqual({ opened: 0, escalated: 1, cleared: 0 });
    const [open] = await alertList("open");
    expect(open).toMatchObject({ level: "critical", peak: 250, clearedAt: null });
    // One e-mail per owner and engineer of the structure for each event, queued with it in the same transaction.
    const queued = await getDb().select().from(mailOutbox);
    expect(queued.map((m) => m.toAddress).sort()).toEqual(["engineer@test.example", "engineer@test.example", "owner@test.example", "owner@test.example"]);
    expect(queued[0]!.subject).toMatch(/^WATCH: BR G1 stress crossed the watch limit/);
    expect(queued[0]!.text).toContain("responsibility of the engineer");
    const third = await ingest([90, 80], 5);
    expect(third).toEqual({ opened: 0, escalated: 0, cleared: 1 });
    expect(await alertList("open")).toEqual([]);
    expect(await alertList("cleared")).toHaveLength(1);
  });

  it("takes a late reading in by replaying from the checkpoint before it, without raising twice", async () => {
    // Readings 7–9 arrive first, then reading 6 late: 6 and 7 beyond 100 MPa open a new alert once.
    await ingest([40, 45, 50], 20);
    const late = await ingest([150], 19);
    expect(late.opened).toBe(1);
    const again = await ingest([60], 23);
    expect(again).toEqual({ opened: 0, escalated: 0, cleared: 0 });
  });

  it("lets an engineer acknowledge with a comment; an owner may not", async () => {
    const [alert] = await alertList("all");
    const post = (token: string, body: unknown) =>
      acknowledgeRoute.POST(apiRequest(`/alerts/${alert!.id}/acknowledge`, { token, body }), { params: Promise.resolve({ id: String(alert!.id) }) });
    expect((await post(tokens.owner!, { comment: "seen" })).status).toBe(403);
    expect((await post(tokens.engineer!, { comment: "" })).status).toBe(400);
    const response = await post(tokens.engineer!, { comment: "Checked on site: maintenance vehicle on deck." });
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ acknowledgedBy: "engineer@test.example", comment: "Checked on site: maintenance vehicle on deck." });
  });

  it("backtests proposed limits over stored readings with the live evaluation", async () => {
    const response = await backtestRoute.POST(
      apiRequest("/structures/BR/gauges/G1/limits/backtest", {
        token: tokens.engineer,
        body: { limits: limitSet, from: new Date(T0).toISOString(), to: new Date(T0 + 30 * TEN_MINUTES).toISOString() },
      }),
      at,
    );
    expect(response.status).toBe(200);
    const result = await response.json();
    expect(result.readingsChecked).toBe(await countReadings());
    // The same two episodes live ingestion raised: one to critical (cleared), one at watch.
    expect(result.episodes.map((e: { level: string; clearedAt: number | null }) => [e.level, e.clearedAt !== null])).toEqual([
      ["critical", true],
      ["watch", true],
    ]);
  });
});

async function countReadings() {
  return (await getDb().select().from(readings)).length;
}

describe("data that stop arriving", () => {
  it("raises one sensor alert when a gauge falls silent, and ingestion clears it", async () => {
    const lastTime = T0 + 23 * TEN_MINUTES;
    const quiet = await runStaleWatch(lastTime + 20 * TEN_MINUTES);
    expect(quiet).toMatch(/1 newly stale/);
    expect(await runStaleWatch(lastTime + 30 * TEN_MINUTES)).toMatch(/0 newly stale/);
    const [stale] = (await getDb().select().from(alerts)).filter((alert) => alert.code === "stale");
    expect(stale).toMatchObject({ kind: "sensor", clearedAt: null });
    await ingest([30], 60);
    const [after] = (await getDb().select().from(alerts)).filter((alert) => alert.code === "stale");
    expect(after!.clearedAt).not.toBeNull();
  });
});

describe("the daily digest", () => {
  it("sends one digest of the day's events to those who chose it, and none twice", async () => {
    await setAlertMailMode(owner, "BR", "digest");
    // 06:00 the day after T0's: the digest covers T0's day.
    const nextDay = Math.floor(T0 / DAY) * DAY + DAY + 6 * HOUR;
    expect(await runDailyDigest(nextDay)).toMatch(/1 digests queued/);
    expect(await runDailyDigest(nextDay)).toMatch(/0 digests queued/);
    const digests = (await getDb().select().from(mailOutbox)).filter((mail) => mail.kind === "digest");
    expect(digests).toHaveLength(1);
    expect(digests[0]).toMatchObject({ toAddress: "owner@test.example" });
    expect(digests[0]!.text).toContain("G1");
  });
});
