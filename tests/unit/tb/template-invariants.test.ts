import { describe, expect, it } from "vitest";
import {
  type ComplexMatrix,
  createComplexMatrix,
  createEigenOutput,
  createGeneralisedEigenSolver,
  createRandom,
  hermiticityDefect,
} from "@/lib/linalg";
import {
  type CompiledModel,
  type RealSpaceElement,
  TEMPLATE_IDS,
  type Vec3,
  bandsWithGradients,
  buildTemplate,
  combine,
  compileModel,
  completeLattice,
  expandHoppings,
  hamiltonianAt,
  hamiltonianDerivativeAt,
  overlapAt,
  overlapDerivativeAt,
  prepareHamiltonian,
  reducedToCartesian,
} from "@/lib/tb";

const cases: { name: string; compiled: CompiledModel }[] = [
  ...TEMPLATE_IDS.map((id) => ({ name: id, compiled: compileModel(buildTemplate(id)) })),
  { name: "honeycomb-pz with overlap", compiled: compileModel(buildTemplate("honeycomb-pz", { overlap: true })) },
];

function eigenvalues(h: ComplexMatrix, s: ComplexMatrix): number[] {
  const out = createEigenOutput(h.size);
  createGeneralisedEigenSolver(h.size).solve(h.re, h.im, s.re, s.im, out, false);
  return Array.from(out.values);
}
const bands = (c: CompiledModel, k: Vec3, theta = c.initialValues) => eigenvalues(hamiltonianAt(c, theta, k), overlapAt(c, theta, k));

/** H or S rebuilt from the real-space list alone, with or without τ in the Bloch phase. */
function rebuild(c: CompiledModel, elements: RealSpaceElement[], diagonal: number[], k: Vec3, withBasis: boolean): ComplexMatrix {
  const n = c.orbitalCount;
  const full = completeLattice(c.lattice);
  const m = createComplexMatrix(n);
  diagonal.forEach((d, i) => (m.re[i * n + i] = d));
  for (const e of elements) {
    const r = combine(e.translation, full);
    const tau = c.orbitals[e.to].position.map((x, i) => x - c.orbitals[e.from].position[i]);
    const d = withBasis ? r.map((x, i) => x + tau[i]) : r;
    const phase = k[0] * d[0] + k[1] * d[1] + k[2] * d[2];
    m.re[e.from * n + e.to] += e.value * Math.cos(phase) - e.imaginary * Math.sin(phase);
    m.im[e.from * n + e.to] += e.value * Math.sin(phase) + e.imaginary * Math.cos(phase);
  }
  return m;
}

const maxDifference = (a: ComplexMatrix, b: ComplexMatrix) =>
  Math.max(...Array.from(a.re, (x, i) => Math.hypot(x - b.re[i], a.im[i] - b.im[i])));

describe.each(cases)("template invariants at seeded random k: $name", ({ compiled }) => {
  const random = createRandom(3).uniform;
  const ks: Vec3[] = Array.from({ length: 4 }, () =>
    reducedToCartesian(compiled.reciprocal.map(() => random() - 0.5), compiled.reciprocal),
  );
  const G = reducedToCartesian(compiled.reciprocal.map((_, i) => [1, -2, 1][i]), compiled.reciprocal);

  it("H(k) and S(k) are Hermitian", () => {
    for (const k of ks) {
      expect(hermiticityDefect(hamiltonianAt(compiled, compiled.initialValues, k))).toBeLessThan(1e-12);
      expect(hermiticityDefect(overlapAt(compiled, compiled.initialValues, k))).toBeLessThan(1e-12);
    }
  });

  it("E(k) = E(k + G) and, without spin–orbit coupling, E(k) = E(−k) (Bloch's theorem; time reversal)", () => {
    for (const k of ks) {
      const e = bands(compiled, k);
      expect(bands(compiled, [k[0] + G[0], k[1] + G[1], k[2] + G[2]])).toEqual(e.map((x) => expect.closeTo(x, 9)));
      expect(bands(compiled, [-k[0], -k[1], -k[2]])).toEqual(e.map((x) => expect.closeTo(x, 9)));
    }
  });

  it("the real-space list rebuilds H(k) exactly, and the eigenvalues do not depend on the phase convention", () => {
    // DESIGN.md: e^{ik·(R + τj − τi)} and e^{ik·R} differ by a diagonal unitary transform.
    const real = expandHoppings(compiled, compiled.initialValues);
    const ones = real.onsite.map(() => 1);
    for (const k of ks) {
      const h = hamiltonianAt(compiled, compiled.initialValues, k);
      expect(maxDifference(rebuild(compiled, real.hoppings, real.onsite, k, true), h)).toBeLessThan(1e-12);
      expect(maxDifference(rebuild(compiled, real.overlaps, ones, k, true), overlapAt(compiled, compiled.initialValues, k))).toBeLessThan(1e-12);
      const other = eigenvalues(rebuild(compiled, real.hoppings, real.onsite, k, false), rebuild(compiled, real.overlaps, ones, k, false));
      expect(other).toEqual(bands(compiled, k).map((x) => expect.closeTo(x, 9)));
    }
  });

  it("∂H/∂θ and ∂S/∂θ equal a central finite difference of H and S", () => {
    const h = 1e-5;
    const k = ks[0];
    compiled.parameters.forEach((_, p) => {
      const plus = Float64Array.from(compiled.initialValues);
      const minus = Float64Array.from(compiled.initialValues);
      plus[p] += h;
      minus[p] -= h;
      for (const [derivative, at] of [
        [hamiltonianDerivativeAt, hamiltonianAt],
        [overlapDerivativeAt, overlapAt],
      ] as const) {
        const exact = derivative(compiled, p, k);
        const hp = at(compiled, plus, k);
        const hm = at(compiled, minus, k);
        const fd = createComplexMatrix(compiled.orbitalCount);
        fd.re.forEach((_, i) => {
          fd.re[i] = (hp.re[i] - hm.re[i]) / (2 * h);
          fd.im[i] = (hp.im[i] - hm.im[i]) / (2 * h);
        });
        expect(maxDifference(exact, fd)).toBeLessThan(1e-8);
      }
    });
  });

  it("Hellmann–Feynman gradients equal finite differences of the eigenvalues (non-degenerate bands)", () => {
    const prepared = prepareHamiltonian(compiled, ks);
    const theta = compiled.initialValues;
    const { energies, gradients } = bandsWithGradients(prepared, theta);
    const n = compiled.orbitalCount;
    const np = compiled.parameters.length;
    const step = 1e-6;
    compiled.parameters.forEach((_, p) => {
      const plus = Float64Array.from(theta);
      const minus = Float64Array.from(theta);
      plus[p] += step;
      minus[p] -= step;
      const ep = bandsWithGradients(prepared, plus, { gradients: false }).energies;
      const em = bandsWithGradients(prepared, minus, { gradients: false }).energies;
      for (let k = 0; k < ks.length; k++)
        for (let b = 0; b < n; b++) {
          const i = k * n + b;
          const gap = Math.min(b > 0 ? energies[i] - energies[i - 1] : Infinity, b < n - 1 ? energies[i + 1] - energies[i] : Infinity);
          if (gap < 1e-3) continue;
          expect(gradients![i * np + p]).toBeCloseTo((ep[i] - em[i]) / (2 * step), 5);
        }
    });
  });
});
