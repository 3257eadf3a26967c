import { ALERT_CAUTION, gaugeChartLink, type AlertStructure } from "./alert";
import { formatInTimeZone } from "@/lib/time-format";
import { htmlButton, htmlFrame, htmlParagraph, type BuiltMail } from "./message";

export type SensorAlertMailInput = {
  structure: AlertStructure;
  gauge: { tag: string; label?: string | null; location?: string | null };
  event: "opened" | "cleared";
  /** stale, flat-line, jump or out-of-range */
  code: string;
  message: string;
  at: Date;
};

const FAULT_NAMES: Record<string, string> = {
  stale: "no data arriving",
  "flat-line": "flat line (stuck reading)",
  jump: "implausible jump",
  "out-of-range": "reading outside the sensor's range",
};

/** A sensor fault told as such: it says nothing about the structure, only that a gauge cannot be trusted now. */
export function buildSensorAlertMail(input: SensorAlertMailInput, appUrl: string): BuiltMail {
  const { structure, gauge } = input;
  const fault = FAULT_NAMES[input.code] ?? input.code;
  const subject = `${input.event === "cleared" ? "Resolved" : "Sensor fault"}: ${structure.code} ${gauge.tag} ${fault}`;
  const opening =
    input.event === "cleared"
      ? `On ${structure.name}, gauge ${gauge.tag} is reporting normally again (${fault} resolved).`
      : `On ${structure.name}, gauge ${gauge.tag} shows a sensor fault: ${fault}. This is not a structural alert; until it is fixed, this gauge's limits cannot warn anyone.`;
  const link = gaugeChartLink(appUrl, structure.code, gauge.tag);
  const facts = [
    `Gauge: ${gauge.label ? `${gauge.tag}, ${gauge.label}` : gauge.tag}`,
    `Location: ${gauge.location || "not recorded"}`,
    `Finding: ${input.message}`,
    `Time: ${formatInTimeZone(input.at, structure.timezone)} (${structure.timezone})`,
  ];
  const text = [opening, facts.join("\n"), `Chart: ${link}`, ALERT_CAUTION].join("\n\n");
  const html = htmlFrame(subject, [htmlParagraph(opening), ...facts.map(htmlParagraph), htmlButton(link, "Open the gauge")].join("\n"), ALERT_CAUTION);
  return { subject, text, html };
}
