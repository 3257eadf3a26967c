import type { RainflowMatrix } from "./histogram";

// Bin labels are multiples of a width and can carry binary rounding noise (0.30000000000000004).
const label = (value: number) => String(Number(value.toPrecision(12)));

/** The column of cycles counted without their mean, for histograms stored before means were kept. */
export const MEAN_NOT_RECORDED = "mean not recorded";

/**
 * The rainflow matrix as CSV for a spreadsheet: one row per range bin (upper edge, MPa), one
 * column per mean bin (centre, MPa), cycles in the cells with half cycles as 0.5, and a last
 * column "mean not recorded" when some cycles were stored without their mean. The corner cell
 * names both axes, so the file explains itself without a side note.
 */
export function rainflowMatrixCsv(matrix: RainflowMatrix): string {
  const unknown = matrix.meanNotRecorded;
  const header = ["range bin upper edge (MPa) \\ mean bin centre (MPa)", ...matrix.meanCentres.map(label), ...(unknown ? [MEAN_NOT_RECORDED] : [])];
  const rows = matrix.rangeUpperEdges.map((edge, i) => [label(edge), ...matrix.counts[i]!.map(String), ...(unknown ? [String(unknown[i]!)] : [])]);
  // RFC 4180 line ends; no cell holds a comma or a quote, so none needs quoting.
  return [header, ...rows].map((row) => row.join(",")).join("\r\n") + "\r\n";
}
