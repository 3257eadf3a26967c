import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as readingsRoute from "@/app/api/v1/structures/[code]/readings/route";
import { getDb, writeTransaction } from "@/db/client";
import { alerts, caughtMail, mailOutbox } from "@/db/schema";
import { runOutboxSender } from "@/jobs/outbox-sender";
import type { LocalSmtpServer } from "@/lib/mail/local-smtp-server";
import { queueMail } from "@/lib/mail/outbox";
import { createGauge } from "@/lib/services/gauges";
import { replaceLimits } from "@/lib/services/limits";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, loggerToken, makeStructure, makeUser, params } from "./helpers";
import { startCatcher } from "./mail-helpers";

const TEN_SECONDS = 10_000;
const HOUR = 3_600_000;
// Recent enough for immediate e-mails: the storm, the calm and the critical crossing all lie within the last day.
const T0 = Math.floor(Date.now() / HOUR) * HOUR - 9 * HOUR;
const CYCLES = 600;

let logger: string;
let catcher: LocalSmtpServer | undefined;

beforeAll(async () => {
  const engineer = await makeUser("engineer", "eng@storm.example");
  const owner = await makeUser("owner", "own@storm.example");
  await makeStructure("STORM", [engineer, owner]);
  await createGauge(engineer, "STORM", microstrainGauge("FL", { expectedInterval: 10 }));
  await replaceLimits(engineer, "STORM", "FL", [
    { quantity: "strain", level: "watch", upper: 100, hysteresis: 0.2, persistence: 2 },
    { quantity: "strain", level: "critical", upper: 300, hysteresis: 0.2, persistence: 2 },
  ]);
  logger = await loggerToken("STORM");
});

afterAll(async () => {
  await catcher?.close();
});

/** Microstrain readings every 10 s from reading `index` (the fixture's zero is 0: strain = value). */
async function post(values: number[], index: number) {
  const body = { readings: values.map((value, i) => ({ gauge: "FL", time: new Date(T0 + (index + i) * TEN_SECONDS).toISOString(), value, temperature: 10 })) };
  const response = await readingsRoute.POST(apiRequest("/structures/STORM/readings", { token: logger, body }), params({ code: "STORM" }));
  expect(response.status).toBe(200);
  return response.json();
}

describe("a gauge flapping around a watch bound", () => {
  it("sends a bounded number of e-mails, and a later critical e-mail goes out first behind thousands queued", async () => {
    // Each cycle: two readings 0.5 µε beyond the bound (persistence 2 opens), two back inside the 0.2 µε dead band (clears).
    const storm = Array.from({ length: CYCLES }, () => [100.5, 100.5, 99.7, 99.7]).flat();
    const stormResult = await post(storm, 0);
    expect(stormResult.alerts.opened).toBe(CYCLES);
    // An hour and more back inside (a little noise, so no flat line): the flapping has settled.
    const calm = Array.from({ length: 400 }, (_, i) => 99 + (i % 3) * 0.01);
    await post(calm, storm.length);
    const stormMails = await getDb().select().from(mailOutbox);
    const limitAlerts = (await getDb().select().from(alerts)).filter((alert) => alert.kind === "limit");
    console.log(`storm: ${CYCLES} crossings, ${limitAlerts.length} alert, ${stormMails.length} e-mails queued for 2 recipients`);
    // One flapping episode (common practice in alarm management: a chattering alarm is one alarm):
    // opened, cleared, opened again, cleared, "flapping", "settled" for each of the two recipients.
    expect(limitAlerts).toHaveLength(1);
    expect(limitAlerts[0]).toMatchObject({ openings: CYCLES, clearedAt: expect.any(Date) });
    expect(stormMails).toHaveLength(12);
    expect(stormMails.filter((mail) => mail.subject.startsWith("Settled:"))).toHaveLength(2);

    // Thousands of other messages already waiting (a busy installation), all less urgent.
    await writeTransaction(async (tx) => {
      for (let i = 0; i < 3000; i++) {
        await queueMail(tx, { to: `someone${i}@storm.example`, kind: "alert", dedupeKey: `backlog:${i}`, subject: `Backlog ${i}`, text: "t", html: "<p>t</p>" });
      }
    });
    catcher = await startCatcher();
    await post([350, 360], storm.length + calm.length);
    const raised = Date.now();
    const criticalCaught = async () => (await getDb().select().from(caughtMail)).filter((mail) => mail.subject?.startsWith("CRITICAL: STORM FL"));
    // One run of the sender, as the job does every five seconds; the catcher is watched while it runs.
    const run = runOutboxSender({ holder: "storm" });
    while ((await criticalCaught()).length < 2 && Date.now() - raised < 30_000) await new Promise((resolve) => setTimeout(resolve, 10));
    const deliveredMs = Date.now() - raised;
    await run;
    console.log(`critical e-mail delivered ${deliveredMs} ms after it was raised, in the first sender run, with ${3000 + stormMails.length} messages queued`);
    expect((await criticalCaught()).map((mail) => mail.envelopeTo[0]).sort()).toEqual(["eng@storm.example", "own@storm.example"]);
    expect((await getDb().select().from(caughtMail)).slice(0, 2).every((mail) => mail.subject?.startsWith("CRITICAL:"))).toBe(true);
    const waiting = await getDb().select({ id: mailOutbox.id }).from(mailOutbox).where(eq(mailOutbox.state, "queued"));
    expect(waiting.length).toBeGreaterThan(2900);
  }, 120_000);
});
