import { describe, expect, it } from "vitest";
import { gaugeState, isStale, worstState } from "@/lib/alerting/gauge-state";

const now = Date.UTC(2026, 11, 1, 12);
const minutes = (n: number) => n * 60_000;

// Stale data must never read as an old "all clear" (trade brief, cautions): three missed 10-minute
// readings make a gauge stale (common practice: more than one missed logging cycle).
describe("gauge state", () => {
  it("is stale once three expected intervals pass without a reading", () => {
    expect(isStale(now - minutes(30), 600, now)).toBe(false);
    expect(isStale(now - minutes(31), 600, now)).toBe(true);
    expect(isStale(null, 600, now)).toBe(false);
  });

  it("puts open limit levels before staleness, and staleness before ok", () => {
    const base = { retired: false, lastReadingAt: now - minutes(5), expectedIntervalS: 600, now };
    expect(gaugeState({ ...base, openLevels: ["watch", "critical"] })).toBe("critical");
    expect(gaugeState({ ...base, openLevels: [] })).toBe("ok");
    expect(gaugeState({ ...base, openLevels: [], lastReadingAt: now - minutes(90) })).toBe("stale");
    expect(gaugeState({ ...base, openLevels: [], lastReadingAt: null })).toBe("no-data");
    expect(gaugeState({ ...base, openLevels: ["critical"], retired: true })).toBe("retired");
  });

  it("takes the worst of a structure's gauges, ignoring retired ones", () => {
    expect(worstState(["ok", "stale", "watch", "retired"])).toBe("watch");
    expect(worstState(["ok", "stale"])).toBe("stale");
    expect(worstState(["retired"])).toBe("no-data");
  });
});
