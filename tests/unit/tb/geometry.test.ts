import { describe, expect, it } from "vitest";
import {
  type Vec3,
  buildKPath,
  buildTemplate,
  compileModel,
  findNeighbourShells,
  harrisonBondIntegrals,
  templateKPath,
  withHarrisonStartingValues,
} from "@/lib/tb";

describe("neighbour shells", () => {
  it("fcc: 12 neighbours at a/√2, 6 at a (Ashcroft & Mermin, ch. 4, Table 4.1 coordination numbers)", () => {
    const a = 4.05;
    const fcc: Vec3[] = [[0, a / 2, a / 2], [a / 2, 0, a / 2], [a / 2, a / 2, 0]];
    const shells = findNeighbourShells(fcc, [[0, 0, 0]], { maxShell: 2 });
    expect(shells.distances[0]).toBeCloseTo(a / Math.SQRT2, 12);
    expect(shells.distances[1]).toBeCloseTo(a, 12);
    expect(shells.bonds.filter((b) => b.shell === 1)).toHaveLength(12);
    expect(shells.bonds.filter((b) => b.shell === 2)).toHaveLength(6);
  });

  it("diamond: 4 nearest neighbours per atom at √3a/4 (Ashcroft & Mermin, ch. 4), then 12 like atoms at a/√2", () => {
    const a = 5.431;
    const fcc: Vec3[] = [[0, a / 2, a / 2], [a / 2, 0, a / 2], [a / 2, a / 2, 0]];
    const shells = findNeighbourShells(fcc, [[0, 0, 0], [0.25, 0.25, 0.25]], { maxShell: 2 });
    expect(shells.distances[0]).toBeCloseTo((Math.sqrt(3) * a) / 4, 12);
    expect(shells.bonds.filter((b) => b.shell === 1 && b.from === 0)).toHaveLength(4);
    expect(shells.bonds.filter((b) => b.shell === 2 && b.from === 0).every((b) => b.to === 0)).toBe(true);
    expect(shells.bonds.filter((b) => b.shell === 2 && b.from === 0)).toHaveLength(12);
  });

  it("groups distances within the tolerance into one shell", () => {
    const lattice: Vec3[] = [[1, 0, 0], [0, 1.0004, 0]];
    expect(findNeighbourShells(lattice, [[0, 0, 0]], { maxShell: 1, tolerance: 1e-3 }).bonds).toHaveLength(4);
    expect(findNeighbourShells(lattice, [[0, 0, 0]], { maxShell: 1, tolerance: 1e-4 }).bonds).toHaveLength(2);
  });
});

describe("k-paths", () => {
  it("spaces points by density, shares segment ends and places ticks at the vertices", () => {
    const path = buildKPath(
      [
        { label: "Γ", k: [0, 0, 0] },
        { label: "X", k: [1, 0, 0] },
        { label: "M", k: [1, 1, 0] },
      ],
      { pointsPerInverseAngstrom: 10 },
    );
    expect(path.k).toHaveLength(21);
    expect(path.distance[20]).toBeCloseTo(2, 12);
    expect(path.ticks).toEqual([
      { label: "Γ", distance: 0, index: 0 },
      { label: "X", distance: 1, index: 10 },
      { label: "M", distance: 2, index: 20 },
    ]);
  });

  it("jumps without adding distance and joins the labels, U|K", () => {
    const path = buildKPath(
      [
        { label: "Γ", k: [0, 0, 0] },
        { label: "U", k: [1, 0, 0] },
        { label: "K", k: [0, 5, 0], jump: true },
        { label: "X", k: [0, 6, 0] },
      ],
      { totalPoints: 12 },
    );
    expect(path.k).toHaveLength(12);
    const tick = path.ticks.find((t) => t.label === "U|K")!;
    expect(tick.distance).toBeCloseTo(1, 12);
    expect(path.k[tick.index]).toEqual([0, 5, 0]);
    expect(path.distance[tick.index - 1]).toBeCloseTo(1, 12);
    expect(path.distance[path.k.length - 1]).toBeCloseTo(2, 12);
  });

  it("builds a template's path in the model's frame: fcc X = (2π/a)(1,0,0) and L = (π/a)(1,1,1) (Ashcroft & Mermin, ch. 5)", () => {
    const a = 5.431;
    const path = templateKPath(buildTemplate("diamond-sp3s-star"), { pointsPerInverseAngstrom: 20 });
    const X = path.k[path.ticks.find((t) => t.label === "X")!.index];
    const L = path.k[path.ticks.find((t) => t.label === "L")!.index];
    [(2 * Math.PI) / a, 0, 0].forEach((x, i) => expect(X[i]).toBeCloseTo(x, 12));
    L.forEach((x) => expect(x).toBeCloseTo(Math.PI / a, 12));
  });
});

describe("Harrison's universal sp parameters (Harrison 1980, Solid State Table; REFERENCES.md §2)", () => {
  it("Si at d = 2.35 Å: V_ssσ −1.932, V_spσ +2.539, V_ppσ +4.471, V_ppπ −1.118 (computed worked example)", () => {
    const v = harrisonBondIntegrals(2.35);
    expect(v["ssσ"]).toBeCloseTo(-1.932, 3);
    expect(v["spσ"]).toBeCloseTo(2.539, 3);
    expect(v["ppσ"]).toBeCloseTo(4.471, 3);
    expect(v["ppπ"]).toBeCloseTo(-1.118, 3);
  });

  it("applies them to a model's sp bond integrals at each shell's bond length and leaves the rest alone", () => {
    const compiled = compileModel(buildTemplate("diamond-sp3s-star"));
    const doc = withHarrisonStartingValues(compiled);
    const value = (name: string) => doc.parameters.find((p) => p.name === name)!.value;
    const d = (Math.sqrt(3) * 5.431) / 4;
    expect(value("V_ppπ[Si–Si,1]")).toBeCloseTo(harrisonBondIntegrals(d)["ppπ"], 12);
    expect(value("V_spσ[Si–Si,1]")).toBeCloseTo(harrisonBondIntegrals(d)["spσ"], 12);
    expect(value("E_s[Si]")).toBe(-4.2); // on-site untouched (Vogl–Hjalmarson–Dow 1983)
    expect(value("V_s*pσ[Si–Si,1]")).toBe(compiled.parameters.find((p) => p.name === "V_s*pσ[Si–Si,1]")!.value);
  });
});
