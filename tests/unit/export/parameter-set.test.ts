import { readFileSync } from "node:fs";
import { Matrix, inverse } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { type ParameterSet, buildParameterSet, parameterSetJsonSchema, parameterSetSchema } from "@/lib/export";
import { ENERGY_ALIGNMENT_FORMULA, fitOptionsSchema, readStoredResult, runBandFit, validateBandFit } from "@/lib/fit/bands";
import { buildTemplate, compileModel, computeBands, reducedToCartesian, type Vec3 } from "@/lib/tb";
import { pathPoints, syntheticPoints } from "../fit-bands/synthetic";
import { rebuiltBands } from "./rebuild";

// The exported parameter set, version 2 (issue 11, items 12–14): it explains itself, carries the covariance
// and each bond's parameters and vector, and H(k) rebuilt from it alone gives the fitted bands.

const provenance = {
  dataset: { id: "ds-1", name: "Halvorsen graphene cut 3", sha256: "a".repeat(64), source: "calculation" as const, energyReference: "Fermi level" },
  fit: { id: "fit-1", name: "pz nearest neighbour" },
  revision: 1,
  launchedBy: "Halvorsen lab member",
  launchedAt: new Date("2031-03-01T10:00:00Z"),
  finishedAt: new Date("2031-03-01T10:00:02Z"),
  exportedAt: new Date("2031-03-01T10:05:00Z"),
  softwareVersion: "0.1.0",
};
const settings = (options: object = {}) => ({ mapping: { kind: "offset" as const, firstModelBand: 1 }, window: null, options: fitOptionsSchema.parse(options) });

/** Every object property of a JSON Schema, with its path, wherever it sits (items, unions, nested objects). */
function properties(schema: unknown, path = "$"): { path: string; schema: Record<string, unknown> }[] {
  if (!schema || typeof schema !== "object") return [];
  const node = schema as Record<string, unknown>;
  const found: { path: string; schema: Record<string, unknown> }[] = [];
  for (const [name, child] of Object.entries((node.properties ?? {}) as Record<string, Record<string, unknown>>)) {
    found.push({ path: `${path}.${name}`, schema: child }, ...properties(child, `${path}.${name}`));
  }
  for (const key of ["items", "additionalProperties"]) found.push(...properties(node[key], `${path}[]`));
  for (const key of ["anyOf", "oneOf", "allOf", "prefixItems"])
    for (const [i, child] of ((node[key] as unknown[]) ?? []).entries()) found.push(...properties(child, `${path}|${i}`));
  return found;
}

describe("parameter-set JSON Schema", () => {
  it("the committed file is the one generated from the zod schema", () => {
    const committed = JSON.parse(readFileSync("lib/export/parameter-set.schema.json", "utf8"));
    expect(committed).toEqual(parameterSetJsonSchema());
    expect(committed.$schema).toBe("https://json-schema.org/draft/2020-12/schema");
  });

  it("describes every field", () => {
    const all = properties(parameterSetJsonSchema());
    expect(all.length).toBeGreaterThan(100);
    expect(all.filter((p) => typeof p.schema.description !== "string" || p.schema.description.length === 0).map((p) => p.path)).toEqual([]);
  });
});

async function fittedExport(options: object = {}, overrides: Record<string, { free: boolean }> = {}) {
  // graphene-like: t1 from 2.8 eV (template default) to 2.62 eV, t2 freed, E_p shifted by 0.1 eV, 4 meV noise
  const truth = buildTemplate("honeycomb-pz", { parameters: { t1: { value: 2.62 }, t2: { value: 0.11 }, "E_p[C]": { value: 0.1 } } });
  const k = pathPoints(truth, 40);
  const points = syntheticPoints(truth, k, [1, 2], 0.004, 7);
  const input = { points, model: { template: "honeycomb-pz" as const, parameters: { t2: { free: true }, ...overrides } }, options };
  const { residuals, ...result } = await runBandFit(input);
  return { set: buildParameterSet(result, settings(options), provenance), result, residuals, k, input };
}

