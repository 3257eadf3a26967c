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

  it("tells a missing strength from missing readings", () => {
    expect(formatUtilisation({ utilisationPeak: { basis: "yield", ratio: 250 / 355, yield: 355 }, stress: { min: 0, max: 250, unit: "MPa" } }, "si")).toBe(
      "70 % of yield (355.0 MPa)",
    );
    expect(formatUtilisation({ utilisationPeak: null, stress: { min: 0, max: 2, unit: "MPa" } }, "si")).toBe("no yield or compressive strength set for the material");
    expect(formatUtilisation({ utilisationPeak: null, stress: null }, "si")).toBe("no readings");
  });

  it("rates concrete against f_ck in compression and says in words that tension is not rated", () => {
    // 12 MPa of compression on f_ck = 30 MPa is 40 % (compressive stress ÷ f_ck, EN 1992-1-1 §3.1.2 names f_ck).
    const compression = { basis: "compressive-strength" as const, ratio: 12 / 30, compressiveStrength: 30 };
    expect(formatUtilisation({ utilisationPeak: compression, stress: { min: -12, max: 1, unit: "MPa" } }, "si")).toBe("40 % of f_ck in compression (f_ck 30.0 MPa)");
    const tensionOnly = { basis: "compressive-strength" as const, ratio: null, compressiveStrength: 30 };
    expect(formatUtilisation({ utilisationPeak: tensionOnly, stress: { min: 0.5, max: 1, unit: "MPa" } }, "si")).toBe(
      "not rated: concrete in tension cracks (f_ck 30.0 MPa)",
    );
  });

  it("says who acknowledged, with the comment, and whether the alert is over", () => {
    expect(alertHandling(alert, "Europe/London")).toBe("acknowledged by Priya Venn at 2026-10-20 13:30 BST: “Crane lift”; cleared at 2026-10-20 14:00 BST");
    expect(alertHandling({ ...alert, acknowledged: null, clearedAt: null }, "UTC")).toBe("not acknowledged; still open");
  });
});
