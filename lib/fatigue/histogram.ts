import type { Cycle } from "./rainflow";

export interface RangeBin {
  /** Upper edge of the bin: the bin holds ranges in (range − width, range]. */
  range: number;
  count: number;
}

export interface RainflowMatrix {
  /** Row labels: upper edges of the range bins, ascending, every bin between the extremes. */
  rangeUpperEdges: number[];
  /** Column labels: centres of the mean bins, ascending, every bin between the extremes. */
  meanCentres: number[];
  /** counts[row][column], cycles with half cycles as 0.5. */
  counts: number[][];
  /**
   * Per row, the cycles counted without their mean (histograms stored before means were kept);
   * absent when every cycle's mean is known.
   */
  meanNotRecorded?: number[];
}

// Differences of sampled values carry rounding noise; without this slack a range meant to sit on
// a bin edge could spill into the next bin up.
const EDGE_TOLERANCE = 1e-9;

function checkWidth(width: number) {
  if (!(Number.isFinite(width) && width > 0)) throw new RangeError(`A bin width must be positive, got ${width}`);
}

/**
 * Range bins are labelled by their upper edge so that damage computed from a binned histogram
 * errs on the safe side (a larger range does more damage). A range of exactly k·width belongs to
 * bin k.
 */
export function rangeBinIndex(range: number, width: number): number {
  return Math.max(1, Math.ceil(range / width - EDGE_TOLERANCE));
}

/**
 * Mean bins are centred on multiples of the width, so a mean of zero sits mid-bin; a mean on a
 * boundary goes to the bin above. Adding 0 turns −0 into 0, which would otherwise label a column.
 */
export function meanBinIndex(mean: number, width: number): number {
  return Math.round(mean / width) + 0;
}

/** Sum of counts, with half cycles as 0.5: the number of cycles a histogram represents. */
export function totalCycleCount(cycles: Iterable<{ count: number }>): number {
  let total = 0;
  for (const { count } of cycles) total += count;
  return total;
}

/** Histogram of ranges: only occupied bins, ascending by range. */
export function binRanges(cycles: Iterable<Cycle>, binWidth: number): RangeBin[] {
  checkWidth(binWidth);
  const countsByBin = new Map<number, number>();
  for (const { range, count } of cycles) {
    const bin = rangeBinIndex(range, binWidth);
    countsByBin.set(bin, (countsByBin.get(bin) ?? 0) + count);
  }
  return [...countsByBin]
    .sort(([a], [b]) => a - b)
    .map(([bin, count]) => ({ range: bin * binWidth, count }));
}

/**
 * Merges cycles that share a (range bin, mean bin) cell into one cycle labelled by the cell: the
 * range bin's upper edge and the mean bin's centre. Binning the result again with the same widths
 * gives the same histogram and matrix as binning the originals, so a long history folds page by
 * page into at most one cycle per occupied cell. Ascending by range, then by mean.
 */
export function mergeIntoCells(cycles: Iterable<Cycle>, rangeBinWidth: number, meanBinWidth: number): Cycle[] {
  checkWidth(rangeBinWidth);
  checkWidth(meanBinWidth);
  const cells = new Map<string, Cycle>();
  for (const { range, mean, count } of cycles) {
    const rangeBin = rangeBinIndex(range, rangeBinWidth);
    const meanBin = meanBinIndex(mean, meanBinWidth);
    const key = `${rangeBin} ${meanBin}`;
    const cell = cells.get(key);
    if (cell) cell.count += count;
    else cells.set(key, { range: rangeBin * rangeBinWidth, mean: meanBin * meanBinWidth, count });
  }
  return [...cells.values()].sort((a, b) => a.range - b.range || a.mean - b.mean);
}

/** Every index from the lowest to the highest given; a loop, as spreading a year of cycles into Math.min overflows the stack. */
function indexSpan(indices: readonly number[]): number[] {
  let low = Infinity;
  let high = -Infinity;
  for (const index of indices) {
    low = Math.min(low, index);
    high = Math.max(high, index);
  }
  return indices.length === 0 ? [] : Array.from({ length: high - low + 1 }, (_, offset) => low + offset);
}

/**
 * Range × mean matrix for export. The grid is dense between the occupied extremes, so a narrow
 * width over a wide spread makes a large matrix: the caller picks widths to suit. Cycles whose
 * mean was never recorded (`withoutMean`, by range bin) get a column of their own rather than a
 * mean they did not have.
 */
export function rainflowMatrix(cycles: readonly Cycle[], rangeBinWidth: number, meanBinWidth: number, withoutMean: readonly RangeBin[] = []): RainflowMatrix {
  checkWidth(rangeBinWidth);
  checkWidth(meanBinWidth);
  const rangeBins = cycles.map(({ range }) => rangeBinIndex(range, rangeBinWidth));
  const meanBins = cycles.map(({ mean }) => meanBinIndex(mean, meanBinWidth));
  const unknownBins = withoutMean.map(({ range }) => rangeBinIndex(range, rangeBinWidth));
  const rows = indexSpan([...rangeBins, ...unknownBins]);
  const columns = indexSpan(meanBins);
  const counts = rows.map(() => columns.map(() => 0));
  cycles.forEach(({ count }, i) => {
    counts[rangeBins[i]! - rows[0]!]![meanBins[i]! - columns[0]!]! += count;
  });
  const matrix: RainflowMatrix = {
    rangeUpperEdges: rows.map((bin) => bin * rangeBinWidth),
    meanCentres: columns.map((bin) => bin * meanBinWidth),
    counts,
  };
  if (withoutMean.length > 0) {
    const unknown = rows.map(() => 0);
    withoutMean.forEach(({ count }, i) => {
      unknown[unknownBins[i]! - rows[0]!]! += count;
    });
    matrix.meanNotRecorded = unknown;
  }
  return matrix;
}
