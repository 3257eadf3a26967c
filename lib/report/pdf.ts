import { readFileSync } from "node:fs";
import path from "node:path";
import PDFDocument from "pdfkit";
import type { ReportDrawing, ReportGauge, StructureReport } from "@/lib/api/report-schema";
import { formatInTimeZone } from "@/lib/time-format";
import { alertEventLine, alertHandling, alertTitle, formatGap, gaugeFacts, summaryFacts } from "./format";
import { STATE_LOOK, conditionText, shownState } from "@/lib/alerting/condition-display";
import { loadTestReportLines } from "@/lib/load-tests/results";
import { labelSlots } from "@/lib/drawings/label-slots";
import { reportStressChart } from "./chart";
import { fieldRecordSections } from "./field-records";
import { drawChart } from "./pdf-chart";
import { periodLevelText } from "./status";

/**
 * The report as an A4 PDF, in SI units, set in IBM Plex Sans from fonts/ (embedded, so µε, σ,
 * ≥ and °C print and copy as themselves). Server only: the fonts are read from disk.
 */

/** The image formats a PDF holds as they are (pdfkit embeds PNG and JPEG). */
export const PDF_IMAGE_TYPES: readonly string[] = ["image/png", "image/jpeg"];

const FONT_FILES = { body: "ibm-plex-sans-400-normal.ttf", bold: "ibm-plex-sans-600-normal.ttf" } as const;
type FontName = keyof typeof FONT_FILES;
let fontBytes: Record<FontName, Buffer> | undefined;

function fonts(): Record<FontName, Buffer> {
  fontBytes ??= {
    body: readFileSync(path.join(/*turbopackIgnore: true*/ process.cwd(), "fonts", FONT_FILES.body)),
    bold: readFileSync(path.join(/*turbopackIgnore: true*/ process.cwd(), "fonts", FONT_FILES.bold)),
  };
  return fontBytes;
}

/**
 * IBM Plex Sans has superscript digits but no superscript minus (its character map): a negative
 * power of ten, as in 1.2×10⁻⁵, is written 1.2×10^−5 so that it never prints as a missing glyph.
 */
const inFont = (text: string) => text.replace(/⁻([⁰¹²³⁴⁵⁶⁷⁸⁹]+)/g, (_, digits: string) => `^−${digits.normalize("NFKD")}`);

const MARGIN = 50;
const FOOTER_SPACE = 30;
const LABEL_WIDTH = 150;
/** Heading and eight table rows of one gauge, in points. */
const GAUGE_BLOCK_HEIGHT = 200;
const CHART_HEIGHT = 170;
/** A drawing is scaled to the content width, and no taller than this. */
const DRAWING_MAX_HEIGHT = 420;
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
  doc.moveDown(0.8).font("bold").fontSize(size).fillColor(INK).text(inFont(text), MARGIN, doc.y, { width: contentWidth(doc) });
  doc.moveDown(0.3);
}

function paragraph(doc: Doc, text: string, options: { color?: string; size?: number; indent?: number } = {}) {
  const width = contentWidth(doc) - (options.indent ?? 0);
  doc.font("body").fontSize(options.size ?? 10);
  keepTogether(doc, doc.heightOfString(inFont(text), { width }) + 2);
  doc.fillColor(options.color ?? INK).text(inFont(text), MARGIN + (options.indent ?? 0), doc.y, { width });
}

/** One row of a two-column table: label on the left, value on the right, a hairline under both. */
function tableRow(doc: Doc, label: string, value: string) {
  const valueWidth = contentWidth(doc) - LABEL_WIDTH - 8;
  doc.font("body").fontSize(10);
  const height = Math.max(doc.heightOfString(inFont(label), { width: LABEL_WIDTH }), doc.heightOfString(inFont(value), { width: valueWidth })) + 6;
  keepTogether(doc, height);
  const top = doc.y + 3;
  doc.fillColor(MUTED).text(inFont(label), MARGIN, top, { width: LABEL_WIDTH });
  doc.fillColor(INK).text(inFont(value), MARGIN + LABEL_WIDTH + 8, top, { width: valueWidth });
  const bottom = top + height - 3;
  doc.moveTo(MARGIN, bottom).lineTo(MARGIN + contentWidth(doc), bottom).lineWidth(0.5).strokeColor(RULE).stroke();
  doc.y = bottom;
}

function titleBlock(doc: Doc, report: StructureReport) {
  const { structure, period } = report;
  doc.font("bold").fontSize(10).fillColor("#1d4ed8").text("Hookeline · structure report", MARGIN, MARGIN);
  doc.moveDown(0.4).font("bold").fontSize(20).fillColor(INK).text(inFont(`${structure.name} (${structure.code})`));
  doc.font("body").fontSize(13).text(inFont(period.name));
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
  tableRow(doc, "Status over the period", periodLevelText(s.level));
  for (const [label, value] of summaryFacts(s)) tableRow(doc, label, value);
  const last = s.current.lastReadingAt ? formatInTimeZone(new Date(s.current.lastReadingAt), structure.timezone) : "none yet";
  tableRow(doc, "Condition now", `${conditionText({ state: s.current.state, faults: [], stale: s.current.stale })}; last reading ${last}`);
  tableRow(doc, "Gauges in the report", String(report.gauges.length));
}

