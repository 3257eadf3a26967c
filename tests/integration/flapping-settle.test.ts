import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import * as readingsRoute from "@/app/api/v1/structures/[code]/readings/route";
import { getDb } from "@/db/client";
import { alerts, gauges, mailOutbox } from "@/db/schema";
import { runFlappingSettle } from "@/jobs/flapping-settle";
import { withLease } from "@/jobs/lease";
import { JOBS } from "@/jobs/registry";
import { FLAP_WINDOW_MS } from "@/lib/alerting/flapping";
import { createGauge } from "@/lib/services/gauges";
import { replaceLimits } from "@/lib/services/limits";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, loggerToken, makeStructure, makeUser, params } from "./helpers";

const HOUR = 3_600_000;
const TEN_MINUTES = 600_000;
// Recent readings, so the episode's e-mails go out at once rather than into the digest.
const T0 = Math.floor(Date.now() / HOUR) * HOUR - 6 * HOUR;
const LAST_CLEARED = T0 + 5 * TEN_MINUTES;

let logger: string;

beforeAll(async () => {
  const engineer = await makeUser("engineer", "eng@flap.example");
  const owner = await makeUser("owner", "own@flap.example");
  await makeStructure("FLAP", [engineer, owner]);
  await createGauge(engineer, "FLAP", microstrainGauge("FQ"));
  await replaceLimits(engineer, "FLAP", "FQ", [{ quantity: "strain", level: "watch", upper: 100 }]);
  logger = await loggerToken("FLAP");
  // Out and back three times in an hour (persistence 1): three openings make the alert flapping.
  const body = { readings: [150, 50, 150, 50, 150, 50].map((value, i) => ({ gauge: "FQ", time: new Date(T0 + i * TEN_MINUTES).toISOString(), value, temperature: 10 })) };
  const response = await readingsRoute.POST(apiRequest("/structures/FLAP/readings", { token: logger, body }), params({ code: "FLAP" }));
  expect(response.status).toBe(200);
});

async function flappingAlert() {
  const [gauge] = await getDb().select().from(gauges).where(eq(gauges.tag, "FQ"));
  const [alert] = await getDb().select().from(alerts).where(eq(alerts.gaugeId, gauge!.id));
  return alert!;
}

const settledMails = async () => (await getDb().select().from(mailOutbox)).filter((mail) => mail.subject.startsWith("Settled: FLAP FQ"));

describe("a flapping alert on a gauge that sends no more readings", () => {
  it("is a leased job of its own", () => {
    expect(JOBS.find((job) => job.name === "flapping-settle")).toMatchObject({ leaseMs: expect.any(Number) });
  });

  it("stays unsettled while the quiet window lasts, by the clock", async () => {
    expect(await flappingAlert()).toMatchObject({ openings: 3, flappingSince: expect.any(Date), clearedAt: new Date(LAST_CLEARED), settledAt: null });
    expect(await runFlappingSettle(LAST_CLEARED + FLAP_WINDOW_MS - 60_000)).toBe("0 flapping alerts settled");
    expect(await settledMails()).toEqual([]);
  });

  it("settles once the window has passed with no reading, and its summary goes out once, with two instances running", async () => {
    const later = LAST_CLEARED + FLAP_WINDOW_MS + 60_000;
    const holders = ["instance-a", "instance-b"];
    const runs = await Promise.all(holders.map((holder) => withLease("flapping-settle", 5 * 60_000, () => runFlappingSettle(later), holder)));
    // Whichever instance ran (one, or both one after the other), the alert settled once.
    const summaries = runs.filter((summary) => summary !== null);
    expect(summaries).toContain("1 flapping alerts settled");
    expect(summaries.filter((summary) => summary !== "0 flapping alerts settled")).toHaveLength(1);
    expect(await flappingAlert()).toMatchObject({ settledAt: new Date(later) });
    const mails = await settledMails();
    expect(mails.map((mail) => mail.toAddress).sort()).toEqual(["eng@flap.example", "own@flap.example"]);
    expect(mails[0]!.subject).toContain("3 openings, peak 150 µε");
    expect(await runFlappingSettle(later + HOUR)).toBe("0 flapping alerts settled");
    expect(await settledMails()).toHaveLength(2);
  });

  it("after settling, a new crossing is a new alert", async () => {
    const body = { readings: [{ gauge: "FQ", time: new Date(T0 + 20 * TEN_MINUTES).toISOString(), value: 160, temperature: 10 }] };
    const response = await readingsRoute.POST(apiRequest("/structures/FLAP/readings", { token: logger, body }), params({ code: "FLAP" }));
    expect((await response.json()).alerts.opened).toBe(1);
    const [gauge] = await getDb().select().from(gauges).where(eq(gauges.tag, "FQ"));
    expect(await getDb().select().from(alerts).where(eq(alerts.gaugeId, gauge!.id))).toHaveLength(2);
  });
});
