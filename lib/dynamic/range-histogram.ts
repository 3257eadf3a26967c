import { meanBinIndex, rangeBinIndex, type Cycle, type RangeBin } from "@/lib/fatigue";

/**
 * Rainflow ranges counted in fixed-width bins (MPa): `counts[k − 1]` holds the cycles with a range
 * in ((k − 1)·w, k·w], labelled by the upper edge as lib/fatigue does, so damage from a binned
 * histogram errs on the safe side. Half cycles count 0.5; every count is a multiple of 0.5 and so
 * exact in a double, which makes merging exactly associative and independent of order.
 *
 * `means[k − 1]` splits range bin k by the cycles' means (ASTM E1049: the mean of a cycle's two
 * extremes), in mean bins of the same width centred on multiples of it (bin j holds means in
 * [(j − ½)·w, (j + ½)·w)). Histograms stored before means were kept have none: the part of a
 * range bin's count that its mean bins do not hold is "mean not recorded", never guessed.
 */
export interface RangeHistogram {
  readonly binWidth: number;
  counts: Float64Array;
  /**
   * Range bin k − 1 → (mean bin → half cycles); a row is absent when no mean was recorded in it.
   * Whole half cycles keep the values small integers, which the engine stores without allocating.
   */
  means: (Map<number, number> | undefined)[];
}

export function emptyHistogram(binWidth: number): RangeHistogram {
  if (!(Number.isFinite(binWidth) && binWidth > 0)) throw new RangeError(`A range bin is a positive width in MPa, got ${binWidth}`);
  return { binWidth, counts: new Float64Array(0), means: [] };
}

/** Adds `count` cycles of `range` whose mean is not known; the array grows by doubling, so a stream of cycles rarely allocates. */
export function addRange(histogram: RangeHistogram, range: number, count: number): number {
  const bin = rangeBinIndex(range, histogram.binWidth);
  if (bin > histogram.counts.length) {
    const grown = new Float64Array(Math.max(bin, histogram.counts.length * 2, 16));
    grown.set(histogram.counts);
    histogram.counts = grown;
  }
  histogram.counts[bin - 1]! += count;
  return bin;
}

function addToMeanBin(histogram: RangeHistogram, bin: number, meanBin: number, halves: number) {
  let row = histogram.means[bin - 1];
  if (!row) histogram.means[bin - 1] = row = new Map();
  row.set(meanBin, (row.get(meanBin) ?? 0) + halves);
}

/** Adds `count` cycles between the extremes `from` and `to`, with their range and mean; answers the range. */
export function addCycle(histogram: RangeHistogram, from: number, to: number, count: number): number {
  const range = Math.abs(to - from);
  const bin = addRange(histogram, range, count);
  addToMeanBin(histogram, bin, meanBinIndex((from + to) / 2, histogram.binWidth), count * 2);
  return range;
}

function checkSameWidth(a: RangeHistogram, b: RangeHistogram) {
  if (a.binWidth !== b.binWidth) {
    throw new RangeError(`Histograms in bins of ${a.binWidth} and ${b.binWidth} MPa cannot be added; rebin one first.`);
  }
}

function mergeMeanRows(a: Map<number, number> | undefined, b: Map<number, number> | undefined): Map<number, number> | undefined {
  if (!a || !b) return a || b ? new Map(a ?? b) : undefined;
  const merged = new Map(a);
  for (const [meanBin, halves] of b) merged.set(meanBin, (merged.get(meanBin) ?? 0) + halves);
  return merged;
}

/** A new histogram holding both; neither argument changes. */
export function mergeHistograms(a: RangeHistogram, b: RangeHistogram): RangeHistogram {
  checkSameWidth(a, b);
  const [longer, shorter] = a.counts.length >= b.counts.length ? [a.counts, b.counts] : [b.counts, a.counts];
  const counts = Float64Array.from(longer);
  for (let i = 0; i < shorter.length; i++) counts[i]! += shorter[i]!;
  const rows = Math.max(a.means.length, b.means.length);
  const means = Array.from({ length: rows }, (_, i) => mergeMeanRows(a.means[i], b.means[i]));
  return { binWidth: a.binWidth, counts, means };
}

/**
 * The same cycles in bins of another width, each moved by its range bin's upper edge (so damage
 * still errs on the safe side) and its mean bin's centre; for a gauge whose bin width changed.
 */
export function rebinHistogram(histogram: RangeHistogram, binWidth: number): RangeHistogram {
  if (histogram.binWidth === binWidth) return histogram;
  const rebinned = emptyHistogram(binWidth);
  histogram.counts.forEach((count, i) => {
    if (count <= 0) return;
    const bin = addRange(rebinned, (i + 1) * histogram.binWidth, count);
    for (const [meanBin, halves] of histogram.means[i] ?? []) addToMeanBin(rebinned, bin, meanBinIndex(meanBin * histogram.binWidth, binWidth), halves);
  });
  return rebinned;
}

/**
 * The histogram as range × mean cells (range bin upper edge, mean bin centre, MPa) and, by range
 * bin, the cycles without a recorded mean; ascending by range, then by mean.
 */
