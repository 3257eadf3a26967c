import type { GaugeFields } from "./schema";

/** The gauge form keeps every field as text under its dotted API path ("material.E"). */
export type GaugeFormValues = Record<string, string>;

export const COEFFICIENT_KEYS = ["thermal.A0", "thermal.A1", "thermal.A2", "thermal.A3", "thermal.A4"] as const;

const text = (value: number | string | null | undefined) => (value === null || value === undefined ? "" : String(value));

export function formValuesOf(gauge: Partial<GaugeFields>): GaugeFormValues {
  const thermal = gauge.thermal ?? { method: "none" as const };
  const coefficients = thermal.method === "polynomial" ? thermal.coefficients : [];
  return {
    tag: text(gauge.tag),
    label: text(gauge.label),
    member: text(gauge.member),
    kind: gauge.kind ?? "foil",
    input: gauge.input ?? "mV/V",
    bridge: text(gauge.bridge ?? "quarter"),
    gaugeFactor: text(gauge.gaugeFactor),
    loggerGaugeFactor: text(gauge.loggerGaugeFactor),
    calibrationFactor: text(gauge.calibrationFactor),
    polarity: text(gauge.polarity ?? 1),
    wiring: text(gauge.wiring),
    leadResistance: text(gauge.leadResistance),
    gaugeResistance: text(gauge.gaugeResistance),
    excitationVoltage: text(gauge.excitationVoltage),
    "thermal.method": thermal.method,
    ...Object.fromEntries(COEFFICIENT_KEYS.map((key, i) => [key, text(coefficients[i])])),
    "thermal.gaugeCte": thermal.method === "cte" ? text(thermal.gaugeCte) : "",
    "material.name": text(gauge.material?.name),
    "material.E": text(gauge.material?.E),
    "material.nu": text(gauge.material?.nu),
    "material.alpha": text(gauge.material?.alpha),
    "material.yield": text(gauge.material?.yield),
    "material.compressiveStrength": text(gauge.material?.compressiveStrength),
    initialStress: text(gauge.initialStress ?? 0),
    "zero.value": text(gauge.zero?.value),
    "zero.temperature": text(gauge.zero?.temperature),
    "zero.time": text(gauge.zero?.time),
    expectedInterval: text(gauge.expectedInterval),
    ratedRange: text(gauge.ratedRange),
    detailCategory: text(gauge.detailCategory),
    ...samplingValuesOf(gauge.sampling),
  };
}

function samplingValuesOf(sampling: GaugeFields["sampling"] | undefined): GaugeFormValues {
  const dynamic = sampling?.mode === "dynamic" ? sampling : null;
  return {
    "sampling.mode": dynamic ? "dynamic" : "static",
    "sampling.rateHz": text(dynamic?.rateHz),
    "sampling.summaryMinutes": text(dynamic?.summaryMinutes ?? 10),
    "sampling.rangeBin": text(dynamic?.rangeBin ?? 1),
    "sampling.trigger.above": text(dynamic?.trigger?.above),
    "sampling.trigger.below": text(dynamic?.trigger?.below),
    "sampling.trigger.preSeconds": text(dynamic?.trigger?.preSeconds ?? 2),
    "sampling.trigger.postSeconds": text(dynamic?.trigger?.postSeconds ?? 5),
  };
}

/** Static, or dynamic with its rate, interval, bin and a trigger when a level is given. */
function samplingOf(values: GaugeFormValues) {
  if (values["sampling.mode"] !== "dynamic") return { mode: "static" };
  const above = numberOrText(values["sampling.trigger.above"]);
  const below = numberOrText(values["sampling.trigger.below"]);
  return {
    mode: "dynamic",
    rateHz: numberOrText(values["sampling.rateHz"]),
    summaryMinutes: numberOrText(values["sampling.summaryMinutes"]) ?? 10,
    rangeBin: numberOrText(values["sampling.rangeBin"]) ?? 1,
    trigger:
      above === undefined && below === undefined
        ? null
        : {
            above: above ?? null,
            below: below ?? null,
            preSeconds: numberOrText(values["sampling.trigger.preSeconds"]) ?? 2,
            postSeconds: numberOrText(values["sampling.trigger.postSeconds"]) ?? 5,
          },
  };
}

