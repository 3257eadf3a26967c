import { ALERT_CAUTION, alertPlace, describeAlertEvent, type AlertEventFacts, type AlertStructure } from "./alert";
import { formatInTimeZone } from "@/lib/time-format";
import { htmlButton, htmlFrame, htmlParagraph, type BuiltMail } from "./message";

export type FlappingMailInput = Omit<AlertEventFacts, "event"> & {
  structure: AlertStructure;
  /** "started": the alert is now flapping; "settled": it stayed clear for the whole window. */
  phase: "started" | "settled";
  openings: number;
  since: Date;
};

/**
 * One e-mail when an alert starts flapping and one summary when it settles, instead of one per
 * crossing: the reader learns that the value hovers at the bound, and how far it went.
 */
export function buildFlappingMail(input: FlappingMailInput, appUrl: string): BuiltMail {
  const { structure } = input;
  const { headline, peak, bound } = describeAlertEvent({ ...input, event: "opened" });
  const place = alertPlace(input, appUrl, structure.code);
  const since = `${formatInTimeZone(input.since, structure.timezone)} (${structure.timezone})`;
  const subject =
    input.phase === "started"
      ? `${input.level.toUpperCase()} flapping: ${structure.code} ${place.name} ${headline} ${input.openings} times (peak ${peak})`
      : `Settled: ${structure.code} ${place.name} flapping at the ${input.level} limit is over (${input.openings} openings, peak ${peak})`;
  const opening =
    input.phase === "started"
      ? `On ${structure.name}, ${place.name}: ${headline} ${input.openings} times since ${since}. The value is hovering at the bound (${bound}); further crossings are not e-mailed one by one, a higher level is. A summary follows when it settles.`
      : `On ${structure.name}, ${place.name}: the flapping at the ${input.level} limit has settled; the value stayed back within for an hour. It opened ${input.openings} times since ${since}; the furthest value was ${peak} (bound ${bound}).`;
  const facts = [`Peak: ${peak}`, `Bound: ${bound}`, `Openings: ${input.openings}`, `Last change: ${formatInTimeZone(input.at, structure.timezone)} (${structure.timezone})`];
  const text = [opening, facts.join("\n"), `Chart: ${place.link}`, ALERT_CAUTION].join("\n\n");
  const html = htmlFrame(subject, [htmlParagraph(opening), ...facts.map(htmlParagraph), htmlButton(place.link, "Open the chart")].join("\n"), ALERT_CAUTION);
  return { subject, text, html };
}
