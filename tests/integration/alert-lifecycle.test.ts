import { and, eq } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it } from "vitest";
import * as readingsRoute from "@/app/api/v1/structures/[code]/readings/route";
import * as alertsRoute from "@/app/api/v1/structures/[code]/alerts/route";
import * as resolveRoute from "@/app/api/v1/alerts/[id]/resolve/route";
import * as gaugeReadingsRoute from "@/app/api/v1/structures/[code]/gauges/[tag]/readings/route";
import { getDb, writeTransaction } from "@/db/client";
import { alertEvents, alerts, evaluationStates, gauges, mailOutbox, readings, rollups } from "@/db/schema";
import { runDailyDigest } from "@/jobs/daily-digest";
import { runStaleWatch } from "@/jobs/stale-watch";
import { EVALUATION_STATE_VERSION } from "@/lib/alerting/evaluation-state";
import { FAULT_BITS } from "@/lib/limits";
import { handleAlert, openSensorFaults } from "@/lib/services/alerts";
import { createGauge, getGauge, recordZero, updateGauge } from "@/lib/services/gauges";
import { replaceLimits } from "@/lib/services/limits";
import { setAlertMailMode } from "@/lib/services/memberships";
import type { UserActor } from "@/lib/auth/actor";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, loggerToken, makeStructure, makeUser, params, userToken } from "./helpers";

const HOUR = 3_600_000;
const DAY = 86_400_000;
const TEN_MINUTES = 600_000;
// Recent readings, so their alert events are mailed at once (older than a day go to the digest).
const T0 = Math.floor(Date.now() / HOUR) * HOUR - 20 * HOUR;

let engineer: UserActor;
let owner: UserActor;
let logger: string;
let engineerToken: string;

beforeAll(async () => {
  engineer = await makeUser("engineer", "eng@life.example");
  owner = await makeUser("owner", "own@life.example");
  await makeStructure("LIFE", [engineer, owner]);
  logger = await loggerToken("LIFE");
  engineerToken = await userToken(engineer.email);
});

beforeEach(async () => {
  await getDb().delete(mailOutbox);
});

/** A logger's batch of microstrain readings (the fixture gauge's zero is 0, so strain = value), every ten minutes from `index`. */
async function post(tag: string, values: number[], index: number) {
  const body = { readings: values.map((value, i) => ({ gauge: tag, time: new Date(T0 + (index + i) * TEN_MINUTES).toISOString(), value, temperature: 10 })) };
  const response = await readingsRoute.POST(apiRequest("/structures/LIFE/readings", { token: logger, body }), params({ code: "LIFE" }));
  expect(response.status).toBe(200);
  return (await response.json()) as { accepted: number; alerts: { opened: number; escalated: number; cleared: number } };
}

async function gaugeId(tag: string) {
  const [row] = await getDb().select({ id: gauges.id }).from(gauges).where(eq(gauges.tag, tag));
  return row!.id;
}

async function alertsOf(tag: string) {
  return getDb().select().from(alerts).where(eq(alerts.gaugeId, await gaugeId(tag))).orderBy(alerts.id);
}

async function apiAlerts() {
  const response = await alertsRoute.GET(apiRequest("/structures/LIFE/alerts?state=all", { token: engineerToken }), params({ code: "LIFE" }));
  return (await response.json()).alerts as { id: number; gauge: string; peak: number; peakAt: string; clearedAt: string | null }[];
}

async function newGauge(tag: string, limits: Parameters<typeof replaceLimits>[3]) {
  await createGauge(engineer, "LIFE", microstrainGauge(tag));
  await replaceLimits(engineer, "LIFE", tag, limits);
}

const at = (index: number) => T0 + index * TEN_MINUTES;

