import { describe, expect, it } from "vitest";
import { buildAlertMail, type AlertMailInput } from "@/lib/mail/alert";
import { buildDigestMail } from "@/lib/mail/digest";
import { conditionText } from "@/lib/alerting/condition-display";
import { formatInTimeZone } from "@/lib/time-format";
import { buildInvitationMail } from "@/lib/mail/invitation";
import { buildPasswordResetMail } from "@/lib/mail/password-reset";

const APP = "https://monitor.hookeline.example";

const alert: AlertMailInput = {
  structure: { code: "MILL-FB", name: "Millrace Footbridge", timezone: "Europe/London" },
  gauge: { tag: "LC-03", label: "Lower chord, mid-span", location: "Bay 4, bottom flange" },
  event: "opened",
  level: "warning",
  quantity: "stress",
  value: 212.44,
  bound: { side: "upper", value: 200 },
  peak: 212.44,
  at: new Date("2026-07-01T12:00:00Z"),
};

describe("time in the structure's time zone", () => {
  // IANA tz data, common practice: the UK keeps BST (UTC+1) from the last Sunday of March to the last Sunday of October.
  it("writes 2026-07-01T12:00Z as 13:00 BST in London, and 12:00 GMT in January", () => {
    expect(formatInTimeZone(new Date("2026-07-01T12:00:00Z"), "Europe/London")).toBe("2026-07-01 13:00 BST");
    expect(formatInTimeZone(new Date("2026-01-15T12:00:00Z"), "Europe/London")).toBe("2026-01-15 12:00 GMT");
  });

  it("moves to the next calendar day east of UTC (Asia/Tokyo is UTC+9 all year, by hand)", () => {
    expect(formatInTimeZone(new Date("2026-07-01T20:30:00Z"), "Asia/Tokyo")).toMatch(/^2026-07-02 05:30 /);
  });
});

describe("alert e-mail", () => {
  const mail = buildAlertMail(alert, APP);

  it("says structure, gauge, location, level, quantity, value with unit, bound and local time in both parts", () => {
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain("Millrace Footbridge (MILL-FB)");
      expect(part).toContain("LC-03, Lower chord, mid-span");
      expect(part).toContain("Bay 4, bottom flange");
      expect(part).toContain("warning");
      expect(part).toContain("stress");
      expect(part).toContain("212.4 MPa");
      expect(part).toContain("upper 200.0 MPa");
      expect(part).toContain("2026-07-01 13:00 BST (Europe/London)");
    }
    expect(mail.subject).toBe("WARNING: MILL-FB LC-03 stress crossed the warning limit (peak 212.4 MPa)");
  });

  it("links to the gauge's chart and carries the caution", () => {
    expect(mail.text).toContain(`Chart: ${APP}/structures/MILL-FB/gauges/LC-03`);
    expect(mail.html).toContain(`href="${APP}/structures/MILL-FB/gauges/LC-03"`);
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain("responsibility of the engineer who set it");
      expect(part).toContain("Monitoring supplements inspection and never replaces it");
    }
  });

  it("escapes names typed by people in the HTML part", () => {
    const html = buildAlertMail({ ...alert, gauge: { tag: "G<1>", location: `"top" & bottom` } }, APP).html;
    expect(html).toContain("G&lt;1&gt;");
    expect(html).toContain("&quot;top&quot; &amp; bottom");
    expect(html).not.toContain("G<1>");
  });

  it("says when a value is back within bounds, naming the episode's peak as the alert's page does", () => {
    const cleared = buildAlertMail({ ...alert, event: "cleared", value: 180, peak: 231.26 }, APP);
    expect(cleared.subject).toBe("Cleared: MILL-FB LC-03 stress back within the warning limit (peak 231.3 MPa)");
    expect(cleared.text).toContain("Value at this event: 180.0 MPa");
  });

  it("names the quantity with its unit and rounds the value as it is read", () => {
    const strain = buildAlertMail({ ...alert, quantity: "strain", value: 2598.2770717615213, bound: { side: "upper", value: 220 } }, APP);
    expect(strain.text).toContain("Quantity: strain (µε)");
    expect(strain.text).toContain("Value at this event: 2,598 µε");
    const utilisation = buildAlertMail({ ...alert, quantity: "utilisation", value: 0.874, bound: { side: "upper", value: 0.8 } }, APP);
    expect(utilisation.text).toContain("Quantity: utilisation (% of yield)");
    expect(utilisation.text).toContain("Value at this event: 87 % of yield");
  });
});

