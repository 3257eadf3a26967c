import { PDFParse } from "pdf-parse";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getClient } from "@/db/client";
import type { UserActor } from "@/lib/auth/actor";
import { gaugeInput, shuntCheckInput } from "@/lib/gauges/schema";
import { renderReportPdf } from "@/lib/report/pdf";
import { addCertificate } from "@/lib/services/certificates";
import { createGauge, resolveGauge } from "@/lib/services/gauges";
import { structureReport } from "@/lib/services/report";
import { recordShuntCheck } from "@/lib/services/shunt-checks";
import { saveThermalModel } from "@/lib/services/thermal";
import { thermalModelInput } from "@/lib/thermal/schema";
import { pdfDocument } from "../fixtures/documents";
import { microstrainGauge, shuntableFoilGauge } from "../fixtures/gauges";
import { storeReadings, type StoredReading } from "../fixtures/readings";
import { makeStructure, makeUser } from "./helpers";

const storage = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-report-records-"));
process.env.FILE_STORAGE_DIR = storage;
afterAll(() => fs.rmSync(storage, { recursive: true, force: true }));

const OCTOBER = { month: { year: 2026, month: 10 } };
const NOW = new Date(Date.UTC(2026, 10, 2, 9));
const TEN_MINUTES = 600_000;

const R_GAUGE = 350;
const R_SHUNT = 174_650;
/** The Wheatstone circuit Vout/Vex = R1/(R1+R2) − R4/(R3+R4) (Dally & Riley, Experimental Stress Analysis, bridge chapter), in mV/V. */
const circuit = ([r1, r2, r3, r4]: number[]) => 1000 * (r1! / (r1! + r2!) - r4! / (r3! + r4!));
const parallel = (a: number, b: number) => (a * b) / (a + b);
const QUARTER_SHUNTED = circuit([parallel(R_GAUGE, R_SHUNT), R_GAUGE, R_GAUGE, R_GAUGE]) - circuit([R_GAUGE, R_GAUGE, R_GAUGE, R_GAUGE]);

/** Strain of a free member, ε = ε₀ + k·T: a straight line, which least squares recovers exactly (any statistics text on ordinary least squares). */
const INTERCEPT = 5;
const SLOPE = 11;
/** Deviations from that line in October, µε: what the residual must read, measured − model. */
const DEVIATIONS = [-3, 0, 2, 8, 1];

let engineer: UserActor;
let owner: UserActor;

async function pdfText(pdf: Buffer) {
  // pdf.js folds compatibility characters by default (the micro sign µ into Greek mu μ): read them as written.
  const parsed = await new PDFParse({ data: new Uint8Array(pdf) }).getText({ disableNormalization: true });
  return parsed.text.replace(/\s+/g, " ");
}

/** Readings every 10 minutes from `from` to `to`, temperature cycling over 0…23 °C, strain on the line plus `deviation`. */
function readingsBetween(from: number, to: number, deviation: (i: number) => number): StoredReading[] {
  const rows: StoredReading[] = [];
  for (let time = from, i = 0; time < to; time += TEN_MINUTES, i++) {
    const temperature = i % 24;
    const strain = INTERCEPT + SLOPE * temperature + deviation(i);
    rows.push({ time, temperature, strain, stress: strain * 0.2 });
  }
  return rows;
}

beforeAll(async () => {
  engineer = await makeUser("engineer", "records-engineer@test.example");
  owner = await makeUser("owner", "records-owner@test.example");
  await makeStructure("REC", [engineer, owner]);
  await makeStructure("REC0", [engineer, owner]);
  await createGauge(
    engineer,
    "REC",
    gaugeInput.parse(shuntableFoilGauge("S1", R_GAUGE)),
  );
  await createGauge(engineer, "REC", microstrainGauge("T1"));
  const shunt = (measuredOutput: number, time: string) => recordShuntCheck(engineer, "REC", "S1", shuntCheckInput.parse({ shuntResistance: R_SHUNT, measuredOutput, time }), NOW.getTime());
  await shunt(QUARTER_SHUNTED * 1.005, "2026-10-12T08:30:00Z");
  await shunt(QUARTER_SHUNTED * 0.97, "2026-10-20T14:00:00Z");
  // Outside October: not in the report.
  await shunt(QUARTER_SHUNTED, "2026-09-30T23:50:00Z");

  const pdf = await pdfDocument("Calibration certificate");
  const certificate = (number: string, expiresOn: string, subject: Record<string, string>) =>
    addCertificate(engineer, "REC", { bytes: pdf, fields: { ...subject, number, issuedBy: "Test laboratory", issuedOn: "2025-06-01", expiresOn } }, NOW.getTime());
  await certificate("C-EXPIRED", "2026-10-05", { gauge: "S1" });
  await certificate("C-SOON", "2026-11-30", { logger: "Logger north" });
  // Before the period, and a day past the window (31 October + 30 days = 30 November, October having 31 days).
  await certificate("C-BEFORE", "2026-09-30", { gauge: "S1" });
  await certificate("C-LATER", "2026-12-01", { gauge: "S1" });

  const t1 = (await resolveGauge(engineer, "REC", "T1", "structure:view")).gauge.id;
  const september = readingsBetween(Date.UTC(2026, 8, 1), Date.UTC(2026, 9, 1), () => 0);
  const october = readingsBetween(Date.UTC(2026, 9, 1), Date.UTC(2026, 10, 1), (i) => DEVIATIONS[i % DEVIATIONS.length]!);
  await storeReadings(getClient(), t1, [...september, ...october]);
  // A reading sensor health found faulty: far off the line, and left out of the residual range.
  await getClient().execute({ sql: "UPDATE readings SET fault = 1, strain = strain + 500 WHERE gauge_id = ? AND t = ?", args: [t1, Date.UTC(2026, 9, 15, 12)] });
  await saveThermalModel(engineer, "REC", "T1", thermalModelInput.parse({ from: "2026-09-01T00:00:00Z", to: "2026-09-30T23:50:00Z", lagMinutes: 0 }));
}, 60_000);

