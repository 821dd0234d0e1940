import { describe, expect, it } from "vitest";
import { createComplexMatrix } from "@/lib/linalg";
import {
  type Vec3,
  assembleHamiltonian,
  assembleOverlap,
  bandsWithGradients,
  buildTemplate,
  compileModel,
  computeBands,
  hamiltonianAt,
  overlapAt,
  prepareHamiltonian,
} from "@/lib/tb";

const ks: Vec3[] = [[0.1, 0.2, 0.3], [0.5, -0.4, 0.25]];

describe("bands", () => {
  it("assembles from the prepared coefficients exactly what hamiltonianAt / overlapAt return", () => {
    for (const doc of [buildTemplate("diamond-sp3s-star"), buildTemplate("honeycomb-pz", { overlap: true })]) {
      const compiled = compileModel(doc);
      const prepared = prepareHamiltonian(compiled, ks);
      const theta = compiled.initialValues.map((x, i) => x * (1 + 0.01 * i));
      const h = createComplexMatrix(compiled.orbitalCount);
      const s = createComplexMatrix(compiled.orbitalCount);
      ks.forEach((k, i) => {
        assembleHamiltonian(prepared, i, theta, h);
        assembleOverlap(prepared, i, theta, s);
        expect(Array.from(h.re)).toEqual(Array.from(hamiltonianAt(compiled, theta, k).re).map((x) => expect.closeTo(x, 13)));
        expect(Array.from(h.im)).toEqual(Array.from(hamiltonianAt(compiled, theta, k).im).map((x) => expect.closeTo(x, 13)));
        expect(Array.from(s.re)).toEqual(Array.from(overlapAt(compiled, theta, k).re).map((x) => expect.closeTo(x, 13)));
      });
    }
  });

  it("computeBands agrees with bandsWithGradients and its orbital weights sum to 1 per band (Mulliken with S)", () => {
    for (const doc of [buildTemplate("fcc-spd"), buildTemplate("honeycomb-pz", { overlap: true })]) {
      const compiled = compileModel(doc);
      const n = compiled.orbitalCount;
      const bands = computeBands(compiled, undefined, ks, { eigenvectors: true, orbitalWeights: true });
      const reference = bandsWithGradients(prepareHamiltonian(compiled, ks), compiled.initialValues, { gradients: false });
      expect(Array.from(bands.energies)).toEqual(Array.from(reference.energies));
      for (let k = 0; k < ks.length; k++)
        for (let b = 0; b < n; b++) {
          const w = bands.orbitalWeights!.slice((k * n + b) * n, (k * n + b + 1) * n);
          expect(w.reduce((sum, x) => sum + x, 0)).toBeCloseTo(1, 12);
        }
      expect(bands.eigenvectorsRe).toHaveLength(ks.length * n * n);
    }
  });

  it("refuses a parameter vector of the wrong length", () => {
    const compiled = compileModel(buildTemplate("chain-s"));
    expect(() => bandsWithGradients(prepareHamiltonian(compiled, ks), new Float64Array(3))).toThrow(/expected 2 parameter values, got 3/);
  });
});
