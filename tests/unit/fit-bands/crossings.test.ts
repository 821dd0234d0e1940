// Accidental band crossings (issue 11, item 15). Where two sorted bands meet, each band's own derivative is
// not defined: the sorted band has a kink. By degenerate perturbation theory (Sakurai & Napolitano, Modern
// Quantum Mechanics, §5.2) the first-order shifts of a degenerate level under θ_p → θ_p + h are h·μ_i, with
// μ_1 ≤ … ≤ μ_d the eigenvalues of ∂H/∂θ_p projected onto the degenerate subspace; the i-th sorted band
// moves by h·μ_i for h > 0 and by h·μ_{d+1−i} for h < 0, so central finite differences converge to
// (μ_i + μ_{d+1−i})/2. The fit's Jacobian must give that number at a crossing, not the Hellmann–Feynman
// value of whichever eigenvector the solver happened to return.
//
// The model: one site on a square lattice with s, px, py and nearest-neighbour Slater–Koster integrals.
// Along Γ–X (k_y = 0) the mirror y → −y decouples py from s and px, so the py band crosses an s–px band
// exactly at some k_x* (found by bisection). At Γ, px and py are degenerate by the fourfold rotation: every
// parameter moves them together, so that degeneracy is no crossing.
import { describe, expect, it } from "vitest";
import { runBandFit, validateBandFit } from "@/lib/fit";
import { type ModelDocumentInput, type Vec3, bandsWithGradients, compileModel, computeBands, prepareHamiltonian } from "@/lib/tb";

const A = 2.5; // Å
const V = { es: 0, ep: -1, ss: -1, sp: 1.2, ppSigma: 1, ppPi: 1.5 }; // eV
const model: ModelDocumentInput = {
  format: "bandwright-model",
  version: 1,
  lattice: [
    [A, 0, 0],
    [0, A, 0],
  ],
  sites: [{ label: "X", species: "X", position: [0, 0, 0], orbitals: ["s", "px", "py"] }],
  slaterKoster: { maxShell: 1 },
  parameters: [
    { name: "E_s[X]", value: V.es, unit: "eV", free: true },
    { name: "E_p[X]", value: V.ep, unit: "eV", free: true },
    { name: "V_ssσ[X–X,1]", value: V.ss, unit: "eV", free: true },
    { name: "V_spσ[X–X,1]", value: V.sp, unit: "eV", free: true },
    { name: "V_ppσ[X–X,1]", value: V.ppSigma, unit: "eV", free: true },
    { name: "V_ppπ[X–X,1]", value: V.ppPi, unit: "eV", free: true },
  ],
};
const compiled = compileModel(model);
const bandsAt = (k: Vec3) => Array.from(computeBands(compiled, undefined, [k]).energies);

/**
 * k_x (1/Å) where the py band meets an s–px band along Γ–X, by bisection. Slater & Koster (1954) Table I
 * at k_y = 0: py gives E_p + 2V_ppσ + 2V_ppπ cos(k_x a); s and px form the 2×2 block
 * [[E_s + 2V_ssσ(cos k_x a + 1), 2i V_spσ sin k_x a], [c.c., E_p + 2V_ppσ cos k_x a + 2V_ppπ]].
 */
function crossing(): number {
  const py = (kx: number) => V.ep + 2 * V.ppSigma + 2 * V.ppPi * Math.cos(kx * A);
  const even = (kx: number) => {
    const c = Math.cos(kx * A);
    const hss = V.es + 2 * V.ss * (c + 1);
    const hxx = V.ep + 2 * V.ppSigma * c + 2 * V.ppPi;
    const half = Math.hypot((hss - hxx) / 2, 2 * V.sp * Math.sin(kx * A));
    return [(hss + hxx) / 2 - half, (hss + hxx) / 2 + half];
  };
  const steps = 400;
  for (const branch of [0, 1])
    for (let i = 1; i < steps; i++) {
      // from just off Γ, where px and py meet by symmetry
      const f = (kx: number) => even(kx)[branch] - py(kx);
      let lo = ((i / steps) * Math.PI) / A;
      let hi = (((i + 1) / steps) * Math.PI) / A;
      if (Math.sign(f(lo)) === Math.sign(f(hi))) continue;
      for (let j = 0; j < 200; j++) {
        const mid = (lo + hi) / 2;
        if (Math.sign(f(mid)) === Math.sign(f(lo))) lo = mid;
        else hi = mid;
      }
      return (lo + hi) / 2;
    }
  throw new Error("no crossing along Γ–X");
}