export function histogramCells(histogram: RangeHistogram): { cells: Cycle[]; withoutMean: RangeBin[] } {
  const cells: Cycle[] = [];
  const withoutMean: RangeBin[] = [];
  const width = histogram.binWidth;
  histogram.counts.forEach((count, i) => {
    if (count <= 0) return;
    const range = (i + 1) * width;
    let known = 0;
    for (const [meanBin, halves] of [...(histogram.means[i] ?? [])].sort(([a], [b]) => a - b)) {
      cells.push({ range, mean: meanBin * width, count: halves / 2 });
      known += halves / 2;
    }
    if (count > known) withoutMean.push({ range, count: count - known });
  });
  return { cells, withoutMean };
}

/** Occupied bins as lib/fatigue's histogram, ascending, for Miner sums and the API. */
export function occupiedBins(histogram: RangeHistogram): RangeBin[] {
  const bins: RangeBin[] = [];
  histogram.counts.forEach((count, i) => {
    if (count > 0) bins.push({ range: (i + 1) * histogram.binWidth, count });
  });
  return bins;
}

/** Cycles the histogram holds, half cycles as 0.5. */
export function histogramCycles(histogram: RangeHistogram): number {
  let total = 0;
  for (const count of histogram.counts) total += count;
  return total;
}

/** Upper edge of the highest occupied bin, 0 when empty. */
export function largestBinnedRange(histogram: RangeHistogram): number {
  for (let i = histogram.counts.length - 1; i >= 0; i--) if (histogram.counts[i]! > 0) return (i + 1) * histogram.binWidth;
  return 0;
}

// Encoding, format 2: the bin width negated as a float64 (format 1 wrote it positive, and a width
// is always positive, so the sign tells the two apart), then for each occupied range bin, as
// LEB128 varints: the gap in bin number since the previous occupied one, twice its count, the
// number of its mean bins, and for each mean bin ascending the zigzagged step in mean bin number
// since the previous (from 0) and twice its count. Format 1 stopped after twice the count: its
// cycles read back as "mean not recorded". A 10-minute interval of traffic occupies a few dozen
// cells, so it takes a few hundred bytes rather than a dense array.

function writeVarint(out: number[], value: number) {
  let rest = value;
  while (rest >= 0x80) {
    out.push((rest % 0x80) | 0x80);
    rest = Math.floor(rest / 0x80);
  }
  out.push(rest);
}

// Arithmetic rather than bit operations: a mean bin number need not fit in 32 bits.
const zigzag = (value: number) => (value >= 0 ? 2 * value : -2 * value - 1);
const unzigzag = (value: number) => (value % 2 === 0 ? value / 2 : -(value + 1) / 2);

export function encodeHistogram(histogram: RangeHistogram): Uint8Array {
  const body: number[] = [];
  let previous = 0;
  histogram.counts.forEach((count, i) => {
    if (count <= 0) return;
    writeVarint(body, i + 1 - previous);
    writeVarint(body, Math.round(count * 2));
    const row = [...(histogram.means[i] ?? [])].sort(([a], [b]) => a - b);
    writeVarint(body, row.length);
    let previousMean = 0;
    for (const [meanBin, halves] of row) {
      writeVarint(body, zigzag(meanBin - previousMean));
      writeVarint(body, halves);
      previousMean = meanBin;
    }
    previous = i + 1;
  });
  const bytes = new Uint8Array(8 + body.length);
  new DataView(bytes.buffer).setFloat64(0, -histogram.binWidth, true);
  bytes.set(body, 8);
  return bytes;
}

/** Reads either format; a histogram of format 1 comes back with no means recorded. */
export function decodeHistogram(bytes: Uint8Array): RangeHistogram {
  if (bytes.byteLength < 8) throw new RangeError("A stored histogram is at least its 8-byte bin width.");
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const header = view.getFloat64(0, true);
  const withMeans = header < 0;
  const histogram = emptyHistogram(Math.abs(header));
  let offset = 8;
  const readVarint = () => {
    let value = 0;
    let scale = 1;
    for (;;) {
      if (offset >= bytes.byteLength) throw new RangeError("A stored histogram ends inside a number.");
      const byte = bytes[offset++]!;
      value += (byte & 0x7f) * scale;
      if (byte < 0x80) return value;
      scale *= 0x80;
    }
  };
  let bin = 0;
  while (offset < bytes.byteLength) {
    bin += readVarint();
    const count = readVarint() / 2;
    const stored = addRange(histogram, bin * histogram.binWidth, count);
    if (!withMeans) continue;
    let meanBin = 0;
    let known = 0;
    for (let cells = readVarint(); cells > 0; cells--) {
      meanBin += unzigzag(readVarint());
      const halves = readVarint();
      addToMeanBin(histogram, stored, meanBin, halves);
      known += halves / 2;
    }
    if (known > count) throw new RangeError(`A stored histogram holds more cycles by mean (${known}) than by range (${count}) in range bin ${bin}.`);
  }
  return histogram;
}
