/**
 * A gauge as the API describes it (see the Gauges section of the API contract). Plain types only:
 * request validation lives with the API; `prepareGauge` re-checks what the physics depends on.
 */

export const GAUGE_KINDS = ["foil", "vibrating-wire"] as const;
export type GaugeKind = (typeof GAUGE_KINDS)[number];

export const FOIL_INPUTS = ["microstrain", "mV/V"] as const;
export type FoilInput = (typeof FOIL_INPUTS)[number];

/** The resonant frequency in Hz, or its square over 1000 (f²/1000). */
export const VIBRATING_WIRE_INPUTS = ["Hz", "frequency-squared"] as const;
export type VibratingWireInput = (typeof VIBRATING_WIRE_INPUTS)[number];

export type GaugeInput = FoilInput | VibratingWireInput;

export const BRIDGES = [
  "quarter",
  "half-bending",
  "half-poisson",
  "full-bending",
  "full-poisson",
  "full-axial-poisson",
] as const;
export type Bridge = (typeof BRIDGES)[number];

/**
 * How a quarter bridge's gauge is wired to the logger: 2-wire puts both leads in series with the
 * gauge; 3-wire moves one lead into the adjacent arm, so only one dilutes the gauge's signal.
 */
export const QUARTER_BRIDGE_WIRINGS = ["2-wire", "3-wire"] as const;
export type QuarterBridgeWiring = (typeof QUARTER_BRIDGE_WIRINGS)[number];

export const THERMAL_METHODS = ["none", "polynomial", "cte"] as const;
export type ThermalMethod = (typeof THERMAL_METHODS)[number];

export type ThermalCompensation =
  | { method: "none" }
  /** Thermal output P(T) = A0 + A1·T + … + A4·T⁴ in µε, T in °C; missing higher terms are zero. */
  | { method: "polynomial"; coefficients: readonly number[] }
  /**
   * Expansion coefficient (µε/°C) the foil gauge is matched to (required), or of the vibrating wire
   * (defaults to the steel wire's `STEEL_WIRE_CTE`).
   */
  | { method: "cte"; gaugeCte?: number | null };

/** Host material. E in MPa, alpha in µε/°C, yield and compressive strength in MPa. */
export interface Material {
  name?: string;
  E: number;
  nu: number;
  alpha: number;
  yield?: number | null;
  /** Concrete: characteristic cylinder strength f_ck (EN 1992-1-1) or specified f'c (ACI 318). */
  compressiveStrength?: number | null;
}

/** The reference reading: strain is measured from this state. */
export interface ZeroReading {
  /** Raw value in the gauge's input unit. */
  value: number;
  /** °C; required whenever the thermal compensation uses temperature. */
  temperature?: number | null;
  time?: string | Date;
}

export interface GaugeConfig {
  kind: GaugeKind;
  input: GaugeInput;
  /** Required for foil `mV/V`; for foil `microstrain` only `quarter` matters (lead correction). */
  bridge?: Bridge | null;
  /** Foil: gauge factor GF. Vibrating wire: the wire gauge factor K in µε per unit of f²/1000. */
  gaugeFactor: number;
  /** Foil `microstrain`: the GF the logger assumed; defaults to `gaugeFactor`. */
  loggerGaugeFactor?: number | null;
  /** Vibrating wire: multiplier C from the gauge's calibration record; defaults to 1. */
  calibrationFactor?: number | null;
  /**
   * Defaults to 1; -1 for a gauge wired the other way round: for `mV/V` it reverses the bridge
   * output before the bridge relation, for the other inputs the strain.
   */
  polarity?: 1 | -1;
  /** Quarter bridge: null when not recorded (gauges registered before the wiring was asked for). */
  wiring?: QuarterBridgeWiring | null;
  /**
   * Ohms. With the wiring recorded, the resistance of one lead; without it, the resistance in
   * series with the gauge in its arm (as gauges registered before the wiring was asked for give it).
   */
  leadResistance?: number | null;
  /** Ohms. */
  gaugeResistance?: number | null;
  /** Defaults to `none` for foil and to `cte` with the steel wire's coefficient (`STEEL_WIRE_CTE`) for vibrating wire. */
  thermal?: ThermalCompensation | null;
  material: Material;
  /** MPa added to the computed stress: the dead-load stress present when the gauge was zeroed. */
  initialStress?: number | null;
  zero: ZeroReading;
  /** µε the gauge can measure away from its zero reading, when the maker states it. */
  ratedRange?: number | null;
}
