import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import * as limitsRoute from "@/app/api/v1/structures/[code]/rosettes/[tag]/limits/route";
import * as backtestRoute from "@/app/api/v1/structures/[code]/rosettes/[tag]/limits/backtest/route";
import * as alertsRoute from "@/app/api/v1/structures/[code]/alerts/route";
import { getDb } from "@/db/client";
import { alerts, mailOutbox, rosettes } from "@/db/schema";
import type { UserActor } from "@/lib/auth/actor";
import { createGauge, resolveGauge } from "@/lib/services/gauges";
import { ingestJson } from "@/lib/services/ingest";
import { limitsOfRosette } from "@/lib/services/rosette-limits";
import { createRosette } from "@/lib/services/rosettes";
import type { GaugeInput } from "@/lib/gauges/schema";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, loggerToken, makeStructure, makeUser, params, userToken } from "./helpers";

const tokens: Record<string, string> = {};
let engineer: UserActor;
// Recent readings: events about readings more than a day old are left to the digest rather than mailed at once.
const T0 = Math.floor(Date.now() / 3_600_000) * 3_600_000 - 20 * 3_600_000;
const TEN_MINUTES = 600_000;
const at = params({ code: "WEB", tag: "R1" });

beforeAll(async () => {
  engineer = await makeUser("engineer");
  const technician = await makeUser("technician");
  const owner = await makeUser("owner");
  await makeStructure("WEB", [engineer, technician, owner]);
  for (const user of [engineer, technician, owner]) tokens[user.role] = await userToken(user.email);
  for (const tag of ["a", "b", "c"]) await createGauge(engineer, "WEB", microstrainGauge(tag));
  await createRosette(engineer, "WEB", { tag: "R1", layout: "rectangular", gauges: ["a", "b", "c"] });
});

const put = (token: string, body: unknown, rosette = "R1") =>
  limitsRoute.PUT(apiRequest(`/structures/WEB/rosettes/${rosette}/limits`, { token, body, method: "PUT" }), params({ code: "WEB", tag: rosette }));

type Strains = [number, number, number];

/** The three gauges' strains (µε) at the tenth-of-an-hour step `index` (a fraction for a time between steps). */
const instant = (index: number, [a, b, c]: Strains, [tagA, tagB, tagC] = ["a", "b", "c"]) => {
  const time = new Date(T0 + index * TEN_MINUTES).toISOString();
  return [
    { gauge: tagA, time, value: a },
    { gauge: tagB, time, value: b },
    { gauge: tagC, time, value: c },
  ];
};

/** A rosette on three new gauges of WEB, with one limit on von Mises; `gaugeA` sets fields of its gauge a. */
async function rosetteWithLimit(tag: string, gauges: [string, string, string], limit: object, gaugeA: Partial<GaugeInput> = {}) {
  for (const gauge of gauges) await createGauge(engineer, "WEB", microstrainGauge(gauge, gauge === gauges[0] ? gaugeA : {}));
  await createRosette(engineer, "WEB", { tag, layout: "rectangular", gauges });
  expect((await put(tokens.engineer!, { limits: [{ quantity: "vonMises", level: "watch", ...limit }] }, tag)).status).toBe(200);
}

async function alertsOfRosette(tag: string) {
  const [rosette] = await getDb().select().from(rosettes).where(eq(rosettes.tag, tag));
  return getDb().select().from(alerts).where(eq(alerts.rosetteId, rosette!.id));
}

// Rectangular rosette on steel (E = 200 GPa, ν = 0.3), by hand (strain transformation as in
// lib/mechanics/rosette.ts; plane-stress Hooke's law; von Mises plane stress, common practice):
// εa = 500, εb = 300, εc = −100 µε: εx = 500, εy = −100, γxy = 2·300 − 500 + 100 = 200;
// ε1,2 = 200 ± √(300² + 100²) = 516.23, −116.23; σ1 = E/(1 − ν²)·(ε1 + ν·ε2) = 105.79 MPa,
// σ2 = E/(1 − ν²)·(ε2 + ν·ε1) = 8.49 MPa; σvm = √(σ1² − σ1·σ2 + σ2²) = 101.81 MPa. Stress is
// linear in strain and von Mises homogeneous of degree one, so a fifth of those strains gives
// 20.36 MPa and four fifths 81.45 MPa.
const ABOVE: Strains = [500, 300, -100];
const LOW: Strains = [100, 60, -20];
const BACK_INSIDE: Strains = [400, 240, -80];

