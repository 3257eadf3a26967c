import { prepareGauge, type Bridge, type GaugeConfig, type GaugeConverter } from "@/lib/mechanics";
import { bridgeOutputFor, gaugeArmLeadResistance, leadWireCorrection, loggerGaugeFactorCorrection } from "@/lib/mechanics/bridge";
import { MICRO } from "@/lib/mechanics/stress";
import { frequencySquaredFromHz } from "@/lib/mechanics/vibrating-wire";

/** The raw reading (gauge input unit) whose conversion at `temperature` °C gives `mechanicalStrain` µε. */
export type InverseConversion = (mechanicalStrain: number, temperature: number) => number;

/**
 * Inverts `prepareGauge(config).convert`. Demo gauges are written by hand, so an invalid
 * configuration throws.
 */
export function prepareInverseConversion(config: GaugeConfig): InverseConversion {
  const gauge = prepareGauge(config);
  if (!gauge.ok) throw new Error(`Demo gauge configuration refused (${gauge.code}): ${gauge.message}`);
  const fromGaugeStrain = gaugeStrainInverse(config);
  return (mechanicalStrain, temperature) => fromGaugeStrain(mechanicalStrain - thermalCorrection(gauge, config.zero.value, temperature));
}

/**
 * The converter adds a temperature correction Q(T) to the indicated strain. The zero reading
 * indicates no strain at all, so converting it yields Q(T) alone, whatever the compensation
 * method and its defaults.
 */
function thermalCorrection(gauge: GaugeConverter, zeroValue: number, temperature: number): number {
  const result = gauge.convert(zeroValue, temperature);
  if (!result.ok) throw new Error(`Demo reading refused (${result.code}): ${result.message}`);
  return result.strain;
}

/**
 * Raw value from the gauge's strain change since zero (µε, polarity applied, before temperature):
 * polarity reverses the bridge output of a mV/V gauge and the strain of any other.
 */
function gaugeStrainInverse(config: GaugeConfig): (gaugeStrain: number) => number {
  const zero = config.zero.value;
  const polarity = config.polarity ?? 1;
  if (config.kind === "vibrating-wire") {
    const wire = vibratingWireInverse(config);
    return (gaugeStrain) => wire(polarity * gaugeStrain);
  }
  const lead = quarterBridgeLeadFactor(config);
  if (config.input === "microstrain") {
    const scale = lead * loggerGaugeFactorCorrection(config.loggerGaugeFactor ?? config.gaugeFactor, config.gaugeFactor);
    return (gaugeStrain) => zero + (polarity * gaugeStrain) / scale;
  }
  const bridgeOutput = bridgeOutputFor(config.bridge as Bridge);
  const { gaugeFactor } = config;
  const nu = config.material.nu;
  return (gaugeStrain) => zero + 1000 * polarity * bridgeOutput((gaugeFactor * gaugeStrain * MICRO) / lead, nu);
}

function quarterBridgeLeadFactor(config: GaugeConfig): number {
  const armResistance = gaugeArmLeadResistance(config);
  return armResistance === null ? 1 : leadWireCorrection(armResistance, config.gaugeResistance!);
}

/** R = R₀ + ε/(K·C) in f²/1000, and f = √(1000·R) for a gauge read in Hz. */
function vibratingWireInverse(config: GaugeConfig): (gaugeStrain: number) => number {
  const inHz = config.input === "Hz";
  const zeroFrequencySquared = inHz ? frequencySquaredFromHz(config.zero.value) : config.zero.value;
  const strainPerUnit = config.gaugeFactor * (config.calibrationFactor ?? 1);
  return (gaugeStrain) => {
    const frequencySquared = zeroFrequencySquared + gaugeStrain / strainPerUnit;
    if (!(frequencySquared > 0)) throw new RangeError(`${gaugeStrain} µε slackens the wire past what it can read.`);
    return inHz ? Math.sqrt(1000 * frequencySquared) : frequencySquared;
  };
}
