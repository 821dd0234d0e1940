// Synthetic band data for the band-fit tests and the benchmark: bands of a model at known parameters,
// with seeded Gaussian noise (lib/linalg/seeded-random.ts), and starts perturbed from the truth.
import { createRandom } from "@/lib/fit";
import type { BandFitPoint } from "@/lib/fit";
import { type ModelDocument, type Vec3, compileModel, computeBands, templateKPath } from "@/lib/tb";

/** Points of `bands` (1-based) of the model at its own values along `kPoints`, with noise of σ = noise (eV). */
export function syntheticPoints(
  doc: ModelDocument,
  kPoints: readonly Vec3[],
  bands: readonly number[],
  noise: number,
  seed: number,
): BandFitPoint[] {
  const compiled = compileModel(doc);
  const { energies } = computeBands(compiled, undefined, kPoints);
  const n = compiled.orbitalCount;
  const random = createRandom(seed);
  return kPoints.flatMap((k, ki) =>
    bands.map((band) => ({
      k,
      band,
      energy: energies[ki * n + band - 1] + (noise > 0 ? noise * random.gaussian() : 0),
      ...(noise > 0 ? { sigma: noise } : {}),
    })),
  );
}

/** The model's own k-path with `count` points (Cartesian 1/Å). */
export function pathPoints(doc: ModelDocument, count: number): Vec3[] {
  return templateKPath(doc, { totalPoints: count }).k;
}

/**
 * A copy of the document with every free parameter moved by ±`fraction` of its value (by `fraction` eV
 * when it is 0), the sign drawn from a seeded generator.
 */
export function perturbed(doc: ModelDocument, fraction: number, seed: number): ModelDocument {
  const random = createRandom(seed);
  return {
    ...doc,
    parameters: doc.parameters.map((p) => {
      if (!p.free) return p;
      const sign = random.uniform() < 0.5 ? -1 : 1;
      return { ...p, value: p.value === 0 ? sign * fraction : p.value * (1 + sign * fraction) };
    }),
  };
}
