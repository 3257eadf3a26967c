import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { gaugeResponse, gaugeResult, loadTestInput, parsePredictedTable, resultsCsv, RESULTS_CSV_HEADER, type GaugeOfTest } from "@/lib/load-tests";

describe("predicted-strain table", () => {
  it("reads a header in any order, with a unit in brackets, and a file without a header", () => {
    expect(parsePredictedTable("predicted (µε),gauge\n-85.5,G1\n1.2e2,G2\n")).toEqual({
      ok: true,
      rows: [
        { gauge: "G1", predicted: -85.5 },
        { gauge: "G2", predicted: 120 },
      ],
    });
    expect(parsePredictedTable("\uFEFFG1, 40\r\n\r\nG2,-.5\r\n")).toEqual({
      ok: true,
      rows: [
        { gauge: "G1", predicted: 40 },
        { gauge: "G2", predicted: -0.5 },
      ],
    });
  });

  it("names every line to fix: bad numbers, decimal commas, zero, repeats, missing tags", () => {
    const table = parsePredictedTable(["gauge,predicted", "G1,abc", "G2,85,5", "G3,0", "G4,12", "G4,13", ",14", "G5,"].join("\n"));
    expect(table.ok).toBe(false);
    if (table.ok) return;
    expect(table.problems).toEqual([
      'Line 2 (G1): "abc" is not a number; write µε with a decimal point, e.g. 85.5.',
      "Line 3: 3 fields where the table has 2; write decimals with a point, not a comma.",
      "Line 4 (G3): a predicted strain of 0 µε has no sign to measure in and no ratio; leave the gauge out instead.",
      "Line 6: gauge G4 is already on line 5.",
      "Line 7: the gauge tag is missing.",
      "Line 8 (G5): the predicted strain is missing.",
    ]);
  });

  it("refuses an empty table and a header alone", () => {
    expect(parsePredictedTable("\n\n")).toMatchObject({ ok: false, problems: [expect.stringContaining("empty")] });
    expect(parsePredictedTable("gauge,predicted\n")).toMatchObject({ ok: false, problems: [expect.stringContaining("no gauges")] });
  });
});

describe("load test input", () => {
  const base = { title: "Static test", load: "Two trucks at midspan", start: "2026-06-02T09:00:00Z", end: "2026-06-02T10:00:00+01:00" };

  it("refuses a window that ends at or before its start, naming the field", () => {
    const result = loadTestInput.safeParse({ ...base, predicted: [{ gauge: "G1", predicted: 50 }] });
    expect(result.success).toBe(false);
    expect(result.error?.issues).toEqual([expect.objectContaining({ path: ["end"], message: "The end of the window must be after its start." })]);
  });

  it("takes the table as CSV text and reports its problems on predictedCsv", () => {
    const ok = loadTestInput.parse({ ...base, end: "2026-06-02T10:00:00Z", predictedCsv: "gauge,predicted\nG1,50" });
    expect(ok).toEqual({ title: "Static test", load: "Two trucks at midspan", start: Date.UTC(2026, 5, 2, 9), end: Date.UTC(2026, 5, 2, 10), predicted: [{ gauge: "G1", predicted: 50 }] });
    const bad = loadTestInput.safeParse({ ...base, end: "2026-06-02T10:00:00Z", predictedCsv: "gauge,predicted\nG1,fifty" });
    expect(bad.error?.issues).toEqual([expect.objectContaining({ path: ["predictedCsv"], message: expect.stringContaining('"fifty" is not a number') })]);
  });
});

describe("results CSV", () => {
  const gauge = (tag: string, predicted: number): GaugeOfTest => ({ gauge: tag, label: null, member: "Girder, 2", source: "readings", predicted });
  const t = Date.UTC(2026, 5, 2, 9, 15);

  it("parses back (csv-parse) with units in the header, strain to 0.1 µε, ratios to 0.01 and empty cells where nothing was measured", () => {
    const measured = gaugeResult(gauge("G1", 100), gaugeResponse(100, { time: t - 60_000, strain: 40.04 }, [{ start: t, end: t, low: 60, high: 163.456 }]));
    const empty = gaugeResult(gauge("G2", -30), gaugeResponse(-30, { time: t, strain: 0 }, []));
    const text = resultsCsv({ gauges: [measured, empty] });
    const [header, first, second] = parse(text, { bom: true }) as string[][];
    expect(header).toEqual([...RESULTS_CSV_HEADER]);
    const row = Object.fromEntries(header!.map((name, i) => [name, first![i]]));
    expect(row).toMatchObject({
      gauge: "G1",
      member: "Girder, 2",
      "predicted (µε)": "100.0",
      "baseline (µε)": "40.0",
      "measured peak (µε)": "123.4",
      "ratio (measured/predicted)": "1.23",
      "largest change against (µε)": "0.0",
      "peak from (UTC)": "2026-06-02T09:15:00.000Z",
    });
    expect(second![header!.indexOf("measured peak (µε)")]).toBe("");
    expect(second![header!.indexOf("state")]).toMatch(/^No data in window/);
  });
});
