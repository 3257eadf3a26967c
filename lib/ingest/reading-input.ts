import { failure, type Failure } from "@/lib/mechanics/result";
import type { RejectionCode } from "./rejections";
import { parseReadingTime } from "./reading-time";

/** A reading as sent, decoded and checked on its own, before its gauge is looked at. */
export interface IncomingReading {
  gauge: string;
  /** Epoch ms. */
  time: number;
  /** Raw value in the gauge's input unit. */
  value: number;
  /** °C, or null when not sent. */
  temperature: number | null;
}

export type DecodedReading = IncomingReading | Failure<RejectionCode>;

export const isProblem = (reading: DecodedReading): reading is Failure<RejectionCode> => "ok" in reading;

const NOT_AN_OBJECT = failure("invalid-reading", 'Each reading is an object: { "gauge": tag, "time": ISO time, "value": number, "temperature"?: number }.');
const MISSING_GAUGE = failure("missing-gauge", 'Name the reading\'s gauge by its tag in "gauge".');
const MISSING_TIME = failure("missing-time", "The reading has no time; send it as ISO-8601 with Z or an offset.");
const TIME_NOT_TEXT = failure("invalid-time", 'The time must be ISO-8601 text such as "2026-03-01T12:00:00Z", not a number.');
const MISSING_VALUE = failure("missing-value", "The reading has no value; send the logger's raw value as a number.");
const VALUE_NOT_NUMBER = failure(
  "not-finite",
  "The value must be a JSON number. JSON cannot carry NaN or Infinity: leave such readings out.",
);
const TEMPERATURE_NOT_NUMBER = failure("not-finite", "The temperature must be a number in °C, or left out.");

function textValueProblem(text: string): Failure<"not-finite"> {
  return failure(
    "not-finite",
    `The value "${text.slice(0, 40)}" is text; send the raw value as a JSON number (JSON cannot carry NaN or Infinity: leave such readings out).`,
  );
}

/** One element of a JSON `readings` array; its time must carry an offset, as the contract says. */
export function decodeJsonReading(item: unknown): DecodedReading {
  if (typeof item !== "object" || item === null || Array.isArray(item)) return NOT_AN_OBJECT;
  const { gauge, time, value, temperature } = item as Record<string, unknown>;
  if (typeof gauge !== "string" || gauge === "") return MISSING_GAUGE;
  if (time === undefined || time === null || time === "") return MISSING_TIME;
  if (typeof time !== "string") return TIME_NOT_TEXT;
  const parsedTime = parseReadingTime(time, null);
  if (typeof parsedTime !== "number") return parsedTime;
  if (value === undefined || value === null) return MISSING_VALUE;
  if (typeof value === "string") return textValueProblem(value);
  if (typeof value !== "number" || !Number.isFinite(value)) return VALUE_NOT_NUMBER;
  if (temperature !== undefined && temperature !== null && (typeof temperature !== "number" || !Number.isFinite(temperature))) {
    return TEMPERATURE_NOT_NUMBER;
  }
  return { gauge, time: parsedTime, value, temperature: (temperature as number | null | undefined) ?? null };
}

/** Where each contract column sits in the file's rows. */
export interface CsvColumns {
  gauge: number;
  time: number;
  value: number;
  /** -1 when the file has no temperature column. */
  temperature: number;
  /** Fields per row, from the header. */
  width: number;
}

const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?\d*,\d+$/;

/** A CSV cell as a number: plain decimal notation only, so "NaN", "1e999" or "12,5" are refused. */
function csvNumber(text: string): number | null {
  const trimmed = text.trim();
  if (!DECIMAL.test(trimmed)) return null;
  const number = Number(trimmed);
  return Number.isFinite(number) ? number : null;
}

function csvNumberProblem<Code extends RejectionCode>(code: Code, what: string, text: string): Failure<Code> {
  const hint = DECIMAL_COMMA.test(text.trim())
    ? " Write decimals with a point (12.5), not a comma."
    : " Write it as a plain decimal number; NaN and Infinity are not readings.";
  return failure(code, `The ${what} "${text.slice(0, 40)}" is not a finite number.${hint}`);
}

/** One CSV data row; times without an offset are read in `zone`. */
export function decodeCsvReading(fields: readonly string[], columns: CsvColumns, zone: string): DecodedReading {
  if (fields.length !== columns.width) {
    return failure(
      "wrong-column-count",
      `The row has ${fields.length} fields where the header has ${columns.width}. A decimal comma splits a number in two: write decimals with a point, or quote the field.`,
    );
  }
  const gauge = fields[columns.gauge]!.trim();
  if (gauge === "") return MISSING_GAUGE;
  const timeText = fields[columns.time]!;
  if (timeText.trim() === "") return MISSING_TIME;
  const time = parseReadingTime(timeText, zone);
  if (typeof time !== "number") return time;
  const valueText = fields[columns.value]!;
  if (valueText.trim() === "") return MISSING_VALUE;
  const value = csvNumber(valueText);
  if (value === null) return csvNumberProblem("not-finite", "value", valueText);
  const temperatureText = columns.temperature < 0 ? "" : fields[columns.temperature]!;
  if (temperatureText.trim() === "") return { gauge, time, value, temperature: null };
  const temperature = csvNumber(temperatureText);
  if (temperature === null) return csvNumberProblem("not-finite", "temperature", temperatureText);
  return { gauge, time, value, temperature };
}