describe("an open alert's peak", () => {
  it("follows the episode's furthest value while open, and the API and e-mail give the same number with its unit", async () => {
    await newGauge("PK", [{ quantity: "strain", level: "watch", upper: 100, persistence: 2 }]);
    await post("PK", [50, 110, 126.5], 0);
    await post("PK", [150, 172, 160], 3);
    const [alert] = await alertsOf("PK");
    // The furthest value beyond the bound is the largest reading of the run (172 µε at reading 4), by definition of the contract's peak.
    expect(alert).toMatchObject({ peak: 172, peakAt: new Date(at(4)), clearedAt: null });
    const [viewed] = (await apiAlerts()).filter((view) => view.gauge === "PK");
    expect(viewed).toMatchObject({ peak: 172, peakAt: new Date(at(4)).toISOString() });
    // The opening e-mail names the peak at the time, rounded to whole µε as the page shows strain.
    const [mail] = await getDb().select().from(mailOutbox);
    expect(mail!.subject).toContain("(peak 127 µε)");
  });
});

describe("clearing by hand", () => {
  it("closes the episode too: the next crossing opens a new alert, and its escalation is e-mailed", async () => {
    await newGauge("HC", [
      { quantity: "strain", level: "watch", upper: 100 },
      { quantity: "strain", level: "critical", upper: 300 },
    ]);
    await post("HC", [120, 130], 0);
    const [first] = await alertsOf("HC");
    await handleAlert(engineer, first!.id, "cleared", "Checked on site; test load on the deck.");
    await getDb().delete(mailOutbox);
    const next = await post("HC", [140, 350], 2);
    expect(next.alerts).toEqual({ opened: 1, escalated: 1, cleared: 0 });
    const [, second] = await alertsOf("HC");
    expect(second).toMatchObject({ level: "critical", clearedAt: null });
    const subjects = (await getDb().select().from(mailOutbox)).map((mail) => mail.subject);
    expect(subjects.filter((subject) => subject.startsWith("CRITICAL: LIFE HC strain rose to the critical limit"))).toHaveLength(2);
  });
});

describe("changing limits", () => {
  it("removing a quantity's limits clears its open alert, saying so", async () => {
    await newGauge("RL", [{ quantity: "strain", level: "watch", upper: 100 }]);
    await post("RL", [150], 0);
    await replaceLimits(engineer, "LIFE", "RL", []);
    const [alert] = await alertsOf("RL");
    expect(alert!.clearedAt).not.toBeNull();
    const history = await getDb().select().from(alertEvents).where(eq(alertEvents.alertId, alert!.id));
    expect(history.at(-1)!.text).toMatch(/limits of this quantity were removed/);
  });
});

