import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { eq, like } from "drizzle-orm";
import { PDFParse } from "pdf-parse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as reportRoute from "@/app/api/v1/structures/[code]/report/route";
import { getClient, getDb } from "@/db/client";
import { alertEvents, alerts, mailOutbox } from "@/db/schema";
import { runMonthlyReport } from "@/jobs/monthly-report";
import type { UserActor } from "@/lib/auth/actor";
import { fatigueSummary, rainflow } from "@/lib/fatigue";
import type { GaugeInput } from "@/lib/gauges/schema";
import { renderReportPdf } from "@/lib/report/pdf";
import { monthPeriod } from "@/lib/report/period";
import { handleAlert } from "@/lib/services/alerts";
import { placeGauge, uploadDrawing } from "@/lib/services/files";
import { replaceLimits } from "@/lib/services/limits";
import { addMember } from "@/lib/services/memberships";
import { updateUser } from "@/lib/services/users";
import { createGauge, resolveGauge } from "@/lib/services/gauges";
import { createStructure } from "@/lib/services/structures";
import { structureReport, structureReportPdf } from "@/lib/services/report";
import { CHART_INK } from "@/lib/report/chart";
import { STATE_LOOK } from "@/lib/alerting/condition-display";
import { apiRequest, makeStructure, makeUser, params, userToken } from "./helpers";
import { microstrainGauge } from "../fixtures/gauges";
import { storeReadings, type StoredReading } from "../fixtures/readings";
import { pngImage } from "../fixtures/images";
import { countColour, hexRgb, pageWith, renderPdfPage, widestRow } from "../fixtures/pdf-pages";

const storage = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-report-files-"));
process.env.FILE_STORAGE_DIR = storage;
afterAll(() => fs.rmSync(storage, { recursive: true, force: true }));

const HOUR = 3_600_000;
const TEN_MINUTES = 600_000;
const OCTOBER_REQUEST = { month: { year: 2026, month: 10 } };
const OCTOBER = monthPeriod(OCTOBER_REQUEST.month, "UTC");
const START = OCTOBER.from.getTime();
/** Made on 2 November: October is over, so every hour of it was expected. */
const NOW = new Date(Date.UTC(2026, 10, 2, 9));
const E_STEEL = 210_000;
const DRAWING = { width: 400, height: 200 };

const GAP = { start: Date.UTC(2026, 9, 10, 6), end: Date.UTC(2026, 9, 10, 18) };
const PEAK = { at: Date.UTC(2026, 9, 20, 12), stress: 250 };
const TROUGH = { at: Date.UTC(2026, 9, 25, 0), stress: -40 };
// ASTM E1049 worked example, read as 10 MPa per unit about 40 MPa (as in the fatigue tests).
const ASTM_EXAMPLE = [-2, 1, -3, 5, -1, 3, -4, 4, -2];

let engineer: UserActor;
let owners: UserActor[];
let outsider: UserActor;
const tokens: Record<string, string> = {};

const gaugeInput = (tag: string, fields: Partial<GaugeInput> = {}): GaugeInput =>
  microstrainGauge(tag, {
    label: `Lower chord ${tag}`,
    material: { E: E_STEEL, nu: 0.3, alpha: 12, yield: 355 },
    zero: { value: 0, temperature: 10, time: "2026-09-01T00:00:00Z" },
    ...fields,
  });

const reading = (time: number, stress: number): StoredReading => ({ time, stress, strain: (stress / E_STEEL) * 1e6, temperature: 10 + (time % 7) });

/** Every 10 minutes of October, from `stressAt`, skipping `skip`; plus one reading either side of the month that must not count. */
function october(stressAt: (i: number, time: number) => number, skip?: { start: number; end: number }): StoredReading[] {
  const rows = [reading(START - TEN_MINUTES, 999), reading(OCTOBER.to.getTime(), -999)];
  for (let time = START, i = 0; time < OCTOBER.to.getTime(); time += TEN_MINUTES, i++) {
    if (skip && time >= skip.start && time < skip.end) continue;
    rows.push(reading(time, stressAt(i, time)));
  }
  return rows;
}

