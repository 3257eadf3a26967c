import { PDFParse } from "pdf-parse";
import { beforeAll, describe, expect, it } from "vitest";
import * as structureRoute from "@/app/api/v1/structures/[code]/route";
import * as readingsRoute from "@/app/api/v1/structures/[code]/readings/route";
import { and, eq } from "drizzle-orm";
import { getClient, getDb } from "@/db/client";
import { alerts } from "@/db/schema";
import type { UserActor } from "@/lib/auth/actor";
import { renderReportPdf } from "@/lib/report/pdf";
import { resolveSensorFault } from "@/lib/services/fault-resolution";
import { createGauge, resolveGauge } from "@/lib/services/gauges";
import { replaceLimits } from "@/lib/services/limits";
import { structureReport } from "@/lib/services/report";
import { gaugeStatuses, structureSummary } from "@/lib/services/status";
import { getVisibleStructure } from "@/lib/services/structures";
import { microstrainGauge } from "../fixtures/gauges";
import { storeReadings, type StoredReading } from "../fixtures/readings";
import { apiRequest, makeStructure, makeUser, params, userToken } from "./helpers";

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
const DAY = 24 * HOUR;
/** The UTC day (the test structures' zone) holding a moment, as the report asks for days. */
const utcDay = (ms: number) => new Date(ms).toISOString().slice(0, 10);
const now = Date.now();
const iso = (ms: number) => new Date(ms).toISOString();
/** Zeroed a day ago, so every reading below comes after the zero reading. */
const zero = { value: 0, temperature: 10, time: iso(now - DAY) };
const limit = { quantity: "strain" as const, level: "watch" as const, upper: 5_000, lower: -5_000, hysteresis: 0, persistence: 1 };

let engineer: UserActor;
let token: string;

/** Readings every 10 minutes ending 10 minutes ago, one value each. */
const recent = (tag: string, values: number[], endAgo = 10 * MINUTE) =>
  values.map((value, i) => ({ gauge: tag, time: iso(now - endAgo - (values.length - 1 - i) * 10 * MINUTE), value, temperature: 10 }));

async function ingest(code: string, readings: ReturnType<typeof recent>) {
  const response = await readingsRoute.POST(apiRequest(`/structures/${code}/readings`, { token, body: { readings } }), params({ code }));
  expect(response.status).toBe(200);
  return response.json();
}

beforeAll(async () => {
  engineer = await makeUser("engineer");
  token = await userToken(engineer.email);
  await makeStructure("CND", [engineer]);
  for (const tag of ["J1", "N1", "S1", "W1"]) await createGauge(engineer, "CND", microstrainGauge(tag, { zero }));
  for (const tag of ["J1", "S1", "W1"]) await replaceLimits(engineer, "CND", tag, [limit]);
  // J1 steps by 2 600 µε between two readings, more than the 1 500 µε a structure can plausibly
  // move in ten minutes (the jump detector's threshold), yet inside its ±5 000 µε watch limit.
  await ingest("CND", [
    ...recent("J1", [100, 102, 101, 2_700, 2_701]),
    ...recent("N1", [50, 51]),
    ...recent("W1", [60, 61]),
    // Three hours silent at a 10-minute interval: stale (three missed readings, common practice).
    ...recent("S1", [70, 71], 3 * HOUR),
  ]);
});