/** The gauge's stress over the period with its limits and numbered alerts, or why there is none. */
function gaugeChart(doc: Doc, report: StructureReport, gauge: ReportGauge) {
  const chart = reportStressChart(report, gauge, "si", { width: contentWidth(doc), height: CHART_HEIGHT });
  if (!chart) {
    paragraph(doc, "No stress chart: the gauge stored no reading in this period.", { color: MUTED, size: 9 });
    return;
  }
  keepTogether(doc, CHART_HEIGHT + 24 + 11 * chart.legend.length);
  drawChart(doc, chart.geometry, MARGIN, doc.y + 4, "body");
  doc.y += CHART_HEIGHT + 6;
  paragraph(doc, `Stress, MPa: band from min to max of each interval, line the mean; breaks where no readings arrived; dashed lines the limits; shaded and numbered the alerts. Times in ${report.structure.timezone}.`, { color: MUTED, size: 8 });
  for (const line of chart.legend) paragraph(doc, line, { size: 8, indent: 8 });
  doc.moveDown(0.4);
}

function gaugeTables(doc: Doc, report: StructureReport) {
  // The heading goes with the first gauge's chart, never alone at the foot of a page.
  if (report.gauges[0]?.stressSeries) keepTogether(doc, 60 + CHART_HEIGHT);
  heading(doc, "Gauges");
  if (report.gauges.length === 0) {
    paragraph(doc, "No gauge was installed on the structure during this period.");
    return;
  }
  const zone = report.structure.timezone;
  for (const gauge of report.gauges) {
    // A gauge's chart and table read as one: start them on a new page unless they fit (a long gap list may still split).
    const gapLines = gauge.gaps.list.length + (gauge.gaps.more > 0 ? 1 : 0);
    keepTogether(doc, Math.min(CHART_HEIGHT + GAUGE_BLOCK_HEIGHT + 12 * gapLines, doc.page.height - 2 * MARGIN - FOOTER_SPACE));
    const where = [gauge.label, gauge.member].filter(Boolean).join(", ");
    heading(doc, `Gauge ${gauge.tag}${where ? ` - ${where}` : ""}${gauge.status === "retired" ? " (retired)" : ""}`, 11);
    gaugeChart(doc, report, gauge);
    for (const fact of gaugeFacts(gauge, "si", zone)) {
      tableRow(doc, fact.label, fact.value);
      if (fact.key !== "gaps") continue;
      for (const gap of gauge.gaps.list) paragraph(doc, `- ${formatGap(gap, zone)}`, { indent: LABEL_WIDTH + 8, size: 9 });
      if (gauge.gaps.more > 0) paragraph(doc, `and ${gauge.gaps.more} more`, { indent: LABEL_WIDTH + 8, size: 9, color: MUTED });
      if (gapLines > 0) doc.y += 3;
    }
  }
}

/** A gauge's marker: its condition's shape (the page's 16-unit box, drawn 10 pt wide) centred on its point, its tag beside it. */
function marker(doc: Doc, x: number, y: number, tag: string, state: ReturnType<typeof shownState>, slot: number) {
  const look = STATE_LOOK[state];
  const size = 10;
  doc.save();
  doc.translate(x - size / 2, y - size / 2).scale(size / 16);
  doc.circle(8, 8, 9).fillOpacity(0.85).fill("#ffffff").fillOpacity(1);
  for (const mark of look.marks) {
    doc.path(mark.d);
    if (mark.kind === "fill") doc.fill(look.ink);
    else {
      if (mark.dashed) doc.dash(3, { space: 2 });
      doc.lineWidth(mark.kind === "stroke" ? 2.2 : 2).lineCap("round").stroke(mark.kind === "knockout" ? "#ffffff" : look.ink);
      doc.undash();
    }
  }
  doc.restore();
  doc.font("bold").fontSize(7);
  const width = doc.widthOfString(tag) + 4;
  const top = y - 4.5 + slot * 10;
  doc.rect(x + size / 2 + 1, top, width, 9).fillOpacity(0.9).fill("#ffffff").fillOpacity(1);
  doc.fillColor(INK).text(tag, x + size / 2 + 3, top + 1, { lineBreak: false });
}