const g1Stress = (_: number, time: number) => (time === PEAK.at ? PEAK.stress : time === TROUGH.at ? TROUGH.stress : 50 + 20 * Math.sin(time / HOUR));
const g2History = (i: number) => 40 + 10 * ASTM_EXAMPLE[i % ASTM_EXAMPLE.length]!;

async function gaugeId(code: string, tag: string) {
  return (await resolveGauge(engineer, code, tag, "structure:view")).gauge.id;
}

async function pdfText(pdf: Buffer) {
  // pdf.js folds compatibility characters by default (the micro sign µ into Greek mu μ): read them as written.
  const parsed = await new PDFParse({ data: new Uint8Array(pdf) }).getText({ disableNormalization: true });
  // Lines wrap wherever the page ends them: compare words, not line breaks.
  return { text: parsed.text.replace(/\s+/g, " "), pages: parsed.total };
}

let limitAlertId: number;

beforeAll(async () => {
  engineer = await makeUser("engineer");
  owners = [await makeUser("owner"), await makeUser("owner", "second-owner@test.example")];
  outsider = await makeUser("owner", "outsider@test.example");
  await makeStructure("RPT", [engineer, ...owners]);
  await makeStructure("OTHER", [outsider]);
  for (const user of [engineer, owners[0]!, outsider]) tokens[user.email] = await userToken(user.email);

  await createGauge(engineer, "RPT", gaugeInput("G1"));
  await replaceLimits(engineer, "RPT", "G1", [{ quantity: "stress", level: "warning", upper: 200 }]);
  await createGauge(engineer, "RPT", gaugeInput("G2", { detailCategory: 71 }));
  // Installed half-way through the month and silent since.
  await createGauge(engineer, "RPT", gaugeInput("G3", { zero: { value: 0, temperature: 10, time: "2026-10-16T00:00:00Z" } }));
  await storeReadings(getClient(), await gaugeId("RPT", "G1"), october(g1Stress, GAP));
  // An elevation, pale grey like a scanned sheet, with G1 and G2 placed on it.
  const drawing = await uploadDrawing(engineer, "RPT", { bytes: pngImage(DRAWING.width, DRAWING.height, () => [236, 238, 240]), fields: { title: "South elevation" } });
  await placeGauge(engineer, "RPT", "G1", { drawingId: drawing.id, x: 0.25, y: 0.5 });
  await placeGauge(engineer, "RPT", "G2", { drawingId: drawing.id, x: 0.75, y: 0.5 });
  await storeReadings(getClient(), await gaugeId("RPT", "G2"), october(g2History));

  const g1 = await gaugeId("RPT", "G1");
  const [alert] = await getDb()
    .insert(alerts)
    .values({
      structureId: (await resolveGauge(engineer, "RPT", "G1", "structure:view")).structure.id,
      gaugeId: g1,
      kind: "limit",
      level: "warning",
      quantity: "stress",
      openedAt: new Date(PEAK.at),
      bound: 200,
      peak: PEAK.stress,
      clearedAt: new Date(PEAK.at + HOUR),
    })
    .returning();
  limitAlertId = alert!.id;
  await getDb()
    .insert(alertEvents)
    .values([
      { alertId: alert!.id, type: "opened", at: new Date(PEAK.at), level: "warning", value: PEAK.stress },
      { alertId: alert!.id, type: "cleared", at: new Date(PEAK.at + HOUR), level: "warning", value: 60 },
    ]);
  await handleAlert(engineer, alert!.id, "acknowledged", "Crane lift on the deck, planned and supervised");
  await handleAlert(owners[0]!, alert!.id, "note", "Seen, thank you");
  // A sensor alert opened in September and still open: part of October's record. It is on the
  // silent G3, so no reading of G1 is doubted (the report leaves out readings taken under a fault).
  const g3 = await gaugeId("RPT", "G3");
  await getDb().insert(alerts).values({ structureId: alert!.structureId, gaugeId: g3, kind: "sensor", level: "watch", code: "flat-line", openedAt: new Date(Date.UTC(2026, 8, 28)) });
  // A limit alert over before October began: not part of it.
  await getDb()
    .insert(alerts)
    .values({ structureId: alert!.structureId, gaugeId: g1, kind: "limit", level: "critical", quantity: "stress", openedAt: new Date(Date.UTC(2026, 8, 5)), clearedAt: new Date(Date.UTC(2026, 8, 6)) });
});