describe("the report's field records", () => {
  it("lists the period's shunt checks with the difference from the circuit's output and the verdict", async () => {
    const report = await structureReport(owner, "REC", OCTOBER, NOW);
    expect(report.shuntChecks!.map((check) => [check.gauge, check.time, check.passed])).toEqual([
      ["S1", "2026-10-12T08:30:00.000Z", true],
      ["S1", "2026-10-20T14:00:00.000Z", false],
    ]);
    expect(report.shuntChecks![0]!.expectedOutput).toBeCloseTo(QUARTER_SHUNTED, 12);
    expect(report.shuntChecks![0]!.differencePercent).toBeCloseTo(0.5, 9);
    expect(report.shuntChecks![1]!.differencePercent).toBeCloseTo(-3, 9);
    console.info(`report shunt checks: expected ${QUARTER_SHUNTED.toFixed(6)} mV/V, differences ${report.shuntChecks!.map((c) => c.differencePercent.toFixed(2)).join(", ")} %`);
  });

  it("lists certificates that expired in the period or expire within 30 days of its end, soonest first", async () => {
    const report = await structureReport(owner, "REC", OCTOBER, NOW);
    expect(report.certificates).toEqual([
      { gauge: "S1", logger: null, number: "C-EXPIRED", expiresOn: "2026-10-05", expiredInPeriod: true },
      { gauge: null, logger: "Logger north", number: "C-SOON", expiresOn: "2026-11-30", expiredInPeriod: false },
    ]);
  });

  it("gives the thermal model's slope and the residual range of the period, without the faulty reading", async () => {
    const report = await structureReport(owner, "REC", OCTOBER, NOW);
    expect(report.thermalModels).toHaveLength(1);
    const model = report.thermalModels![0]!;
    console.info(`report thermal model T1: slope ${model.slope} µε/°C, R² ${model.r2}, residual ${model.residual?.min} to ${model.residual?.max} µε`);
    expect(model.gauge).toBe("T1");
    expect(model.slope).toBeCloseTo(SLOPE, 9);
    expect(model.r2).toBeCloseTo(1, 9);
    expect(model.residualStd).toBeCloseTo(0, 6);
    expect(model.residual!.min).toBeCloseTo(Math.min(...DEVIATIONS), 6);
    expect(model.residual!.max).toBeCloseTo(Math.max(...DEVIATIONS), 6);
  });

  it("prints the three sections in the PDF, with dates in the structure's zone", async () => {
    const text = await pdfText(await renderReportPdf(await structureReport(owner, "REC", OCTOBER, NOW)));
    expect(text).toContain("Shunt-calibration checks");
    expect(text).toContain("S1, 2026-10-12 08:30 UTC: expected");
    expect(text).toContain("difference +0.50 % (tolerance ±1 %): Passed");
    expect(text).toContain("difference -3.00 % (tolerance ±1 %): Failed");
    expect(text).toContain("gauge S1, certificate C-EXPIRED: expired on 2026-10-05");
    expect(text).toContain("logger Logger north, certificate C-SOON: expires on 2026-11-30");
    expect(text).not.toContain("C-LATER");
    expect(text).toContain("T1: slope +11.00 µε/°C, lag 0 min, R² 1.000");
    expect(text).toContain("residual -3 µε to 8 µε over the period");
  });

  it("says so when there is nothing to list", async () => {
    const report = await structureReport(owner, "REC0", OCTOBER, NOW);
    expect([report.shuntChecks, report.certificates, report.thermalModels]).toEqual([[], [], []]);
    const text = await pdfText(await renderReportPdf(report));
    expect(text).toContain("No shunt check was recorded in this period.");
    expect(text).toContain("No calibration certificate expired in this period or expires within the reminder window after it.");
    expect(text).toContain("No gauge in this report has a thermal model.");
  });
});