describe("an alert closed by a configuration change", () => {
  const mails = async () => getDb().select().from(mailOutbox).orderBy(mailOutbox.id);

  it("is e-mailed to the people told it opened, saying it closed because the limits were changed and by whom, once", async () => {
    await newGauge("CL", [{ quantity: "strain", level: "warning", upper: 100 }]);
    await post("CL", [150], 0);
    const opened = await mails();
    expect(opened.map((mail) => mail.toAddress).sort()).toEqual(["eng@life.example", "own@life.example"]);
    await getDb().delete(mailOutbox);
    await replaceLimits(engineer, "LIFE", "CL", [{ quantity: "strain", level: "warning", upper: 200 }]);
    const closed = await mails();
    expect(closed.map((mail) => mail.toAddress).sort()).toEqual(["eng@life.example", "own@life.example"]);
    // Not "back within": the reading of 150 µε stays beyond the old bound; a person's change closed it.
    expect(closed[0]!.subject).toBe("Closed: LIFE CL strain alert at the warning limit closed (peak 150 µε)");
    expect(closed[0]!.text).toContain("Closed because the limits were changed by eng@life.example.");
    expect(closed[0]!.text).not.toContain("back within");
    // The same change again finds no open alert: nobody is told twice.
    await replaceLimits(engineer, "LIFE", "CL", [{ quantity: "strain", level: "warning", upper: 250 }]);
    expect(await mails()).toHaveLength(2);
  });

  it("says so when the limits were removed, the material changed or a new zero was recorded", async () => {
    await newGauge("CR", [{ quantity: "strain", level: "watch", upper: 100 }]);
    await newGauge("CM", [{ quantity: "stress", level: "watch", upper: 20 }]);
    await newGauge("CZ", [{ quantity: "strain", level: "watch", upper: 100 }]);
    // 150 µε × 200 000 MPa = 30 MPa, beyond the 20 MPa bound (σ = E·ε).
    for (const tag of ["CR", "CM", "CZ"]) await post(tag, [150], 0);
    await getDb().delete(mailOutbox);
    await replaceLimits(engineer, "LIFE", "CR", []);
    await updateGauge(engineer, "LIFE", "CM", { material: { E: 210000, nu: 0.3, alpha: 12, yield: 355 } });
    await recordZero(engineer, "LIFE", "CZ", { value: 150, temperature: 10, time: new Date(at(0)).toISOString(), reason: "re-zeroed" });
    const sent = (await mails()).filter((mail) => mail.toAddress === "eng@life.example").map((mail) => mail.text);
    expect(sent).toHaveLength(3);
    expect(sent[0]).toContain("Closed because the limits of this quantity were removed by eng@life.example.");
    expect(sent[1]).toContain("Closed because the gauge's material was changed by eng@life.example.");
    expect(sent[2]).toContain("Closed because a new zero was recorded by eng@life.example.");
  });

  it("reaches a member who takes the digest in the digest, in the same words", async () => {
    const digestReader = await makeUser("engineer", "digest@life.example");
    await makeStructure("LIFED", [digestReader]);
    await setAlertMailMode(digestReader, "LIFED", "digest");
    const dayLogger = await loggerToken("LIFED");
    await createGauge(digestReader, "LIFED", microstrainGauge("DG"));
    await replaceLimits(digestReader, "LIFED", "DG", [{ quantity: "strain", level: "watch", upper: 100 }]);
    const body = { readings: [{ gauge: "DG", time: new Date(at(0)).toISOString(), value: 150, temperature: 10 }] };
    await readingsRoute.POST(apiRequest("/structures/LIFED/readings", { token: dayLogger, body }), params({ code: "LIFED" }));
    await replaceLimits(digestReader, "LIFED", "DG", []);
    expect((await mails()).filter((mail) => mail.toAddress === "digest@life.example")).toEqual([]);
    await runDailyDigest(Date.now() + DAY);
    const [digest] = (await mails()).filter((mail) => mail.toAddress === "digest@life.example");
    expect(digest!.text).toMatch(/strain alert at the watch limit closed: Closed because the limits of this quantity were removed\. .*\(digest@life\.example\)/);
    // Back to e-mails as they happen, so the later digest test of this file sees only its own readers.
    await setAlertMailMode(digestReader, "LIFED", "immediate");
  });
});

describe("a new zero", () => {
  it("is never taken for a jump", async () => {
    await newGauge("RZ", [{ quantity: "strain", level: "watch", upper: 500 }]);
    await post("RZ", [2000, 2001, 2002], 0);
    // Reset the reference to today's reading: converted values drop by 2 000 µε, more than the 1 500 µε jump threshold.
    await recordZero(engineer, "LIFE", "RZ", { value: 2002, temperature: 10, time: new Date(at(2)).toISOString(), reason: "re-zeroed after repair" });
    const after = await post("RZ", [2003, 2004], 3);
    expect(after.alerts.opened).toBe(0);
    expect((await alertsOf("RZ")).filter((alert) => alert.code === "jump")).toEqual([]);
    const stored = await getDb().select({ fault: readings.fault }).from(readings).where(eq(readings.gaugeId, await gaugeId("RZ")));
    expect(stored.every((row) => row.fault === 0)).toBe(true);
  });
});

async function resolve(id: number, resolution: string) {
  const body = { resolution, comment: "Checked the gauge on site." };
  return resolveRoute.POST(apiRequest(`/alerts/${id}/resolve`, { token: engineerToken, body }), params({ id: String(id) }));
}

async function faultsOf(tag: string) {
  const rows = await getDb().select({ t: readings.time, fault: readings.fault }).from(readings).where(eq(readings.gaugeId, await gaugeId(tag))).orderBy(readings.time);
  return rows.map((row) => row.fault);
}

