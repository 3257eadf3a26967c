import type { ReportAlert, ReportGauge, StructureReport } from "@/lib/api/report-schema";
import { formatScientific } from "@/lib/fatigue";
import { formatInTimeZone } from "@/lib/time-format";
import { formatForDisplay, formatMicrostrain, formatShareOfYield, formatStressRating, type UnitSystem } from "@/lib/units";
import { STATE_LOOK, conditionText, faultWord } from "@/lib/alerting/condition-display";
import { formatHours } from "./gaps";
import { formatPercent } from "./status";

/**
 * The report's wording, shared by the page (in the reader's units) and the PDF (SI): every number
 * leaves here with its unit.
 */

const count = (value: number) => value.toLocaleString("en-US", { maximumFractionDigits: 1 });

/** "-40.0 MPa to 250.0 MPa", or "no readings" when the gauge sent nothing. */
function formatExtremes(extremes: { min: number; max: number } | null, format: (value: number) => string): string {
  return extremes ? `${format(extremes.min)} to ${format(extremes.max)}` : "no readings";
}

export function formatUtilisation(gauge: Pick<ReportGauge, "utilisationPeak" | "stress">, units: UnitSystem): string {
  const peak = gauge.utilisationPeak;
  if (peak?.basis === "yield") return `${formatShareOfYield(peak.ratio)} (${formatForDisplay(units, "stress", peak.yield)})`;
  if (peak) {
    const rating = formatStressRating({ basis: peak.basis, ratio: peak.ratio, strength: peak.compressiveStrength });
    return `${rating} (f_ck ${formatForDisplay(units, "stress", peak.compressiveStrength)})`;
  }
  return gauge.stress ? "no yield or compressive strength set for the material" : "no readings";
}

function formatReadings(readings: ReportGauge["readings"], intervalS?: number): string {
  const share = readings.completeness === null ? "none expected" : formatPercent(readings.completeness);
  const every = intervalS === undefined ? "" : `, one expected every ${count(intervalS)} s`;
  const surplus = readings.surplus > 0 ? `; ${count(readings.surplus)} more than expected: check the registered interval` : "";
  return `${count(readings.received)} readings received, ${count(readings.expected)} expected (${share} complete)${every}${surplus}`;
}

function formatGapTotal(gaps: ReportGauge["gaps"]): string {
  const runs = gaps.list.length + gaps.more;
  if (runs === 0) return "none";
  return `${runs === 1 ? "1 run" : `${runs} runs`} without readings, ${formatHours(gaps.totalHours)} in all`;
}

export function formatGap(gap: ReportGauge["gaps"]["list"][number], timeZone: string): string {
  return `${formatInTimeZone(new Date(gap.start), timeZone)} to ${formatInTimeZone(new Date(gap.end), timeZone)}, ${formatHours(gap.hours)} without readings`;
}

/** "Sensor fault (jump) since 2026-11-03 14:10 CET": the gauge's condition when the report was made. */
export function formatCondition(condition: ReportGauge["condition"], status: ReportGauge["status"], timeZone: string): string {
  const since = condition.since && status !== "retired" ? ` since ${formatInTimeZone(new Date(condition.since), timeZone)}` : "";
  return `${conditionText(condition, status === "retired")}${since}`;
}

function withLeftOut(text: string, gauge: ReportGauge): string {
  return gauge.leftOut ? `${text} (${count(gauge.leftOut.readings)} readings left out: ${gauge.leftOut.reason})` : text;
}

function formatFatigue(fatigue: ReportGauge["fatigue"]): string {
  if (fatigue.status === "not-assessed") return "not assessed (no detail category set)";
  if (fatigue.readingsUsed === 0) return `no readings to count (category ${fatigue.category} MPa)`;
  return `D = ${formatScientific(fatigue.damage)} (Miner sum, category ${fatigue.category} MPa, ${count(fatigue.cyclesCounted)} cycles)`;
}

