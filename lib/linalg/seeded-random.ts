/**
 * Seeded pseudo-random numbers: the one generator of lib/ (fit starts) and of the unit tests.
 *
 * Generator: xoshiro128** (Blackman & Vigna, "Scrambled linear pseudorandom number generators",
 * ACM Trans. Math. Softw. 47(4), 36 (2021)). Its 128-bit state is filled from the 32-bit seed by a
 * SplitMix-style sequence (golden-ratio increment, Steele, Lea & Flood, OOPSLA 2014) passed through
 * the MurmurHash3 32-bit finaliser, so that nearby seeds give unrelated streams.
 * Gaussian deviates: Box–Muller transform (Box & Muller, Ann. Math. Statist. 29, 610 (1958)).
 */

/** A reproducible stream of random numbers. */
export interface RandomSource {
  /** Uniform deviate in [0, 1). */
  uniform(): number;
  /**
   * Uniform deviate in [low, high).
   * @param low - lower end, any unit
   * @param high - upper end, same unit, high ≥ low
   */
  uniformIn(low: number, high: number): number;
  /** Standard normal deviate (mean 0, variance 1). */
  gaussian(): number;
}

const GOLDEN_RATIO_32 = 0x9e3779b9;

function splitMix32(seed: number): () => number {
  let x = seed >>> 0;
  return () => {
    x = (x + GOLDEN_RATIO_32) >>> 0;
    let z = x;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
    return (z ^ (z >>> 16)) >>> 0;
  };
}

const rotl = (x: number, k: number): number => ((x << k) | (x >>> (32 - k))) >>> 0;

/**
 * Creates a seeded random source; the same seed always gives the same sequence.
 * @param seed - any integer; only its low 32 bits are used
 */
export function createRandom(seed: number): RandomSource {
  if (!Number.isInteger(seed)) throw new RangeError(`The random seed must be an integer, got ${seed}`);
  const fill = splitMix32(seed);
  const s = new Uint32Array([fill(), fill(), fill(), fill()]);
  // An all-zero state would be a fixed point of the generator.
  if ((s[0] | s[1] | s[2] | s[3]) === 0) s[0] = 1;

  const nextUint32 = (): number => {
    const result = Math.imul(rotl(Math.imul(s[1], 5) >>> 0, 7), 9) >>> 0;
    const t = (s[1] << 9) >>> 0;
    s[2] ^= s[0];
    s[3] ^= s[1];
    s[1] ^= s[2];
    s[0] ^= s[3];
    s[2] ^= t;
    s[3] = rotl(s[3], 11);
    return result;
  };

  // 53 random bits from two 32-bit outputs give every double in [0, 1) on a 2⁻⁵³ grid.
  const uniform = (): number => ((nextUint32() >>> 5) * 67108864 + (nextUint32() >>> 6)) / 9007199254740992;

  let spareGaussian: number | null = null;
  const gaussian = (): number => {
    if (spareGaussian !== null) {
      const value = spareGaussian;
      spareGaussian = null;
      return value;
    }
    const u1 = 1 - uniform(); // in (0, 1], so the logarithm is finite
    const u2 = uniform();
    const radius = Math.sqrt(-2 * Math.log(u1));
    spareGaussian = radius * Math.sin(2 * Math.PI * u2);
    return radius * Math.cos(2 * Math.PI * u2);
  };

  return {
    uniform,
    uniformIn: (low, high) => low + (high - low) * uniform(),
    gaussian,
  };
}
