import { createRandom } from "../../linalg/seeded-random";

/** Where the starts may be drawn. */
export interface StartRegion {
  /** The given start of the free parameters. */
  initial: Float64Array;
  lower: Float64Array;
  upper: Float64Array;
  /** Half-width as a fraction of |θ₀| (absolute when θ₀ = 0) for parameters without both bounds. */
  spread: number;
}

/**
 * The starts of a multi-start fit: the given start first, then `count − 1` draws from a generator
 * seeded with `seed`, so the same seed gives the same starts. A parameter with both bounds finite is
 * drawn uniformly between them; otherwise uniformly within θ₀·(1 ± spread), clamped to its one bound.
 * @param count - number of starts, ≥ 1
 * @param seed - generator seed
 */
export function drawStarts(region: StartRegion, count: number, seed: number): Float64Array[] {
  const { initial, lower, upper, spread } = region;
  const random = createRandom(seed);
  const starts = [Float64Array.from(initial)];
  for (let s = 1; s < count; s++)
    starts.push(
      initial.map((theta, k) => {
        if (Number.isFinite(lower[k]) && Number.isFinite(upper[k])) return random.uniformIn(lower[k], upper[k]);
        const halfWidth = spread * (theta === 0 ? 1 : Math.abs(theta));
        const drawn = random.uniformIn(theta - halfWidth, theta + halfWidth);
        return Math.min(upper[k], Math.max(lower[k], drawn));
      }),
    );
  return starts;
}