describe("rosette limits", () => {
  it("refuses a technician and answers bad bounds with the field", async () => {
    const limits = [{ quantity: "vonMises", level: "watch", upper: 100 }];
    expect((await put(tokens.technician!, { limits })).status).toBe(403);
    const bad = await put(tokens.engineer!, { limits: [{ quantity: "vonMises", level: "watch", upper: 50, lower: 80 }] });
    expect(bad.status).toBe(400);
    const paths = (await bad.json()).error.details.issues.map((issue: { path: string }) => issue.path);
    expect(paths).toContain("limits.0.lower");
    expect((await put(tokens.engineer!, { limits: [{ quantity: "tauMax", level: "watch", upper: 50 }] })).status).toBe(400);
  });

  it("saves the limits and shows them to every member", async () => {
    const saved = await put(tokens.engineer!, { limits: [{ quantity: "vonMises", level: "watch", upper: 100, hysteresis: 5 }] });
    expect(saved.status).toBe(200);
    const read = await limitsRoute.GET(apiRequest("/structures/WEB/rosettes/R1/limits", { token: tokens.technician! }), at);
    expect((await read.json()).limits).toEqual([{ quantity: "vonMises", level: "watch", upper: 100, hysteresis: 5, persistence: 1 }]);
  });

  it("opens one alert when von Mises crosses the bound, once, and clears it back inside", async () => {
    const batch = [...instant(0, LOW), ...instant(1, ABOVE)];
    const first = await ingestJson(engineer, "WEB", batch);
    expect(first.alerts).toEqual({ opened: 1, escalated: 0, cleared: 0 });

    const [rosette] = await getDb().select().from(rosettes);
    const { gauge } = await resolveGauge(engineer, "WEB", "a", "structure:view");
    const stored = await getDb().select().from(alerts);
    expect(stored).toHaveLength(1);
    expect(stored[0]).toMatchObject({ kind: "limit", quantity: "vonMises", level: "watch", rosetteId: rosette!.id, gaugeId: gauge.id, bound: 100 });
    expect(stored[0]!.peak).toBeCloseTo(101.81, 1);

    const mails = await getDb().select().from(mailOutbox);
    expect(mails.map((mail) => mail.toAddress).sort()).toEqual(["engineer@test.example", "owner@test.example"]);
    expect(mails[0]!.subject).toMatch(/^WATCH: WEB rosette R1 von Mises stress crossed the watch limit \(peak 101\.8 MPa\)/);
    expect(mails[0]!.text).toContain("/structures/WEB/rosettes/R1");

    const list = await alertsRoute.GET(apiRequest("/structures/WEB/alerts?state=open", { token: tokens.owner! }), params({ code: "WEB" }));
    expect((await list.json()).alerts).toMatchObject([{ gauge: "a", rosette: "R1", quantity: "vonMises" }]);

    const resent = await ingestJson(engineer, "WEB", batch);
    expect(resent).toMatchObject({ accepted: 0, alerts: { opened: 0, escalated: 0, cleared: 0 } });
    expect(await getDb().select().from(alerts)).toHaveLength(1);

    const back = await ingestJson(engineer, "WEB", instant(2, BACK_INSIDE));
    expect(back.alerts).toEqual({ opened: 0, escalated: 0, cleared: 1 });
    const [cleared] = await getDb().select().from(alerts);
    expect(cleared!.clearedAt?.getTime()).toBe(T0 + 2 * TEN_MINUTES);
    expect(await getDb().select().from(mailOutbox)).toHaveLength(4);
  });
});

