import type { Level, Quantity, RosetteLimitQuantity } from "@/lib/limits/limit";
import { formatQuantity, quantityScale } from "@/lib/limits/display-scale";
import { formatInTimeZone } from "@/lib/time-format";
import { escapeHtml, htmlButton, htmlFrame, htmlParagraph, type BuiltMail } from "./message";

/** What happened to the alert: a bound crossed, a higher level reached, or the value back within bounds. */
export type AlertMailEvent = "opened" | "escalated" | "cleared";

export type AlertStructure = { code: string; name: string; timezone: string };

/** One alert event as the e-mails tell it, without the structure it belongs to. */
export type AlertEventFacts = {
  gauge: { tag: string; label?: string | null; location?: string | null };
  /** The rosette's tag when the quantity is a rosette's; `gauge` is then its gauge a. */
  rosette?: string | null;
  event: AlertMailEvent;
  level: Level;
  quantity: Quantity | RosetteLimitQuantity;
  /** In the quantity's stored unit: MPa, µε, or utilisation as a ratio (1 = at yield); MPa for a rosette's. */
  value: number;
  bound: { side: "upper" | "lower"; value: number };
  /** The alert's furthest value so far, the same number its page and the API show. */
  peak: number;
  at: Date;
  /**
   * When a person's action closed the alert rather than the values coming back (limits, material or
   * zero changed, cleared by hand): the sentence saying why and by whom. "Back within" would be untrue.
   */
  closedBecause?: string | null;
};

export type AlertMailInput = AlertEventFacts & { structure: AlertStructure };

/** Shown in every alert and digest e-mail, as the trade asks. */
export const ALERT_CAUTION =
  "What a limit means is the responsibility of the engineer who set it, under local codes. " +
  "Monitoring supplements inspection and never replaces it; mail can be delayed, so check in the app when data last arrived.";


/** How the e-mails name a quantity: a rosette's by its symbol rather than the API's name. */
const QUANTITY_NAME: Record<AlertEventFacts["quantity"], string> = {
  stress: "stress",
  strain: "strain",
  utilisation: "utilisation",
  residual: "thermal residual",
  sigma1: "σ₁",
  sigma2: "σ₂",
  vonMises: "von Mises stress",
};

export function gaugeChartLink(appUrl: string, structureCode: string, gaugeTag: string): string {
  return `${appUrl}/structures/${encodeURIComponent(structureCode)}/gauges/${encodeURIComponent(gaugeTag)}`;
}

/** What an alert event is about ("G1" or "rosette R1") and the chart that shows it. */
export function alertPlace(facts: Pick<AlertEventFacts, "gauge" | "rosette">, appUrl: string, structureCode: string): { name: string; link: string } {
  if (!facts.rosette) return { name: facts.gauge.tag, link: gaugeChartLink(appUrl, structureCode, facts.gauge.tag) };
  return {
    name: `rosette ${facts.rosette}`,
    link: `${appUrl}/structures/${encodeURIComponent(structureCode)}/rosettes/${encodeURIComponent(facts.rosette)}`,
  };
}

const EVENT_WORDING: Record<AlertMailEvent, string> = {
  opened: "crossed",
  escalated: "rose to",
  cleared: "back within",
};

/** The wording of one event ("stress crossed the warning limit", value, bound), shared with the digest. */
export function describeAlertEvent(facts: AlertEventFacts): { headline: string; value: string; bound: string; peak: string } {
  const value = formatQuantity(facts.quantity, facts.value);
  const bound = `${facts.bound.side} ${formatQuantity(facts.quantity, facts.bound.value)}`;
  const headline = facts.closedBecause
    ? `${QUANTITY_NAME[facts.quantity]} alert at the ${facts.level} limit closed`
    : `${QUANTITY_NAME[facts.quantity]} ${EVENT_WORDING[facts.event]} the ${facts.level} limit`;
  return { headline, value, bound, peak: formatQuantity(facts.quantity, facts.peak) };
}

export function buildAlertMail(input: AlertMailInput, appUrl: string): BuiltMail {
  const { structure, gauge } = input;
  const { headline, value, bound, peak } = describeAlertEvent(input);
  const place = alertPlace(input, appUrl, structure.code);
  const levelWord = input.closedBecause ? "Closed" : input.event === "cleared" ? "Cleared" : input.level.toUpperCase();
  const subject = `${levelWord}: ${structure.code} ${place.name} ${headline} (peak ${peak})`;
  const facts: [string, string][] = [
    ["Structure", `${structure.name} (${structure.code})`],
    ...(input.rosette ? [["Rosette", input.rosette] as [string, string]] : []),
    [input.rosette ? "Gauge a" : "Gauge", gauge.label ? `${gauge.tag}, ${gauge.label}` : gauge.tag],
    ["Location", gauge.location || "not recorded"],
    ["Level", input.level],
    ["Quantity", `${QUANTITY_NAME[input.quantity]} (${quantityScale(input.quantity).unit})`],
    ["Peak so far", peak],
    input.closedBecause ? ["Why closed", input.closedBecause] : ["Value at this event", value],
    ["Bound", bound],
    ["Time", `${formatInTimeZone(input.at, structure.timezone)} (${structure.timezone})`],
  ];
  const opening = `On ${structure.name}, ${input.rosette ? place.name : `gauge ${gauge.tag}`}: ${headline}.${input.closedBecause ? ` ${input.closedBecause}` : ""}`;
  const text = [
    opening,
    facts.map(([name, fact]) => `${name}: ${fact}`).join("\n"),
    `Chart: ${place.link}`,
    ALERT_CAUTION,
  ].join("\n\n");
  const rows = facts
    .map(
      ([name, fact]) =>
        `<tr><th align="left" style="padding:4px 12px 4px 0;color:#64748b;font-weight:normal">${escapeHtml(name)}</th><td style="padding:4px 0">${escapeHtml(fact)}</td></tr>`,
    )
    .join("\n");
  const html = htmlFrame(
    subject,
    [htmlParagraph(opening), `<table style="border-collapse:collapse">${rows}</table>`, htmlButton(place.link, "Open the chart")].join("\n"),
    ALERT_CAUTION,
  );
  return { subject, text, html };
}