async function hourlyMaxStrain(tag: string) {
  const rows = await getDb().select().from(rollups).where(and(eq(rollups.gaugeId, await gaugeId(tag)), eq(rollups.resolution, HOUR)));
  return Math.max(...rows.map((row) => row.strainMax));
}

/** 100 µε, then a step of 1 900 µε (more than the 1 500 µε the default jump check allows), then staying up: beyond the 500 µε watch bound. */
async function jumpOn(tag: string) {
  await newGauge(tag, [{ quantity: "strain", level: "watch", upper: 500 }]);
  await post(tag, [100, 100], 0);
  const result = await post(tag, [2000, 2010, 2020], 2);
  const jump = (await alertsOf(tag)).find((alert) => alert.code === "jump")!;
  return { result, jump };
}

describe("a jump", () => {
  it("quarantines the gauge's readings from the jump on: no limit alert, marked in SQL, out of roll-ups, and the e-mail says limits are not checked", async () => {
    const { result, jump } = await jumpOn("JQ");
    expect(result.alerts.opened).toBe(0);
    expect(jump).toMatchObject({ kind: "sensor", clearedAt: null });
    expect((await alertsOf("JQ")).filter((alert) => alert.kind === "limit")).toEqual([]);
    expect(await faultsOf("JQ")).toEqual([0, 0, FAULT_BITS.jump, FAULT_BITS["after-jump"], FAULT_BITS["after-jump"]]);
    expect(await hourlyMaxStrain("JQ")).toBe(100);
    const faults = await openSensorFaults([await gaugeId("JQ")]);
    expect(faults.get(await gaugeId("JQ"))).toEqual({ since: new Date(at(2)), faults: ["jump"] });
    const [mail] = (await getDb().select().from(mailOutbox)).filter((row) => row.subject.startsWith("Sensor fault"));
    expect(mail!.text).toContain("limits are NOT being checked on this gauge");
    // Later readings stay out until an engineer decides.
    expect((await post("JQ", [2030], 5)).alerts.opened).toBe(0);
    await expect(handleAlert(engineer, jump.id, "cleared", "gone")).rejects.toThrow(/accept the step as real, or record a new zero/);
  });

  it("accepted as a real step: the quarantined readings are checked against the limits from the jump on", async () => {
    const { jump } = await jumpOn("JA");
    await getDb().delete(mailOutbox);
    const response = await resolve(jump.id, "accept-step");
    expect(response.status).toBe(200);
    expect((await response.json()).clearedAt).not.toBeNull();
    // The engineer, told of the jump at once, is told how it was settled (the owner reads sensor faults in the digest).
    const resolved = (await getDb().select().from(mailOutbox)).filter((mail) => mail.subject.startsWith("Resolved: LIFE JA"));
    expect(resolved.map((mail) => mail.toAddress)).toEqual(["eng@life.example"]);
    expect(resolved[0]!.text).toContain("Accepted as a real step by eng@life.example");
    const limit = (await alertsOf("JA")).find((alert) => alert.kind === "limit");
    expect(limit).toMatchObject({ level: "watch", openedAt: new Date(at(2)), peak: 2020, clearedAt: null });
    expect(await faultsOf("JA")).toEqual([0, 0, 0, 0, 0]);
    expect(await hourlyMaxStrain("JA")).toBe(2020);
    expect((await openSensorFaults([await gaugeId("JA")])).size).toBe(0);
  });

  it("settled by a new zero: the reading at the jump is the zero, the readings between stay set aside, later ones are checked", async () => {
    const { jump } = await jumpOn("JZ");
    await getDb().delete(mailOutbox);
    expect((await resolve(jump.id, "new-zero")).status).toBe(200);
    const [resolved] = (await getDb().select().from(mailOutbox)).filter((mail) => mail.subject.startsWith("Resolved: LIFE JZ"));
    expect(resolved!.text).toContain("Resolved by a new zero recorded by eng@life.example");
    expect((await getGauge(engineer, "LIFE", "JZ")).zero).toMatchObject({ value: 2000 });
    const [cleared] = (await alertsOf("JZ")).filter((alert) => alert.code === "jump");
    expect(cleared!.clearedAt).not.toBeNull();
    // 2 005 raw is 5 µε from the new zero: healthy, within limits, no jump.
    const later = await post("JZ", [2005, 2600], 5);
    expect(later.alerts.opened).toBe(1);
    expect(await faultsOf("JZ")).toEqual([0, 0, FAULT_BITS.jump, FAULT_BITS["after-jump"], FAULT_BITS["after-jump"], 0, 0]);
  });

  it("answers a resolution of an alert that is no jump with 409", async () => {
    await newGauge("NJ", [{ quantity: "strain", level: "watch", upper: 100 }]);
    await post("NJ", [150], 0);
    const [limit] = await alertsOf("NJ");
    expect((await resolve(limit!.id, "accept-step")).status).toBe(409);
    expect((await resolve(limit!.id, "guess")).status).toBe(400);
  });
});