describe("buildParameterSet", () => {
  // Rebuilding H(k) from the bonds alone must reproduce the fitted model's bands: both are the same Bloch sum
  // (the document's conventions.hamiltonian), so agreement is to rounding, 1e-9 eV.
  it("honeycomb pz: validates, and H(k) from its bonds alone gives the fitted bands to 1e-9 eV", async () => {
    const { set, result, k } = await fittedExport();
    expect(parameterSetSchema.safeParse(JSON.parse(JSON.stringify(set))).success).toBe(true);
    const fitted = compileModel(result.fittedModel);
    const { energies } = computeBands(fitted, undefined, k);
    for (const index of [0, 7, 19, 33]) rebuiltBands(set, k[index]).forEach((e, b) => expect(Math.abs(e - energies[index * 2 + b])).toBeLessThan(1e-9));
  });

  it("states the sign convention by example: t1 enters its bonds with coefficient −1, so t1 = 2.62 eV is −2.62 eV", async () => {
    const { set } = await fittedExport();
    const t1 = set.parameters.find((p) => p.name === "t1")!;
    expect(t1.value).toBeCloseTo(2.62, 2); // 4 meV noise
    const nearest = set.bonds.filter((b) => b.parameters.some((c) => c.name === "t1"));
    expect(nearest).toHaveLength(6); // three A→B and three B→A bonds of length C–C = 1.42 Å
    for (const bond of nearest) {
      expect(bond.parameters).toEqual([{ name: "t1", coefficient: -1 }]);
      expect(bond.value).toBeCloseTo(-t1.value, 12);
      expect(bond.length).toBeCloseTo(1.42, 12);
    }
    expect(set.conventions.signs).toContain("t1 = 2.62 eV appears as −2.62 eV");
  });

  it("lists each bond with its vector R·a + τ_to − τ_from, a unique key and its Hermitian partner", async () => {
    const { set } = await fittedExport();
    const byKey = new Map(set.bonds.map((b) => [b.key, b]));
    expect(byKey.size).toBe(set.bonds.length);
    for (const b of set.bonds) {
      const [i, j] = b.matrixEntry;
      const expected = [0, 1, 2].map((c) => set.lattice.reduce((r, a, n) => r + b.translation[n] * a[c], set.orbitals[j].position[c] - set.orbitals[i].position[c]));
      b.vector.forEach((x, c) => expect(x).toBeCloseTo(expected[c], 12));
      const partner = byKey.get(b.partner)!;
      expect(partner.matrixEntry).toEqual([j, i]);
      expect(partner.value).toBe(b.value); // real: its own complex conjugate
      expect(partner.translation).toEqual(b.translation.map((n) => -n || 0));
    }
  });

  it("exports the covariance s²(JᵀWJ)⁻¹ of the free parameters, checked against a central-difference Jacobian", async () => {
    // GSL reference manual, "Nonlinear Least-Squares Fitting: Covariance matrix of best fit parameters";
    // central differences, Nocedal & Wright, Numerical Optimization, 2nd ed., §8.1.
    const { set, result, input } = await fittedExport();
    const names = set.covariance.parameters;
    expect(names).toEqual(["E_p[C]", "t1", "t2"]);
    const validation = validateBandFit(input);
    if (!validation.ok) throw new Error("fit input refused");
    const { residualModel, parameters } = validation.prepared;
    const problem = residualModel.problem(parameters);
    const theta = Float64Array.from(parameters, (p) => result.parameters.find((q) => q.name === p.name)?.value ?? p.initial);
    const columns = names.map((name) => parameters.findIndex((p) => p.name === name));
    const sigma = input.points.map((p) => p.sigma!);
    const n = sigma.length;
    const jacobian = new Matrix(n, columns.length);
    columns.forEach((j, c) => {
      const h = 1e-6;
      const plus = Float64Array.from(theta);
      const minus = Float64Array.from(theta);
      plus[j] += h;
      minus[j] -= h;
      const up = Float64Array.from(problem.evaluate(plus));
      const down = Float64Array.from(problem.evaluate(minus));
      for (let i = 0; i < n; i++) jacobian.set(i, c, (up[i] - down[i]) / (2 * h) / sigma[i]);
    });
    const s2 = result.chiSquared / (n - columns.length);
    const expected = inverse(jacobian.transpose().mmul(jacobian)).mul(s2);
    set.covariance.matrix.forEach((row, i) =>
      row.forEach((c, j) => expect(Math.abs(c! - expected.get(i, j))).toBeLessThan(1e-4 * Math.sqrt(expected.get(i, i) * expected.get(j, j)))),
    );
    // the diagonal is the squared standard errors, the correlation is the normalised covariance
    names.forEach((name, i) => expect(set.covariance.matrix[i][i]).toBeCloseTo(set.parameters.find((p) => p.name === name)!.standardError! ** 2, 15));
    expect(set.covariance.correlation).toEqual(result.correlation.matrix);
    // an error propagated to a t1 bond through its coefficient −1 is t1's own
    const bond = set.bonds.find((b) => b.parameters[0]?.name === "t1")!;
    const c = bond.parameters[0].coefficient as number;
    expect(Math.sqrt(c * c * set.covariance.matrix[1][1]!)).toBeCloseTo(set.parameters.find((p) => p.name === "t1")!.standardError!, 15);
  });

  it("states the energy alignment, the data's energy zero, the fit's settings, the k-path and the spin", async () => {
    const options = { energyOffset: { value: 0.02, free: true }, starts: 2, seed: 9, sigma: "uniform", uniformSigma: 0.01, bandWeights: { "2": 0.5 } };
    // a free offset needs a fixed on-site energy (else the two are one shift)
    const { set, result } = await fittedExport(options, { "E_p[C]": { free: false } });
    expect(set.energyAlignment.formula).toBe(ENERGY_ALIGNMENT_FORMULA);
    const offset = result.parameters.find((p) => p.name === "energy offset")!;
    expect(set.energyAlignment.offset).toEqual({ value: offset.value, free: true, standardError: offset.standardError });
    expect(set.energyAlignment.renormalisation).toEqual({ value: 1, free: false, standardError: null });
    expect(set.energyAlignment.dataEnergyZero).toBe("Fermi level");
    expect(set.covariance.parameters).toContain("energy offset");
    expect(set.fit).toMatchObject({ starts: 2, seed: 9, sigma: { policy: "uniform", uniform: 0.01 }, bandWeights: { "2": 0.5 }, window: null, crossingTolerance: 1e-5 });
    expect(set.spin).toBe("spinless");
    expect(set.kPath?.map((p) => p.label)).toEqual(["Γ", "M", "K", "Γ"]);
    for (const p of set.kPath!) reducedToCartesian(p.reduced, set.reciprocalLattice as Vec3[]).forEach((x, c) => expect(p.cartesian[c]).toBeCloseTo(x, 12));
    expect(set.orbitalDefinitions).toEqual({ pz: "z/r" });
    expect(set.statistics.crossingPoints).toBe(result.crossings!.points);
    const unstated = buildParameterSet(result, settings(options), { ...provenance, dataset: { ...provenance.dataset, energyReference: null } });
    expect(unstated.energyAlignment.dataEnergyZero).toBe("unstated");
  });

  it("sp3s* silicon: a 10-orbital export rebuilds the template bands to 1e-9 eV; its bonds name their Slater–Koster integrals", () => {
    // Vogl, Hjalmarson & Dow (1983) parameters are the template's defaults; no fit needed for the check.
    const doc = buildTemplate("diamond-sp3s-star");
    const compiled = compileModel(doc);
    const result = {
      parameters: compiled.parameters.map((p) => ({ name: p.name, value: p.value, standardError: null, start: p.value, free: p.free, determined: !p.free, unit: p.unit, atBound: null })),
      fittedModel: doc,
      correlation: { names: [], matrix: [] },
      rms: 0,
      maxAbsResidual: 0,
      chiSquared: 0,
      reducedChiSquared: 0,
      pointsUsed: 0,
      pointsDropped: { window: 0, unmapped: 0, zeroWeight: 0 },
      converged: true,
      stopReason: "chi-squared-tolerance",
    } as unknown as Parameters<typeof buildParameterSet>[0];
    const set: ParameterSet = buildParameterSet(result, settings(), provenance);
    // mathjs eigs loses accuracy at exactly degenerate points such as X (seen: 1e-3 eV), so away from Γ
    // the k-points are general ones.
    const ks: Vec3[] = [[0, 0, 0], [1.1, 0.05, 0], [0.31, -0.17, 0.52]];
    const { energies } = computeBands(compiled, undefined, ks);
    ks.forEach((k, i) => rebuiltBands(set, k).forEach((e, b) => expect(Math.abs(e - energies[i * 10 + b])).toBeLessThan(1e-9)));
    expect(set.overlaps).toEqual([]);
    // s–s bonds are V(ssσ) as it is (coefficient 1), at the nearest-neighbour distance a√3/4
    const ss = set.bonds.filter((b) => b.from.endsWith(":s") && b.to.endsWith(":s"));
    expect(ss).toHaveLength(8);
    for (const b of ss) {
      expect(b.parameters).toEqual([{ name: "V_ssσ[Si–Si,1]", coefficient: 1 }]);
      expect(b.length).toBeCloseTo((5.431 * Math.sqrt(3)) / 4, 12);
    }
    expect(set.parameters.find((p) => p.name === "V_ppπ[Si–Si,1]")?.integral).toEqual({ matrix: "hamiltonian", bond: "pp", kind: "π", pair: ["Si", "Si"], shell: 1 });
    // V(ss*σ) = V(s*s*σ) = 0 and fixed: no bond of theirs is listed
    expect(set.bonds.some((b) => b.parameters.some((c) => c.name === "V_ss*σ[Si–Si,1]"))).toBe(false);
    expect(set.orbitals.map((o) => o.label).slice(0, 5)).toEqual(["Si1:s", "Si1:px", "Si1:py", "Si1:pz", "Si1:s*"]);
  });

  it("exports a revision stored in the earlier spelling with today's names, and says its fit predates crossing counts", () => {
    const legacy = JSON.parse(readFileSync("tests/support/legacy-spelling-revision.json", "utf8"));
    const result = readStoredResult(legacy.result);
    const set = buildParameterSet(result, { mapping: legacy.inputs.mapping, window: null, options: fitOptionsSchema.parse(legacy.inputs.options) }, provenance);
    expect(set.parameters.map((p) => p.name)).toContain("V_s*pσ[Si–Si,1]");
    expect(set.covariance.parameters.every((n) => !n.includes("_sigma"))).toBe(true);
    expect(set.fit.crossingTolerance).toBeNull();
    expect(set.statistics.crossingPoints).toBeNull();
    const truth = compileModel(result.fittedModel);
    // general k-points: mathjs eigs is inaccurate at the path's degeneracies (see above)
    const k: Vec3[] = [[1.1, 0.05, 0], [0.31, -0.17, 0.52]];
    const { energies } = computeBands(truth, undefined, k);
    k.forEach((kk, i) => rebuiltBands(set, kk).forEach((e, b) => expect(Math.abs(e - energies[i * 10 + b])).toBeLessThan(1e-9)));
  });
});
