import { describe, expect, it } from "vitest";
import { csvRows } from "@/lib/ingest/csv";
import { previewRows } from "@/lib/ingest/csv-preview";

// Quoted fields holding commas, line breaks and doubled quotes, as RFC 4180 (section 2, rules 5–7) allows.
const FILE =
  "\uFEFFgauge,time,value,temperature\r\n" +
  '"G,1",2026-03-01T12:00:00Z,0.0135,14.2\r\n' +
  "\r\n" +
  '"G\n2",2026-03-01T12:10:00Z,"0,0136",14.3\r\n' +
  '"say ""G3""",2026-03-01 12:20:00,0.0137,\r\n' +
  'G4,2026-03-01T12:30:00Z,1"5,14.5\r\n';

async function serverRows(text: string): Promise<string[][]> {
  const rows: string[][] = [];
  const body = (async function* () {
    yield text;
  })();
  for await (const row of csvRows(body)) rows.push(row.fields);
  return rows;
}

describe("the upload page's preview of a logger file", () => {
  it("reads the same fields as the server, quoted commas, line breaks and quotes included", async () => {
    const server = await serverRows(FILE);
    expect(server[2]).toEqual(["G\n2", "2026-03-01T12:10:00Z", "0,0136", "14.3"]);
    expect(previewRows(FILE, 10, true)).toEqual(server);
    expect(previewRows(FILE, 3, true)).toEqual(server.slice(0, 3));
  });

  it("drops the row a slice of the file cuts, even inside a quoted field that spans lines", async () => {
    const server = await serverRows(FILE);
    const insideQuotedBreak = FILE.indexOf("\n2") + 1;
    expect(previewRows(FILE.slice(0, insideQuotedBreak), 10, false)).toEqual(server.slice(0, 2));
    const midRow = FILE.indexOf("G4") + 5;
    expect(previewRows(FILE.slice(0, midRow), 10, false)).toEqual(server.slice(0, 4));
  });
});