/** The gauge's readings through the API, as time index and flags. */
async function apiFlags(tag: string) {
  const query = `from=${new Date(T0 - HOUR).toISOString()}&to=${new Date(T0 + DAY).toISOString()}`;
  const response = await gaugeReadingsRoute.GET(apiRequest(`/structures/LIFE/gauges/${tag}/readings?${query}`, { token: engineerToken }), params({ code: "LIFE", tag }));
  expect(response.status).toBe(200);
  return ((await response.json()).readings as { time: string; flags: string[] }[]).map((reading) => reading.flags);
}

describe("a lone spike", () => {
  // Common practice: one reading far from both neighbours is noise on the channel, a fault of that
  // reading alone; a change of level that stays is a jump. 2 600 µε out and straight back is > 1 500 µε both ways.
  it("is set aside on its own: no sensor alert, nothing held, the following good readings are checked against the limits", async () => {
    await newGauge("SPK", [{ quantity: "strain", level: "watch", upper: 500 }]);
    const result = await post("SPK", [100, 100, 2700, 100, 600], 0);
    // The spike opens nothing; the 600 µε reading after it does.
    expect(result.alerts.opened).toBe(1);
    const raised = await alertsOf("SPK");
    expect(raised.map((alert) => [alert.kind, alert.openedAt])).toEqual([["limit", new Date(at(4))]]);
    expect(await faultsOf("SPK")).toEqual([0, 0, FAULT_BITS.spike, 0, 0]);
    expect(await hourlyMaxStrain("SPK")).toBe(600);
    expect((await openSensorFaults([await gaugeId("SPK")])).size).toBe(0);
    // 2 700 µε is also 540 MPa, past the 355 MPa yield (σ = E·ε): outside the linear range as well.
    expect(await apiFlags("SPK")).toEqual([[], [], ["outside-linear-range", "spike"], [], []]);
  });

  it("sent last in a batch waits for the next reading: back, it stays a spike; still up, it becomes the jump", async () => {
    await newGauge("SPB", [{ quantity: "strain", level: "watch", upper: 500 }]);
    await post("SPB", [100, 2700], 0);
    expect(await faultsOf("SPB")).toEqual([0, FAULT_BITS.spike]);
    expect(await alertsOf("SPB")).toEqual([]);
    await post("SPB", [110], 2);
    expect(await faultsOf("SPB")).toEqual([0, FAULT_BITS.spike, 0]);

    await newGauge("JPB", [{ quantity: "strain", level: "watch", upper: 500 }]);
    await post("JPB", [100, 2700], 0);
    const next = await post("JPB", [2710], 2);
    expect(next.alerts.opened).toBe(0);
    expect(await faultsOf("JPB")).toEqual([0, FAULT_BITS.jump, FAULT_BITS["after-jump"]]);
    const [jump] = await alertsOf("JPB");
    expect(jump).toMatchObject({ kind: "sensor", code: "jump", openedAt: new Date(at(1)), clearedAt: null });
    expect(await apiFlags("JPB")).toEqual([[], ["outside-linear-range", "jump"], ["outside-linear-range", "after-jump"]]);
  });
});

