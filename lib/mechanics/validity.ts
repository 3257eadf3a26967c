/**
 * Validity flags travel as a bitmask on the per-reading path (no allocation) and become the API's
 * flag words only when a reading is shown or stored.
 */
export const Flag = {
  /** Linear elasticity no longer describes the reading: stress near yield, or gauge past its range. */
  outsideLinearRange: 1,
  /** The gauge reads beyond its rated range: a sensor condition, not a structural one. */
  outOfRange: 2,
} as const;

export type FlagWord = "outside-linear-range" | "out-of-range";

const WORD_OF_FLAG: readonly (readonly [number, FlagWord])[] = [
  [Flag.outsideLinearRange, "outside-linear-range"],
  [Flag.outOfRange, "out-of-range"],
];

/** Past the gauge's rated range: the reading says nothing reliable about the structure. */
export function isOutOfRange(flags: number): boolean {
  return (flags & Flag.outOfRange) !== 0;
}

export function flagWords(flags: number): FlagWord[] {
  return WORD_OF_FLAG.filter(([bit]) => (flags & bit) !== 0).map(([, word]) => word);
}

/**
 * A gauge past its rated range is both a sensor condition and a reading whose gauge factor no
 * longer holds, so it raises both flags. Limits are Infinity when unknown.
 */
export function validityFlags(stress: number, indicatedStrain: number, linearStressLimit: number, ratedRange: number): number {
  let flags = 0;
  if (Math.abs(stress) > linearStressLimit) flags |= Flag.outsideLinearRange;
  if (Math.abs(indicatedStrain) > ratedRange) flags |= Flag.outOfRange | Flag.outsideLinearRange;
  return flags;
}