describe("the structure report", () => {
  it("gives each gauge's extremes from the daily roll-ups, the readings either side of the month left out", async () => {
    const report = await structureReport(owners[0]!, "RPT", OCTOBER_REQUEST, NOW);
    expect(report.period).toMatchObject({ name: "October 2026", key: "2026-10", lastDay: "2026-10-31", from: "2026-10-01T00:00:00.000Z" });
    const g1 = report.gauges.find((gauge) => gauge.tag === "G1")!;
    expect(g1.stress).toEqual({ min: TROUGH.stress, max: PEAK.stress, unit: "MPa" });
    // 250 MPa / 210 000 MPa = 1190.48 µε (Hooke's law), 250 / 355 = 0.704 of yield (by hand).
    expect(g1.strain!.max).toBeCloseTo(1190.476, 2);
    expect(g1.utilisationPeak!.ratio).toBeCloseTo(250 / 355, 6);
    expect(g1.temperature).toEqual({ min: 10, max: 16, unit: "°C" });
  });

  it("measures completeness and finds the planted gap (by hand: 31 × 144 = 4464 expected, 72 missing)", async () => {
    const report = await structureReport(owners[0]!, "RPT", OCTOBER_REQUEST, NOW);
    const [g1, g2, g3] = report.gauges;
    expect(g1!.readings).toEqual({ received: 4392, expected: 4464, completeness: 4392 / 4464, surplus: 0 });
    expect(g1!.gaps).toEqual({ list: [{ start: "2026-10-10T06:00:00.000Z", end: "2026-10-10T18:00:00.000Z", hours: 12 }], more: 0, totalHours: 12 });
    expect(g2!.readings.completeness).toBe(1);
    expect(g2!.gaps.totalHours).toBe(0);
    // Installed on the 16th: 16 days × 144 expected, none received, one gap of 16 × 24 = 384 hours.
    expect(g3!.readings).toEqual({ received: 0, expected: 2304, completeness: 0, surplus: 0 });
    expect(g3!.gaps.list).toEqual([{ start: "2026-10-16T00:00:00.000Z", end: "2026-11-01T00:00:00.000Z", hours: 384 }]);
    expect(g3!.stress).toBeNull();
    expect(report.summary.readings).toEqual({ received: 4392 + 4464, expected: 4464 * 2 + 2304, completeness: (4392 + 4464) / (4464 * 2 + 2304), surplus: 0 });
  });

  it("takes fatigue damage from the fatigue service where a category is set, and says 'not assessed' elsewhere", async () => {
    const report = await structureReport(owners[0]!, "RPT", OCTOBER_REQUEST, NOW);
    const history = october(g2History).slice(2).map((row) => row.stress);
    expect(report.gauges[0]!.fatigue).toEqual({ status: "not-assessed" });
    const g2 = report.gauges[1]!.fatigue;
    expect(g2.status).toBe("assessed");
    if (g2.status !== "assessed") return;
    expect(g2.category).toBe(71);
    expect(g2.readingsUsed).toBe(4464);
    expect(g2.damage).toBeGreaterThan(0);
    expect(g2.damage).toBeCloseTo(fatigueSummary(rainflow(history), 71).damage, 12);
  });

  it("lists the alerts open in the period with how they were handled, and takes the worst level", async () => {
    const report = await structureReport(owners[0]!, "RPT", OCTOBER_REQUEST, NOW);
    expect(report.summary.level).toBe("warning");
    expect(report.summary.alerts).toEqual({ watch: 0, warning: 1, critical: 0, sensor: 1 });
    expect(report.alerts.map((alert) => [alert.kind, alert.openedBeforePeriod])).toEqual([
      ["limit", false],
      ["sensor", true],
    ]);
    const limit = report.alerts[0]!;
    expect(limit).toMatchObject({ id: limitAlertId, gauge: "G1", unit: "MPa", peak: 250, bound: 200, clearedAt: "2026-10-20T13:00:00.000Z" });
    expect(limit.acknowledged).toMatchObject({ by: "Test engineer", comment: "Crane lift on the deck, planned and supervised" });
    expect(limit.events.map((event) => event.type)).toEqual(["opened", "cleared", "acknowledged", "note"]);
    expect(limit.events[3]).toMatchObject({ by: owners[0]!.email, text: "Seen, thank you" });
  });

  it("calls a period without readings 'no data', never all clear", async () => {
    const report = await structureReport(owners[0]!, "RPT", { month: { year: 2026, month: 9 } }, NOW);
    expect(report.summary.level).toBe("critical");
    const august = await structureReport(owners[0]!, "RPT", { month: { year: 2026, month: 8 } }, NOW);
    // No gauge was installed yet: none in the report, and nothing to call all clear.
    expect(august.gauges).toEqual([]);
    expect(august.summary.level).toBe("no-data");
    // 3 November: the gauges are installed and nothing came in.
    const silentDay = await structureReport(owners[0]!, "RPT", { firstDay: "2026-11-03", lastDay: "2026-11-03" }, new Date(Date.UTC(2026, 10, 5)));
    expect(silentDay.gauges.map((gauge) => gauge.readings)).toEqual(Array(3).fill({ received: 0, expected: 144, completeness: 0, surplus: 0 }));
    expect(silentDay.summary.level).toBe("no-data");
  });
});

