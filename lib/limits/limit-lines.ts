import type { Level, Limit } from "./limit";

/** A bound drawn across a chart of its quantity, already in the chart's display unit. */
export type LimitLine = { value: number; level: Level; text: string };

/**
 * The bounds of the limits on `quantity` as chart lines in display units. Given a yield stress, the
 * stress chart also carries utilisation bounds at bound × yield, since utilisation is |σ| / yield.
 */
export function limitLines(limits: readonly Limit<string>[], quantity: string, toDisplay: (value: number) => number, yieldStress: number | null = null): LimitLine[] {
  const lines: LimitLine[] = [];
  for (const limit of limits) {
    const inStress = limit.quantity === "utilisation" && quantity === "stress" && yieldStress;
    if (limit.quantity !== quantity && !inStress) continue;
    for (const side of ["upper", "lower"] as const) {
      const bound = limit[side];
      if (bound === undefined) continue;
      const value = toDisplay(inStress ? bound * yieldStress : bound);
      lines.push({ value, level: limit.level, text: `${limit.level} ${side}${inStress ? ` (${Math.round(bound * 100)} % of yield)` : ""}` });
    }
  }
  return lines;
}

/**
 * The value axis's extent around the data and every limit line, padded by 5 %, so a bound far from
 * the data stays in view instead of being cut off where the data end.
 */
export function rangeWithLines(min: number, max: number, lines: readonly LimitLine[]): [number, number] {
  const values = [min, max, ...lines.map((line) => line.value)].filter(Number.isFinite);
  const low = Math.min(...values);
  const high = Math.max(...values);
  const pad = (high - low) * 0.05 || 1;
  return [low - pad, high + pad];
}

/** Bounds this close beyond the data (a quarter of the data's span) stay in view when fitting to the data. */
const NEAR_FRACTION = 0.25;

/**
 * The value axis's extent. Fitted to the data by default, so a bound far away does not squash the
 * signal into a flat line; bounds near the data stay in view. With `showAll`, every line is in view.
 */
export function valueAxisRange(min: number, max: number, lines: readonly LimitLine[], showAll: boolean): [number, number] {
  if (showAll || !Number.isFinite(min) || !Number.isFinite(max)) return rangeWithLines(min, max, lines);
  const reach = (max - min) * NEAR_FRACTION;
  return rangeWithLines(min, max, lines.filter((line) => line.value >= min - reach && line.value <= max + reach));
}

/** The lines outside an axis range, and on which side, to mark at the chart's edge. */
export type OffScaleLine = LimitLine & { side: "above" | "below" };

export function offScaleLines(lines: readonly LimitLine[], [low, high]: readonly [number, number]): OffScaleLine[] {
  return lines.flatMap((line): OffScaleLine[] => (line.value > high ? [{ ...line, side: "above" }] : line.value < low ? [{ ...line, side: "below" }] : []));
}
