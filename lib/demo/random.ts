/** A source of uniform numbers in [0, 1). */
export type Random = () => number;

/**
 * mulberry32, a public-domain 32-bit generator (recalled from memory): a few integer operations
 * a draw, a period of 2³², and the same sequence on every machine for the same seed, which is
 * all invented demo data needs. Not for anything secret.
 */
export function mulberry32(seed: number): Random {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let mixed = Math.imul(state ^ (state >>> 15), state | 1);
    mixed ^= mixed + Math.imul(mixed ^ (mixed >>> 7), mixed | 61);
    return ((mixed ^ (mixed >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal draw by the Box–Muller transform; 1 − u keeps the logarithm finite. */
export function gaussian(random: Random): number {
  return Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
}

/**
 * The seed of a named stream (a gauge's tag) drawn from one demo seed: FNV-1a over the name
 * (common practice), mixed with the seed. Streams follow names rather than positions, so adding,
 * removing or reordering gauges leaves the other gauges' data unchanged.
 */
export function streamSeed(seed: number, name: string): number {
  let hash = 0x811c9dc5 ^ seed;
  for (let i = 0; i < name.length; i++) hash = Math.imul(hash ^ name.charCodeAt(i), 0x01000193);
  return hash >>> 0;
}
