import { Readable } from "node:stream";
import { CsvError, parse } from "csv-parse";
import { AppError } from "@/lib/errors";
import { LOGGER_CSV_OPTIONS } from "./csv-options";
import type { CsvColumns } from "./reading-input";

/** The contract's CSV header; temperature may be left out for gauges that need none. */
export const CSV_COLUMNS = ["gauge", "time", "value", "temperature"] as const;
const REQUIRED: readonly (typeof CSV_COLUMNS)[number][] = ["gauge", "time", "value"];
const HEADER = CSV_COLUMNS.join(",");

/**
 * Column positions from the header row. Names are matched case-insensitively in any order; a
 * missing or unknown column is refused before any row is read, since a misspelt "temperature"
 * would otherwise silently drop every temperature.
 */
export function csvColumns(header: readonly string[]): CsvColumns {
  const names = header.map((name) => name.trim().toLowerCase());
  if (names.length === 1 && /[;\t]/.test(names[0]!)) {
    const separator = names[0]!.includes(";") ? "semicolons" : "tabs";
    throw new AppError(
      "bad_request",
      `The file is separated by ${separator}; export it separated by commas with the header ${HEADER}, and decimals written with a point.`,
    );
  }
  for (const name of names) {
    if (!(CSV_COLUMNS as readonly string[]).includes(name)) {
      throw new AppError("bad_request", `Unknown CSV column "${name.slice(0, 40)}"; the header is ${HEADER}.`, { column: name });
    }
    if (names.indexOf(name) !== names.lastIndexOf(name)) {
      throw new AppError("bad_request", `The CSV column "${name}" appears twice; the header is ${HEADER}.`, { column: name });
    }
  }
  for (const name of REQUIRED) {
    if (!names.includes(name)) {
      throw new AppError("bad_request", `The CSV header lacks the column "${name}"; the header is ${HEADER} (temperature may be left out).`, {
        column: name,
      });
    }
  }
  return {
    gauge: names.indexOf("gauge"),
    time: names.indexOf("time"),
    value: names.indexOf("value"),
    temperature: names.indexOf("temperature"),
    width: names.length,
  };
}

/** A CSV data row and the file line it ends on (the header is line 1). */
export interface CsvRow {
  line: number;
  fields: string[];
}

/**
 * Streams the rows of a CSV body, header first: csv-parse reads it chunk by chunk with
 * backpressure, so a file of any size costs the memory of the rows the caller holds.
 * A UTF-8 byte-order mark is skipped; blank lines are ignored; a quote left open is a 400.
 */
export async function* csvRows(body: ReadableStream<Uint8Array> | AsyncIterable<Uint8Array | string>): AsyncGenerator<CsvRow> {
  const source = body instanceof ReadableStream ? Readable.fromWeb(body as import("node:stream/web").ReadableStream) : Readable.from(body);
  const parser = source.pipe(parse({ ...LOGGER_CSV_OPTIONS, info: true }));
  source.on("error", (error) => parser.destroy(error));
  try {
    for await (const { record, info } of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
      yield { line: info.lines, fields: record };
    }
  } catch (error) {
    if (error instanceof CsvError) {
      throw new AppError("bad_request", `The CSV cannot be read: ${error.message}`);
    }
    throw error;
  } finally {
    source.destroy();
  }
}
