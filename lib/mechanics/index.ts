/**
 * Mechanics core: raw gauge readings to strain and stress. Pure functions, no I/O.
 *
 *   const gauge = prepareGauge(config);          // once per gauge (per batch)
 *   if (!gauge.ok) reject(gauge.code, gauge.message);
 *   const result = gauge.convert(value, temperature);
 *   if (result.ok) store(result.strain, result.stress, flagWords(result.flags));
 *
 * The success object of `convert` is reused by the next call on the same gauge.
 */
export * from "./gauge-config";
export { prepareGauge, type Conversion, type ConversionResult, type GaugeConverter, type PrepareOptions } from "./convert";
export type { GaugeConfigErrorCode, ReadingErrorCode } from "./errors";
export type { Failure, Result } from "./result";
export { Flag, flagWords, isOutOfRange, type FlagWord } from "./validity";
export {
  EN_CONCRETE_CLASSES,
  MATERIALS,
  concreteMeanModulus,
  concreteModulus,
  concreteOfClass,
  normalWeightConcrete,
  type ConcreteClass,
  type MaterialId,
} from "./materials";
export { CONCRETE_CAUTION, peakRating, rateStress, type RatingBasis, type StressRating } from "./stress-rating";
export {
  ROSETTE_LAYOUTS,
  analyseRosette,
  principalStrains,
  rosetteStrainState,
  type PlaneStrain,
  type PrincipalStrains,
  type RosetteAnalysis,
  type RosetteErrorCode,
  type RosetteLayout,
} from "./rosette";
export { STEEL_WIRE_CTE, thermalCompensationFor } from "./thermal";
export { uniaxialStress, utilisation, vonMises } from "./stress";
export { decimalsForStep, derivedDecimals, writtenDecimals, type DerivedDecimals } from "./resolution";
