/**
 * Invented demo data: raw logger readings that tell a chosen story once converted. Pure, seeded.
 *
 *   for (const reading of syntheticReadings({ start, seed, gauges })) batch.push(reading);
 */
export {
  DEFAULT_CLIMATE,
  syntheticReadings,
  type GaugeStory,
  type SyntheticClimate,
  type SyntheticGauge,
  type SyntheticOptions,
  type SyntheticReading,
  type TimeWindow,
} from "./synthetic-readings";
export { prepareInverseConversion, type InverseConversion } from "./inverse-conversion";
export { syntheticBursts, type BurstStory, type SyntheticBurst, type SyntheticBurstGauge, type SyntheticBurstOptions } from "./synthetic-bursts";
