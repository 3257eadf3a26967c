import PDFDocument from "pdfkit";
import type { StructureReport } from "@/lib/api/report-schema";
import { formatInTimeZone } from "@/lib/time-format";
import { alertEventLine, alertHandling, alertTitle, formatGap, gaugeFacts, summaryFacts } from "./format";
import { pdfText } from "./pdf-text";
import { conditionText } from "@/lib/alerting/condition-display";
import { loadTestReportLines } from "@/lib/load-tests/results";

/**
 * The report as an A4 PDF, in SI units. Built with pdfkit and its standard Helvetica, so no font
 * files ship with the app; every string goes through pdfText because that font's encoding has
 * no Greek letters. Server only: pdfkit reads its font metrics from disk.
 */

const MARGIN = 50;
const FOOTER_SPACE = 30;
const LABEL_WIDTH = 150;
/** Heading and eight table rows of one gauge, in points. */
const GAUGE_BLOCK_HEIGHT = 200;
const INK = "#0f172a";
const MUTED = "#475569";
const RULE = "#cbd5e1";

type Doc = PDFKit.PDFDocument;

/** Room left on the page above the footer. */
const roomLeft = (doc: Doc) => doc.page.height - MARGIN - FOOTER_SPACE - doc.y;
const contentWidth = (doc: Doc) => doc.page.width - 2 * MARGIN;

/** A new page unless `height` points still fit, so a row or a heading never splits across pages. */
function keepTogether(doc: Doc, height: number) {
  if (roomLeft(doc) < height) doc.addPage();
}

function heading(doc: Doc, text: string, size = 14) {
  keepTogether(doc, size * 4);
  doc.moveDown(0.8).font("Helvetica-Bold").fontSize(size).fillColor(INK).text(pdfText(text), MARGIN, doc.y, { width: contentWidth(doc) });
  doc.moveDown(0.3);
}

function paragraph(doc: Doc, text: string, options: { color?: string; size?: number; indent?: number } = {}) {
  const width = contentWidth(doc) - (options.indent ?? 0);
  doc.font("Helvetica").fontSize(options.size ?? 10);
  keepTogether(doc, doc.heightOfString(pdfText(text), { width }) + 2);
  doc.fillColor(options.color ?? INK).text(pdfText(text), MARGIN + (options.indent ?? 0), doc.y, { width });
}

/** One row of a two-column table: label on the left, value on the right, a hairline under both. */
function tableRow(doc: Doc, label: string, value: string) {
  const valueWidth = contentWidth(doc) - LABEL_WIDTH - 8;
  doc.font("Helvetica").fontSize(10);
  const height = Math.max(doc.heightOfString(pdfText(label), { width: LABEL_WIDTH }), doc.heightOfString(pdfText(value), { width: valueWidth })) + 6;
  keepTogether(doc, height);
  const top = doc.y + 3;
  doc.fillColor(MUTED).text(pdfText(label), MARGIN, top, { width: LABEL_WIDTH });
  doc.fillColor(INK).text(pdfText(value), MARGIN + LABEL_WIDTH + 8, top, { width: valueWidth });
  const bottom = top + height - 3;
  doc.moveTo(MARGIN, bottom).lineTo(MARGIN + contentWidth(doc), bottom).lineWidth(0.5).strokeColor(RULE).stroke();
  doc.y = bottom;
}

function titleBlock(doc: Doc, report: StructureReport) {
  const { structure, period } = report;
  doc.font("Helvetica-Bold").fontSize(10).fillColor("#1d4ed8").text("Hookeline · structure report", MARGIN, MARGIN);
  doc.moveDown(0.4).font("Helvetica-Bold").fontSize(20).fillColor(INK).text(pdfText(`${structure.name} (${structure.code})`));
  doc.font("Helvetica").fontSize(13).text(pdfText(period.name));
  doc.moveDown(0.3);
  const zone = structure.timezone;
  paragraph(doc, `Period: ${formatInTimeZone(new Date(period.from), zone)} to ${formatInTimeZone(new Date(period.to), zone)}. Days and times below are in ${zone}.`, { color: MUTED });
  if (structure.location) paragraph(doc, `Location: ${structure.location}`, { color: MUTED });
  paragraph(doc, `Generated at ${formatInTimeZone(new Date(report.generatedAt), zone)} by Hookeline.`, { color: MUTED });
}

function summary(doc: Doc, report: StructureReport) {
  const { summary: s, structure } = report;
  heading(doc, "Summary");
  paragraph(doc, s.headline);
  doc.moveDown(0.3);
  tableRow(doc, "Status over the period", s.level);
  for (const [label, value] of summaryFacts(s)) tableRow(doc, label, value);
  const last = s.current.lastReadingAt ? formatInTimeZone(new Date(s.current.lastReadingAt), structure.timezone) : "none yet";
  tableRow(doc, "Condition now", `${conditionText({ state: s.current.state, faults: [], stale: s.current.stale })}; last reading ${last}`);
  tableRow(doc, "Gauges in the report", String(report.gauges.length));
}

