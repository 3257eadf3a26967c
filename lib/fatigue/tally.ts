import { minerDamage } from "./damage";
import { binRanges, mergeIntoCells, rainflowMatrix, totalCycleCount, type RainflowMatrix } from "./histogram";
import type { Cycle } from "./rainflow";
import type { FatigueSummary } from "./summary";

export interface FatigueTally {
  /** Folds in a batch of counted cycles (ranges and means in MPa), e.g. one page of a long history. */
  add(cycles: readonly Cycle[]): void;
  summary(): FatigueSummary;
  matrix(): RainflowMatrix;
}

/**
 * Running totals over a history counted in batches: the Miner sum and the cycle count from the
 * exact ranges, the histogram and matrix from cells. Memory is bounded by the occupied cells,
 * never by the length of the history.
 */
export function createFatigueTally(category: number, rangeBinWidth: number, meanBinWidth: number): FatigueTally {
  let damage = 0;
  let cyclesCounted = 0;
  let cells: Cycle[] = [];
  return {
    add(cycles) {
      damage += minerDamage(cycles, category);
      cyclesCounted += totalCycleCount(cycles);
      cells = mergeIntoCells(cells.concat(cycles), rangeBinWidth, meanBinWidth);
    },
    summary: () => ({ cycles: binRanges(cells, rangeBinWidth), damage, category, cyclesCounted }),
    matrix: () => rainflowMatrix(cells, rangeBinWidth, meanBinWidth),
  };
}
