import type { ReportCertificate, ReportShuntCheck, ReportThermalModel, StructureReport } from "@/lib/api/report-schema";
import { formatInTimeZone } from "@/lib/time-format";
import { formatMicrostrain } from "@/lib/units";

/**
 * The report's field-record sections (shunt checks, certificates, thermal models) as a title and
 * lines of text, shared by the page and the PDF so both say the same thing; every number leaves
 * here with its unit.
 */
export type FieldRecordSection = { id: string; title: string; empty: string; lines: string[] };

const signed = (value: number, digits: number) => `${value > 0 ? "+" : ""}${value.toFixed(digits)}`;

export function shuntCheckLine(check: ReportShuntCheck, timeZone: string): string {
  const verdict = check.passed ? "Passed" : "Failed";
  return (
    `${check.gauge}, ${formatInTimeZone(new Date(check.time), timeZone)}: expected ${check.expectedOutput.toPrecision(4)} ${check.unit}, ` +
    `measured ${check.measuredOutput.toPrecision(4)} ${check.unit}, difference ${signed(check.differencePercent, 2)} % (tolerance ±${check.tolerancePercent} %): ${verdict}`
  );
}

export function certificateLine(certificate: ReportCertificate): string {
  const instrument = certificate.gauge !== null ? `gauge ${certificate.gauge}` : `logger ${certificate.logger}`;
  return `${instrument}, certificate ${certificate.number}: ${certificate.expiredInPeriod ? "expired on" : "expires on"} ${certificate.expiresOn}`;
}

export function thermalModelLine(model: ReportThermalModel): string {
  const residual = model.residual ? `residual ${formatMicrostrain(model.residual.min)} to ${formatMicrostrain(model.residual.max)} over the period` : "no residual in the period";
  return `${model.gauge}: slope ${signed(model.slope, 2)} µε/°C, lag ${model.lagMinutes} min, R² ${model.r2.toFixed(3)}, σ ${model.residualStd.toFixed(1)} µε; ${residual}`;
}

export function fieldRecordSections(report: StructureReport): FieldRecordSection[] {
  const zone = report.structure.timezone;
  return [
    {
      id: "shunt-checks-heading",
      title: "Shunt-calibration checks",
      empty: "No shunt check was recorded in this period.",
      lines: (report.shuntChecks ?? []).map((check) => shuntCheckLine(check, zone)),
    },
    {
      id: "certificates-heading",
      title: "Calibration certificates expired or expiring",
      empty: "No calibration certificate expired in this period or expires within the reminder window after it.",
      lines: (report.certificates ?? []).map(certificateLine),
    },
    {
      id: "thermal-models-heading",
      title: "Thermal models",
      empty: "No gauge in this report has a thermal model.",
      lines: (report.thermalModels ?? []).map(thermalModelLine),
    },
  ];
}
