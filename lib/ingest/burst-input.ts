import type { ReadingErrorCode } from "@/lib/mechanics";
import { failure, type Failure } from "@/lib/mechanics/result";
import { parseReadingTime } from "./reading-time";

/**
 * Why a burst can be refused, as `rejected[].code` of the bursts response; printed in the OpenAPI
 * document. A burst is refused whole: its summaries would otherwise describe a signal with holes.
 */
export const BURST_REJECTION_CODES = {
  "invalid-burst": 'The burst is not an object with gauge, start, rateHz and values.',
  "missing-gauge": "The burst names no gauge tag.",
  "unknown-gauge": "No gauge of the structure has this tag.",
  "retired-gauge": "The gauge is retired and takes no more data.",
  "gauge-not-convertible": "The gauge's stored configuration cannot convert samples; fix the gauge first.",
  "not-dynamic": "The gauge is static: send its data as readings, or make it dynamic first.",
  "invalid-time": "The start is not ISO-8601 with Z or an offset, or is before 1970.",
  "time-in-future": "The burst ends more than 5 minutes ahead of the server's clock.",
  "before-zero": "The burst starts earlier than the gauge's first zero reading, from which its strain is measured.",
  "temperature-out-of-range": "The burst's temperature is outside −80…+150 °C, beyond what a strain gauge installation reads.",
  "wrong-rate": "rateHz is not the gauge's rate.",
  "empty-burst": "The burst has no samples.",
  "not-finite":
    "A sample or the burst's temperature (or the strain or stress a sample converts to) is not a finite number: NaN, Infinity, text or null. The whole burst is refused.",
  "temperature-required": "The gauge's temperature compensation needs the burst's temperature.",
  "non-positive-frequency": "A vibrating-wire frequency must be above 0 Hz.",
  "non-positive-frequency-squared": "A vibrating-wire reading in f²/1000 must be above 0.",
  "impossible-bridge-output": "No bridge of the gauge's arrangement can produce this output change.",
  overlap: "The burst overlaps a stored burst of the same gauge, or another burst of the request, without starting at the same instant.",
} as const satisfies Record<string, string>;

export type BurstRejectionCode = keyof typeof BURST_REJECTION_CODES;

/** Conversion failures a sample can meet, each a burst rejection of the same name. */
export type SampleFailureCode = Extract<ReadingErrorCode, BurstRejectionCode>;

export interface BurstRejection {
  /** Position of the burst in the request (0 for a binary body). */
  index: number;
  code: BurstRejectionCode;
  message: string;
}

/** A burst as sent, checked on its own before its gauge is looked at. */
export interface IncomingBurst {
  gauge: string;
  /** Epoch ms of the first sample. */
  start: number;
  rateHz: number;
  /** °C for the whole burst, or null. */
  temperature: number | null;
  /** Raw samples in the gauge's input unit; JSON values are checked when converted. */
  values: ArrayLike<unknown>;
}

export type DecodedBurst = IncomingBurst | Failure<BurstRejectionCode>;

export const isBurstProblem = (burst: DecodedBurst): burst is Failure<BurstRejectionCode> => "ok" in burst;

const NOT_AN_OBJECT = failure(
  "invalid-burst",
  'Each burst is an object: { "gauge": tag, "start": ISO time, "rateHz": number, "temperature"?: number, "values": [raw, …] }.',
);
const MISSING_GAUGE = failure("missing-gauge", 'Name the burst\'s gauge by its tag in "gauge".');
const MISSING_START = failure("invalid-time", 'The burst has no "start"; send the first sample\'s time as ISO-8601 with Z or an offset.');
const RATE_NOT_NUMBER = failure("wrong-rate", '"rateHz" must be the gauge\'s sampling rate as a positive number.');
const VALUES_NOT_ARRAY = failure("invalid-burst", '"values" must be an array of raw samples (numbers).');
const TEMPERATURE_NOT_NUMBER = failure("not-finite", "The temperature must be a number in °C, or left out.");
const EMPTY = failure("empty-burst", "The burst has no samples; leave empty bursts out.");

/** The burst's start: ISO-8601 with Z or an offset, as the contract wants for JSON and for the binary query. */
export function decodeBurstStart(start: unknown): number | Failure<"invalid-time"> {
  if (typeof start !== "string" || start === "") return MISSING_START;
  return parseReadingTime(start, null);
}

export function decodeBurstRate(rateHz: unknown): number | Failure<"wrong-rate"> {
  return typeof rateHz === "number" && Number.isFinite(rateHz) && rateHz > 0 ? rateHz : RATE_NOT_NUMBER;
}

export function decodeBurstTemperature(temperature: unknown): number | null | Failure<"not-finite"> {
  if (temperature === undefined || temperature === null) return null;
  return typeof temperature === "number" && Number.isFinite(temperature) ? temperature : TEMPERATURE_NOT_NUMBER;
}

const isFailure = (value: unknown): value is Failure<BurstRejectionCode> => typeof value === "object" && value !== null && "ok" in value;

/** One element of a JSON `bursts` array. */
export function decodeJsonBurst(item: unknown): DecodedBurst {
  if (typeof item !== "object" || item === null || Array.isArray(item)) return NOT_AN_OBJECT;
  const { gauge, start, rateHz, temperature, values } = item as Record<string, unknown>;
  return decodeBurstFields(gauge, start, rateHz, temperature, values);
}

/** The fields of a burst, from JSON or from a binary body's query. */
export function decodeBurstFields(gauge: unknown, start: unknown, rateHz: unknown, temperature: unknown, values: unknown): DecodedBurst {
  if (typeof gauge !== "string" || gauge === "") return MISSING_GAUGE;
  const parsedStart = decodeBurstStart(start);
  if (isFailure(parsedStart)) return parsedStart;
  const rate = decodeBurstRate(rateHz);
  if (isFailure(rate)) return rate;
  const parsedTemperature = decodeBurstTemperature(temperature);
  if (isFailure(parsedTemperature)) return parsedTemperature;
  if (!Array.isArray(values) && !(values instanceof Float32Array)) return VALUES_NOT_ARRAY;
  if (values.length === 0) return EMPTY;
  return { gauge, start: parsedStart, rateHz: rate, temperature: parsedTemperature, values };
}

/** Epoch ms just after the last sample. */
export const burstEnd = (burst: Pick<IncomingBurst, "start" | "rateHz" | "values">) => burst.start + (burst.values.length * 1000) / burst.rateHz;
