import type { Gauge } from "@/db/schema";
import { thermalCompensationFor, type GaugeConfig } from "@/lib/mechanics";
import type { GaugeFields } from "./schema";

/** Columns of a gauge row from validated fields (zero and status are handled by their own steps). */
export function gaugeColumns(fields: Omit<GaugeFields, "tag" | "zero">) {
  return {
    label: fields.label ?? null,
    member: fields.member ?? null,
    kind: fields.kind,
    input: fields.input,
    bridge: fields.bridge,
    gaugeFactor: fields.gaugeFactor,
    loggerGaugeFactor: fields.loggerGaugeFactor,
    calibrationFactor: fields.calibrationFactor,
    polarity: fields.polarity,
    wiring: fields.wiring,
    leadResistance: fields.leadResistance,
    gaugeResistance: fields.gaugeResistance,
    excitationVoltage: fields.excitationVoltage,
    // The default is stored with the gauge: a later change of default never changes its conversion.
    thermal: thermalCompensationFor(fields.kind, fields.thermal) as Gauge["thermal"],
    material: fields.material,
    initialStress: fields.initialStress,
    expectedInterval: fields.expectedInterval,
    ratedRange: fields.ratedRange,
    detailCategory: fields.detailCategory,
    sampling: fields.sampling,
  };
}

/** A stored gauge as the API shows it (the contract's field names). */
export function gaugeFieldsOf(row: Gauge): GaugeFields {
  return {
    tag: row.tag,
    label: row.label ?? undefined,
    member: row.member ?? undefined,
    kind: row.kind as GaugeFields["kind"],
    input: row.input as GaugeFields["input"],
    bridge: row.bridge as GaugeFields["bridge"],
    gaugeFactor: row.gaugeFactor,
    loggerGaugeFactor: row.loggerGaugeFactor,
    calibrationFactor: row.calibrationFactor,
    polarity: row.polarity === -1 ? -1 : 1,
    wiring: row.wiring as GaugeFields["wiring"],
    leadResistance: row.leadResistance,
    gaugeResistance: row.gaugeResistance,
    excitationVoltage: row.excitationVoltage,
    thermal: row.thermal,
    material: {
      ...row.material,
      name: row.material.name ?? undefined,
      yield: row.material.yield ?? null,
      compressiveStrength: row.material.compressiveStrength ?? null,
    },
    initialStress: row.initialStress,
    zero: { value: row.zeroValue, temperature: row.zeroTemperature, time: row.zeroTime.toISOString() },
    expectedInterval: row.expectedInterval,
    ratedRange: row.ratedRange,
    detailCategory: row.detailCategory as GaugeFields["detailCategory"],
    sampling: row.sampling as GaugeFields["sampling"],
  };
}

/** The stored gauge as the mechanics core converts with it. */
export function gaugeConfigOf(row: Gauge): GaugeConfig {
  const fields = gaugeFieldsOf(row);
  return { ...fields, zero: { value: row.zeroValue, temperature: row.zeroTemperature, time: row.zeroTime } };
}
