import { parse } from "csv-parse/sync";
import { count, eq } from "drizzle-orm";
import { PDFParse } from "pdf-parse";
import { beforeAll, describe, expect, it } from "vitest";
import * as listRoute from "@/app/api/v1/structures/[code]/load-tests/route";
import * as testRoute from "@/app/api/v1/structures/[code]/load-tests/[id]/route";
import * as csvRoute from "@/app/api/v1/structures/[code]/load-tests/[id]/results.csv/route";
import * as readingsRoute from "@/app/api/v1/structures/[code]/readings/route";
import * as burstsRoute from "@/app/api/v1/structures/[code]/bursts/route";
import { getDb } from "@/db/client";
import { auditLog, loadTestPredictions, loadTests } from "@/db/schema";
import type { LoadTestResults } from "@/lib/api/load-test-schemas";
import { renderReportPdf } from "@/lib/report/pdf";
import { structureReport } from "@/lib/services/report";
import { createGauge } from "@/lib/services/gauges";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, makeTeam, params } from "./helpers";

const MINUTE = 60_000;
const START = Date.UTC(2026, 5, 2, 9, 0);
const END = START + 30 * MINUTE;
const iso = (ms: number) => new Date(ms).toISOString();
const RATE = 100;

let team: Awaited<ReturnType<typeof makeTeam>>;

/**
 * The planted test, made here: each static gauge rests at its own offset, and during the window a
 * half sine of the gauge's amplitude rises and falls (the crest on the 15-minute reading), as a
 * truck parked at midspan and driven off again would strain a girder. Readings every minute
 * from an hour before to an hour after, every other one 0.3 µε up (a constant record would be a
 * flat-line fault); the ripple is 0 at 08:59 (the baseline) and at the crest, so the planted values are exact.
 */
const PLANTED = { S1: { offset: 40, amplitude: 120 }, S2: { offset: -15, amplitude: -60 } } as const;

function plantedReadings() {
  const rows: { gauge: string; time: string; value: number }[] = [];
  for (let time = START - 60 * MINUTE; time < END + 60 * MINUTE; time += MINUTE) {
    const inWindow = time >= START && time < END;
    for (const [gauge, { offset, amplitude }] of Object.entries(PLANTED)) {
      const load = inWindow ? amplitude * Math.sin((Math.PI * (time - START)) / (END - START)) : 0;
      const ripple = ((time - START) / MINUTE) % 2 === 0 ? 0.3 : 0;
      rows.push({ gauge, time: iso(time), value: offset + load + ripple });
    }
  }
  return rows;
}

/** A dynamic gauge's two bursts: at rest (10 µε) before the window, and a passage peaking at 100 µε inside it. Float32-exact values. */
function plantedBursts() {
  const rest = Array.from({ length: 60 * RATE }, () => 10);
  const passage = Array.from({ length: 60 * RATE }, (_, i) => Math.fround(10 + 90 * Math.sin((Math.PI * i) / (60 * RATE - 1))));
  return [
    { gauge: "D1", start: iso(START - 20 * MINUTE), rateHz: RATE, values: rest },
    { gauge: "D1", start: iso(START + 10 * MINUTE), rateHz: RATE, values: passage },
  ];
}

async function post(body: unknown, token = team.tokens.engineer) {
  const response = await listRoute.POST(apiRequest("/structures/LT/load-tests", { token, body }), params({ code: "LT" }));
  return { status: response.status, body: await response.json() };
}

const storedTests = async () => (await getDb().select({ n: count() }).from(loadTests))[0]!.n;
const storedPredictions = async () => (await getDb().select({ n: count() }).from(loadTestPredictions))[0]!.n;

const window = { start: iso(START), end: iso(END) };
/** The results' line of a gauge. */
const byGauge = (results: LoadTestResults) => (tag: string) => results.gauges.find((gauge) => gauge.gauge === tag)!;

