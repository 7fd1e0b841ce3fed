/**
 * Seeded pseudo-random numbers for reproducible synthetic data (tests, benchmarks, demo sweeps).
 */

/**
 * A mulberry32 generator: returns a function giving uniform numbers in [0, 1).
 * Deterministic for a given 32-bit seed; not for cryptography.
 *
 * @param seed any integer
 * @example const rand = seededRandom(42); rand() // 0.6011...
 */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Standard normal deviates from a uniform generator (Box–Muller).
 *
 * @param uniform generator of uniform numbers in [0, 1)
 */
export function seededNormal(uniform: () => number): () => number {
  return () => {
    const u = 1 - uniform();
    const v = uniform();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
}
