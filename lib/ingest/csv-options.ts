import type { Options } from "csv-parse";

/**
 * How a logger file is read, by the server's stream (lib/ingest/csv.ts) and by the upload page's
 * preview alike, so that the preview shows the fields the server will store: a UTF-8 byte-order
 * mark skipped, blank lines ignored, a stray quote inside a field kept, rows of any width kept
 * (the server rejects a wrong width row by row).
 */
export const LOGGER_CSV_OPTIONS = { bom: true, relax_column_count: true, relax_quotes: true, skip_empty_lines: true } as const satisfies Options;
