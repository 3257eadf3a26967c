/**
 * Recognises a PDF by its content (ISO 32000-1, §7.5.2 and §7.5.5): a file opens with the header
 * "%PDF-" and a version number such as 1.7 or 2.0, and its last line is the end-of-file marker
 * "%%EOF". Pure functions, no framework imports.
 */

export const PDF_TYPE = "application/pdf";

const HEADER = /^%PDF-\d\.\d/;
const END_MARKER = "%%EOF";
/** Writers may leave a line ending or a little padding after the marker; the end is looked for in the last kilobyte. */
const TAIL_BYTES = 1024;

const latin1 = (bytes: Uint8Array) => String.fromCharCode(...bytes);

export type PdfInspection = "pdf" | "not-pdf" | "cut-short";

/** Whether the bytes are a PDF, something else, or a PDF whose end is missing (an interrupted download or copy). */
export function inspectPdf(bytes: Uint8Array): PdfInspection {
  if (!HEADER.test(latin1(bytes.subarray(0, 8)))) return "not-pdf";
  return latin1(bytes.subarray(Math.max(0, bytes.length - TAIL_BYTES))).includes(END_MARKER) ? "pdf" : "cut-short";
}
