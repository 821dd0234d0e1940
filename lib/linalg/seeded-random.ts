/**
 * A seeded pseudo-random generator returning uniform numbers in [0, 1): mulberry32 (Tommy Ettinger's
 * public-domain 32-bit generator). Used by tests and benchmarks so that random inputs are reproducible.
 * @param seed - any 32-bit integer
 */
export function createSeededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
