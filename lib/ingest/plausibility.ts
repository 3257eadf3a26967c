import { failure, type Failure } from "@/lib/mechanics/result";

/**
 * Temperatures a strain-gauge installation on a structure can report, °C. Bonded foil gauges and
 * vibrating-wire gauges in service read well inside this band (common practice); a value outside
 * it is a broken thermistor, a wrong unit or a logger's error code, not weather.
 */
export const PLAUSIBLE_TEMPERATURE_C = { min: -80, max: 150 } as const;

const TEMPERATURE_OUT_OF_RANGE = failure(
  "temperature-out-of-range",
  `The temperature is outside ${PLAUSIBLE_TEMPERATURE_C.min}…+${PLAUSIBLE_TEMPERATURE_C.max} °C; check the thermistor, its channel and that the logger sends °C (not °F or K), or leave the temperature out.`,
);

export function temperatureProblem(temperature: number | null): Failure<"temperature-out-of-range"> | null {
  if (temperature === null) return null;
  return temperature < PLAUSIBLE_TEMPERATURE_C.min || temperature > PLAUSIBLE_TEMPERATURE_C.max ? TEMPERATURE_OUT_OF_RANGE : null;
}

/**
 * Strain is measured from the zero reading in force at installation: a reading older than that
 * has no reference and is a logger clock problem or a file of another gauge.
 */
export function beforeZeroProblem(time: number, firstZeroTime: number, tag: string): Failure<"before-zero"> | null {
  if (time >= firstZeroTime) return null;
  return failure(
    "before-zero",
    `The time ${new Date(time).toISOString()} is earlier than gauge "${tag}"'s first zero reading (${new Date(firstZeroTime).toISOString()}), from which its strain is measured; check the logger's clock, or correct the time of the gauge's zero reading.`,
  );
}
