/**
 * Fatigue strength curves by detail category, in the shape of EN 1993-1-9 (from memory): the category Δσ_C is the stress range in MPa that gives 2×10⁶ cycles;
 * slope m = 3 down to the constant-amplitude limit Δσ_D at 5×10⁶ cycles, slope m = 5 down to the
 * cut-off Δσ_L at 10⁸ cycles, no damage below. Characteristic curves: partial factors on load or
 * resistance are the engineer's to apply to the ranges before they get here.
 */

const REFERENCE_CYCLES = 2e6;
const CONSTANT_AMPLITUDE_CYCLES = 5e6;
const CUT_OFF_CYCLES = 1e8;
const UPPER_SLOPE = 3;
const LOWER_SLOPE = 5;

export const DETAIL_CATEGORY_VALUES = [160, 140, 125, 112, 100, 90, 80, 71, 63, 56, 50, 45, 40, 36] as const;

export interface DetailCategory {
  /** Δσ_C in MPa. */
  category: (typeof DETAIL_CATEGORY_VALUES)[number];
  description: string;
}

export const DETAIL_CATEGORIES: readonly DetailCategory[] = DETAIL_CATEGORY_VALUES.map((category) => ({
  category,
  description: `Detail category ${category}`,
}));

export interface SnCurveLimits {
  /** Δσ_C, MPa at 2×10⁶ cycles. */
  referenceRange: number;
  /** Δσ_D, MPa at 5×10⁶ cycles. */
  constantAmplitudeLimit: number;
  /** Δσ_L, MPa at 10⁸ cycles. */
  cutOffLimit: number;
}

/**
 * The knee ranges follow from keeping the curve continuous: Δσ_D = (2/5)^(1/3)·Δσ_C ≈ 0.737·Δσ_C
 * and Δσ_L = (5/100)^(1/5)·Δσ_D ≈ 0.549·Δσ_D.
 */
export function snCurveLimits(category: number): SnCurveLimits {
  if (!(Number.isFinite(category) && category > 0)) {
    throw new RangeError(`A detail category is a positive stress range in MPa, got ${category}`);
  }
  const constantAmplitudeLimit = category * (REFERENCE_CYCLES / CONSTANT_AMPLITUDE_CYCLES) ** (1 / UPPER_SLOPE);
  const cutOffLimit = constantAmplitudeLimit * (CONSTANT_AMPLITUDE_CYCLES / CUT_OFF_CYCLES) ** (1 / LOWER_SLOPE);
  return { referenceRange: category, constantAmplitudeLimit, cutOffLimit };
}

/** Endurance N at a stress range in MPa; Infinity below the cut-off, where no damage accrues. */
export function cyclesToFailure(range: number, category: number): number {
  if (!(Number.isFinite(range) && range >= 0)) {
    throw new RangeError(`A stress range is a finite value ≥ 0 in MPa, got ${range}`);
  }
  const limits = snCurveLimits(category);
  if (range < limits.cutOffLimit) return Infinity;
  if (range >= limits.constantAmplitudeLimit) {
    return REFERENCE_CYCLES * (category / range) ** UPPER_SLOPE;
  }
  return CONSTANT_AMPLITUDE_CYCLES * (limits.constantAmplitudeLimit / range) ** LOWER_SLOPE;
}