const kStar = crossing();
const kPoints: Vec3[] = [[kStar, 0, 0], [0, 0, 0], [0.31, 0.17, 0], [0.9, 0.4, 0], [1.1, 1.05, 0]];
// the model's own bands: the fit stays at these values, where the crossing is
const points = kPoints.flatMap((k) => bandsAt(k).map((energy, b) => ({ k, band: b + 1, energy })));

describe("accidental crossings in the band fit", () => {
  it("the model has one: at k_x* two bands agree to rounding, and they differ in slope", () => {
    const e = bandsAt([kStar, 0, 0]);
    const gaps = [e[1] - e[0], e[2] - e[1]];
    expect(Math.min(...gaps)).toBeLessThan(1e-12);
    expect(Math.max(...gaps)).toBeGreaterThan(0.1);
  });

  it("the analytic Jacobian matches central finite differences at the crossing (the degenerate-subspace derivative)", () => {
    const validation = validateBandFit({ points, model });
    if (!validation.ok) throw new Error(JSON.stringify(validation.issues));
    const { residualModel, parameters } = validation.prepared;
    const problem = residualModel.problem(parameters);
    const theta = Float64Array.from(parameters, (p) => p.initial);
    const analytic = Float64Array.from(problem.evaluateWithJacobian!(theta).jacobian);
    const width = parameters.length;
    // h·(slope difference) ≫ the crossing's gap (rounding), so the differences see the kink; the
    // truncation error is O(h) at a kink (second-order shifts), 1e-6 here.
    const h = 1e-6;
    let worstRelative = 0;
    for (let j = 0; j < compiled.parameters.length; j++) {
      const plus = Float64Array.from(theta);
      const minus = Float64Array.from(theta);
      plus[j] += h;
      minus[j] -= h;
      const up = Float64Array.from(problem.evaluate(plus));
      const down = Float64Array.from(problem.evaluate(minus));
      for (let i = 0; i < points.length; i++) {
        const numeric = (up[i] - down[i]) / (2 * h);
        const error = Math.abs(analytic[i * width + j] - numeric);
        worstRelative = Math.max(worstRelative, error / Math.max(Math.abs(numeric), 1e-3));
        expect(error, `${parameters[j].name}, point ${i} (band ${points[i].band} at k ${points[i].k.join(", ")})`).toBeLessThan(1e-4);
      }
    }
    expect(worstRelative).toBeLessThan(1e-4);
  });

  it("gives a band at a crossing the same derivative when only that band's gradients are asked for", () => {
    const e = bandsAt([kStar, 0, 0]);
    const lower = e[1] - e[0] < 1e-12 ? 0 : 1;
    const prepared = prepareHamiltonian(compiled, [[kStar, 0, 0]]);
    const options = { crossingTolerance: 1e-3, crossingsInto: new Uint8Array(3) };
    const all = bandsWithGradients(prepared, compiled.initialValues, options).gradients!;
    expect([...options.crossingsInto]).toEqual([0, 1, 2].map((b) => (b === lower || b === lower + 1 ? 1 : 0)));
    const one = bandsWithGradients(prepared, compiled.initialValues, { ...options, gradientBands: [lower, lower] }).gradients!;
    const np = compiled.parameters.length;
    for (let p = 0; p < np; p++) expect(one[lower * np + p]).toBeCloseTo(all[lower * np + p], 12);
    expect([...options.crossingsInto]).toEqual([0, 1, 2].map((b) => (b === lower ? 1 : 0)));
  });

  it("counts the points at accidental crossings (not the symmetric px–py pair at Γ) in the result and warns", async () => {
    const result = await runBandFit({ points, model, options: { maxIterations: 3 } });
    expect(result.crossings).toEqual({ tolerance: 1e-5, points: 2 });
    const warning = result.warnings.find((w) => w.kind === "band-crossings");
    expect(warning?.message).toMatch(/^2 of 15 points lie where their model band meets another within 0.01 meV/);
  });

  it("a tolerance of 0 turns the treatment off: no crossing is counted", async () => {
    const result = await runBandFit({ points, model, options: { maxIterations: 3, crossingTolerance: 0 } });
    expect(result.crossings).toEqual({ tolerance: 0, points: 0 });
  });
});