describe("rosette limits and late readings", () => {
  const GAUGES: [string, string, string] = ["la", "lb", "lc"];
  const late = (index: number, strains: Strains) => instant(index, strains, GAUGES);

  it("takes in a late reading that completes an older instant, replaying from the checkpoint before it, and raises nothing twice", async () => {
    await rosetteWithLimit("LATE", GAUGES, { upper: 100, persistence: 3 });
    // Instant 0 is the rosette's first checkpoint. Instants 1 and 3 are above 101.81 MPa; instant 2
    // lacks gauge c, so the run of three instants beyond the bound is incomplete.
    expect((await ingestJson(engineer, "WEB", late(0, LOW))).alerts.opened).toBe(0);
    const gap = [...late(1, ABOVE), ...late(2, ABOVE).slice(0, 2), ...late(3, ABOVE)];
    expect((await ingestJson(engineer, "WEB", gap)).alerts.opened).toBe(0);

    const completing = late(2, ABOVE).slice(2);
    const filled = await ingestJson(engineer, "WEB", completing);
    expect(filled).toMatchObject({ accepted: 1, alerts: { opened: 1, escalated: 0, cleared: 0 } });
    const [opened] = await alertsOfRosette("LATE");
    expect(opened!.openedAt.getTime()).toBe(T0 + 3 * TEN_MINUTES);
    expect(opened!.peak).toBeCloseTo(101.81, 1);

    expect(await ingestJson(engineer, "WEB", completing)).toMatchObject({ accepted: 0, alerts: { opened: 0, escalated: 0, cleared: 0 } });
    // A late instant inside the clear band between 0 and 1 replays the run again: the opening it meets is already recorded.
    const between = await ingestJson(engineer, "WEB", late(0.5, LOW));
    expect(between).toMatchObject({ accepted: 3, alerts: { opened: 0, escalated: 0, cleared: 0 } });
    expect(await alertsOfRosette("LATE")).toHaveLength(1);
  });
});

describe("rosette limits and sensor faults", () => {
  // Below the bound: εa = 100, εb = 0, εc = −100 µε give εx = 100, εy = −100, γxy = 0, so
  // ε1,2 = ±100 µε, σ1,2 = ±E/(1 − ν²)·(1 − ν)·100 µε = ±15.38 MPa and σvm = √3·15.38 = 26.65 MPa
  // (von Mises plane stress, common practice); a change of 1 µε in any gauge moves it by under 0.3 MPa.
  const quiet = (index: number, c: number): Strains => [100 + (index % 2), index % 2, c];

  it("skips an instant whose gauge reading is a flat line, while the same values from a live gauge open the alert", async () => {
    await rosetteWithLimit("FLAT", ["fa", "fb", "fc"], { upper: 100 });
    await rosetteWithLimit("LIVE", ["va", "vb", "vc"], { upper: 100 });
    // Gauge fc reads −100 µε 36 times in a row: a flat line at the 36th (defaultHealthThresholds),
    // the instant at which both rosettes read ABOVE. Gauge vc varies by 1 µε until then.
    const batch = Array.from({ length: 36 }, (_, index) => {
      const last = index === 35;
      return [
        ...instant(index, last ? ABOVE : quiet(index, -100), ["fa", "fb", "fc"]),
        ...instant(index, last ? ABOVE : quiet(index, -100 + (index % 2)), ["va", "vb", "vc"]),
      ];
    }).flat();
    const result = await ingestJson(engineer, "WEB", batch);
    expect(result.alerts.opened).toBe(1);
    expect(await alertsOfRosette("FLAT")).toEqual([]);
    expect(await alertsOfRosette("LIVE")).toMatchObject([{ quantity: "vonMises", openedAt: new Date(T0 + 35 * TEN_MINUTES) }]);
    const { gauge } = await resolveGauge(engineer, "WEB", "fc", "structure:view");
    const sensor = await getDb().select().from(alerts).where(eq(alerts.gaugeId, gauge.id));
    expect(sensor).toMatchObject([{ kind: "sensor", code: "flat-line" }]);
  });

  it("skips an instant whose gauge reading is past its rated range, while the same values in range open the alert", async () => {
    await rosetteWithLimit("RATED", ["ra", "rb", "rc"], { upper: 100 }, { ratedRange: 400 });
    await rosetteWithLimit("INRANGE", ["ia", "ib", "ic"], { upper: 100 });
    // εa = 500 µε is past ra's rated 400 µε (flagged out of range), inside ia's unknown range: 101.81 MPa for both.
    const result = await ingestJson(engineer, "WEB", [...instant(0, LOW, ["ra", "rb", "rc"]), ...instant(0, LOW, ["ia", "ib", "ic"]), ...instant(1, ABOVE, ["ra", "rb", "rc"]), ...instant(1, ABOVE, ["ia", "ib", "ic"])]);
    expect(result.alerts.opened).toBe(1);
    expect(await alertsOfRosette("RATED")).toEqual([]);
    expect(await alertsOfRosette("INRANGE")).toHaveLength(1);
  });
});

