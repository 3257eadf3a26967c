import type { ReadingErrorCode } from "@/lib/mechanics";

/**
 * Why a reading can be refused, as `rejected[].code` of the ingestion response. The catalogue is
 * printed in the OpenAPI document, so integrators can match on the codes.
 */
export const REJECTION_CODES = {
  "invalid-reading": "The reading is not a JSON object with gauge, time and value.",
  "wrong-column-count": "A CSV row has more or fewer fields than the header (a decimal comma splits a number in two).",
  "missing-gauge": "The reading names no gauge tag.",
  "unknown-gauge": "No gauge of the structure has this tag.",
  "retired-gauge": "The gauge is retired and takes no more readings.",
  "gauge-not-convertible": "The gauge's stored configuration cannot convert readings; fix the gauge first.",
  "missing-time": "The reading has no time.",
  "invalid-time": "The time is not ISO-8601 with a date, lacks an offset where one is required, or is before 1970.",
  "time-in-future": "The time is more than 5 minutes ahead of the server's clock.",
  "missing-value": "The reading has no value.",
  "not-finite":
    "The value, or the temperature, strain or stress it converts to, is not a finite number (text, NaN, Infinity, or a value so far outside anything a gauge reads that its conversion overflows).",
  "before-zero": "The time is earlier than the gauge's first zero reading, from which its strain is measured.",
  "temperature-out-of-range": "The temperature is outside −80…+150 °C, beyond what a strain gauge installation reads.",
  "temperature-required": "The gauge's temperature compensation needs the temperature at each reading.",
  "non-positive-frequency": "A vibrating-wire frequency must be above 0 Hz.",
  "non-positive-frequency-squared": "A vibrating-wire reading in f²/1000 must be above 0.",
  "impossible-bridge-output": "No bridge of the gauge's arrangement can produce this output change.",
} as const satisfies Record<string, string> & Record<ReadingErrorCode, string>;

export type RejectionCode = keyof typeof REJECTION_CODES;

export interface Rejection {
  /** Position of the reading in the request (JSON array index, or CSV data row counted from 0). */
  index: number;
  code: RejectionCode;
  message: string;
}

