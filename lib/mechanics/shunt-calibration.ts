import { bridgeFormula, bridgeOutputFor, gaugeArmLeadResistance, leadWireCorrection } from "./bridge";
import type { GaugeConfig } from "./gauge-config";
import { failure, type Failure } from "./result";
import { MICRO } from "./stress";

export type ShuntCalibrationErrorCode = "not-a-foil-bridge" | "gauge-resistance-required" | "invalid-shunt";

export interface ShuntCalibrationExpectation {
  /** ΔR/R of the shunted arm (negative: a shunt lowers the arm's resistance, as compression does). */
  armResistanceChange: number;
  /** mV/V the bridge should show, polarity applied. */
  expectedOutput: number;
  /**
   * Change the logger should show in the gauge's input unit: the mV/V above, or for a logger that
   * reports microstrain the strain it computes from that output with its own gauge factor and the
   * same arrangement (lead correction not applied: the logger does not know the leads). The gauge's
   * conversion reads this value back as `equivalentStrain`.
   */
  expectedReading: number;
  /** µε the gauge's own conversion gives that output: the strain the shunt simulates. */
  equivalentStrain: number;
}

/**
 * What a shunt of `shuntResistance` Ω across the gauge, at the gauge, should do to the bridge.
 * The shunted gauge is R_g·R_s/(R_g + R_s), so with the arm's lead resistance R_L in series the arm
 * changes by ΔR/R = −R_g² / ((R_g + R_s)·(R_g + R_L)), which is −R_g/(R_g + R_s) without leads
 * (common practice). Only the shunted arm changes, so the Wheatstone relation gives the output of a
 * single changing arm whatever the arrangement; the arrangement's own relation then reads that
 * output back as the strain it simulates.
 */
export function expectedShuntOutput(
  config: GaugeConfig,
  shuntResistance: number,
): { ok: true; value: ShuntCalibrationExpectation } | Failure<ShuntCalibrationErrorCode> {
  const formula = config.bridge == null ? undefined : bridgeFormula(config.bridge);
  if (config.kind !== "foil" || !formula) {
    return failure("not-a-foil-bridge", "A shunt check needs a foil gauge with its bridge arrangement; this gauge has no bridge to shunt.");
  }
  const gaugeResistance = config.gaugeResistance;
  if (gaugeResistance == null || !(gaugeResistance > 0)) {
    return failure("gauge-resistance-required", "Record the gauge's resistance (e.g. 120 or 350 Ω) before a shunt check.");
  }
  if (!Number.isFinite(shuntResistance) || shuntResistance <= 0) {
    return failure("invalid-shunt", "The shunt resistance must be a positive number of ohms.");
  }
  const armLead = gaugeArmLeadResistance(config) ?? 0;
  const armResistanceChange = -(gaugeResistance * gaugeResistance) / ((gaugeResistance + shuntResistance) * (gaugeResistance + armLead));
  const bridgeOutput = bridgeOutputFor("quarter")(armResistanceChange, config.material.nu);
  const polarity = config.polarity ?? 1;
  const lead = armLead > 0 ? leadWireCorrection(armLead, gaugeResistance) : 1;
  const expectedOutput = 1000 * polarity * bridgeOutput;
  const loggerGaugeFactor = config.loggerGaugeFactor ?? config.gaugeFactor;
  return {
    ok: true,
    value: {
      armResistanceChange,
      expectedOutput,
      expectedReading: config.input === "microstrain" ? formula(polarity * bridgeOutput, loggerGaugeFactor, config.material.nu) / MICRO : expectedOutput,
      equivalentStrain: (lead * formula(bridgeOutput, config.gaugeFactor, config.material.nu)) / MICRO,
    },
  };
}

/**
 * Pass when the measured output is within `tolerancePercent` of the expected one. The deviation is
 * relative to the expected output, so a reading smaller in size than expected is a negative one.
 */
export function shuntCheckVerdict(measuredOutput: number, expectedOutput: number, tolerancePercent: number) {
  const deviationPercent = (100 * (measuredOutput - expectedOutput)) / expectedOutput;
  return { deviationPercent, passed: Math.abs(deviationPercent) <= tolerancePercent };
}
