import { describe, expect, it } from "vitest";
import type { ReportAlert } from "@/lib/api/report-schema";
import { alertHandling, alertTitle, formatUtilisation } from "@/lib/report/format";

const alert: ReportAlert = {
  id: 1,
  gauge: "G1",
  kind: "limit",
  level: "warning",
  quantity: "stress",
  code: null,
  message: null,
  unit: "MPa",
  bound: 200,
  peak: 250,
  openedAt: "2026-10-20T12:00:00.000Z",
  openedBeforePeriod: false,
  clearedAt: "2026-10-20T13:00:00.000Z",
  acknowledged: { at: "2026-10-20T12:30:00.000Z", by: "Priya Venn", comment: "Crane lift" },
  events: [],
};

describe("report wording", () => {
  it("puts stress in the reader's units (NIST SP 811: 1 ksi = 6.894757 MPa)", () => {
    expect(alertTitle(alert, "si")).toBe("G1: Warning, stress limit, peak 250.0 MPa against 200.0 MPa");
    expect(alertTitle(alert, "us")).toBe("G1: Warning, stress limit, peak 36.26 ksi against 29.01 ksi");
  });

  it("names a sensor alert's fault in words, not its code", () => {
    const sensor: ReportAlert = { ...alert, kind: "sensor", level: "watch", quantity: null, unit: null, code: "stale", bound: null, peak: null };
    expect(alertTitle(sensor, "si")).toBe("G1: Watch, sensor alert (no data arriving)");
    expect(alertTitle({ ...sensor, code: "flat-line" }, "si")).toBe("G1: Watch, sensor alert (flat line)");
  });

  it("tells a missing yield stress from missing readings", () => {
    expect(formatUtilisation({ utilisationPeak: { ratio: 250 / 355, yield: 355 }, stress: { min: 0, max: 250, unit: "MPa" } }, "si")).toBe("70 % of yield (355.0 MPa)");
    expect(formatUtilisation({ utilisationPeak: null, stress: { min: 0, max: 2, unit: "MPa" } }, "si")).toBe("no yield stress set for the material");
    expect(formatUtilisation({ utilisationPeak: null, stress: null }, "si")).toBe("no readings");
  });

  it("says who acknowledged, with the comment, and whether the alert is over", () => {
    expect(alertHandling(alert, "Europe/London")).toBe("acknowledged by Priya Venn at 2026-10-20 13:30 BST: “Crane lift”; cleared at 2026-10-20 14:00 BST");
    expect(alertHandling({ ...alert, acknowledged: null, clearedAt: null }, "UTC")).toBe("not acknowledged; still open");
  });
});
