import { describe, expect, it } from "vitest";
import { formValuesOf, gaugePayloadOf } from "@/lib/gauges/form-values";
import { previewConversion } from "@/lib/gauges/preview";

const typed = (values: Record<string, string>) =>
  gaugePayloadOf({
    ...formValuesOf({}),
    gaugeFactor: "2",
    "material.E": "200000",
    "material.nu": "0.3",
    "material.alpha": "12",
    ...values,
  });

describe("the gauge form's conversion preview", () => {
  it("says in words which value is still missing, before the tag is typed", () => {
    expect(previewConversion(typed({}), 1, null)).toEqual({ ok: false, message: "Type the zero reading to see a preview." });
    expect(previewConversion(typed({ "zero.value": "0", gaugeFactor: "" }), 1, null)).toEqual({ ok: false, message: "Type the gauge factor to see a preview." });
  });

  it("names the field of a value that cannot be used", () => {
    const preview = previewConversion(typed({ "zero.value": "0", gaugeFactor: "-2" }), 1, null);
    expect(preview).toEqual({ ok: false, message: "The gauge factor needs fixing before a preview: Must be greater than zero." });
  });

  // Quarter bridge of the Dally & Riley circuit: 1 mV/V at GF 2, ε = 4Vr/(GF(1 − 2Vr)) = 2004.0 µε.
  it("converts the sample once the gauge is complete", () => {
    const preview = previewConversion(typed({ "zero.value": "0" }), 1, null);
    expect(preview.ok && Math.round(preview.strain * 10) / 10).toBe(2004);
  });
});