describe("GET /structures/{code}/report", () => {
  const get = (query: string, token = tokens[owners[0]!.email]!, headers: Record<string, string> = {}) =>
    reportRoute.GET(apiRequest(`/structures/RPT/report${query}`, { token, headers }), params({ code: "RPT" }));

  it("answers the report of a month as JSON", async () => {
    const response = await get("?month=2026-10");
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body.period.name).toBe("October 2026");
    expect(body.gauges.map((gauge: { tag: string }) => gauge.tag)).toEqual(["G1", "G2", "G3"]);
    expect(body.cautions.join(" ")).toMatch(/never replaces it/);
  });

  it("takes a first and a last day, both included", async () => {
    const body = await (await get("?from=2026-10-10&to=2026-10-10")).json();
    expect(body.period).toMatchObject({ from: "2026-10-10T00:00:00.000Z", to: "2026-10-11T00:00:00.000Z", name: "10 October 2026", key: "2026-10-10_2026-10-10" });
    expect(body.gauges[0].gaps.list).toEqual([{ start: "2026-10-10T06:00:00.000Z", end: "2026-10-10T18:00:00.000Z", hours: 12 }]);
  });

  it("says what to fix in a bad query", async () => {
    const cases: [string, RegExp][] = [
      ["?month=2026-13", /month is YYYY-MM/],
      ["?from=2026-10-01", /Give both from and to/],
      ["?from=2026-10-05&to=2026-10-01", /from must not be after to/],
      ["?from=2026-02-30&to=2026-03-01", /not a calendar day/],
      ["?month=2026-10&from=2026-10-01&to=2026-10-02", /either month or from and to/],
      ["?from=2024-01-01&to=2026-01-01", /at most 366 days/],
      ["?month=2026-10&format=docx", /format is "json" or "pdf"/],
    ];
    for (const [query, message] of cases) {
      const response = await get(query);
      expect(response.status, query).toBe(400);
      expect((await response.json()).error.message, query).toMatch(message);
    }
  });

  it("answers 404 to someone who may not see the structure", async () => {
    expect((await get("?month=2026-10", tokens[outsider.email]!)).status).toBe(404);
  });

  it("sends the PDF as an attachment with format=pdf or Accept: application/pdf", async () => {
    for (const response of [await get("?month=2026-10&format=pdf"), await get("?month=2026-10", undefined, { accept: "application/pdf" })]) {
      expect(response.status).toBe(200);
      expect(response.headers.get("content-type")).toBe("application/pdf");
      expect(response.headers.get("content-disposition")).toBe('attachment; filename="RPT-report-2026-10.pdf"');
      const bytes = Buffer.from(await response.arrayBuffer());
      expect(bytes.subarray(0, 4).toString("latin1")).toBe("%PDF");
    }
  });
});

