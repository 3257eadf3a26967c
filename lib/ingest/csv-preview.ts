import { CsvError, parse } from "csv-parse/browser/esm/sync";
import { LOGGER_CSV_OPTIONS } from "./csv-options";

/**
 * The first rows of a logger file as the browser reads them from its first few kilobytes, to show
 * before uploading, read by csv-parse with the server's options. A row cut by the end of the
 * slice is dropped; so is one whose quoted field runs past it.
 */
export function previewRows(head: string, maxRows: number, wholeFile: boolean): string[][] {
  let text = wholeFile ? head : head.slice(0, head.lastIndexOf("\n") + 1);
  for (;;) {
    try {
      return parse(text, { ...LOGGER_CSV_OPTIONS, to: maxRows });
    } catch (error) {
      // A quote still open at the end: the slice ends inside a quoted field. Try one line less.
      if (!(error instanceof CsvError) || error.code !== "CSV_QUOTE_NOT_CLOSED" || text === "") return [];
      text = text.slice(0, text.lastIndexOf("\n", text.length - 2) + 1);
    }
  }
}

/** A CSV field, quoted when it must be. */
export function csvField(value: string | number): string {
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}