/** What the report says about one gauge, label and value, in the order the page's columns and the PDF's rows show it. */
export function gaugeFacts(gauge: ReportGauge, units: UnitSystem, timeZone: string): { key: string; label: string; value: string }[] {
  return [
    { key: "condition", label: "Condition now", value: formatCondition(gauge.condition, gauge.status, timeZone) },
    { key: "stress", label: "Stress, min to max", value: withLeftOut(formatExtremes(gauge.stress, (v) => formatForDisplay(units, "stress", v)), gauge) },
    { key: "strain", label: "Strain, min to max", value: formatExtremes(gauge.strain, (v) => formatMicrostrain(v)) },
    { key: "temperature", label: "Temperature, min to max", value: formatExtremes(gauge.temperature, (v) => formatForDisplay(units, "temperature", v)) },
    { key: "utilisation", label: "Utilisation peak", value: formatUtilisation(gauge, units) },
    { key: "completeness", label: "Data completeness", value: formatReadings(gauge.readings, gauge.expectedIntervalS) },
    { key: "gaps", label: "Gaps", value: formatGapTotal(gauge.gaps) },
    { key: "fatigue", label: "Fatigue damage of the period", value: formatFatigue(gauge.fatigue) },
  ];
}

/** The summary's counts, shared by the page, the PDF and the e-mail. */
export function summaryFacts(summary: StructureReport["summary"]): [label: string, value: string][] {
  const { alerts } = summary;
  return [
    ["Limit alerts in the period", `${alerts.critical} critical, ${alerts.warning} warning, ${alerts.watch} watch`],
    ["Sensor alerts in the period", String(alerts.sensor)],
    ["Data received", formatReadings(summary.readings)],
  ];
}

/** A bound or peak in its unit: stress in the reader's units, strain in µε, utilisation in % of yield. */
export function formatAlertValue(alert: Pick<ReportAlert, "unit">, value: number | null, units: UnitSystem): string {
  if (value === null) return "—";
  if (alert.unit === "MPa") return formatForDisplay(units, "stress", value);
  if (alert.unit === "µε") return formatMicrostrain(value);
  if (alert.unit === "ratio") return formatShareOfYield(value);
  return String(value);
}

/** "G1: Warning, stress limit, peak 250.0 MPa against 200.0 MPa" or "G2: Watch, sensor alert (no data arriving)", levels and codes in the condition code's words. */
export function alertTitle(alert: ReportAlert, units: UnitSystem): string {
  const level = STATE_LOOK[alert.level].word;
  if (alert.kind === "sensor") return `${alert.gauge}: ${level}, sensor alert (${faultWord(alert.code ?? "sensor")})`;
  return `${alert.gauge}: ${level}, ${alert.quantity} limit, peak ${formatAlertValue(alert, alert.peak, units)} against ${formatAlertValue(alert, alert.bound, units)}`;
}

/** How the alert was dealt with, in one line a reader can file. */
export function alertHandling(alert: ReportAlert, timeZone: string): string {
  const parts: string[] = [];
  if (alert.acknowledged) {
    const comment = alert.acknowledged.comment ? `: “${alert.acknowledged.comment}”` : "";
    parts.push(`acknowledged by ${alert.acknowledged.by ?? "a former user"} at ${formatInTimeZone(new Date(alert.acknowledged.at), timeZone)}${comment}`);
  } else {
    parts.push("not acknowledged");
  }
  parts.push(alert.clearedAt ? `cleared at ${formatInTimeZone(new Date(alert.clearedAt), timeZone)}` : "still open");
  return parts.join("; ");
}

/** One line of an alert's history. */
export function alertEventLine(event: ReportAlert["events"][number], timeZone: string): string {
  const who = event.by ? ` by ${event.by}` : "";
  const level = event.level && (event.type === "opened" || event.type === "escalated") ? ` (${event.level})` : "";
  const text = event.text ? `: ${event.text}` : "";
  return `${formatInTimeZone(new Date(event.at), timeZone)} ${event.type}${level}${who}${text}`;
}
