import type { Material } from "./gauge-config";

/** What a stress is rated against: a metal's yield, or concrete's compressive strength. */
export type RatingBasis = "yield" | "compressive-strength";

/**
 * A stress as a share of the strength it is rated against. `ratio` is null only for concrete in
 * tension: concrete cracks at a small fraction of f_ck in tension, so a share of its compressive
 * strength would say nothing about it.
 */
export interface StressRating {
  basis: RatingBasis;
  /** MPa: the yield, or the characteristic compressive strength f_ck. */
  strength: number;
  ratio: number | null;
}

/** What every screen that shows a concrete utilisation says beside it. */
export const CONCRETE_CAUTION =
  "Concrete utilisation is compressive stress ÷ f_ck from a linear-elastic conversion: creep and shrinkage are not modelled, so a long-term reading overstates stress; near a crack the concrete's strain is not the section's strain; concrete in tension is not rated, since it cracks.";

/**
 * |σ| / yield for a material with a yield; compressive stress / f_ck for concrete (compression is
 * negative under the tension-positive convention); null when the material states neither.
 */
export function rateStress(stress: number, material: Pick<Material, "yield" | "compressiveStrength">): StressRating | null {
  if (material.yield) return { basis: "yield", strength: material.yield, ratio: Math.abs(stress) / material.yield };
  const strength = material.compressiveStrength;
  if (!strength) return null;
  return { basis: "compressive-strength", strength, ratio: stress <= 0 ? -stress / strength : null };
}

/**
 * The highest rating over a span whose stresses ran from `min` to `max` MPa: the larger magnitude
 * against a yield, the most compressive stress against f_ck.
 */
export function peakRating(min: number, max: number, material: Pick<Material, "yield" | "compressiveStrength">): StressRating | null {
  if (material.yield) return rateStress(Math.abs(max) > Math.abs(min) ? max : min, material);
  return rateStress(min, material);
}
