/**
 * The first rows of a logger file as the browser reads them from its first few kilobytes, to show
 * before uploading. Quotes are honoured within a line; a line cut by the end of the slice is dropped.
 */
export function previewRows(head: string, maxRows: number, wholeFile: boolean): string[][] {
  const lines = head.replace(/^\uFEFF/, "").split(/\r?\n/);
  if (!wholeFile) lines.pop();
  return lines
    .filter((line) => line.trim() !== "")
    .slice(0, maxRows)
    .map(splitLine);
}

function splitLine(line: string): string[] {
  const fields: string[] = [];
  let field = "";
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const char = line[i]!;
    if (quoted) {
      if (char === '"' && line[i + 1] === '"') {
        field += '"';
        i++;
      } else if (char === '"') quoted = false;
      else field += char;
    } else if (char === '"') quoted = true;
    else if (char === ",") {
      fields.push(field);
      field = "";
    } else field += char;
  }
  fields.push(field);
  return fields;
}

/** A CSV field, quoted when it must be. */
export function csvField(value: string | number): string {
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}