function gaugeTables(doc: Doc, report: StructureReport) {
  heading(doc, "Gauges");
  if (report.gauges.length === 0) {
    paragraph(doc, "No gauge was installed on the structure during this period.");
    return;
  }
  const zone = report.structure.timezone;
  for (const gauge of report.gauges) {
    // A gauge's table reads as one: start it on a new page unless it fits (a long gap list may still split).
    const gapLines = gauge.gaps.list.length + (gauge.gaps.more > 0 ? 1 : 0);
    keepTogether(doc, Math.min(GAUGE_BLOCK_HEIGHT + 12 * gapLines, doc.page.height - 2 * MARGIN - FOOTER_SPACE));
    const where = [gauge.label, gauge.member].filter(Boolean).join(", ");
    heading(doc, `Gauge ${gauge.tag}${where ? ` - ${where}` : ""}${gauge.status === "retired" ? " (retired)" : ""}`, 11);
    for (const fact of gaugeFacts(gauge, "si", zone)) {
      tableRow(doc, fact.label, fact.value);
      if (fact.key !== "gaps") continue;
      for (const gap of gauge.gaps.list) paragraph(doc, `- ${formatGap(gap, zone)}`, { indent: LABEL_WIDTH + 8, size: 9 });
      if (gauge.gaps.more > 0) paragraph(doc, `and ${gauge.gaps.more} more`, { indent: LABEL_WIDTH + 8, size: 9, color: MUTED });
      if (gapLines > 0) doc.y += 3;
    }
  }
}

function alertSection(doc: Doc, report: StructureReport) {
  heading(doc, "Alerts and how they were handled");
  if (report.alerts.length === 0) {
    paragraph(doc, "No alert was open during this period.");
    return;
  }
  const zone = report.structure.timezone;
  for (const alert of report.alerts) {
    doc.moveDown(0.4);
    keepTogether(doc, 40);
    doc.font("Helvetica-Bold").fontSize(10).fillColor(INK).text(pdfText(alertTitle(alert, "si")), MARGIN, doc.y, { width: contentWidth(doc) });
    const opened = `Opened ${formatInTimeZone(new Date(alert.openedAt), zone)}${alert.openedBeforePeriod ? " (before the period)" : ""}`;
    paragraph(doc, `${opened}; ${alertHandling(alert, zone)}.`);
    for (const event of alert.events) paragraph(doc, `- ${alertEventLine(event, zone)}`, { indent: 12, size: 9, color: MUTED });
  }
}

function loadTestSection(doc: Doc, report: StructureReport) {
  if (report.loadTests.length === 0) return;
  heading(doc, "Load tests");
  for (const test of report.loadTests) {
    const { title, lines } = loadTestReportLines(test, report.structure.timezone);
    heading(doc, title, 11);
    for (const line of lines) paragraph(doc, line, { size: 9 });
    paragraph(doc, test.caution, { size: 9, color: MUTED });
  }
}

function cautions(doc: Doc, report: StructureReport) {
  heading(doc, "Read with care");
  for (const caution of report.cautions) paragraph(doc, `- ${caution}`);
}

/** "Hookeline · MILL-FB · November 2026 · page 2 of 5" on every page, once the page count is known. */
function footers(doc: Doc, report: StructureReport) {
  const { start, count } = doc.bufferedPageRange();
  for (let i = start; i < start + count; i++) {
    doc.switchToPage(i);
    // Writing below the bottom margin would make pdfkit start a new page: lift the margin for the footer.
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    const text = `Hookeline · ${report.structure.code} · ${report.period.name} · page ${i - start + 1} of ${count}`;
    doc.font("Helvetica").fontSize(8).fillColor(MUTED).text(pdfText(text), MARGIN, doc.page.height - MARGIN, { width: contentWidth(doc), align: "center" });
    doc.page.margins.bottom = bottom;
  }
}

export function renderReportPdf(report: StructureReport): Promise<Buffer> {
  const doc = new PDFDocument({
    size: "A4",
    margin: MARGIN,
    bufferPages: true,
    info: {
      Title: pdfText(`${report.structure.name} (${report.structure.code}): report ${report.period.name}`),
      Author: "Hookeline",
      CreationDate: new Date(report.generatedAt),
    },
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("data", (chunk: Buffer) => chunks.push(chunk));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });
  titleBlock(doc, report);
  summary(doc, report);
  gaugeTables(doc, report);
  alertSection(doc, report);
  loadTestSection(doc, report);
  cautions(doc, report);
  footers(doc, report);
  doc.end();
  return done;
}
