import type { Bridge, GaugeConfig, QuarterBridgeWiring } from "./gauge-config";

/**
 * Strain (dimensionless, tension positive) from the change of bridge output ratio Vr in V/V, the
 * gauge's polarity already applied to Vr. NaN when Vr lies past the relation's singularity, where
 * no real bridge can be.
 */
export type BridgeFormula = (vr: number, gaugeFactor: number, poisson: number) => number;

/**
 * Each arrangement solved for ε from the Wheatstone circuit Vout/Vex = R1/(R1+R2) − R4/(R3+R4)
 * (Dally & Riley, Experimental Stress Analysis, bridge chapter), every active arm changing by
 * ΔR/R = GF·ε of its gauge and the primary active gauge in R1, so that tension raises the output.
 * The non-linear terms are kept: x = GF·ε, ν Poisson's ratio.
 *   quarter             R1 axial:                      Vr = x / (4 + 2x)
 *   half-bending        R1 +ε, R2 −ε (opposite face):  Vr = x / 2
 *   half-poisson        R1 axial, R2 transverse −νε:   Vr = x(1+ν) / (4 + 2x(1−ν))
 *   full-bending        R1, R3 +ε; R2, R4 −ε:          Vr = x
 *   full-poisson        R1 +ε, R2 −ε, R3 +νε, R4 −νε:  Vr = x(1+ν) / 2
 *   full-axial-poisson  R1, R3 axial; R2, R4 −νε:      Vr = x(1+ν) / (2 + x(1−ν))
 */
const BRIDGE_FORMULAS: Readonly<Record<Bridge, BridgeFormula>> = {
  quarter: (vr, gf) => positiveDenominator(4 * vr, gf * (1 - 2 * vr)),
  "half-bending": (vr, gf) => (2 * vr) / gf,
  "half-poisson": (vr, gf, nu) => positiveDenominator(4 * vr, gf * (1 + nu - 2 * vr * (1 - nu))),
  "full-bending": (vr, gf) => vr / gf,
  "full-poisson": (vr, gf, nu) => (2 * vr) / (gf * (1 + nu)),
  "full-axial-poisson": (vr, gf, nu) => positiveDenominator(2 * vr, gf * (1 + nu - vr * (1 - nu))),
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

/**
 * The same circuit run forwards: the output change Vr (V/V) of each arrangement at x = GF·ε, before
 * polarity. The demo inverts conversions with it.
 */
const BRIDGE_OUTPUTS: Readonly<Record<Bridge, (x: number, nu: number) => number>> = {
  quarter: (x) => x / (4 + 2 * x),
  "half-bending": (x) => x / 2,
  "half-poisson": (x, nu) => (x * (1 + nu)) / (4 + 2 * x * (1 - nu)),
  "full-bending": (x) => x,
  "full-poisson": (x, nu) => (x * (1 + nu)) / 2,
  "full-axial-poisson": (x, nu) => (x * (1 + nu)) / (2 + x * (1 - nu)),
};

export function bridgeOutputFor(bridge: Bridge): (x: number, nu: number) => number {
  return BRIDGE_OUTPUTS[bridge];
}

/** Loggers report µε already; they used their own gauge factor, so rescale to the gauge's. */
export function loggerGaugeFactorCorrection(loggerGaugeFactor: number, gaugeFactor: number): number {
  return loggerGaugeFactor / gaugeFactor;
}

/** Lead resistance in the gauge's arm dilutes its resistance change by R_G / (R_G + R_L). */
export function leadWireCorrection(leadResistance: number, gaugeResistance: number): number {
  return 1 + leadResistance / gaugeResistance;
}

const LEADS_IN_GAUGE_ARM: Readonly<Record<QuarterBridgeWiring, number>> = { "2-wire": 2, "3-wire": 1 };

/**
 * Ohms in series with a quarter-bridge gauge in its arm, or null when the correction does not apply
 * (another arrangement, or a resistance not given). Without recorded wiring the stored lead
 * resistance is already the arm's.
 */
export function gaugeArmLeadResistance(config: Pick<GaugeConfig, "bridge" | "wiring" | "leadResistance" | "gaugeResistance">): number | null {
  const { bridge, wiring, leadResistance, gaugeResistance } = config;
  if (bridge !== "quarter" || leadResistance == null || gaugeResistance == null) return null;
  return wiring ? LEADS_IN_GAUGE_ARM[wiring] * leadResistance : leadResistance;
}

/** Loggers report mV/V; the bridge relations want V/V. */
export function millivoltsPerVoltToRatio(mvPerV: number): number {
  return mvPerV / 1000;
}