describe("a gauge's condition", () => {
  it("is in GET /structures/{code} for every gauge: a jump is a sensor fault, never within limits", async () => {
    const response = await structureRoute.GET(apiRequest("/structures/CND", { token }), params({ code: "CND" }));
    expect(response.status).toBe(200);
    const body = (await response.json()) as { gauges: { tag: string; condition: unknown }[] };
    const conditionOf = Object.fromEntries(body.gauges.map((gauge) => [gauge.tag, gauge.condition]));
    expect(conditionOf.J1).toEqual({ state: "sensor-fault", since: recent("J1", [0, 0])[0]!.time, faults: ["jump"], stale: false });
    expect(conditionOf.N1).toMatchObject({ state: "no-limits", faults: [], stale: false });
    expect(conditionOf.S1).toEqual({ state: "no-data", since: recent("S1", [0], 3 * HOUR)[0]!.time, faults: [], stale: true });
    expect(conditionOf.W1).toMatchObject({ state: "within-limits", faults: [], stale: false });
  });

  it("gives the overview the worst condition, the count in each, and a peak that leaves the faulty gauge out", async () => {
    const summary = await structureSummary(await getVisibleStructure(engineer, "CND"), now);
    expect(summary.state).toBe("sensor-fault");
    expect(summary.gaugesIn).toEqual({ "sensor-fault": 1, "no-limits": 1, "no-data": 1, "within-limits": 1 });
    expect(summary.peakLeavesOut).toBe(1);
    // Highest believed strain is S1's 71 µε (J1 left out): 71e-6 × 200 000 MPa = 14.2 MPa, / 355 MPa yield (Hooke's law, by hand).
    expect(summary.peakUtilisation24h).toBeCloseTo((71e-6 * 200_000) / 355, 6);
  });

  it("is gathered in the same few queries whatever the number of gauges", async () => {
    const structure = await getVisibleStructure(engineer, "CND");
    const client = getClient();
    const execute = client.execute.bind(client);
    let queries = 0;
    client.execute = ((statement: Parameters<typeof execute>[0]) => {
      queries += 1;
      return execute(statement);
    }) as typeof client.execute;
    try {
      await gaugeStatuses(structure, now);
    } finally {
      client.execute = execute;
    }
    const fourGauges = queries;
    expect(fourGauges).toBeGreaterThan(0);
    await createGauge(engineer, "CND", microstrainGauge("X1", { zero }));
    await createGauge(engineer, "CND", microstrainGauge("X2", { zero }));
    queries = 0;
    client.execute = ((statement: Parameters<typeof execute>[0]) => {
      queries += 1;
      return execute(statement);
    }) as typeof client.execute;
    try {
      const statuses = await gaugeStatuses(structure, now);
      expect(statuses.find((status) => status.tag === "X1")!.condition.state).toBe("no-data");
    } finally {
      client.execute = execute;
    }
    expect(queries).toBe(fourGauges);
  });

  it("is in the report, whose extremes leave out the readings taken under the sensor fault and say so", async () => {
    const today = Math.floor(now / DAY) * DAY;
    const report = await structureReport(engineer, "CND", { firstDay: utcDay(today - DAY), lastDay: utcDay(today) }, new Date(now));
    const j1 = report.gauges.find((gauge) => gauge.tag === "J1")!;
    expect(j1.condition).toMatchObject({ state: "sensor-fault", faults: ["jump"] });
    expect(j1.leftOut?.readings).toBe(2);
    // Without the two readings after the jump: 100 to 102 µε (thermal compensation none, zero 0).
    expect(j1.strain).toMatchObject({ min: 100, max: 102 });
    expect(report.gauges.find((gauge) => gauge.tag === "N1")!.condition.state).toBe("no-limits");
    expect(report.summary.current.state).toBe("sensor-fault");
    // Counted by hand from the setup: J1, S1 and W1 carry limits and sent readings; N1 sent
    // readings without limits; J1's jump is a sensor fault; X1 and X2 (added above) are silent.
    expect(report.summary.headline).toMatch(/^No limit was crossed on the 3 gauges with limits that sent readings \(.+\); 1 gauge has no limits and was not checked; 1 gauge had sensor faults, whose faulty readings were not checked; 2 gauges sent no readings\.$/);
    const parsed = await new PDFParse({ data: new Uint8Array(await renderReportPdf(report)) }).getText();
    const text = parsed.text.replace(/\s+/g, " ");
    expect(text).toContain("Condition now Sensor fault (jump) since");
    expect(text).toContain("2 readings left out: found faulty by the sensor checks");
    // N1's section (its chart's labels come first) says so before the next gauge's heading.
    expect(text).toMatch(/Gauge N1 (?:(?!Gauge ).)*Condition now No limits/);
  });
});

