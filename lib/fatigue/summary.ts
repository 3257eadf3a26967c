import { minerDamage } from "./damage";
import { binRanges, totalCycleCount, type RangeBin } from "./histogram";
import type { Cycle } from "./rainflow";

/** The body of the API's fatigue response. */
export interface FatigueSummary {
  /** Range histogram, bins labelled by upper edge in MPa (see binRanges). */
  cycles: RangeBin[];
  /** Miner sum over the unbinned cycles, so the bin width never changes the damage. */
  damage: number;
  /** Δσ_C in MPa. */
  category: number;
  /** Sum of counts with half cycles as 0.5, so the residue of an unfinished history counts half. */
  cyclesCounted: number;
}

/** Stress ranges in MPa; the histogram uses 1 MPa bins unless told otherwise. */
export function fatigueSummary(cycles: readonly Cycle[], category: number, rangeBinWidth = 1): FatigueSummary {
  return {
    cycles: binRanges(cycles, rangeBinWidth),
    damage: minerDamage(cycles, category),
    category,
    cyclesCounted: totalCycleCount(cycles),
  };
}