describe("the report PDF", () => {
  it("carries the structure, the gauges, the alert handling and the cautions in SI units", async () => {
    const { text, pages } = await pdfText(await renderReportPdf(await structureReport(owners[0]!, "RPT", OCTOBER_REQUEST, NOW)));
    expect(pages).toBeGreaterThanOrEqual(1);
    expect(text).toContain("Structure RPT (RPT)");
    expect(text).toContain("October 2026");
    expect(text).toContain("Gauge G1");
    expect(text).toContain("-40.0 MPa to 250.0 MPa");
    expect(text).toContain("-190 µε to 1,190 µε");
    expect(text).toContain("10.0 °C to 16.0 °C");
    expect(text).toContain("4,392 readings received, 4,464 expected (98.4 % complete)");
    expect(text).toContain("2026-10-10 06:00 UTC to 2026-10-10 18:00 UTC, 12 h without readings");
    expect(text).toContain("acknowledged by Test engineer");
    expect(text).toContain("not assessed");
    expect(text).toContain("Monitoring supplements inspection and never replaces it.");
    expect(text).toContain("Fatigue damage is an estimate that depends on the detail category chosen by the engineer");
    expect(text).toContain(`page 1 of ${pages}`);
    // Levels and codes in words: no internal code reaches the owner.
    expect(text).toContain("Status over the period Warning");
    expect(text).toContain("G3: Watch, sensor alert (flat line)");
    expect(text).not.toMatch(/all-clear|within-limits|flat-line|no-data/);
  });

  it("sets its text in the embedded IBM Plex Sans, so µε, σ, ≥, °C and ü read back as written", async () => {
    const report = await structureReport(owners[0]!, "RPT", OCTOBER_REQUEST, NOW);
    const location = "Mühlgraben crossing; design σ ≥ 180 MPa, 850 µε at 20 °C";
    const pdf = await renderReportPdf({ ...report, structure: { ...report.structure, location } });
    expect((await pdfText(pdf)).text).toContain(`Location: ${location}`);
    // The font is in the file, not a standard font a viewer must supply.
    expect(pdf.toString("latin1")).toMatch(/\/FontFile2/);
    expect(pdf.toString("latin1")).not.toMatch(/\/BaseFont \/Helvetica/);
  });

  it("draws each gauge's stress chart with its limit and alert, and the drawing with the gauges' markers (checked on the rendered pages)", async () => {
    const report = await structureReport(owners[0]!, "RPT", OCTOBER_REQUEST, NOW);
    const pdf = await structureReportPdf(owners[0]!, report);
    const scale = 2;

    // The drawing: embedded once, at its own size, and painted over the area its aspect ratio gives
    // across the content width (A4 is 595.28 pt wide, margins 50 pt: 495.28 pt × 247.64 pt).
    const drawingPage = await pageWith(pdf, "South elevation");
    const images = await new PDFParse({ data: new Uint8Array(pdf) }).getImage({ partial: [drawingPage], imageBuffer: false, imageDataUrl: false });
    expect(images.pages[0]!.images.map((image) => [image.width, image.height])).toEqual([[DRAWING.width, DRAWING.height]]);
    const drawn = await renderPdfPage(pdf, drawingPage, scale);
    const area = 495.28 * 247.64 * scale ** 2;
    const grey = countColour(drawn, [236, 238, 240], 3);
    console.log(`drawing page ${drawingPage}: ${grey} px of the drawing's grey, ${Math.round(area)} px expected less the markers`);
    expect(grey).toBeGreaterThan(area * 0.95);
    expect(grey).toBeLessThan(area * 1.02);
    // Markers in the condition code's ink of each gauge's state, at 25 % and 75 % across.
    const ink = hexRgb(STATE_LOOK[report.gauges[0]!.condition.state].ink);
    const leftHalf = countColour(drawn, ink, 30, { left: 0, top: 0, right: drawn.width / 2, bottom: drawn.height });
    const rightHalf = countColour(drawn, ink, 30, { left: drawn.width / 2, top: 0, right: drawn.width, bottom: drawn.height });
    console.log(`markers: ${leftHalf} px left, ${rightHalf} px right in ${STATE_LOOK[report.gauges[0]!.condition.state].ink}`);
    expect(leftHalf).toBeGreaterThan(20);
    expect(rightHalf).toBeGreaterThan(20);

    // G1's chart: the mean line and the envelope band in the chart's colours, the warning limit
    // at 200 MPa and the alert's shading in the warning ink.
    const chartPage = await renderPdfPage(pdf, await pageWith(pdf, "Gauge G1"), scale);
    const mean = countColour(chartPage, hexRgb(CHART_INK.mean), 40);
    const limitRow = widestRow(chartPage, hexRgb(STATE_LOOK.warning.ink), 40);
    console.log(`G1 chart: ${mean} px of the mean line; the widest row of warning ink covers ${(limitRow * 100).toFixed(1)} % of the page width`);
    // The mean wanders over the whole 427 pt plot: it covers more than its length at 2 px per point.
    expect(mean).toBeGreaterThan(427 * scale);
    // The dashed limit line across the plot, 4 on 3 off: 427/595.28 × 4/7 = 41 % of a row of the page.
    expect(limitRow).toBeGreaterThan(0.3);
    // G3 stored nothing: the sentence saying so stands where its chart would.
    expect((await pdfText(pdf)).text).toContain("No stress chart: the gauge stored no reading in this period.");
  });

  it("grows by pages with the number of gauges", async () => {
    await makeStructure("MANY", [engineer]);
    for (let i = 1; i <= 14; i++) await createGauge(engineer, "MANY", gaugeInput(`M${String(i).padStart(2, "0")}`));
    const none = await pdfText(await renderReportPdf(await structureReport(engineer, "RPT", { month: { year: 2026, month: 8 } }, NOW)));
    const many = await pdfText(await renderReportPdf(await structureReport(engineer, "MANY", OCTOBER_REQUEST, NOW)));
    expect(many.pages).toBeGreaterThan(1);
    expect(many.pages).toBeGreaterThan(none.pages);
    expect(many.text).toContain("Gauge M14");
    expect(many.text).toContain(`page ${many.pages} of ${many.pages}`);
  });
});

