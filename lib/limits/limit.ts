/**
 * What a limit bounds, as named by the API contract; `utilisation` is |stress| / yield, `residual`
 * the thermal residual (measured − thermal model, µε) of a gauge with a thermal model.
 */
export const QUANTITIES = ["stress", "strain", "utilisation", "residual"] as const;
export type Quantity = (typeof QUANTITIES)[number];

/** What a rosette limit bounds: stresses derived from its three gauges, all in MPa. */
export const ROSETTE_LIMIT_QUANTITIES = ["sigma1", "sigma2", "vonMises"] as const;
export type RosetteLimitQuantity = (typeof ROSETTE_LIMIT_QUANTITIES)[number];

/** Alert levels from the mildest to the most severe; the order is what "escalate" means. */
export const LEVELS = ["watch", "warning", "critical"] as const;
export type Level = (typeof LEVELS)[number];

/**
 * A limit as the engineer proposes it (the API's body): defaults not yet applied. The machine
 * never looks at `quantity` beyond grouping, so gauges and rosettes share it with their own names.
 */
export interface LimitInput<Q extends string = Quantity> {
  readonly quantity: Q;
  readonly level: Level;
  readonly upper?: number;
  readonly lower?: number;
  readonly hysteresis?: number;
  readonly persistence?: number;
}

/** A validated limit with its defaults applied: hysteresis 0, persistence 1. */
export interface Limit<Q extends string = Quantity> {
  readonly quantity: Q;
  readonly level: Level;
  readonly upper?: number;
  readonly lower?: number;
  readonly hysteresis: number;
  readonly persistence: number;
}

export function levelRank(level: Level): number {
  return LEVELS.indexOf(level);
}

/** Mildest level first, so "the lowest level" is always element 0. */
export function byLevel<Item extends { readonly level: Level }>(items: readonly Item[]): Item[] {
  return [...items].sort((a, b) => levelRank(a.level) - levelRank(b.level));
}
