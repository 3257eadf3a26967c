import { describe, expect, it } from "vitest";
import { formatPercent, periodHeadline, periodLevel } from "@/lib/report/status";

describe("the period's summary status", () => {
  it("is the worst structural level of the period's limit alerts", () => {
    expect(periodLevel(["watch", "critical", "warning"], 10)).toBe("critical");
    expect(periodLevel(["watch", "watch"], 10)).toBe("watch");
  });

  it("is all clear only with readings, never on silence", () => {
    expect(periodLevel([], 1)).toBe("all-clear");
    expect(periodLevel([], 0)).toBe("no-data");
    expect(periodHeadline("no-data", null, { withLimits: 0, withoutLimits: 0, faulty: 0, silent: 3 })).toMatch(/No readings were received/);
  });

  it("says how much of the data the all clear rests on (by hand: 4248 / 4320 = 98.3 %)", () => {
    expect(periodHeadline("all-clear", 4248 / 4320, { withLimits: 3, withoutLimits: 0, faulty: 0, silent: 0 })).toBe(
      "No limit was crossed on the 3 gauges with limits that sent readings (98.3 % of the expected readings were received).",
    );
    expect(formatPercent(1)).toBe("100.0 %");
  });

  it("never says all clear of gauges it did not check: no limits, sensor faults, silence", () => {
    expect(periodHeadline("all-clear", null, { withLimits: 1, withoutLimits: 2, faulty: 1, silent: 1 })).toBe(
      "No limit was crossed on the 1 gauge with limits that sent readings; 2 gauges have no limits and were not checked; " +
        "1 gauge had sensor faults, whose faulty readings were not checked; 1 gauge sent no readings.",
    );
    expect(periodHeadline("all-clear", null, { withLimits: 0, withoutLimits: 1, faulty: 0, silent: 0 })).toBe(
      "No gauge with limits sent readings, so no limit was checked; 1 gauge has no limits and was not checked.",
    );
  });
});
