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
  /** For "no data": every silent gauge of the structure; the one alert names them all. */
  gauges?: string[];
};

const FAULT_NAMES: Record<string, string> = {
  stale: "no data arriving",
  "flat-line": "flat line (stuck reading)",
  jump: "implausible jump",
  "out-of-range": "reading outside the sensor's range",
};

/** What the fault means for the limits: said in every sensor-fault e-mail, since nobody else will say it. */
const NOT_CHECKED: Record<string, string> = {
  jump:
    "This is not a structural alert, but limits are NOT being checked on this gauge: its readings are set aside from the jump on, until an engineer on the alert accepts the step as real or records a new zero.",
  stale: "This is not a structural alert, but with no readings these gauges' limits are NOT being checked.",
  default: "This is not a structural alert, but limits are NOT being checked on this gauge while its readings are faulty.",
};

/** A jump is settled by a person (accepted as real, or a new zero), who says how; other faults end by themselves. */
function clearedOpening({ structure, gauge, code, message }: SensorAlertMailInput, fault: string): string {
  if (code === "jump") return `On ${structure.name}, gauge ${gauge.tag}: the ${fault} is resolved. ${message}`;
  return `On ${structure.name}, ${code === "stale" ? "readings are arriving again" : `gauge ${gauge.tag} is reporting normally again`} (${fault} resolved).`;
}

/** A sensor fault told as such: it says nothing about the structure, only that a gauge cannot be trusted now. */
export function buildSensorAlertMail(input: SensorAlertMailInput, appUrl: string): BuiltMail {
  const { structure, gauge } = input;
  const fault = FAULT_NAMES[input.code] ?? input.code;
  const silent = input.gauges && input.gauges.length > 0 ? input.gauges : null;
  const which = silent ? `${silent.length === 1 ? "gauge" : "gauges"} ${silent.join(", ")}` : `gauge ${gauge.tag}`;
  const subject = `${input.event === "cleared" ? "Resolved" : "Sensor fault"}: ${structure.code} ${silent ? which : gauge.tag} ${fault}`;
  const opening =
    input.event === "cleared"
      ? clearedOpening(input, fault)
      : `On ${structure.name}, ${which}: ${fault}. ${NOT_CHECKED[input.code] ?? NOT_CHECKED.default}`;
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
