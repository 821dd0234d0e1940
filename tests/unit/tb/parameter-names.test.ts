import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { readStoredResult } from "@/lib/fit/bands";
import {
  BOND_TYPES,
  ModelError,
  bondIntegralName,
  bondIntegralOf,
  buildTemplate,
  canonicalParameterName,
  compileModel,
  computeBands,
  modelDocumentSchema,
  splitBondType,
  templateKPath,
} from "@/lib/tb";

// Parameter names (issue 11, item 14): bond integrals are `V_ppπ[Si–Si,1]` with the structured key
// { matrix, bond, kind, pair, shell } beside them; documents in the earlier spelling `V_pp_pi[Si-Si,1]`
// (stored revisions, user documents) are read as the same parameters.

/** A revision stored before the change (made with the code of f0e7d08: sp3s* Si, bands 1–4, 40 iterations). */
const legacy = JSON.parse(readFileSync("tests/support/legacy-spelling-revision.json", "utf8"));

describe("bond-integral names", () => {
  it("round-trips every bond type, for H and S, through its structured key", () => {
    for (const type of BOND_TYPES)
      for (const matrix of ["hamiltonian", "overlap"] as const) {
        const key = { matrix, ...splitBondType(type), pair: ["Ga", "As"] as [string, string], shell: 2 };
        const name = bondIntegralName(key);
        expect(name).toBe(`${matrix === "hamiltonian" ? "V" : "S"}_${type}[Ga–As,2]`);
        expect(bondIntegralOf(name)).toEqual(key);
      }
  });

  it("reads the earlier spelling as today's name, and leaves every other name alone", () => {
    expect(canonicalParameterName("V_pp_pi[Si-Si,1]")).toBe("V_ppπ[Si–Si,1]");
    expect(canonicalParameterName("V_s*p_sigma[Ga-As,1]")).toBe("V_s*pσ[Ga–As,1]");
    expect(canonicalParameterName("V_ss*_sigma[As-Ga,1]")).toBe("V_ss*σ[As–Ga,1]");
    expect(canonicalParameterName("S_dd_delta[Cu-Cu,2]")).toBe("S_ddδ[Cu–Cu,2]");
    // a typed hyphen with the Greek kind is read too
    expect(canonicalParameterName("V_ppπ[Si-Si,1]")).toBe("V_ppπ[Si–Si,1]");
    for (const name of ["t1", "t''", "E_s[Si]", "E_s*[Ga]", "V_ss_pi[Si-Si,1]", "V_ppπ[Si–Si,0]", "energy offset"])
      expect(canonicalParameterName(name)).toBe(name);
  });
});

describe("model documents", () => {
  it("fill in each bond integral's structured key from its name", () => {
    const doc = buildTemplate("diamond-sp3s-star");
    expect(doc.parameters.find((p) => p.name === "V_ppπ[Si–Si,1]")?.integral).toEqual({
      matrix: "hamiltonian",
      bond: "pp",
      kind: "π",
      pair: ["Si", "Si"],
      shell: 1,
    });
    expect(doc.parameters.find((p) => p.name === "E_s[Si]")?.integral).toBeUndefined();
  });

  it("refuse a structured key that contradicts the name", () => {
    const doc = buildTemplate("diamond-sp3s-star");
    const edited = {
      ...doc,
      parameters: doc.parameters.map((p) => (p.name === "V_ppπ[Si–Si,1]" ? { ...p, integral: { ...p.integral!, kind: "σ" } } : p)),
    };
    try {
      compileModel(edited);
      throw new Error("expected a ModelError");
    } catch (error) {
      expect(error).toBeInstanceOf(ModelError);
      expect((error as ModelError).issues).toEqual([
        { path: "parameters.6.integral", message: 'the integral V_ppσ[Si–Si,1] does not match the parameter\'s name "V_ppπ[Si–Si,1]"' },
      ]);
    }
  });

  it("in the earlier spelling compile to the same model as today's template (names, terms, bands)", () => {
    const stored = legacy.inputs.model;
    expect(stored.parameters.map((p: { name: string }) => p.name)).toContain("V_pp_pi[Si-Si,1]");
    const read = compileModel(stored);
    const today = compileModel(buildTemplate("diamond-sp3s-star", { parameters: { "V_ssσ[Si–Si,1]": { value: -1.9 }, "V_ppπ[Si–Si,1]": { value: -1.2 } } }));
    expect(read.parameters.map((p) => p.name)).toEqual(today.parameters.map((p) => p.name));
    expect(read.document.parameters).toEqual(today.document.parameters);
    const k = templateKPath(today.document, { totalPoints: 12 }).k;
    expect(computeBands(read, undefined, k).energies).toEqual(computeBands(today, undefined, k).energies);
  });

  it("rename a parameter everywhere it is referenced: on-site overrides and explicit hoppings", () => {
    const doc = modelDocumentSchema.parse({
      format: "bandwright-model",
      version: 1,
      lattice: [[3, 0, 0]],
      sites: [{ label: "A", species: "X", position: [0, 0, 0], orbitals: ["s"] }],
      onsite: [{ orbital: "A:s", parameter: "V_ss_sigma[X-X,2]" }],
      hoppings: [{ from: "A:s", to: "A:s", translation: [1, 0, 0], parameter: "V_ss_sigma[X-X,1]" }],
      parameters: [
        { name: "V_ss_sigma[X-X,2]", value: 0, unit: "eV", free: false },
        { name: "V_ss_sigma[X-X,1]", value: -1, unit: "eV", free: true },
      ],
    });
    expect(doc.onsite[0].parameter).toBe("V_ssσ[X–X,2]");
    expect(doc.hoppings[0].parameter).toBe("V_ssσ[X–X,1]");
    expect(compileModel(doc).parameters.map((p) => p.name)).toEqual(["V_ssσ[X–X,2]", "V_ssσ[X–X,1]"]);
  });

  it("template overrides accept either spelling", () => {
    const old = buildTemplate("diamond-sp3s-star", { parameters: { "V_pp_pi[Si-Si,1]": { value: -1.3, free: false } } });
    expect(old.parameters.find((p) => p.name === "V_ppπ[Si–Si,1]")).toMatchObject({ value: -1.3, free: false });
    expect(() => buildTemplate("honeycomb-pz", { parameters: { "V_pp_pi[C-C,1]": { value: 1 } } })).toThrow(/has no parameter "V_pp_pi\[C-C,1\]"/);
  });
});

describe("stored results in the earlier spelling", () => {
  it("are read with today's names in parameters, correlations, warnings and the fitted model", () => {
    const read = readStoredResult(legacy.result);
    const names = read.parameters.map((p) => p.name);
    expect(names).toContain("V_s*pσ[Si–Si,1]");
    expect(names.some((n) => n.includes("_sigma") || n.includes("_pi"))).toBe(false);
    expect(read.correlation.names).toEqual(legacy.result.correlation.names.map(canonicalParameterName));
    expect(read.correlation.matrix).toEqual(legacy.result.correlation.matrix);
    const strong = read.warnings.find((w) => w.kind === "strong-correlation" && w.parameters.includes("V_s*pσ[Si–Si,1]"));
    expect(strong?.message).toMatch(/^E_s\*\[Si\] and V_s\*pσ\[Si–Si,1\] are correlated/);
    expect(read.fittedModel.parameters.map((p) => p.name)).toEqual(names.filter((n) => n !== "energy offset" && n !== "renormalisation"));
    // today's spelling reads back unchanged
    expect(readStoredResult(read)).toEqual(read);
  });
});
