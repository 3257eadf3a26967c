import type { Bridge } from "./gauge-config";

/**
 * Strain (dimensionless, tension positive) from the change of bridge output ratio Vr in V/V.
 * NaN when Vr lies past the formula's singularity, where no real bridge can be.
 */
export type BridgeFormula = (vr: number, gaugeFactor: number, poisson: number) => number;

/**
 * Wheatstone-bridge relations of Dally & Riley, Experimental Stress Analysis, bridge chapter (the
 * same relations are tabulated in most instrumentation handbooks). The non-linear terms are kept.
 */
const BRIDGE_FORMULAS: Readonly<Record<Bridge, BridgeFormula>> = {
  quarter: (vr, gf) => positiveDenominator(-4 * vr, gf * (1 + 2 * vr)),
  "half-bending": (vr, gf) => (-2 * vr) / gf,
  "half-poisson": (vr, gf, nu) => positiveDenominator(-4 * vr, gf * (1 + nu - 2 * vr * (nu - 1))),
  "full-bending": (vr, gf) => -vr / gf,
  "full-poisson": (vr, gf, nu) => (-2 * vr) / (gf * (nu + 1)),
  "full-axial-poisson": (vr, gf, nu) => positiveDenominator(-2 * vr, gf * (nu + 1 - vr * (nu - 1))),
};

/**
 * Each non-linear denominator is positive at Vr = 0 and only reaches zero at an output no bridge of
 * that arrangement can produce, so a non-positive one means the reading is corrupt.
 */
function positiveDenominator(numerator: number, denominator: number): number {
  return denominator > 0 ? numerator / denominator : Number.NaN;
}

export function bridgeFormula(bridge: string): BridgeFormula | undefined {
  return Object.hasOwn(BRIDGE_FORMULAS, bridge) ? BRIDGE_FORMULAS[bridge as Bridge] : undefined;
}

/** Loggers report µε already; they used their own gauge factor, so rescale to the gauge's. */
export function loggerGaugeFactorCorrection(loggerGaugeFactor: number, gaugeFactor: number): number {
  return loggerGaugeFactor / gaugeFactor;
}

/** Lead resistance in the gauge's arm dilutes its resistance change by R_G / (R_G + R_L). */
export function leadWireCorrection(leadResistance: number, gaugeResistance: number): number {
  return 1 + leadResistance / gaugeResistance;
}

/** Loggers report mV/V; the bridge relations want V/V. */
export function millivoltsPerVoltToRatio(mvPerV: number): number {
  return mvPerV / 1000;
}
