import { describe, expect, it } from "vitest";
import { type ModelDocumentInput, ModelError, buildTemplate, compileModel } from "@/lib/tb";

/** A valid two-site chain (A–B dimerised), edited per test into one specific mistake. */
function chain(edit: (doc: ModelDocumentInput) => void = () => {}): ModelDocumentInput {
  const doc: ModelDocumentInput = {
    format: "bandwright-model",
    version: 1,
    lattice: [[3, 0, 0]],
    sites: [
      { label: "A", species: "X", position: [0, 0, 0], orbitals: ["s"] },
      { label: "B", species: "X", position: [0.5, 0, 0], orbitals: ["s"] },
    ],
    hoppings: [
      { from: "A:s", to: "B:s", translation: [0, 0, 0], parameter: "t1", factor: -1 },
      { from: "B:s", to: "A:s", translation: [1, 0, 0], parameter: "t2", factor: -1 },
    ],
    parameters: [
      { name: "E_s[X]", value: 0, unit: "eV", free: false },
      { name: "t1", value: 1, unit: "eV", free: true },
      { name: "t2", value: 0.8, unit: "eV", free: true },
    ],
  };
  edit(doc);
  return doc;
}

function issuesOf(doc: unknown) {
  try {
    compileModel(doc);
  } catch (error) {
    expect(error).toBeInstanceOf(ModelError);
    return (error as ModelError).issues;
  }
  throw new Error("expected a ModelError");
}

describe("model document validation", () => {
  it("accepts the valid document", () => {
    const compiled = compileModel(chain());
    expect(compiled.orbitals.map((o) => o.label)).toEqual(["A:s", "B:s"]);
    expect(compiled.parameters.map((p) => p.name)).toEqual(["E_s[X]", "t1", "t2"]);
    expect(compiled.hasOverlap).toBe(false);
  });

  it("rejects a wrong format header through the schema", () => {
    expect(issuesOf({ ...chain(), format: "other" })[0].path).toBe("format");
  });

  it("names an unknown orbital and the orbitals the site has", () => {
    const issues = issuesOf(chain((d) => (d.hoppings![0].to = "B:pz")));
    expect(issues).toContainEqual({ path: "hoppings.0.to", message: 'unknown orbital "B:pz": site B has s' });
  });

  it("names an unknown site", () => {
    const issues = issuesOf(chain((d) => (d.hoppings![0].from = "C:s")));
    expect(issues).toContainEqual({ path: "hoppings.0.from", message: 'unknown orbital "C:s": there is no site "C"' });
  });

  it("names a missing parameter", () => {
    const issues = issuesOf(chain((d) => (d.hoppings![1].parameter = "t3")));
    expect(issues.map((i) => i.message)).toContain('missing parameter "t3": declare it in parameters');
    expect(issues.map((i) => i.message)).toContain('parameter "t2" is not used by any term');
  });

  it("refuses a Hermitian partner listed by hand when partners are added automatically", () => {
    const issues = issuesOf(chain((d) => d.hoppings!.push({ from: "B:s", to: "A:s", translation: [0, 0, 0], parameter: "t1", factor: -1 })));
    expect(issues[0].message).toMatch(/Hermitian partner of hoppings\.0, which is added automatically/);
  });

  it("refuses non-Hermitian input: a listed partner that is not the complex conjugate", () => {
    const issues = issuesOf(chain((d) => d.hoppings!.push({ from: "B:s", to: "A:s", translation: [0, 0, 0], parameter: "t1", factor: [-1, 0.5] })));
    expect(issues[0].message).toMatch(/^non-Hermitian input/);
  });

  it('with partners: "listed", refuses a hopping that has no partner', () => {
    const issues = issuesOf(chain((d) => (d.partners = "listed")));
    expect(issues[0]).toEqual({ path: "hoppings.0", message: "A:s → B:s at R = [0, 0, 0] has no Hermitian partner (B:s → A:s at −R)" });
    const complete = chain((d) => {
      d.partners = "listed";
      d.hoppings!.push(
        { from: "B:s", to: "A:s", translation: [0, 0, 0], parameter: "t1", factor: -1 },
        { from: "A:s", to: "B:s", translation: [-1, 0, 0], parameter: "t2", factor: -1 },
      );
    });
    expect(compileModel(complete).terms.length).toBe(compileModel(chain()).terms.length);
  });

  it("reports coincident sites as a zero-length bond, and a self-hopping in the home cell", () => {
    expect(issuesOf(chain((d) => (d.sites[1].position = [1, 0, 0])))).toContainEqual({
      path: "sites.1.position",
      message: "sites A and B coincide: zero-length bond",
    });
    const self = issuesOf(chain((d) => d.hoppings!.push({ from: "A:s", to: "A:s", translation: [0, 0, 0], parameter: "t1" })));
    expect(self[0].message).toMatch(/on-site term \(zero-length bond\)/);
  });

  it("checks units, bounds, duplicates and translations beyond the dimension", () => {
    const issues = issuesOf(
      chain((d) => {
        d.parameters[1].unit = "1";
        d.parameters[2].min = 1;
        d.parameters.push({ name: "t1", value: 0, unit: "eV", free: true });
        d.hoppings![0].translation = [0, 1, 0];
      }),
    );
    const messages = issues.map((i) => i.message);
    expect(messages).toContain('parameter "t2": value 0.8 is outside its bounds');
    expect(messages).toContain('parameter "t1" is declared twice');
    expect(messages).toContain("a 1D lattice has no translation along a2");
  });

  it("buildTemplate refuses an unknown template and an unknown parameter name", () => {
    expect(() => buildTemplate("kagome")).toThrow(/unknown template "kagome"; known: chain-s/);
    expect(() => buildTemplate("chain-s", { parameters: { tau: { value: 1 } } })).toThrow(
      /template chain-s has no parameter "tau"; it has E_s\[X\], t/,
    );
    expect(() => buildTemplate("cubic-s", { overlap: true })).toThrow(/has no overlap variant/);
  });
});
