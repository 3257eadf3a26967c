import type { GaugeInput, GaugeKind } from "@/lib/mechanics";

/** The unit a logger sends for each input, as screens write it beside a raw value. */
export const INPUT_UNIT: Readonly<Record<GaugeInput, string>> = {
  microstrain: "µε",
  "mV/V": "mV/V",
  Hz: "Hz",
  "frequency-squared": "f²/1000",
};

/** Each input in words, for choosing and reading a gauge's logger output. */
export const INPUT_NAME: Readonly<Record<GaugeInput, string>> = {
  microstrain: "Microstrain, µε",
  "mV/V": "Bridge output, mV/V",
  Hz: "Frequency, Hz",
  "frequency-squared": "Frequency squared, f²/1000",
};

export function inputUnit(input: string): string {
  return Object.hasOwn(INPUT_UNIT, input) ? INPUT_UNIT[input as GaugeInput] : input;
}

export function inputName(input: string): string {
  return Object.hasOwn(INPUT_NAME, input) ? INPUT_NAME[input as GaugeInput] : input;
}

export const WIRE_GAUGE_FACTOR_UNIT = "µε per f²/1000";

export function gaugeFactorLabel(kind: GaugeKind | string): string {
  return kind === "vibrating-wire" ? `Wire gauge factor (${WIRE_GAUGE_FACTOR_UNIT})` : "Gauge factor";
}

export const CALIBRATION_FACTOR_LABEL = "Calibration multiplier, 1 if none";
