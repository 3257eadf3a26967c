import { prepareGauge, type Bridge, type GaugeConfig, type GaugeConverter } from "@/lib/mechanics";
import { leadWireCorrection, loggerGaugeFactorCorrection } from "@/lib/mechanics/bridge";
import { MICRO } from "@/lib/mechanics/stress";
import { digitsFromFrequency } from "@/lib/mechanics/vibrating-wire";

/** The raw reading (gauge input unit) whose conversion at `temperature` °C gives `mechanicalStrain` µε. */
export type InverseConversion = (mechanicalStrain: number, temperature: number) => number;

/**
 * The bridge relations of Dally & Riley (bridge chapter, as in domain.md) solved exactly for the
 * output change Vr (V/V), given x = GF·ε with ε dimensionless.
 */
const BRIDGE_OUTPUTS: Readonly<Record<Bridge, (x: number, nu: number) => number>> = {
  quarter: (x) => -x / (4 + 2 * x),
  "half-bending": (x) => -x / 2,
  "half-poisson": (x, nu) => (-x * (1 + nu)) / (4 + 2 * x * (1 - nu)),
  "full-bending": (x) => -x,
  "full-poisson": (x, nu) => (-x * (1 + nu)) / 2,
  "full-axial-poisson": (x, nu) => (-x * (1 + nu)) / (2 + x * (1 - nu)),
};

/**
 * Inverts `prepareGauge(config).convert`. Demo gauges are written by hand, so an invalid
 * configuration throws.
 */
export function prepareInverseConversion(config: GaugeConfig): InverseConversion {
  const gauge = prepareGauge(config);
  if (!gauge.ok) throw new Error(`Demo gauge configuration refused (${gauge.code}): ${gauge.message}`);
  const fromGaugeStrain = gaugeStrainInverse(config);
  const polarity = config.polarity ?? 1;
  return (mechanicalStrain, temperature) =>
    fromGaugeStrain(polarity * (mechanicalStrain - thermalCorrection(gauge, config.zero.value, temperature)));
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

/** Raw value from the gauge's strain change since zero (µε, before polarity and temperature). */
function gaugeStrainInverse(config: GaugeConfig): (gaugeStrain: number) => number {
  const zero = config.zero.value;
  if (config.kind === "vibrating-wire") return vibratingWireInverse(config);
  const lead = quarterBridgeLeadFactor(config);
  if (config.input === "microstrain") {
    const scale = lead * loggerGaugeFactorCorrection(config.loggerGaugeFactor ?? config.gaugeFactor, config.gaugeFactor);
    return (gaugeStrain) => zero + gaugeStrain / scale;
  }
  const bridgeOutput = BRIDGE_OUTPUTS[config.bridge as Bridge];
  const { gaugeFactor } = config;
  const nu = config.material.nu;
  return (gaugeStrain) => zero + 1000 * bridgeOutput((gaugeFactor * gaugeStrain * MICRO) / lead, nu);
}

function quarterBridgeLeadFactor({ bridge, leadResistance, gaugeResistance }: GaugeConfig): number {
  return bridge === "quarter" && leadResistance != null && gaugeResistance != null
    ? leadWireCorrection(leadResistance, gaugeResistance)
    : 1;
}

/** Digits R = R₀ + ε/(G·B), and f = √(1000·R) for a gauge read in Hz. */
function vibratingWireInverse(config: GaugeConfig): (gaugeStrain: number) => number {
  const inHz = config.input === "Hz";
  const zeroDigits = inHz ? digitsFromFrequency(config.zero.value) : config.zero.value;
  const strainPerDigit = config.gaugeFactor * (config.batchFactor ?? 1);
  return (gaugeStrain) => {
    const digits = zeroDigits + gaugeStrain / strainPerDigit;
    if (!(digits > 0)) throw new RangeError(`${gaugeStrain} µε slackens the wire past what it can read.`);
    return inHz ? Math.sqrt(1000 * digits) : digits;
  };
}