describe("daily digest", () => {
  it("lists the events of each structure oldest first, in the structure's time, with links and the caution", () => {
    const later = { ...alert, at: new Date("2026-07-01T15:00:00Z"), level: "critical" as const, value: 240 };
    const mail = buildDigestMail(
      {
        recipientName: "Iris Calder",
        period: "2026-07-01",
        structures: [
          { structure: alert.structure, events: [later, alert] },
          { structure: { code: "ORCH-PD", name: "Orchard Street Parking Deck", timezone: "Europe/London" }, events: [] },
        ],
      },
      APP,
    );
    expect(mail.subject).toBe("Hookeline daily summary 2026-07-01: 2 alert events");
    expect(mail.text.indexOf("13:00 BST")).toBeLessThan(mail.text.indexOf("16:00 BST"));
    expect(mail.text).toContain("stress crossed the critical limit: 240.0 MPa (bound upper 200.0 MPa)");
    expect(mail.text).toContain(`${APP}/structures/MILL-FB/gauges/LC-03`);
    expect(mail.text).toContain("Orchard Street Parking Deck (ORCH-PD), times in Europe/London\n- no alert events");
    expect(mail.html).toContain("Monitoring supplements inspection");
  });

  it("says which gauges are not within limits now, in the words of their condition", () => {
    const mail = buildDigestMail(
      {
        recipientName: "Iris Calder",
        period: "2026-07-01",
        structures: [
          {
            structure: alert.structure,
            events: [alert],
            conditions: [
              { tag: "LC-03", condition: conditionText({ state: "sensor-fault", faults: ["jump"], stale: false }) },
              { tag: "LC-04", condition: conditionText({ state: "no-limits", faults: [], stale: false }) },
            ],
          },
          { structure: { code: "ORCH-PD", name: "Orchard Street Parking Deck", timezone: "Europe/London" }, events: [alert], conditions: [] },
        ],
      },
      APP,
    );
    expect(mail.text).toContain("Now, not within limits: LC-03 sensor fault (jump); LC-04 no limits.");
    expect(mail.text).toContain("Now: every gauge is within its limits.");
    expect(mail.html).toContain("LC-03 sensor fault (jump)");
  });
});

describe("account e-mails", () => {
  it("invitation: names the inviter, the role and the link, in text and HTML", () => {
    const link = `${APP}/welcome?token=abc.def`;
    const mail = buildInvitationMail({ name: "Nia", email: "nia@hookeline.example", role: "owner", invitedBy: "Morgan Hale", link, validForDays: 7 });
    expect(mail.subject).toBe("You are invited to Hookeline");
    expect(mail.text).toContain("Morgan Hale has given you a Hookeline account (nia@hookeline.example) with the owner role.");
    expect(mail.text).toContain(`\n\n${link}\n\n`);
    expect(mail.text).toContain("within 7 days");
    expect(mail.html).toContain(`href="${link}"`);
  });

  it("password reset: the link, how long it lasts, and what to do if it was not you", () => {
    const link = `${APP}/reset/confirm?token=abc.def`;
    const mail = buildPasswordResetMail({ name: "Tomas", link, validForMinutes: 60 });
    expect(mail.text).toContain(link);
    expect(mail.text).toContain("within 60 minutes");
    expect(mail.text).toContain("If you did not ask for this");
    expect(mail.html).toContain(`href="${link}"`);
  });
});