describe("the report after an engineer accepts a jump as a real step", () => {
  it("takes the readings after the jump back into its extremes, as their stored verdicts now say", async () => {
    await makeStructure("STP", [engineer]);
    await createGauge(engineer, "STP", microstrainGauge("J2", { zero }));
    await replaceLimits(engineer, "STP", "J2", [limit]);
    // The same 2 600 µε step as J1's: a jump, and the reading after it held with it.
    await ingest("STP", recent("J2", [100, 102, 101, 2_700, 2_701]));
    const [jump] = await getDb()
      .select({ id: alerts.id })
      .from(alerts)
      .where(and(eq(alerts.gaugeId, (await resolveGauge(engineer, "STP", "J2", "structure:view")).gauge.id), eq(alerts.code, "jump")));
    const today = Math.floor(now / DAY) * DAY;
    const period = { firstDay: utcDay(today - DAY), lastDay: utcDay(today) };
    const held = (await structureReport(engineer, "STP", period, new Date(now))).gauges[0]!;
    expect(held.leftOut?.readings).toBe(2);

    await resolveSensorFault(engineer, jump!.id, "accept-step", "Bearing settled, confirmed on site");
    const accepted = (await structureReport(engineer, "STP", period, new Date(now))).gauges[0]!;
    expect(accepted.leftOut).toBeNull();
    // All five readings: 100 to 2 701 µε (thermal compensation none, zero 0).
    expect(accepted.strain).toMatchObject({ min: 100, max: 2_701 });
  });
});

describe("the report's completeness over a 12-day logger gap", () => {
  const OCTOBER_REQUEST = { month: { year: 2026, month: 10 } };
  const OCTOBER = { from: new Date(Date.UTC(2026, 9, 1)), to: new Date(Date.UTC(2026, 10, 1)) };
  const GAP = { start: Date.UTC(2026, 9, 10), end: Date.UTC(2026, 9, 22) };

  beforeAll(async () => {
    await makeStructure("GAP", [engineer]);
    // Registered (and zeroed) today, with October's history loaded afterwards: the gauge was on
    // the structure whenever it sent readings, whatever its registration date.
    await createGauge(engineer, "GAP", microstrainGauge("L1"));
    const rows: StoredReading[] = [];
    for (let time = OCTOBER.from.getTime(); time < OCTOBER.to.getTime(); time += 10 * MINUTE) {
      if (time >= GAP.start && time < GAP.end) continue;
      rows.push({ time, strain: 100, stress: 20, temperature: 12 });
    }
    await storeReadings(getClient(), (await resolveGauge(engineer, "GAP", "L1", "structure:view")).gauge.id, rows);
  });

  it("counts received over expected for the month, at most 100 %, and lists the gap with its start, end and length", async () => {
    const report = await structureReport(engineer, "GAP", OCTOBER_REQUEST, new Date(Date.UTC(2026, 10, 2, 9)));
    const l1 = report.gauges.find((gauge) => gauge.tag === "L1")!;
    // By hand: 31 days × 144 a day = 4 464 expected at 10 minutes; 12 days × 144 = 1 728 missing.
    expect(l1.readings).toEqual({ received: 4_464 - 1_728, expected: 4_464, completeness: (4_464 - 1_728) / 4_464, surplus: 0 });
    expect(l1.readings.completeness).toBeLessThanOrEqual(1);
    expect(l1.gaps).toEqual({ list: [{ start: "2026-10-10T00:00:00.000Z", end: "2026-10-22T00:00:00.000Z", hours: 288 }], more: 0, totalHours: 288 });
    expect(report.summary.readings.completeness).toBeCloseTo(2_736 / 4_464, 9);
  });

  it("never says more than 100 % when the logger sends more often than registered", async () => {
    await createGauge(engineer, "GAP", microstrainGauge("L2", { expectedInterval: 3_600 }));
    const rows: StoredReading[] = [];
    for (let time = OCTOBER.from.getTime(); time < OCTOBER.to.getTime(); time += 10 * MINUTE) rows.push({ time, strain: 100, stress: 20, temperature: 12 });
    await storeReadings(getClient(), (await resolveGauge(engineer, "GAP", "L2", "structure:view")).gauge.id, rows);
    const report = await structureReport(engineer, "GAP", OCTOBER_REQUEST, new Date(Date.UTC(2026, 10, 2, 9)));
    // By hand: 744 hours expect 744 readings at one an hour; 4 464 arrived, 3 720 of them extra.
    expect(report.gauges.find((gauge) => gauge.tag === "L2")!.readings).toEqual({ received: 4_464, expected: 744, completeness: 1, surplus: 3_720 });
  });
});
