import type { StructureReport } from "@/lib/api/report-schema";
import { summaryFacts } from "@/lib/report/format";
import { periodQuery } from "@/lib/report/period";
import { periodLevelText } from "@/lib/report/status";
import { ALERT_CAUTION } from "./alert";
import { escapeHtml, htmlButton, htmlFrame, htmlParagraph, type BuiltMail } from "./message";

const REPORT_MAIL_CAUTION = `${ALERT_CAUTION} Fatigue damage is an estimate that depends on the detail category chosen by the engineer.`;

/** The report page of the same period, so the link shows what the attachment shows. */
export function reportPageLink(appUrl: string, report: Pick<StructureReport, "structure" | "period">): string {
  return `${appUrl}/structures/${encodeURIComponent(report.structure.code)}/report?${periodQuery(report.period)}`;
}

/** The monthly report to an owner: the summary in a few lines, the PDF attached by the caller. */
export function buildReportMail(input: { recipientName: string; report: StructureReport }, appUrl: string): BuiltMail {
  const { report } = input;
  const { structure, period, summary } = report;
  const subject = `Hookeline report ${period.name}: ${structure.name} (${structure.code}), ${periodLevelText(summary.level).toLowerCase()}`;
  const opening = `Hello ${input.recipientName}, the report of ${structure.name} for ${period.name} is attached as a PDF.`;
  const lines = [summary.headline, ...summaryFacts(summary).map(([label, value]) => `${label}: ${value}.`), `Gauges in the report: ${report.gauges.length}.`];
  const link = reportPageLink(appUrl, report);
  const text = [opening, lines.map((line) => `- ${line}`).join("\n"), `Read it online: ${link}`, REPORT_MAIL_CAUTION].join("\n\n");
  const list = `<ul style="padding-left:20px;margin:0 0 12px">${lines.map((line) => `<li>${escapeHtml(line)}</li>`).join("\n")}</ul>`;
  const html = htmlFrame(subject, [htmlParagraph(opening), list, htmlButton(link, "Open the report")].join("\n"), REPORT_MAIL_CAUTION);
  return { subject, text, html };
}
