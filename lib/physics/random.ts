// Small seeded pseudo-random generator (mulberry32) for deterministic start vectors and tests.
// Never use Math.random in the solver: results must be identical run to run.

/**
 * Returns a generator of uniform numbers in [0, 1) from a 32-bit seed (mulberry32, public-domain 32-bit mixer;
 * common practice for small reproducible streams).
 * @example
 * const next = mulberry32(1); next(); // same value on every run
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
