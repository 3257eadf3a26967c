import { beforeAll, describe, expect, it } from "vitest";
import * as alertsRoute from "@/app/api/v1/structures/[code]/alerts/route";
import { getDb } from "@/db/client";
import { alerts } from "@/db/schema";
import type { UserActor } from "@/lib/auth/actor";
import { createGauge, resolveGauge } from "@/lib/services/gauges";
import { listAlerts, listAlertsAcross, listGaugeEpisodes } from "@/lib/services/alerts";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, makeStructure, makeUser, params, userToken } from "./helpers";

const START = Date.UTC(2026, 9, 1);
const LEVELS = ["watch", "warning", "critical"] as const;
/** More alerts than the old lists' 500-row cap; levels take turns watch, warning, critical. */
const COUNT = 620;

let engineer: UserActor;
let token: string;

type Page = { alerts: { id: number; level: string; gauge: string }[]; total: number; nextCursor: string | null };

async function get(query: string): Promise<{ status: number; body: Page }> {
  const response = await alertsRoute.GET(apiRequest(`/structures/PAGE/alerts?${query}`, { token }), params({ code: "PAGE" }));
  return { status: response.status, body: await response.json() };
}

beforeAll(async () => {
  engineer = await makeUser("engineer");
  token = await userToken(engineer.email);
  await makeStructure("PAGE", [engineer]);
  await createGauge(engineer, "PAGE", microstrainGauge("A1"));
  await createGauge(engineer, "PAGE", microstrainGauge("B1"));
  const a1 = (await resolveGauge(engineer, "PAGE", "A1", "structure:view")).gauge;
  const b1 = (await resolveGauge(engineer, "PAGE", "B1", "structure:view")).gauge;
  // Alternate gauges; several alerts share an opening minute, so paging must order by id too.
  const rows = Array.from({ length: COUNT }, (_, i) => ({
    structureId: a1.structureId,
    gaugeId: i % 2 === 0 ? a1.id : b1.id,
    kind: "limit" as const,
    level: LEVELS[i % 3]!,
    quantity: "strain",
    openedAt: new Date(START + Math.floor(i / 4) * 60_000),
    bound: 100,
    peak: 120,
    clearedAt: new Date(START + Math.floor(i / 4) * 60_000 + 30_000),
  }));
  await getDb().insert(alerts).values(rows);
});

describe("alert lists past 500 rows", () => {
  it("answers the count of every match and pages through all of them with the cursor, none twice", async () => {
    const first = await get("state=all");
    expect(first.status).toBe(200);
    expect(first.body.total).toBe(COUNT);
    expect(first.body.alerts).toHaveLength(500);
    expect(first.body.nextCursor).toEqual(expect.any(String));
    const second = await get(`state=all&cursor=${first.body.nextCursor}`);
    expect(second.body.alerts).toHaveLength(COUNT - 500);
    expect(second.body.nextCursor).toBeNull();
    const ids = [...first.body.alerts, ...second.body.alerts].map((alert) => alert.id);
    expect(new Set(ids).size).toBe(COUNT);
  });

  it("filters by level and kind in the database, with the filter's own total", async () => {
    const critical = await get("state=all&level=critical&limit=100");
    // Critical are alerts 2, 5, …, 617 of 0…619: (617 − 2) / 3 + 1 = 206 (by hand).
    expect(critical.body.total).toBe(206);
    expect(critical.body.alerts).toHaveLength(100);
    expect(critical.body.alerts.every((alert) => alert.level === "critical")).toBe(true);
    expect((await get("state=all&kind=sensor")).body.total).toBe(0);
    expect((await get("state=cleared&limit=1")).body.total).toBe(COUNT);
    expect((await get("state=open")).body.total).toBe(0);
  });

  it("says what to fix in a bad limit or cursor, never a 500", async () => {
    for (const query of ["limit=0", "limit=5000", "limit=ten", "cursor=abc", "level=severe"]) {
      const answer = await get(query);
      expect(answer.status, query).toBe(400);
    }
  });

  it("pages a screen's list by offset and a gauge's own alerts in the database", async () => {
    const thirteenth = await listAlerts(engineer, "PAGE", { state: "all", level: "any", kind: "any", limit: 50, offset: 600 });
    expect(thirteenth.total).toBe(COUNT);
    expect(thirteenth.alerts).toHaveLength(20);
    const a1 = await listAlerts(engineer, "PAGE", { state: "all", level: "any", kind: "any", gauge: "A1", limit: 50, offset: 300 });
    expect(a1.total).toBe(COUNT / 2);
    expect(a1.alerts).toHaveLength(10);
    expect(a1.alerts.every((alert) => alert.gauge === "A1")).toBe(true);
    const across = await listAlertsAcross(engineer, { state: "all", level: "warning", kind: "limit", limit: 50, offset: 0 });
    // Warnings are alerts 1, 4, …, 619: (619 − 1) / 3 + 1 = 207 (by hand).
    expect(across.total).toBe(207);
    const episodes = await listGaugeEpisodes(engineer, "PAGE", "B1");
    expect(episodes.total).toBe(COUNT / 2);
    expect(episodes.episodes).toHaveLength(COUNT / 2);
  });
});
