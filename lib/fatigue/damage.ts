import { cyclesToFailure } from "./sn-curve";

/** Julian year, the usual year for rates over multi-year histories. */
export const SECONDS_PER_YEAR = 365.25 * 24 * 3600;

/**
 * Palmgren–Miner sum D = Σ nᵢ/Nᵢ over counted cycles (ranges in MPa). D = 1 is the nominal end
 * of fatigue life. Accepts raw cycles or binned ranges alike.
 */
export function minerDamage(cycles: Iterable<{ range: number; count: number }>, category: number): number {
  let damage = 0;
  for (const { range, count } of cycles) damage += count / cyclesToFailure(range, category);
  return damage;
}

/**
 * Damage-equivalent constant range at `referenceCycles`: Δσ_E = (Σ nᵢ·Δσᵢ^m / N_ref)^(1/m), the
 * single range that, repeated N_ref times on a slope-m curve, does the damage of the whole
 * spectrum (the equivalent-range idea of EN 1993-1-9; m = 3 and N_ref = 2×10⁶ as there, from
 * memory). Comparable at a glance with a detail category Δσ_C, also defined at 2×10⁶ cycles.
 */
export function equivalentRange(cycles: Iterable<{ range: number; count: number }>, slope = 3, referenceCycles = 2e6): number {
  let sum = 0;
  for (const { range, count } of cycles) sum += count * range ** slope;
  return (sum / referenceCycles) ** (1 / slope);
}

/** Damage per year at the rate observed over a period, assuming the period is representative. */
export function damageRatePerYear(damage: number, periodSeconds: number): number {
  if (!(Number.isFinite(periodSeconds) && periodSeconds > 0)) {
    throw new RangeError(`A period must last a positive number of seconds, got ${periodSeconds}`);
  }
  return damage / (periodSeconds / SECONDS_PER_YEAR);
}

/**
 * Years for a yearly damage rate to accumulate `remainingDamage`: pass 1 − D already spent for
 * the life left. Infinity when nothing accrues; 0 when nothing remains.
 */
export function yearsToReachDamage(ratePerYear: number, remainingDamage = 1): number {
  if (!(ratePerYear >= 0)) throw new RangeError(`A damage rate is ≥ 0, got ${ratePerYear}`);
  if (remainingDamage <= 0) return 0;
  return ratePerYear === 0 ? Infinity : remainingDamage / ratePerYear;
}