describe("rosette limits backtest", () => {
  const DAY = 86_400_000;
  const backtest = (token: string, tag: string, body: unknown) =>
    backtestRoute.POST(apiRequest(`/structures/WEB/rosettes/${tag}/limits/backtest`, { token, body }), params({ code: "WEB", tag }));
  const period = { from: new Date(T0 - DAY).toISOString(), to: new Date(T0 + DAY).toISOString() };

  it("finds over the stored data exactly the episodes live evaluation recorded, for every rosette above", async () => {
    const all = await getDb().select().from(rosettes);
    expect(all.map((rosette) => rosette.tag).sort()).toEqual(["FLAT", "INRANGE", "LATE", "LIVE", "R1", "RATED"]);
    for (const rosette of all) {
      const response = await backtest(tokens.owner!, rosette.tag, { limits: await limitsOfRosette(rosette.id), ...period });
      expect(response.status).toBe(200);
      const result = await response.json();
      const recorded = (await alertsOfRosette(rosette.tag)).map((alert) => ({
        quantity: alert.quantity,
        level: alert.level,
        openedAt: alert.openedAt.getTime(),
        peak: alert.peak,
        clearedAt: alert.clearedAt?.getTime() ?? null,
      }));
      expect(result.episodes, rosette.tag).toEqual(recorded);
    }
  });

  it("counts the instants checked and shows what other bounds would have raised", async () => {
    const result = await (await backtest(tokens.engineer!, "R1", { limits: [{ quantity: "vonMises", level: "warning", upper: 80, persistence: 2 }], ...period })).json();
    // R1's instants: 20.36, 101.81 and 81.45 MPa; two in a row above 80 MPa open at the third.
    expect(result).toMatchObject({ from: T0 - DAY, to: T0 + DAY, readingsChecked: 3 });
    expect(result.episodes).toMatchObject([{ quantity: "vonMises", level: "warning", openedAt: T0 + 2 * TEN_MINUTES, clearedAt: null }]);
    expect(result.episodes[0].peak).toBeCloseTo(101.81, 1);
  });

  it("refuses a token whose role may not view the structure, and answers bad input with the field", async () => {
    const limits = [{ quantity: "vonMises", level: "watch", upper: 100 }];
    expect((await backtest(await loggerToken("WEB"), "R1", { limits, ...period })).status).toBe(403);
    const fieldsOf = async (response: Response) => {
      expect(response.status).toBe(400);
      return (await response.json()).error.details.issues.map((issue: { path: string }) => issue.path);
    };
    expect(await fieldsOf(await backtest(tokens.engineer!, "R1", { limits, from: period.to, to: period.from }))).toEqual(["to"]);
    expect(await fieldsOf(await backtest(tokens.engineer!, "R1", { limits: [{ quantity: "stress", level: "watch", upper: 100 }], ...period }))).toEqual(["limits.0.quantity"]);
    expect(await fieldsOf(await backtest(tokens.engineer!, "R1", { limits: [{ quantity: "vonMises", level: "watch", upper: 50, lower: 80 }], ...period }))).toEqual([
      "limits.0.lower",
    ]);
  });
});

// After the backtest, which compares live evaluation with the stored data for every rosette above.
describe("changing a rosette's limits", () => {
  it("closes its open alert when its limits are removed, and tells the people told it opened why and by whom", async () => {
    await rosetteWithLimit("GONE", ["ga", "gb", "gc"], { upper: 100 });
    const opened = await ingestJson(engineer, "WEB", instant(0, ABOVE, ["ga", "gb", "gc"]));
    expect(opened.alerts.opened).toBe(1);
    await getDb().delete(mailOutbox);
    expect((await put(tokens.engineer!, { limits: [] }, "GONE")).status).toBe(200);
    const [alert] = await alertsOfRosette("GONE");
    expect(alert!.clearedAt).not.toBeNull();
    const mails = (await getDb().select().from(mailOutbox)).filter((mail) => mail.toAddress === engineer.email);
    // The peak is the von Mises stress worked out by hand above (101.81 MPa, shown to a tenth).
    expect(mails.map((mail) => mail.subject)).toEqual(["Closed: WEB rosette GONE von Mises stress alert at the watch limit closed (peak 101.8 MPa)"]);
    expect(mails[0]!.text).toContain(`Closed because the limits of this quantity were removed by ${engineer.email}.`);
    // Its machine starts again: the same values open a new alert.
    expect((await put(tokens.engineer!, { limits: [{ quantity: "vonMises", level: "watch", upper: 100 }] }, "GONE")).status).toBe(200);
    expect((await ingestJson(engineer, "WEB", instant(1, ABOVE, ["ga", "gb", "gc"]))).alerts.opened).toBe(1);
  });
});
