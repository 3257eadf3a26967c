/** Shapes the series API's answer for charts: pure, so it is tested without a browser. */

export type SeriesAnswer = { quantity: string; unit: string; t: number[]; min: number[]; max: number[]; mean: number[]; count: number[] };

/** uPlot wants seconds on x and one array per series: [t, min, max, mean], values mapped to display units. */
export function chartColumns(series: SeriesAnswer, toDisplay: (value: number) => number): [number[], number[], number[], number[]] {
  return [series.t.map((ms) => ms / 1000), series.min.map(toDisplay), series.max.map(toDisplay), series.mean.map(toDisplay)];
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
