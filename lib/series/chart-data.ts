/** Shapes the series API's answer for charts: pure, so it is tested without a browser. */

export type SeriesAnswer = {
  quantity: string;
  unit: string;
  t: number[];
  min: number[];
  max: number[];
  mean: number[];
  count: number[];
  /** Width of the answer's buckets, ms; empty buckets are left out of `t`. */
  bucketWidth?: number;
};

/** A value column for uPlot, where null breaks the line (and the band) instead of bridging a gap. */
export type ChartColumn = (number | null)[];

/**
 * The longest step between two buckets that is drawn as one line: one and a half expected
 * intervals (a missed reading breaks it, a late one does not) and never under three buckets, so a
 * coarse view does not break at every empty bucket.
 */
export function gapThreshold(expectedIntervalS: number, bucketWidthMs = 0): number {
  return Math.max(1.5 * expectedIntervalS * 1000, 3 * bucketWidthMs);
}

/**
 * uPlot wants seconds on x and one array per series: [t, min, max, mean], values mapped to display
 * units. Where two buckets are further apart than `breakAfterMs`, a point with no values goes
 * between them: the line and the min/max band stop there, so a logger's silence is never drawn
 * as a straight line of invented data.
 */
export function chartColumns(series: SeriesAnswer, toDisplay: (value: number) => number, breakAfterMs = Infinity): [number[], ChartColumn, ChartColumn, ChartColumn] {
  const columns: [number[], ChartColumn, ChartColumn, ChartColumn] = [[], [], [], []];
  series.t.forEach((ms, i) => {
    const previous = series.t[i - 1];
    if (previous !== undefined && ms - previous > breakAfterMs) {
      columns[0].push((previous + ms) / 2000);
      columns[1].push(null);
      columns[2].push(null);
      columns[3].push(null);
    }
    columns[0].push(ms / 1000);
    columns[1].push(toDisplay(series.min[i]!));
    columns[2].push(toDisplay(series.max[i]!));
    columns[3].push(toDisplay(series.mean[i]!));
  });
  return columns;
}

/** Pairs bucket means of two series taken over the same grid (same from, to and points). */
export function pairByTime(x: SeriesAnswer, y: SeriesAnswer): { x: number[]; y: number[] } {
  const yAt = new Map(y.t.map((time, i) => [time, y.mean[i]!]));
  const pairs = { x: [] as number[], y: [] as number[] };
  x.t.forEach((time, i) => {
    const other = yAt.get(time);
    if (other === undefined) return;
    pairs.x.push(x.mean[i]!);
    pairs.y.push(other);
  });
  return pairs;
}

/** Least-squares slope of y on x: µε per °C for strain against temperature; null without spread in x. */
export function leastSquaresSlope(x: readonly number[], y: readonly number[]): number | null {
  const n = x.length;
  if (n < 2) return null;
  const meanX = x.reduce((a, b) => a + b, 0) / n;
  const meanY = y.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i]! - meanX) * (y[i]! - meanY);
    sxx += (x[i]! - meanX) ** 2;
  }
  return sxx === 0 ? null : sxy / sxx;
}
