import { describe, expect, it } from "vitest";
import { CONDITION_STATES, gaugeCondition, worstCondition, type ConditionFacts, type ConditionState } from "@/lib/alerting/condition";
import { SHOWN_STATES, STATE_LOOK, conditionText } from "@/lib/alerting/condition-display";
import { isStale } from "@/lib/alerting/gauge-state";

const now = Date.UTC(2026, 11, 1, 12);
const minutes = (n: number) => n * 60_000;

/** A gauge reading every 10 minutes, last 5 minutes ago, with limits and nothing open. */
const base: ConditionFacts = {
  openLimitAlerts: [],
  openSensorAlerts: [],
  firstReadingAt: now - minutes(60 * 24 * 20),
  lastReadingAt: now - minutes(5),
  lastLimitClearedAt: null,
  expectedIntervalS: 600,
  hasLimits: true,
  registeredAt: now - minutes(60 * 24 * 21),
  now,
};

/** What makes each state hold, as a change to the facts. */
const HOLDS: Record<ConditionState, (facts: ConditionFacts) => ConditionFacts> = {
  critical: (f) => ({ ...f, openLimitAlerts: [...f.openLimitAlerts, { level: "critical", openedAt: now - minutes(40) }] }),
  warning: (f) => ({ ...f, openLimitAlerts: [...f.openLimitAlerts, { level: "warning", openedAt: now - minutes(50) }] }),
  watch: (f) => ({ ...f, openLimitAlerts: [...f.openLimitAlerts, { level: "watch", openedAt: now - minutes(60) }] }),
  "sensor-fault": (f) => ({ ...f, openSensorAlerts: [...f.openSensorAlerts, { code: "jump", openedAt: now - minutes(70) }] }),
  // Silent for two hours at a 10-minute interval: past three missed readings.
  "no-data": (f) => ({ ...f, lastReadingAt: now - minutes(120) }),
  "within-limits": (f) => ({ ...f, hasLimits: true }),
  "no-limits": (f) => ({ ...f, hasLimits: false }),
};

// The order of precedence follows alarm-management practice (common practice; ANSI/ISA-18.2
// from memory): the most urgent finding is what a gauge shows; a sensor that cannot be believed
// or data that stopped come before any "fine"; a gauge with nothing to judge by says so.
describe("gauge condition", () => {
  const pairs = CONDITION_STATES.flatMap((first, i) => CONDITION_STATES.slice(i + 1).map((second) => [first, second] as const));

  it.each(pairs)("%s comes before %s when both hold", (first, second) => {
    if (first === "within-limits" && second === "no-limits") {
      // The one pair that cannot both hold: a gauge has limits or it has none.
      expect(gaugeCondition(HOLDS[first](base)).state).toBe(first);
      expect(gaugeCondition(HOLDS[second](base)).state).toBe(second);
      return;
    }
    expect(gaugeCondition(HOLDS[first](HOLDS[second](base))).state).toBe(first);
    expect(gaugeCondition(HOLDS[second](HOLDS[first](base))).state).toBe(first);
  });

  it("covers every pair of the seven states", () => {
    expect(pairs).toHaveLength((7 * 6) / 2);
  });

  it("says no limits, never within limits, for a gauge without limits", () => {
    const condition = gaugeCondition({ ...base, hasLimits: false });
    expect(condition.state).toBe("no-limits");
    expect(conditionText(condition)).toBe("No limits");
  });

  it("never shows stale data as fine, with or without limits", () => {
    for (const hasLimits of [true, false]) {
      const condition = gaugeCondition({ ...base, hasLimits, lastReadingAt: now - minutes(31) });
      expect(condition).toMatchObject({ state: "no-data", stale: true, since: now - minutes(31) });
    }
    // Three missed 10-minute readings (common practice: more than one missed logging cycle).
    expect(isStale(now - minutes(30), 600, now)).toBe(false);
    expect(isStale(now - minutes(31), 600, now)).toBe(true);
  });

  it("keeps the stale mark under an open limit alert, and says it in words", () => {
    const condition = gaugeCondition(HOLDS.warning({ ...base, lastReadingAt: now - minutes(120) }));
    expect(condition).toMatchObject({ state: "warning", stale: true });
    expect(conditionText(condition)).toBe("Warning; data stale");
  });

  it("lists open sensor faults oldest first, and names them", () => {
    const condition = gaugeCondition({
      ...base,
      openSensorAlerts: [
        { code: "flat-line", openedAt: now - minutes(10) },
        { code: "jump", openedAt: now - minutes(90) },
      ],
    });
    expect(condition).toEqual({ state: "sensor-fault", since: now - minutes(90), faults: ["jump", "flat-line"], stale: false });
    expect(conditionText(condition)).toBe("Sensor fault (jump, flat line)");
  });

  it("takes a stale-data sensor alert as stale data, not as a fault of the readings", () => {
    const condition = gaugeCondition({ ...base, lastReadingAt: now - minutes(120), openSensorAlerts: [{ code: "stale", openedAt: now - minutes(80) }] });
    expect(condition).toMatchObject({ state: "no-data", faults: [], stale: true });
  });

  it("dates a level from its oldest open alert, and within limits from the last clear", () => {
    const twoWatches = { ...base, openLimitAlerts: [{ level: "watch", openedAt: now - minutes(30) }, { level: "watch", openedAt: now - minutes(90) }] };
    expect(gaugeCondition(twoWatches).since).toBe(now - minutes(90));
    expect(gaugeCondition({ ...base, lastLimitClearedAt: now - minutes(15) }).since).toBe(now - minutes(15));
    expect(gaugeCondition({ ...base, lastReadingAt: null, firstReadingAt: null })).toMatchObject({ state: "no-data", since: base.registeredAt, stale: false });
  });

  it("ranks a gauge without limits worse than one within them for a structure's worst", () => {
    expect(worstCondition(["within-limits", "no-limits"])).toBe("no-limits");
    expect(worstCondition(["no-limits", "sensor-fault", "watch"])).toBe("watch");
    expect(worstCondition(["within-limits", "no-data"])).toBe("no-data");
    expect(worstCondition([])).toBe("no-data");
  });
});

// Readable without colour (common practice for status displays, WCAG 2.x "use of colour", from memory).
describe("condition code", () => {
  it("gives every state its own word and its own shape", () => {
    const words = SHOWN_STATES.map((state) => STATE_LOOK[state].word);
    const shapes = SHOWN_STATES.map((state) => JSON.stringify(STATE_LOOK[state].marks));
    expect(new Set(words).size).toBe(SHOWN_STATES.length);
    expect(new Set(shapes).size).toBe(SHOWN_STATES.length);
    expect(new Set(SHOWN_STATES.map((state) => STATE_LOOK[state].shapeName)).size).toBe(SHOWN_STATES.length);
  });
});
