import { beforeAll, describe, expect, it, vi } from "vitest";
import * as readingsRoute from "@/app/api/v1/structures/[code]/readings/route";
import { getClient } from "@/db/client";
import type { UserActor } from "@/lib/auth/actor";
import { SESSION_FORMAT, userForSession } from "@/lib/auth/session-claims";
import { createGauge } from "@/lib/services/gauges";
import { replaceLimits } from "@/lib/services/limits";
import { structureSummaries } from "@/lib/services/status";
import { listStructuresFor } from "@/lib/services/structures";
import { getUserById, unitsOf } from "@/lib/services/users";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, makeStructure, makeUser, params, userToken } from "./helpers";

/**
 * The home page reads the signed-in user, their units, their structures and each structure's card.
 * Those reads must not grow with the number of gauges: asked once per gauge, a 60-gauge structure
 * costs twenty times what a 3-gauge one does on every visit. The check is structural (statements
 * sent to the database), so it holds on any machine whatever its load.
 */

const MINUTE = 60_000;
const now = Date.now();
const iso = (ms: number) => new Date(ms).toISOString();
const zero = { value: 0, temperature: 10, time: iso(now - 86_400_000) };
/** ±1 000 µε watch limits: the first gauge of each structure goes past them and opens an alert. */
const watch = { quantity: "strain" as const, level: "watch" as const, upper: 1_000, lower: -1_000, hysteresis: 0, persistence: 1 };

const tagsOf = (count: number) => Array.from({ length: count }, (_, g) => `G${String(g).padStart(2, "0")}`);

/** A structure of `count` gauges with an hour of 10-minute readings each, limits on every other gauge, one alert open. */
async function structureWith(code: string, count: number): Promise<UserActor> {
  const engineer = await makeUser("engineer", `${code.toLowerCase()}@test.example`);
  await makeStructure(code, [engineer]);
  const tags = tagsOf(count);
  for (const tag of tags) await createGauge(engineer, code, microstrainGauge(tag, { zero }));
  for (const tag of tags.filter((_, g) => g % 2 === 0)) await replaceLimits(engineer, code, tag, [watch]);
  const readings = tags.flatMap((tag, g) =>
    Array.from({ length: 6 }, (_, i) => ({ gauge: tag, time: iso(now - (60 - i * 10) * MINUTE), value: g === 0 ? 1_500 : 100 + i, temperature: 10 })),
  );
  const token = await userToken(engineer.email);
  const response = await readingsRoute.POST(apiRequest(`/structures/${code}/readings`, { token, body: { readings } }), params({ code }));
  expect(response.status).toBe(200);
  return engineer;
}

/** The statements the home page's reads send for `user`, and what the cards say. */
async function homePageReads(user: UserActor) {
  const client = getClient();
  const execute = vi.spyOn(client, "execute");
  const batch = vi.spyOn(client, "batch");
  try {
    const account = await getUserById(user.id);
    const signedIn = await userForSession({ sub: String(user.id), sessionFormat: SESSION_FORMAT, sessionVersion: account!.sessionVersion, sessionId: "home" });
    expect(signedIn?.id).toBe(user.id);
    await unitsOf(user.id);
    const structures = await listStructuresFor(user);
    const summaries = await structureSummaries(structures, now);
    return { statements: execute.mock.calls.length + batch.mock.calls.length, summaries };
  } finally {
    vi.restoreAllMocks();
  }
}

let small: UserActor;
let large: UserActor;

beforeAll(async () => {
  small = await structureWith("SMALL3", 3);
  large = await structureWith("LARGE60", 60);
}, 60_000);

describe("the home page's reads", () => {
  it("send as many statements for a structure of 60 gauges as for one of 3", async () => {
    const ofSmall = await homePageReads(small);
    const ofLarge = await homePageReads(large);
    // The cards really are about the gauges counted: every gauge, and the one open watch alert.
    expect(ofSmall.summaries.map((summary) => [summary.gaugeCount, summary.openAlerts.watch])).toEqual([[3, 1]]);
    expect(ofLarge.summaries.map((summary) => [summary.gaugeCount, summary.openAlerts.watch])).toEqual([[60, 1]]);
    expect(ofSmall.statements).toBeGreaterThan(0);
    expect(ofLarge.statements).toBe(ofSmall.statements);
  });
});