/** Which fields mean something for the chosen kind, input, bridge and compensation. */
export function applicableFields(values: GaugeFormValues) {
  const foil = values.kind === "foil";
  const bridged = foil && values.input === "mV/V";
  return {
    bridge: bridged,
    loggerGaugeFactor: foil && values.input === "microstrain",
    calibrationFactor: !foil,
    leadResistances: bridged && values.bridge === "quarter",
    // Any bridge: a shunt check needs the resistance of the gauge it shunts.
    gaugeResistance: bridged,
    excitationVoltage: foil,
    coefficients: values["thermal.method"] === "polynomial",
    gaugeCte: values["thermal.method"] === "cte",
  };
}

/** Blank → absent; anything else is sent as a number, so the server names what is not one. */
function numberOrText(value: string | undefined): number | string | undefined {
  const trimmed = (value ?? "").trim().replace(",", ".");
  if (trimmed === "") return undefined;
  const parsed = Number(trimmed);
  return Number.isFinite(parsed) ? parsed : trimmed;
}

function thermalOf(values: GaugeFormValues) {
  switch (values["thermal.method"]) {
    case "polynomial": {
      const coefficients = COEFFICIENT_KEYS.map((key) => numberOrText(values[key]) ?? 0);
      while (coefficients.length > 1 && coefficients.at(-1) === 0) coefficients.pop();
      return { method: "polynomial", coefficients };
    }
    case "cte":
      return { method: "cte", gaugeCte: numberOrText(values["thermal.gaugeCte"]) ?? null };
    default:
      return { method: "none" };
  }
}

/** The API body for the form's values; fields that do not apply are left out. */
export function gaugePayloadOf(values: GaugeFormValues) {
  const applies = applicableFields(values);
  const zeroTime = values["zero.time"]?.trim();
  return {
    tag: values.tag?.trim(),
    label: values.label,
    member: values.member,
    kind: values.kind,
    input: values.input,
    bridge: applies.bridge ? values.bridge : null,
    gaugeFactor: numberOrText(values.gaugeFactor),
    loggerGaugeFactor: applies.loggerGaugeFactor ? (numberOrText(values.loggerGaugeFactor) ?? null) : null,
    calibrationFactor: applies.calibrationFactor ? (numberOrText(values.calibrationFactor) ?? null) : null,
    polarity: numberOrText(values.polarity),
    wiring: applies.leadResistances ? values.wiring || null : null,
    leadResistance: applies.leadResistances ? (numberOrText(values.leadResistance) ?? null) : null,
    gaugeResistance: applies.gaugeResistance ? (numberOrText(values.gaugeResistance) ?? null) : null,
    excitationVoltage: applies.excitationVoltage ? (numberOrText(values.excitationVoltage) ?? null) : null,
    thermal: thermalOf(values),
    material: {
      name: values["material.name"],
      E: numberOrText(values["material.E"]),
      nu: numberOrText(values["material.nu"]),
      alpha: numberOrText(values["material.alpha"]),
      yield: numberOrText(values["material.yield"]) ?? null,
      compressiveStrength: numberOrText(values["material.compressiveStrength"]) ?? null,
    },
    initialStress: numberOrText(values.initialStress) ?? 0,
    zero: {
      value: numberOrText(values["zero.value"]),
      temperature: numberOrText(values["zero.temperature"]) ?? null,
      ...(zeroTime ? { time: zeroTime } : {}),
    },
    expectedInterval: numberOrText(values.expectedInterval) ?? null,
    ratedRange: numberOrText(values.ratedRange) ?? null,
    detailCategory: numberOrText(values.detailCategory) ?? null,
    sampling: samplingOf(values),
  };
}
