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
    expect(periodHeadline("no-data", null)).toMatch(/No readings were received/);
  });

  it("says how much of the data the all clear rests on (by hand: 4248 / 4320 = 98.3 %)", () => {
    expect(periodHeadline("all-clear", 4248 / 4320)).toBe("No limit was crossed on the readings received (98.3 % of the expected readings were received).");
    expect(formatPercent(1)).toBe("100.0 %");
  });
});
