import { rangeBinIndex, type RangeBin } from "@/lib/fatigue";

/**
 * Rainflow ranges counted in fixed-width bins (MPa): `counts[k − 1]` holds the cycles with a range
 * in ((k − 1)·w, k·w], labelled by the upper edge as lib/fatigue does, so damage from a binned
 * histogram errs on the safe side. Half cycles count 0.5; every count is a multiple of 0.5 and so
 * exact in a double, which makes merging exactly associative and independent of order.
 */
export interface RangeHistogram {
  readonly binWidth: number;
  counts: Float64Array;
}

export function emptyHistogram(binWidth: number): RangeHistogram {
  if (!(Number.isFinite(binWidth) && binWidth > 0)) throw new RangeError(`A range bin is a positive width in MPa, got ${binWidth}`);
  return { binWidth, counts: new Float64Array(0) };
}

/** Adds `count` cycles of `range`; the array grows by doubling, so a stream of cycles rarely allocates. */
export function addRange(histogram: RangeHistogram, range: number, count: number): void {
  const bin = rangeBinIndex(range, histogram.binWidth);
  if (bin > histogram.counts.length) {
    const grown = new Float64Array(Math.max(bin, histogram.counts.length * 2, 16));
    grown.set(histogram.counts);
    histogram.counts = grown;
  }
  histogram.counts[bin - 1]! += count;
}

function checkSameWidth(a: RangeHistogram, b: RangeHistogram) {
  if (a.binWidth !== b.binWidth) {
    throw new RangeError(`Histograms in bins of ${a.binWidth} and ${b.binWidth} MPa cannot be added; rebin one first.`);
  }
}

/** A new histogram holding both; neither argument changes. */
export function mergeHistograms(a: RangeHistogram, b: RangeHistogram): RangeHistogram {
  checkSameWidth(a, b);
  const [longer, shorter] = a.counts.length >= b.counts.length ? [a.counts, b.counts] : [b.counts, a.counts];
  const counts = Float64Array.from(longer);
  for (let i = 0; i < shorter.length; i++) counts[i]! += shorter[i]!;
  return { binWidth: a.binWidth, counts };
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

// Encoding: the bin width as a float64, then for each occupied bin the gap in bin number since
// the previous occupied one and twice its count, both as LEB128 varints. A 10-minute interval
// of traffic occupies a few dozen bins, so it takes tens of bytes rather than a dense array.

function writeVarint(out: number[], value: number) {
  let rest = value;
  while (rest >= 0x80) {
    out.push((rest % 0x80) | 0x80);
    rest = Math.floor(rest / 0x80);
  }
  out.push(rest);
}

export function encodeHistogram(histogram: RangeHistogram): Uint8Array {
  const body: number[] = [];
  let previous = 0;
  histogram.counts.forEach((count, i) => {
    if (count <= 0) return;
    writeVarint(body, i + 1 - previous);
    writeVarint(body, Math.round(count * 2));
    previous = i + 1;
  });
  const bytes = new Uint8Array(8 + body.length);
  new DataView(bytes.buffer).setFloat64(0, histogram.binWidth, true);
  bytes.set(body, 8);
  return bytes;
}

export function decodeHistogram(bytes: Uint8Array): RangeHistogram {
  if (bytes.byteLength < 8) throw new RangeError("A stored histogram is at least its 8-byte bin width.");
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const histogram = emptyHistogram(view.getFloat64(0, true));
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
    addRange(histogram, bin * histogram.binWidth, count);
  }
  return histogram;
}