describe("stored evaluation state", () => {
  it("of an unknown version is rebuilt from the stored readings instead of breaking ingestion", async () => {
    await newGauge("SV", [{ quantity: "strain", level: "watch", upper: 100 }]);
    await post("SV", [150, 160], 0);
    const id = await gaugeId("SV");
    await writeTransaction((tx) => tx.update(evaluationStates).set({ state: { current: { version: 1, episodes: "?" }, lastCheckpointAt: null } }).where(eq(evaluationStates.gaugeId, id)));
    const back = await post("SV", [50], 2);
    // Rebuilt, the machine knows the episode is open, so a reading back inside clears it (persistence 1).
    expect(back.alerts).toEqual({ opened: 0, escalated: 0, cleared: 1 });
    expect((await alertsOf("SV")).map((alert) => alert.clearedAt !== null)).toEqual([true]);
    const [row] = await getDb().select().from(evaluationStates).where(eq(evaluationStates.gaugeId, id));
    expect((row!.state as { current: { version: number } }).current.version).toBe(EVALUATION_STATE_VERSION);
  });
});

describe("backfilled readings", () => {
  it("older than a day send no immediate e-mail; the next digest carries their events", async () => {
    await newGauge("OLD", [{ quantity: "strain", level: "watch", upper: 100 }]);
    const months = T0 - 90 * DAY;
    const body = { readings: [150, 160].map((value, i) => ({ gauge: "OLD", time: new Date(months + i * TEN_MINUTES).toISOString(), value, temperature: 10 })) };
    const response = await readingsRoute.POST(apiRequest("/structures/LIFE/readings", { token: logger, body }), params({ code: "LIFE" }));
    expect((await response.json()).alerts.opened).toBe(1);
    expect(await getDb().select().from(mailOutbox)).toEqual([]);
    const summary = await runDailyDigest(Date.now() + DAY);
    expect(summary).toMatch(/2 digests queued/);
    const digests = await getDb().select().from(mailOutbox);
    expect(digests.every((mail) => mail.text.includes("OLD"))).toBe(true);
  });
});

describe("silent gauges", () => {
  it("raise one watch-level alert per structure naming them all, narrowed and then cleared as they report again", async () => {
    const structure = await makeStructure("QUIET", [engineer, owner]);
    const quietLogger = await loggerToken("QUIET");
    for (const tag of ["Q1", "Q2", "Q3"]) await createGauge(engineer, "QUIET", microstrainGauge(tag));
    const send = async (tags: string[], index: number) => {
      const body = { readings: tags.map((gauge) => ({ gauge, time: new Date(T0 + index * TEN_MINUTES).toISOString(), value: 10, temperature: 10 })) };
      await readingsRoute.POST(apiRequest("/structures/QUIET/readings", { token: quietLogger, body }), params({ code: "QUIET" }));
    };
    await send(["Q1", "Q2", "Q3"], 0);
    // Three expected intervals of silence (30 min) and more: stale (common practice: more than one missed cycle).
    await runStaleWatch(T0 + 5 * TEN_MINUTES);
    await runStaleWatch(T0 + 6 * TEN_MINUTES);
    const staleOf = async () => (await getDb().select().from(alerts)).filter((alert) => alert.code === "stale" && alert.structureId === structure.id);
    const quiet = await staleOf();
    expect(quiet).toHaveLength(1);
    expect(quiet[0]).toMatchObject({ level: "watch", clearedAt: null });
    expect(quiet[0]!.message).toMatch(/3 gauges: Q1 .*Q2 .*Q3/);
    // The engineer gets one e-mail naming the three; the owner gets sensor faults in the digest by default.
    const mails = (await getDb().select().from(mailOutbox)).filter((mail) => mail.subject.includes("QUIET") && mail.subject.includes("no data arriving"));
    expect(mails.map((mail) => mail.toAddress)).toEqual(["eng@life.example"]);
    expect(mails[0]!.subject).toContain("gauges Q1, Q2, Q3");
    await send(["Q1"], 6);
    const [narrowed] = await staleOf();
    expect(narrowed!.message).toMatch(/2 gauges: Q2 .*Q3/);
    await send(["Q2", "Q3"], 7);
    const [cleared] = await staleOf();
    expect(cleared!.clearedAt).not.toBeNull();
  });
});