describe("a report on a site's own clock", () => {
  it("covers October in Berlin from local midnight to local midnight, 745 hours with the autumn change (EU rule: last Sunday of October, CEST to CET; from memory)", async () => {
    await createStructure(null, { code: "BER", name: "Structure BER", timezone: "Europe/Berlin" });
    await addMember(null, engineer.email, "BER");
    await createGauge(engineer, "BER", gaugeInput("B1"));
    // 1 October 00:00 CEST is 30 September 22:00 UTC; 1 November 00:00 CET is 31 October 23:00 UTC.
    const from = Date.UTC(2026, 8, 30, 22);
    const to = Date.UTC(2026, 9, 31, 23);
    const rows: StoredReading[] = [reading(from - TEN_MINUTES, 999), reading(to, -999)];
    for (let time = from; time < to; time += TEN_MINUTES) rows.push(reading(time, 50));
    await storeReadings(getClient(), await gaugeId("BER", "B1"), rows);
    const report = await structureReport(engineer, "BER", { month: { year: 2026, month: 10 } }, NOW);
    expect(report.period).toMatchObject({ from: "2026-09-30T22:00:00.000Z", to: "2026-10-31T23:00:00.000Z", firstDay: "2026-10-01", lastDay: "2026-10-31", key: "2026-10" });
    const b1 = report.gauges.find((gauge) => gauge.tag === "B1")!;
    // By hand: 745 hours × 6 readings an hour; the readings just outside the local month stay out of the extremes.
    expect(b1.readings).toMatchObject({ received: 745 * 6, expected: 745 * 6, completeness: 1 });
    expect(b1.stress).toMatchObject({ min: expect.closeTo(50, 9), max: expect.closeTo(50, 9) });
  });
});

