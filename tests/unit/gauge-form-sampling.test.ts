import { describe, expect, it } from "vitest";
import { formValuesOf, gaugePayloadOf } from "@/lib/gauges/form-values";
import { samplingInput } from "@/lib/gauges/schema";

describe("the gauge form's sampling fields", () => {
  it("carry a dynamic gauge's sampling to the form and back as the API's field", () => {
    const sampling = { mode: "dynamic" as const, rateHz: 200, summaryMinutes: 15 as const, rangeBin: 0.5, trigger: { above: 12, below: null, preSeconds: 1, postSeconds: 4 } };
    const payload = gaugePayloadOf(formValuesOf({ sampling }));
    expect(samplingInput.parse(payload.sampling)).toEqual(sampling);
  });

  it("send a static gauge as static, and a dynamic one without levels without a trigger", () => {
    expect(gaugePayloadOf(formValuesOf({})).sampling).toEqual({ mode: "static" });
    const values = { ...formValuesOf({}), "sampling.mode": "dynamic", "sampling.rateHz": "100" };
    expect(samplingInput.parse(gaugePayloadOf(values).sampling)).toEqual({ mode: "dynamic", rateHz: 100, summaryMinutes: 10, rangeBin: 1, trigger: null });
  });

  it("refuse a trigger whose level below is over its level above, and an interval that does not divide the hour", () => {
    expect(samplingInput.safeParse({ mode: "dynamic", rateHz: 100, trigger: { above: 5, below: 8 } }).error?.issues[0]?.message).toMatch(/under the level above/);
    expect(samplingInput.safeParse({ mode: "dynamic", rateHz: 100, summaryMinutes: 7 }).error?.issues[0]?.message).toMatch(/divides the hour/);
  });
});
