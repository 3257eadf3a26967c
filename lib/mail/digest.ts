import { ALERT_CAUTION, alertPlace, describeAlertEvent, gaugeChartLink, type AlertEventFacts, type AlertStructure } from "./alert";
import { formatInTimeZone } from "@/lib/time-format";
import { escapeHtml, htmlFrame, htmlParagraph, type BuiltMail } from "./message";

export type DigestMailInput = {
  recipientName: string;
  /** The day the digest covers, with the zone of its midnights, as the reader should see it ("2026-07-01 (UTC)"). */
  period: string;
  structures: { structure: AlertStructure; events: DigestEvent[]; conditions?: GaugeConditionLine[] }[];
};

/** A sensor fault found or resolved, as a digest line tells it. */
export type SensorEventFacts = { gauge: { tag: string }; code: string; event: "opened" | "cleared"; message: string | null; at: Date };

export type DigestEvent = AlertEventFacts | SensorEventFacts;

/** A gauge that is not within its limits now, and its condition in words ("Sensor fault (jump)"). */
export type GaugeConditionLine = { tag: string; condition: string };

/** "Now: G1 sensor fault (jump); G3 no current data", or that every gauge is within its limits. */
function conditionsLine(conditions: GaugeConditionLine[] | undefined): string | null {
  if (conditions === undefined) return null;
  if (conditions.length === 0) return "Now: every gauge is within its limits.";
  return `Now, not within limits: ${conditions.map((line) => `${line.tag} ${line.condition.toLowerCase()}`).join("; ")}.`;
}

function describeLine(facts: DigestEvent, appUrl: string, structureCode: string): { gauge: string; what: string; link: string } {
  if ("code" in facts) {
    const what = `sensor fault ${facts.code} ${facts.event === "opened" ? "found" : "resolved"}${facts.message ? `: ${facts.message}` : ""}`;
    return { gauge: facts.gauge.tag, what, link: gaugeChartLink(appUrl, structureCode, facts.gauge.tag) };
  }
  const { headline, value, bound } = describeAlertEvent(facts);
  const place = alertPlace(facts, appUrl, structureCode);
  return { gauge: place.name, what: `${headline}: ${facts.closedBecause ?? `${value} (bound ${bound})`}`, link: place.link };
}

/** One e-mail a day for people who chose the digest: every alert event of their structures, oldest first. */
export function buildDigestMail(input: DigestMailInput, appUrl: string): BuiltMail {
  const total = input.structures.reduce((sum, s) => sum + s.events.length, 0);
  const subject = `Hookeline daily summary ${input.period}: ${total === 1 ? "1 alert event" : `${total} alert events`}`;
  const sections = input.structures.map(({ structure, events, conditions }) => {
    const ordered = [...events].sort((a, b) => a.at.getTime() - b.at.getTime());
    const lines = ordered.map((facts) => ({ time: formatInTimeZone(facts.at, structure.timezone), ...describeLine(facts, appUrl, structure.code) }));
    return { title: `${structure.name} (${structure.code}), times in ${structure.timezone}`, lines, now: conditionsLine(conditions) };
  });
  const opening = `Hello ${input.recipientName}, here are the alert events of ${input.period} on the structures you follow.`;
  const text = [
    opening,
    ...sections.map((s) =>
      [
        s.title,
        ...(s.lines.length ? s.lines.map((l) => `- ${l.time}  ${l.gauge}  ${l.what}\n  ${l.link}`) : ["- no alert events"]),
        ...(s.now ? [s.now] : []),
      ].join("\n"),
    ),
    ALERT_CAUTION,
  ].join("\n\n");
  const htmlSections = sections.map((s) => {
    const items = s.lines.length
      ? s.lines
          .map((l) => `<li>${escapeHtml(l.time)} <a href="${escapeHtml(l.link)}">${escapeHtml(l.gauge)}</a> ${escapeHtml(l.what)}</li>`)
          .join("\n")
      : "<li>no alert events</li>";
    const now = s.now ? `\n${htmlParagraph(s.now)}` : "";
    return `<h2 style="font-size:16px;margin:20px 0 8px">${escapeHtml(s.title)}</h2>\n<ul style="padding-left:20px;margin:0">${items}</ul>${now}`;
  });
  const html = htmlFrame(subject, [htmlParagraph(opening), ...htmlSections].join("\n"), ALERT_CAUTION);
  return { subject, text, html };
}
