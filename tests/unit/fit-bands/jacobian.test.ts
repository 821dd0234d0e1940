// The analytic (Hellmann–Feynman) Jacobian of the band residuals against central finite differences on
// every template, at generic k-points (no degeneracies) and with a non-trivial offset and renormalisation.
// Central differences have truncation error O(h²) (Nocedal & Wright, Numerical Optimization, 2nd ed.,
// §8.1); with h = 1e-5 the agreement is far better than the 1e-5 asked for.
import { describe, expect, it } from "vitest";
import { createRandom, validateBandFit } from "@/lib/fit";
import { TEMPLATE_IDS, type TemplateId, type Vec3, buildTemplate, reciprocalLattice } from "@/lib/tb";

const RELATIVE_TOLERANCE = 1e-5;

function genericKPoints(lattice: Vec3[], count: number, seed: number): Vec3[] {
  const b = reciprocalLattice(lattice);
  const random = createRandom(seed);
  return Array.from({ length: count }, () => {
    const f = b.map(() => random.uniformIn(-0.5, 0.5));
    return [0, 1, 2].map((c) => b.reduce((sum, v, i) => sum + f[i] * v[c], 0)) as Vec3;
  });
}

type Case = { id: TemplateId; overlap: boolean };
const cases = TEMPLATE_IDS.flatMap((id): Case[] =>
  id === "honeycomb-pz" ? [{ id, overlap: false }, { id, overlap: true }] : [{ id, overlap: false }],
);

describe("analytic Jacobian matches central finite differences to 1e-5 relative", () => {
  it.each(cases)("$id (overlap: $overlap)", ({ id, overlap }) => {
    const doc = buildTemplate(id, { overlap });
    const bandCount = doc.sites.reduce((n, s) => n + s.orbitals.length, 0);
    const points = genericKPoints(doc.lattice, 6, 17).flatMap((k) =>
      Array.from({ length: bandCount }, (_, b) => ({ k, band: b + 1, energy: 0 })),
    );
    const validation = validateBandFit({
      points,
      model: doc,
      options: { energyOffset: { value: 0.13, free: false }, renormalisation: { value: 1.3, free: false, reference: 0.4 } },
    });
    if (!validation.ok) throw new Error(JSON.stringify(validation.issues));
    const { residualModel, parameters } = validation.prepared;
    // Move every value off the template's round numbers so no symmetry hides a wrong term.
    const theta = Float64Array.from(parameters, (p, j) => p.initial * 1.07 + 0.011 * (j + 1));
    const problem = residualModel.problem(parameters);
    const analytic = Float64Array.from(problem.evaluateWithJacobian!(theta).jacobian);
    const width = parameters.length;
    for (let j = 0; j < width; j++) {
      const h = 1e-5 * Math.max(1, Math.abs(theta[j]));
      const plus = Float64Array.from(theta);
      const minus = Float64Array.from(theta);
      plus[j] += h;
      minus[j] -= h;
      const up = Float64Array.from(problem.evaluate(plus));
      const down = Float64Array.from(problem.evaluate(minus));
      let scale = 0;
      for (let i = 0; i < points.length; i++) scale = Math.max(scale, Math.abs(analytic[i * width + j]));
      for (let i = 0; i < points.length; i++) {
        const numeric = (up[i] - down[i]) / (2 * h);
        expect(Math.abs(analytic[i * width + j] - numeric), `${parameters[j].name}, point ${i}`).toBeLessThanOrEqual(
          RELATIVE_TOLERANCE * Math.max(scale, 1e-3),
        );
      }
    }
  });
});
