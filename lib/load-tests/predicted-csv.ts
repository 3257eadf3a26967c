import { CsvError, parse } from "csv-parse/browser/esm/sync";

/** One gauge's predicted peak strain from the engineer's model, µε (tension positive). */
export interface PredictedStrain {
  gauge: string;
  predicted: number;
}

export type PredictedTable = { ok: true; rows: PredictedStrain[] } | { ok: false; problems: string[] };

/** A load test names at most this many gauges: more is a pasted file of readings, not a prediction table. */
export const MAX_PREDICTED_ROWS = 500;

const GAUGE_HEADERS = ["gauge", "tag", "gauge tag"];
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A header cell without its unit: "predicted (µε)" reads as "predicted". */
const headerName = (cell: string) => cell.replace(/\(.*\)|\[.*\]/g, "").trim().toLowerCase();

/** Where the tag and the prediction are: from a header naming them, or the first two columns of a file without one. */
function columnsOf(first: string[]): { gauge: number; predicted: number; header: boolean; width: number } {
  const names = first.map(headerName);
  const gauge = names.findIndex((name) => GAUGE_HEADERS.includes(name));
  const predicted = names.findIndex((name) => name.startsWith("predicted"));
  if (gauge >= 0 && predicted >= 0) return { gauge, predicted, header: true, width: first.length };
  return { gauge: 0, predicted: 1, header: false, width: 2 };
}

/**
 * The predicted-strain table as typed or uploaded: CSV with a header naming a `gauge` (or `tag`)
 * column and a `predicted` one (a unit in brackets is allowed: `predicted (µε)`), or two columns
 * without a header. Every line with a problem is reported (line 1 is the first line), so the
 * engineer fixes the file once; a prediction of 0 has no sign to measure in and is refused.
 */
export function parsePredictedTable(text: string): PredictedTable {
  let records: string[][];
  try {
    records = parse(text, { bom: true, skip_empty_lines: true, relax_column_count: true, trim: true });
  } catch (error) {
    const message = error instanceof CsvError ? error.message : String(error);
    return { ok: false, problems: [`The table is not readable as CSV: ${message}`] };
  }
  const nonEmpty = records.map((cells, index) => ({ cells, line: index + 1 })).filter(({ cells }) => cells.some((cell) => cell !== ""));
  if (nonEmpty.length === 0) return { ok: false, problems: ["The table is empty: give one line per gauge, its tag and the predicted strain in µε."] };
  const columns = columnsOf(nonEmpty[0]!.cells);
  const body = columns.header ? nonEmpty.slice(1) : nonEmpty;
  if (body.length === 0) return { ok: false, problems: ["The table has a header and no gauges: add one line per gauge below it."] };
  if (body.length > MAX_PREDICTED_ROWS) return { ok: false, problems: [`The table has ${body.length} gauges; a load test takes at most ${MAX_PREDICTED_ROWS}.`] };

  const problems: string[] = [];
  const rows: PredictedStrain[] = [];
  const lineOf = new Map<string, number>();
  for (const { cells, line } of body) {
    if (cells.length > columns.width) {
      problems.push(`Line ${line}: ${cells.length} fields where the table has ${columns.width}; write decimals with a point, not a comma.`);
      continue;
    }
    const gauge = cells[columns.gauge] ?? "";
    const value = cells[columns.predicted] ?? "";
    if (gauge === "") {
      problems.push(`Line ${line}: the gauge tag is missing.`);
      continue;
    }
    if (!NUMBER.test(value)) {
      problems.push(
        value === ""
          ? `Line ${line} (${gauge}): the predicted strain is missing.`
          : `Line ${line} (${gauge}): "${value}" is not a number; write µε with a decimal point, e.g. 85.5.`,
      );
      continue;
    }
    const predicted = Number(value);
    if (!Number.isFinite(predicted)) {
      problems.push(`Line ${line} (${gauge}): ${value} is beyond any strain; give µε.`);
      continue;
    }
    if (predicted === 0) {
      problems.push(`Line ${line} (${gauge}): a predicted strain of 0 µε has no sign to measure in and no ratio; leave the gauge out instead.`);
      continue;
    }
    const earlier = lineOf.get(gauge);
    if (earlier !== undefined) {
      problems.push(`Line ${line}: gauge ${gauge} is already on line ${earlier}.`);
      continue;
    }
    lineOf.set(gauge, line);
    rows.push({ gauge, predicted });
  }
  return problems.length ? { ok: false, problems } : { ok: true, rows };
}
