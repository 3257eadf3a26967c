import { beforeAll, describe, expect, it } from "vitest";
import * as limitsRoute from "@/app/api/v1/structures/[code]/rosettes/[tag]/limits/route";
import * as alertsRoute from "@/app/api/v1/structures/[code]/alerts/route";
import { getDb } from "@/db/client";
import { alerts, mailOutbox, rosettes } from "@/db/schema";
import type { UserActor } from "@/lib/auth/actor";
import { createGauge, resolveGauge } from "@/lib/services/gauges";
import { ingestJson } from "@/lib/services/ingest";
import { createRosette } from "@/lib/services/rosettes";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, makeStructure, makeUser, params, userToken } from "./helpers";

const tokens: Record<string, string> = {};
let engineer: UserActor;
const T0 = Date.UTC(2026, 10, 2);
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

const put = (token: string, body: unknown) => limitsRoute.PUT(apiRequest("/structures/WEB/rosettes/R1/limits", { token, body, method: "PUT" }), at);

/** The three gauges' strains (µε) at the tenth-of-an-hour step `index`. */
const instant = (index: number, [a, b, c]: [number, number, number]) => {
  const time = new Date(T0 + index * TEN_MINUTES).toISOString();
  return [
    { gauge: "a", time, value: a },
    { gauge: "b", time, value: b },
    { gauge: "c", time, value: c },
  ];
};

// Rectangular rosette on steel (E = 200 GPa, ν = 0.3), worked by hand in rosette-series.test.ts:
// εa = 500, εb = 300, εc = −100 µε gives σvm = 101.81 MPa. Stress is linear in strain and von
// Mises homogeneous of degree one, so a fifth of those strains gives 20.36 MPa and four fifths 81.45 MPa.
const ABOVE: [number, number, number] = [500, 300, -100];
const LOW: [number, number, number] = [100, 60, -20];
const BACK_INSIDE: [number, number, number] = [400, 240, -80];

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
    expect(mails[0]!.subject).toMatch(/^WATCH: WEB rosette R1 von Mises stress crossed the watch limit \(101\.8 MPa\)/);
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
