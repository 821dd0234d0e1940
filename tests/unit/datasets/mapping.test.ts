import { describe, expect, it } from "vitest";
import { parseDatasetMapping } from "@/lib/datasets";

// The mapping rules of issue 7 ("Routes", item 4): the issue's own example must pass, and each
// cross-field rule must name the field that is wrong.

const issueExample = {
  name: "Si PBE",
  source: "calculation",
  format: "long",
  k: { kind: "reduced", columns: ["k1", "k2", "k3"], lattice: [[0, 2.7155, 2.7155], [2.7155, 0, 2.7155], [2.7155, 2.7155, 0]] },
  band: { column: "band" },
  energy: { column: "E", unit: "eV" },
  sigma: { column: "dE" },
};

const errorsOf = (input: unknown) => {
  const r = parseDatasetMapping(input);
  if (r.ok) throw new Error("expected the mapping to be refused");
  return r.fieldErrors;
};

describe("dataset mapping", () => {
  it("accepts the issue's example and defaults the delimiter to auto", () => {
    const r = parseDatasetMapping(issueExample);
    expect(r.ok && r.mapping.delimiter).toBe("auto");
  });

  it("needs a band and an energy column in long format", () => {
    const e = errorsOf({ ...issueExample, band: undefined, energy: { unit: "eV" } });
    expect(e["band.column"]).toEqual(["long format needs a band column"]);
    expect(e["energy.column"]).toEqual(["long format needs an energy column"]);
  });

  it("needs energy columns and no band column in wide format", () => {
    const e = errorsOf({ ...issueExample, format: "wide" });
    expect(e["energy.columns"]).toEqual(["wide format needs one energy column per band"]);
    expect(e["energy.column"]).toBeDefined();
    expect(e["band"]).toBeDefined();
  });

  it("needs the lattice for reduced k, and no more reduced columns than lattice vectors", () => {
    expect(errorsOf({ ...issueExample, k: { kind: "reduced", columns: ["k1"] } })["k.lattice"]).toEqual([
      "reduced k needs the lattice vectors (Å)",
    ]);
    const e = errorsOf({ ...issueExample, k: { kind: "reduced", columns: ["k1", "k2"], lattice: [[1, 0, 0]] } });
    expect(e["k.columns"]).toEqual(["2 reduced k columns but only 1 lattice vectors"]);
  });

  it("refuses a path-distance k without a path, and without its distance column", () => {
    const e = errorsOf({ ...issueExample, k: { kind: "path" } });
    expect(e["k.column"]).toEqual(["a path-distance k needs the distance column"]);
    expect(e["k.path"]).toEqual(["a path-distance k needs at least two labelled points"]);
  });

  it("needs the lattice for reduced labelled points, and the lattice constant for 2π/a", () => {
    const e = errorsOf({
      ...issueExample,
      k: { kind: "path", column: "s", path: [{ label: "Γ", k: [0, 0, 0], coordinates: "reduced" }, { label: "X", k: [0.5, 0, 0.5], coordinates: "reduced" }] },
    });
    expect(e["k.path.0.coordinates"]).toBeDefined();
    expect(errorsOf({ ...issueExample, k: { kind: "twoPiOverA", columns: ["k1"] } })["k.latticeConstant"]).toBeDefined();
  });

  it("refuses a column mapped to two roles", () => {
    expect(errorsOf({ ...issueExample, sigma: { column: "E" } }).columns).toEqual([
      "column “E” is mapped more than once (energy, σ)",
    ]);
  });

  it("returns every structural field error at once", () => {
    const e = errorsOf({ name: "", source: "simulation", format: "long", k: { kind: "reduced" }, energy: { unit: "J" } });
    expect(Object.keys(e).sort()).toEqual(["energy.unit", "name", "source"]);
  });
});