describe("the monthly report job", () => {
  const rptMail = () => getDb().select().from(mailOutbox).where(like(mailOutbox.dedupeKey, "report:RPT:%"));

  it("queues one e-mail with the PDF per owner, and nothing more when run again", async () => {
    const firstOfNovember = Date.UTC(2026, 10, 1, 7);
    await runMonthlyReport(firstOfNovember);
    const queued = await rptMail();
    expect(queued.map((mail) => mail.toAddress).sort()).toEqual(owners.map((owner) => owner.email).sort());
    expect(queued.map((mail) => mail.dedupeKey).sort()).toEqual(owners.map((owner) => `report:RPT:2026-10:${owner.id}`).sort());
    for (const mail of queued) {
      expect(mail.kind).toBe("report");
      expect(mail.subject).toBe("Hookeline report October 2026: Structure RPT (RPT), warning");
      expect(mail.text).toContain("/structures/RPT/report?month=2026-10");
      expect(mail.text).toContain("never replaces it");
      expect(mail.attachments).toHaveLength(1);
      const [attachment] = mail.attachments!;
      expect(attachment).toMatchObject({ filename: "RPT-report-2026-10.pdf", contentType: "application/pdf" });
      const pdf = Buffer.from(attachment!.contentBase64, "base64");
      expect(pdf.subarray(0, 4).toString("latin1")).toBe("%PDF");
      expect((await pdfText(pdf)).text).toContain("Structure RPT (RPT)");
    }
    const total = (await getDb().select({ id: mailOutbox.id }).from(mailOutbox)).length;

    expect(await runMonthlyReport(firstOfNovember)).toBe("0 reports built, 0 e-mails queued");
    expect((await getDb().select({ id: mailOutbox.id }).from(mailOutbox)).length).toBe(total);
  });

  it("mails owners only: not engineers, nor owners whose account is switched off", async () => {
    const admin = await makeUser("admin");
    const former = await makeUser("owner", "former-owner@test.example");
    await addMember(null, former.email, "RPT");
    await updateUser(admin, former.id, { active: false });
    await runMonthlyReport(Date.UTC(2026, 11, 1, 7));
    const november = await getDb().select().from(mailOutbox).where(like(mailOutbox.dedupeKey, "report:RPT:2026-11:%"));
    expect(november.map((mail) => mail.toAddress).sort()).toEqual(owners.map((owner) => owner.email).sort());
    expect(await getDb().select().from(mailOutbox).where(eq(mailOutbox.toAddress, engineer.email))).toEqual([]);
  });
});
