/**
 * Fatigue core: rainflow counting, S-N curves by detail category, Miner damage. Pure functions,
 * no I/O. Streaming over a long stress history (MPa):
 *
 *   const counter = createRainflowCounter();
 *   for each page of readings: page.forEach(counter.push); damage += minerDamage(counter.takeCounted(), 71);
 *   damage += minerDamage(counter.finish(), 71);
 *   const years = yearsToReachDamage(damageRatePerYear(damage, periodSeconds));
 *
 * createFatigueTally does the page-by-page folding and also keeps the histogram and matrix.
 */
export {
  createRainflowCounter,
  createRainflowStream,
  rainflow,
  type Cycle,
  type CycleSink,
  type RainflowCounter,
  type RainflowResidue,
  type RainflowStream,
} from "./rainflow";
export { createFatigueHistory, type FatigueHistory, type HistoryCoverage } from "./history";
export { binRanges, meanBinIndex, mergeIntoCells, rainflowMatrix, rangeBinIndex, totalCycleCount, type RainflowMatrix, type RangeBin } from "./histogram";
export {
  DETAIL_CATEGORIES,
  DETAIL_CATEGORY_VALUES,
  cyclesToFailure,
  snCurveLimits,
  type DetailCategory,
  type SnCurveLimits,
} from "./sn-curve";
export { SECONDS_PER_YEAR, damageRatePerYear, equivalentRange, minerDamage, yearsToReachDamage } from "./damage";
export { fatigueSummary, type FatigueSummary } from "./summary";
export { createFatigueTally, type FatigueTally } from "./tally";
export { MEAN_NOT_RECORDED, rainflowMatrixCsv } from "./matrix-csv";
export { formatScientific } from "./format";
