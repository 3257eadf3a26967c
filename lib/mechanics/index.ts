export * from "./gauge-config";
export { prepareGauge, type Conversion, type ConversionResult, type GaugeConverter, type PrepareOptions } from "./convert";
export type { GaugeConfigErrorCode, ReadingErrorCode } from "./errors";
export type { Failure, Result } from "./result";
export { Flag, flagWords, type FlagWord } from "./validity";
export { MATERIALS, concreteModulus, normalWeightConcrete, type MaterialId } from "./materials";
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
export { STEEL_WIRE_CTE } from "./thermal";
export { uniaxialStress, utilisation, vonMises } from "./stress";
