import { afterEach, beforeAll, describe, expect, it } from "vitest";
import * as readingsRoute from "@/app/api/v1/structures/[code]/readings/route";
import { runOutboxSender } from "@/jobs/outbox-sender";
import { createGauge } from "@/lib/services/gauges";
import { replaceLimits } from "@/lib/services/limits";
import { createToken } from "@/lib/services/tokens";
import { microstrainGauge } from "../fixtures/gauges";
import type { LocalSmtpServer } from "@/lib/mail/local-smtp-server";
import { apiRequest, makeStructure, makeUser, params } from "./helpers";
import { freePort, receivedCounts, startCatcher } from "./mail-helpers";
import { getDb } from "@/db/client";
import { caughtMail } from "@/db/schema";

let logger: string;
let catcher: LocalSmtpServer | undefined;
// Recent readings: events about readings more than a day old are left to the digest rather than mailed at once.
const T0 = Math.floor(Date.now() / 3_600_000) * 3_600_000 - 6 * 3_600_000;
const TEN_MINUTES = 600_000;

afterEach(async () => {
  await catcher?.close();
  catcher = undefined;
});

beforeAll(async () => {
  const engineer = await makeUser("engineer", "eng@mail.example");
  const owner = await makeUser("owner", "own@mail.example");
  const technician = await makeUser("technician", "tech@mail.example");
  await makeStructure("CRANE", [engineer, owner, technician]);
  await createGauge(engineer, "CRANE", microstrainGauge("RB-1", { label: "Runway beam, midspan", member: "Runway beam 3" }));
  await replaceLimits(engineer, "CRANE", "RB-1", [{ quantity: "stress", level: "warning", upper: 150, hysteresis: 10, persistence: 2 }]);
  logger = (await createToken(null, { kind: "logger", structureCode: "CRANE" }, "crane logger")).token;
});

/** What a logger sends: microstrain readings every 10 minutes from `start`. */
function post(microstrain: number[], start: number) {
  const readings = microstrain.map((value, i) => ({ gauge: "RB-1", time: new Date(T0 + (start + i) * TEN_MINUTES).toISOString(), value, temperature: 12 }));
  return readingsRoute.POST(apiRequest("/structures/CRANE/readings", { token: logger, body: { readings } }), params({ code: "CRANE" }));
}

describe("a limit crossed through the ingestion API", () => {
  it("opens one alert and e-mails each owner and engineer once through SMTP, even through an outage", async () => {
    // σ = E·ε: 1 000 µε on steel of E = 200 GPa is 200 MPa (Hooke's law): beyond the 150 MPa warning bound.
    const crossing = await post([400, 1000, 1000, 1000], 0);
    expect(crossing.status).toBe(200);
    expect((await crossing.json()).alerts).toEqual({ opened: 1, escalated: 0, cleared: 0 });

    // The logger resends the same batch: duplicates, no new alert, no new mail.
    const again = await (await post([400, 1000, 1000, 1000], 0)).json();
    expect(again).toMatchObject({ accepted: 0, duplicates: 4, alerts: { opened: 0, escalated: 0, cleared: 0 } });

    // The relay is down: nothing is lost, nothing is sent.
    process.env.LOCAL_SMTP_PORT = String(await freePort());
    delete process.env.SMTP_URL;
    const down = await runOutboxSender({ holder: "test" });
    expect(down.sent).toBe(0);

    // Back up, after the retry delay: each recipient gets exactly one e-mail, the technician none.
    catcher = await startCatcher();
    const later = new Date(Date.now() + 10 * 60_000);
    await runOutboxSender({ holder: "test", now: later });
    await runOutboxSender({ holder: "test", now: later });
    expect(await receivedCounts()).toEqual({ "eng@mail.example": 1, "own@mail.example": 1 });
    const [message] = await getDb().select().from(caughtMail);
    expect(message!.subject).toContain("WARNING: CRANE RB-1 stress crossed the warning limit (peak 200.0 MPa)");
    expect(message!.text).toContain("Runway beam 3");
    expect(message!.text).toContain("/structures/CRANE/gauges/RB-1");
  });
});