/** One drawing with the markers of the report's gauges placed on it. */
function drawingFigure(doc: Doc, report: StructureReport, drawing: ReportDrawing, image: Uint8Array | undefined) {
  const placed = report.gauges.filter((gauge) => gauge.placement?.drawing === drawing.id);
  if (!image || !drawing.width || !drawing.height) {
    paragraph(doc, `${drawing.title}: this image is not in the PDF (${drawing.contentType === "image/webp" ? "a WebP image, which a PDF cannot hold" : "its file is missing"}); the report page shows it.`, { color: MUTED });
    return;
  }
  const scale = Math.min(contentWidth(doc) / drawing.width, DRAWING_MAX_HEIGHT / drawing.height);
  const width = drawing.width * scale;
  const height = drawing.height * scale;
  keepTogether(doc, height + 40);
  paragraph(doc, drawing.title, { size: 10 });
  const top = doc.y + 4;
  doc.image(Buffer.from(image), MARGIN, top, { width, height });
  doc.rect(MARGIN, top, width, height).lineWidth(0.5).strokeColor(RULE).stroke();
  const slots = labelSlots(placed.map((gauge) => ({ tag: gauge.tag, x: gauge.placement!.x, y: gauge.placement!.y })));
  for (const gauge of placed) {
    marker(doc, MARGIN + gauge.placement!.x * width, top + gauge.placement!.y * height, gauge.tag, shownState(gauge.condition, gauge.status === "retired"), slots.get(gauge.tag) ?? 0);
  }
  doc.y = top + height + 6;
  doc.x = MARGIN;
  const count = placed.length === 1 ? "1 gauge" : `${placed.length} gauges`;
  paragraph(doc, `${count} on this drawing; each marker's shape and colour give the gauge's condition when the report was made.`, { color: MUTED, size: 8 });
}

/** The marker shapes and their words, as the page's legend lists them. */
function markerLegend(doc: Doc, report: StructureReport) {
  const states = [...new Set(report.gauges.filter((gauge) => gauge.placement).map((gauge) => shownState(gauge.condition, gauge.status === "retired")))];
  if (states.length === 0) return;
  keepTogether(doc, 16);
  let x = MARGIN;
  const y = doc.y + 4;
  for (const state of states) {
    doc.save().translate(x, y).scale(8 / 16);
    for (const mark of STATE_LOOK[state].marks) {
      doc.path(mark.d);
      if (mark.kind === "fill") doc.fill(STATE_LOOK[state].ink);
      else doc.lineWidth(2.2).stroke(mark.kind === "knockout" ? "#ffffff" : STATE_LOOK[state].ink);
    }
    doc.restore();
    doc.font("body").fontSize(8).fillColor(INK).text(STATE_LOOK[state].word, x + 11, y, { lineBreak: false });
    x += 11 + doc.widthOfString(STATE_LOOK[state].word) + 14;
  }
  doc.x = MARGIN;
  doc.y = y + 14;
}

function drawingSection(doc: Doc, report: StructureReport, images: ReadonlyMap<number, Uint8Array>) {
  heading(doc, "Where the gauges are");
  if (report.drawings.length === 0) {
    paragraph(doc, "No drawing of the structure is stored: an engineer can upload one on the structure's drawings page.", { color: MUTED });
    return;
  }
  for (const drawing of report.drawings) drawingFigure(doc, report, drawing, images.get(drawing.id));
  markerLegend(doc, report);
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
    doc.font("bold").fontSize(10).fillColor(INK).text(inFont(alertTitle(alert, "si")), MARGIN, doc.y, { width: contentWidth(doc) });
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

function fieldRecords(doc: Doc, report: StructureReport) {
  for (const section of fieldRecordSections(report)) {
    heading(doc, section.title);
    if (section.lines.length === 0) paragraph(doc, section.empty);
    for (const line of section.lines) paragraph(doc, `- ${line}`, { size: 9 });
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
    doc.font("body").fontSize(8).fillColor(MUTED).text(inFont(text), MARGIN, doc.page.height - MARGIN, { width: contentWidth(doc), align: "center" });
    doc.page.margins.bottom = bottom;
  }
}

/** `drawingImages`: the stored bytes of the report's drawings by id, PNG or JPEG. */
export function renderReportPdf(report: StructureReport, drawingImages: ReadonlyMap<number, Uint8Array> = new Map()): Promise<Buffer> {
  const doc = new PDFDocument({
    size: "A4",
    margin: MARGIN,
    bufferPages: true,
    info: {
      Title: inFont(`${report.structure.name} (${report.structure.code}): report ${report.period.name}`),
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
  for (const [name, bytes] of Object.entries(fonts())) doc.registerFont(name, bytes);
  titleBlock(doc, report);
  summary(doc, report);
  drawingSection(doc, report, drawingImages);
  gaugeTables(doc, report);
  alertSection(doc, report);
  loadTestSection(doc, report);
  fieldRecords(doc, report);
  cautions(doc, report);
  footers(doc, report);
  doc.end();
  return done;
}
