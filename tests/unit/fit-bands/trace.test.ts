// The convergence trace of a band fit starts at iteration 0 with the χ² of the start point, so that a
// chart of it shows the whole drop, not only what happened after the first step.
import { describe, expect, it } from "vitest";
import { bandFitResultSchema, runBandFit } from "@/lib/fit";
import { buildTemplate, compileModel, computeBands } from "@/lib/tb";
import { pathPoints, perturbed, syntheticPoints } from "./synthetic";

describe("convergence trace", () => {
  const truth = buildTemplate("honeycomb-pz");
  const kPoints = pathPoints(truth, 40);
  // Noise-free data without σ: every point gets the default uniform σ = 1 eV (fitOptionsSchema).
  const points = syntheticPoints(truth, kPoints, [1, 2], 0, 1);
  const start = perturbed(truth, 0.15, 2);

  it("begins with iteration 0 at the start's χ², then one entry per iteration down to the result", async () => {
    const result = await runBandFit({ points, model: start });
    // χ² = Σ ((E_model − E_data)/σ)², the least-squares definition (Press et al., Numerical Recipes, 3rd ed.,
    // §15.1; section number from memory), at the start values with σ = 1 eV, data band b against model band b
    // (the default offset mapping).
    const compiled = compileModel(start);
    const { energies } = computeBands(compiled, undefined, kPoints);
    const n = compiled.orbitalCount;
    const startChiSquared = points.reduce((sum, p, i) => sum + (energies[Math.floor(i / 2) * n + p.band - 1] - p.energy) ** 2, 0);

    expect(result.trace.map((t) => t.iteration)).toEqual(Array.from({ length: result.iterations + 1 }, (_, i) => i));
    expect(result.trace[0].chiSquared).toBeCloseTo(startChiSquared, 9);
    expect(result.trace[0].damping).toBeGreaterThan(0);
    // The drop the chart shows: from the start to the converged, noise-free fit (χ² ≈ 0 at the truth).
    expect(result.trace.at(-1)!.chiSquared).toBe(result.chiSquared);
    expect(result.chiSquared).toBeLessThan(1e-6 * startChiSquared);
    for (let i = 1; i < result.trace.length; i++) expect(result.trace[i].chiSquared).toBeLessThanOrEqual(result.trace[i - 1].chiSquared);
    expect(() => bandFitResultSchema.parse(result)).not.toThrow();
  });

  it("keeps the best start's trace, its iteration 0 included, when several starts run", async () => {
    const result = await runBandFit({ points, model: start, options: { starts: 3, seed: 4 } });
    expect(result.trace[0].iteration).toBe(0);
    expect(result.trace.filter((t) => t.iteration === 0)).toHaveLength(1);
    expect(result.trace).toHaveLength(result.iterations + 1);
  });
});
