/**
 * Vibrating-wire gauges report the wire's resonant frequency or its "digits" R = f²/1000
 * (common practice): R is proportional to wire tension, so apparent strain is linear in R.
 */
export function digitsFromFrequency(frequencyHz: number): number {
  return (frequencyHz * frequencyHz) / 1000;
}

/** ε_app = G·B·(R − R₀) in µε, G the gauge constant (µε/digit), B the batch factor. */
export function apparentStrain(gaugeConstant: number, batchFactor: number, digits: number, zeroDigits: number): number {
  return gaugeConstant * batchFactor * (digits - zeroDigits);
}