beforeAll(async () => {
  team = await makeTeam("LT");
  for (const tag of ["S1", "S2", "S3"]) await createGauge(team.users.engineer, "LT", microstrainGauge(tag, { member: "Girder 2" }));
  // E = 200 000 MPa: the summaries hold 0.2 MPa per µε (Hooke's law), read back as µε.
  await createGauge(team.users.engineer, "LT", microstrainGauge("D1", { sampling: { mode: "dynamic", rateHz: RATE, summaryMinutes: 10, rangeBin: 1, trigger: null } }));
  const sent = await readingsRoute.POST(apiRequest("/structures/LT/readings", { token: team.tokens.technician, body: { readings: plantedReadings() } }), params({ code: "LT" }));
  expect(await sent.json()).toMatchObject({ rejected: [] });
  const bursts = await burstsRoute.POST(apiRequest("/structures/LT/bursts", { token: team.tokens.technician, body: { bursts: plantedBursts() } }), params({ code: "LT" }));
  expect(await bursts.json()).toMatchObject({ bursts: 2, rejected: [] });
});

describe("load tests through the API", () => {
  let id: number;

  it("measures the planted peaks from the baseline just before the window, and their ratios to the prediction", async () => {
    const { status, body } = await post({
      title: "Static test, truck at midspan",
      load: "One 32 t three-axle truck parked at midspan, lane 1",
      ...window,
      predicted: [
        { gauge: "S1", predicted: 100 },
        { gauge: "S2", predicted: -75 },
        { gauge: "S3", predicted: 50 },
        { gauge: "D1", predicted: 100 },
      ],
    });
    expect(status).toBe(201);
    id = body.id;
    const gauges = byGauge(body);
    // Planted: S1 rises 120 µε from 40 (ratio 120/100), S2 falls 60 µε from −15 (ratio −60/−75).
    expect(gauges("S1")).toMatchObject({ state: "measured", source: "readings", direction: "tension", baseline: { time: iso(START - MINUTE), strain: 40 }, against: 0 });
    expect(gauges("S1").measured).toBeCloseTo(120, 6);
    expect(gauges("S1").ratio).toBeCloseTo(1.2, 6);
    expect(gauges("S1").peakAt).toEqual({ start: iso(START + 15 * MINUTE), end: iso(START + 15 * MINUTE) });
    expect(gauges("S1").readings).toBe(30);
    expect(gauges("S2")).toMatchObject({ state: "measured", direction: "compression", baseline: { strain: -15 } });
    expect(gauges("S2").measured).toBeCloseTo(-60, 6);
    expect(gauges("S2").ratio).toBeCloseTo(0.8, 6);
    // D1 from its 10-minute summaries: rest at 10 µε, crest at 100 µε in the 09:10 interval.
    expect(gauges("D1")).toMatchObject({ state: "measured", source: "summaries", peakAt: { start: iso(START + 10 * MINUTE), end: iso(START + 20 * MINUTE) } });
    expect(gauges("D1").baseline?.strain).toBeCloseTo(10, 3);
    expect(gauges("D1").measured).toBeCloseTo(90, 2);
    expect(gauges("D1").ratio).toBeCloseTo(0.9, 4);
    expect(gauges("S3")).toMatchObject({ state: "no-data", measured: null, ratio: null, message: expect.stringMatching(/^No data in window/) });
    expect(body.dataState).toBe("partial");
    expect(body.caution).toMatch(/licensed engineer/);
  });

  it("lets members read it and audits who recorded it", async () => {
    const list = await listRoute.GET(apiRequest("/structures/LT/load-tests", { token: team.tokens.owner }), params({ code: "LT" }));
    expect((await list.json()).loadTests).toEqual([expect.objectContaining({ id, title: "Static test, truck at midspan", gauges: 4, createdBy: "Test engineer" })]);
    const one = await testRoute.GET(apiRequest(`/structures/LT/load-tests/${id}`, { token: team.tokens.technician }), params({ code: "LT", id: String(id) }));
    expect(byGauge(await one.json())("S1").ratio).toBeCloseTo(1.2, 6);
    const [audit] = await getDb().select().from(auditLog).where(eq(auditLog.action, "load-test.create"));
    expect(audit).toMatchObject({ entityKey: `LT/${id}`, actorLabel: team.users.engineer.email });
  });

  it("exports the table as CSV that csv-parse reads back, units in the header and values rounded", async () => {
    const response = await csvRoute.GET(apiRequest(`/structures/LT/load-tests/${id}/results.csv`, { token: team.tokens.owner }), params({ code: "LT", id: String(id) }));
    expect(response.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(response.headers.get("content-disposition")).toContain(`LT-load-test-${id}.csv`);
    const rows = parse(await response.text(), { columns: true }) as Record<string, string>[];
    const s1 = rows.find((row) => row.gauge === "S1")!;
    expect(s1).toMatchObject({ "predicted (µε)": "100.0", "baseline (µε)": "40.0", "measured peak (µε)": "120.0", "ratio (measured/predicted)": "1.20", member: "Girder 2" });
    expect(rows.find((row) => row.gauge === "D1")!["ratio (measured/predicted)"]).toBe("0.90");
    expect(rows.find((row) => row.gauge === "S3")!["measured peak (µε)"]).toBe("");
  });

  it("carries the test in the owner's report of the period", async () => {
    const period = { month: { year: 2026, month: 6 } };
    const report = await structureReport(team.users.owner, "LT", period, new Date(Date.UTC(2026, 6, 2)));
    expect(report.loadTests.map((test) => test.id)).toContain(id);
    // Read as printed: pdf.js would otherwise turn the micro sign µ into the Greek letter μ.
    const pdf = await new PDFParse({ data: new Uint8Array(await renderReportPdf(report)) }).getText({ disableNormalization: true });
    const text = pdf.text.replace(/\s+/g, " ");
    expect(text).toContain("Load test: Static test, truck at midspan");
    expect(text).toContain("S1: measured 120.0 µε from a baseline of 40.0 µε, predicted 100.0 µε, ratio 1.20.");
    expect(text).toContain("S3: predicted 50.0 µε. No data in window");
    const july = await structureReport(team.users.owner, "LT", { month: { year: 2026, month: 7 } }, new Date(Date.UTC(2026, 7, 2)));
    expect(july.loadTests).toEqual([]);
  });

  it("stores a window without data but says so for every gauge", async () => {
    const { status, body } = await post({ title: "Planned", load: "Crane lift", start: iso(END + 5 * 60 * MINUTE), end: iso(END + 6 * 60 * MINUTE), predictedCsv: "gauge,predicted (µε)\nS1,80\nD1,-20\n" });
    expect(status).toBe(201);
    expect(body.dataState).toBe("none");
    expect(body.gauges.map((gauge: { state: string }) => gauge.state)).toEqual(["no-data", "no-data"]);
  });

  it("refuses bad input with what to fix, storing nothing", async () => {
    const tests = await storedTests();
    const predictions = await storedPredictions();
    const cases: [unknown, RegExp][] = [
      [{ title: "T", load: "L", start: iso(END), end: iso(START), predicted: [{ gauge: "S1", predicted: 10 }] }, /end of the window must be after its start/],
      [{ title: "T", load: "L", ...window, predicted: [{ gauge: "S1", predicted: 10 }, { gauge: "G9", predicted: 5 }, { gauge: "X.2", predicted: 5 }] }, /no gauge tagged "G9", "X\.2"/],
      [{ title: "T", load: "L", ...window, predictedCsv: "gauge,predicted\nS1,1O0\n" }, /Line 2 \(S1\): "1O0" is not a number/],
      [{ title: "T", load: "L", ...window, predicted: [{ gauge: "S1", predicted: 0 }] }, /0 µε has no sign/],
      [{ title: "T", load: "L", ...window }, /either as `predicted` or as `predictedCsv`/],
    ];
    for (const [body, message] of cases) {
      const answer = await post(body);
      expect(answer.status, JSON.stringify(body)).toBe(400);
      expect(answer.body.error.message).toMatch(message);
    }
    const unknown = await post(cases[1]![0]);
    expect(unknown.body.error.details.unknownGauges).toEqual(["G9", "X.2"]);
    expect(await storedTests()).toBe(tests);
    expect(await storedPredictions()).toBe(predictions);
  });

  it("lets only engineers and admins record, and answers an unknown test with a 404", async () => {
    for (const role of ["technician", "owner"] as const) {
      expect((await post({ title: "T", load: "L", ...window, predicted: [{ gauge: "S1", predicted: 10 }] }, team.tokens[role])).status).toBe(403);
    }
    const missing = await testRoute.GET(apiRequest("/structures/LT/load-tests/9999", { token: team.tokens.owner }), params({ code: "LT", id: "9999" }));
    expect(missing.status).toBe(404);
    const malformed = await testRoute.GET(apiRequest("/structures/LT/load-tests/abc", { token: team.tokens.owner }), params({ code: "LT", id: "abc" }));
    expect(malformed.status).toBe(400);
  });
});
