/**
 * Vibrating-wire gauges report the wire's resonant frequency f in Hz, or its square divided by
 * 1000, R = f²/1000 (common practice). For a taut wire f = (1/2L)·√(σ/ρ) (the string equation of
 * any physics text), so wire stress and strain are linear in f², hence in R.
 */
export function frequencySquaredFromHz(frequencyHz: number): number {
  return (frequencyHz * frequencyHz) / 1000;
}

/** ε_app = K·C·(R − R₀) in µε: K the wire gauge factor (µε per f²/1000), C the calibration multiplier. */
export function apparentStrain(wireGaugeFactor: number, calibrationFactor: number, frequencySquared: number, zeroFrequencySquared: number): number {
  return wireGaugeFactor * calibrationFactor * (frequencySquared - zeroFrequencySquared);
}

/**
 * The wire gauge factor K in µε per unit of f²/1000 of a steel wire of free length L (m), density
 * ρ (kg/m³) and modulus E (Pa): from f = (1/2L)·√(σ/ρ), σ = 4L²ρf², so ε = 4L²ρ·1000·R / E and in
 * microstrain K = 4·L²·ρ·10⁹ / E.
 */
export function wireGaugeFactor(freeLengthM: number, densityKgPerM3: number, wireModulusPa: number): number {
  return (4 * freeLengthM * freeLengthM * densityKgPerM3 * 1e9) / wireModulusPa;
}
