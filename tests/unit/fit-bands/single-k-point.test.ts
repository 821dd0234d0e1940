// Issue 11, item 11: data whose points all lie at one k-point. The rule (lib/fit/bands/single-k-point.ts):
// at one k the fit sees only the band energies there, so it is refused when those energies cannot separate
// the free parameters (the whitened Jacobian is rank-deficient at the start and at a perturbed point), and
// run with a warning when they can (an on-site energy and one hopping from two bands at Γ, say).
// Closed forms of the honeycomb pz model, Castro Neto et al., Rev. Mod. Phys. 81, 109 (2009) (REFERENCES §4,
// computed): nearest neighbours only, E(Γ) = E_p ∓ 3t, E(K) = E_p for both bands; with t′, both bands at Γ
// move by −6t′ together.
import { describe, expect, it } from "vitest";
import { runBandFit, validateBandFit } from "@/lib/fit";
import { type Vec3, buildTemplate, reciprocalLattice, reducedToCartesian } from "@/lib/tb";

const doc = buildTemplate("honeycomb-pz");
const reciprocal = reciprocalLattice(doc.lattice);
const at = (reduced: Vec3) => reducedToCartesian(reduced, reciprocal);
const GAMMA = at([0, 0, 0]);
const K = at([2 / 3, 1 / 3, 0]);
const truth = { t1: 2.6, ep: 0.1 };

/** Both bands at one k, each repeated `repeats` times (as repeated measurements would be). */
function pointsAt(k: Vec3, energies: [number, number], repeats = 1) {
  return Array.from({ length: repeats }, () => [
    { k, band: 1, energy: energies[0] },
    { k, band: 2, energy: energies[1] },
  ]).flat();
}

describe("a fit on points at one k-point", () => {
  it("is refused at K, where the hopping drops out, naming the dataset and the parameter", () => {
    const validation = validateBandFit({
      datasetName: "HQ-09 K only",
      points: pointsAt(K, [truth.ep, truth.ep], 3),
      model: { template: "honeycomb-pz" },
    });
    expect(validation.ok).toBe(false);
    if (validation.ok) return;
    expect(validation.issues).toHaveLength(1);
    const [issue] = validation.issues;
    expect(issue.path).toBe("points");
    expect(issue.message).toMatch(/^dataset “HQ-09 K only”: all 6 points the fit uses lie at one k-point, k = \(.*\) 1\/Å: a fit needs a dispersion\./);
    expect(issue.message).toContain("do not determine t1");
    expect(issue.message).not.toContain("E_p[C]");
  });

  it("is refused at Γ when a second hopping is free: only t1 and one combination of E_p and t2 are fixed", () => {
    const validation = validateBandFit({
      points: pointsAt(GAMMA, [truth.ep - 3 * truth.t1, truth.ep + 3 * truth.t1], 2),
      model: { template: "honeycomb-pz", parameters: { t2: { free: true, value: 0.1 } } },
    });
    expect(validation.ok).toBe(false);
    if (validation.ok) return;
    const [issue] = validation.issues;
    expect(issue.message).toMatch(/^all 4 points the fit uses lie at one k-point/);
    expect(issue.message).toContain("do not determine E_p[C], t2");
    expect(issue.message).not.toMatch(/t1[,;]/);
  });

  it("runs at Γ with a warning when the energies there fix every free parameter, and finds them", async () => {
    // Each band twice: a fit needs more points than free parameters.
    const points = pointsAt(GAMMA, [truth.ep - 3 * truth.t1, truth.ep + 3 * truth.t1], 2);
    const validation = validateBandFit({ datasetName: "HQ-09 Γ only", points, model: { template: "honeycomb-pz" } });
    expect(validation.ok).toBe(true);
    if (!validation.ok) return;
    expect(validation.prepared.warnings).toEqual([
      {
        kind: "single-k-point",
        parameters: [],
        message: expect.stringMatching(/^dataset “HQ-09 Γ only”: all 4 points the fit uses lie at one k-point, k = \(0, 0, 0\) 1\/Å: the free parameters are set by the energies there alone/),
      },
    ]);
    // The template starts from t1 = 2.8 eV, E_p = 0: the fit moves them to the values the two energies fix.
    const result = await runBandFit({ points, model: { template: "honeycomb-pz" } });
    const value = (name: string) => result.parameters.find((p) => p.name === name)?.value;
    expect(value("t1")).toBeCloseTo(truth.t1, 8);
    expect(value("E_p[C]")).toBeCloseTo(truth.ep, 8);
    expect(result.warnings.map((w) => w.kind)).toContain("single-k-point");
  });

  it("adds nothing when the points lie at two k-points", () => {
    const points = [...pointsAt(GAMMA, [truth.ep - 3 * truth.t1, truth.ep + 3 * truth.t1]), ...pointsAt(K, [truth.ep, truth.ep])];
    const validation = validateBandFit({ points, model: { template: "honeycomb-pz" } });
    expect(validation.ok).toBe(true);
    if (validation.ok) expect(validation.prepared.warnings.map((w) => w.kind)).not.toContain("single-k-point");
  });
});
