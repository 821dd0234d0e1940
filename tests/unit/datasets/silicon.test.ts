import { createReadStream, readFileSync } from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import { type DataPoint, type DispersionParseResult, datasetMappingSchema, parseDispersionFile } from "@/lib/datasets";
import type { Vec3 } from "@/lib/tb/geometry/vec3";
import { dftDataPath } from "@/tests/support/dft-data";

// Source: all-electron PBE band structure of Si computed with Elk 8.4.30 (shared/data): 240 k-points along
// L–Γ–X–W–K–Γ × 12 bands, k_frac in the basis of the JSON's reciprocal lattice, k_cart in 1/Å with 2π,
// path_distance = cumulative |Δk| in 1/Å (tests/data/dft).
const csvPath = dftDataPath("silicon-pbe-bands.csv");
const info = JSON.parse(readFileSync(dftDataPath("silicon-pbe-bands.json"), "utf8")) as {
  "lattice_vectors_angstrom (rows a1,a2,a3)": Vec3[];
  kpath: { label: string; k_frac: number[]; path_distance_1_per_angstrom: number }[];
  n_kpoints: number;
  n_bands: number;
  sanity_values_eV: { valence_bandwidth_VBM_minus_Gamma1v: number };
};
const lattice = info["lattice_vectors_angstrom (rows a1,a2,a3)"];
const vertices = info.kpath.map((v) => ({ label: v.label, k: v.k_frac, coordinates: "reduced" as const }));

const base = {
  name: "Si PBE",
  source: "calculation",
  energyReference: "valence-band maximum",
  format: "long",
  band: { column: "band" },
  energy: { column: "energy_eV", unit: "eV" },
} as const;

const parseSi = async (k: object): Promise<DataPoint[]> => {
  // A small read size makes the file arrive in ~60 chunks, as an upload stream would.
  const result: DispersionParseResult = await parseDispersionFile(
    createReadStream(csvPath, { highWaterMark: 4096 }),
    datasetMappingSchema.parse({ ...base, k }),
  );
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.points;
};

/** The file's own path_distance column, row by row. */
const fileDistances = readFileSync(csvPath, "utf8")
  .trim()
  .split("\n")
  .slice(1)
  .map((line) => Number(line.split(",")[6]));

const maxDifference = (a: DataPoint[], b: DataPoint[]): number =>
  Math.max(...a.map((p, i) => Math.max(...p.k.map((c, j) => Math.abs(c - b[i].k[j])))));

describe("the real Si DFT file", () => {
  let cartesian: DataPoint[];
  let reduced: DataPoint[];
  beforeAll(async () => {
    cartesian = await parseSi({ kind: "cartesian", columns: ["k_cart_x", "k_cart_y", "k_cart_z"], lattice, path: vertices });
    reduced = await parseSi({ kind: "reduced", columns: ["k_frac_1", "k_frac_2", "k_frac_3"], lattice, path: vertices });
  });

  it("holds 240 k-points × 12 bands", () => {
    expect(cartesian).toHaveLength(info.n_kpoints * info.n_bands);
    expect(new Set(cartesian.map((p) => p.band)).size).toBe(info.n_bands);
  });

  it("gives the same points from Cartesian k and from reduced k with the JSON's lattice (1e-6 1/Å)", () => {
    expect(reduced).toHaveLength(cartesian.length);
    expect(maxDifference(reduced, cartesian)).toBeLessThan(1e-6);
    expect(reduced.map((p) => [p.band, p.energy, p.kIndex])).toEqual(cartesian.map((p) => [p.band, p.energy, p.kIndex]));
  });

  it("reproduces the file's path distances as cumulative |Δk| (1e-6 1/Å)", () => {
    for (const points of [cartesian, reduced])
      points.forEach((p, i) => expect(Math.abs(p.pathDistance - fileDistances[i])).toBeLessThan(1e-6));
  });

  it("counts Γ, visited twice on the path, as one distinct k-point", () => {
    expect(Math.max(...cartesian.map((p) => p.kIndex)) + 1).toBe(info.n_kpoints - 1);
  });

  it("rebuilds k from path distances and the labelled vertices (1e-6 1/Å)", async () => {
    const fromPath = await parseSi({ kind: "path", column: "path_distance", lattice, path: vertices });
    expect(maxDifference(fromPath, cartesian)).toBeLessThan(1e-6);
  });

  it("summarises ticks at the vertices' distances and the valence bandwidth", async () => {
    const result = await parseDispersionFile(
      createReadStream(csvPath),
      datasetMappingSchema.parse({ ...base, k: { kind: "cartesian", columns: ["k_cart_x", "k_cart_y", "k_cart_z"], lattice, path: vertices } }),
    );
    if (!result.ok) throw new Error("refused");
    expect(result.summary.ticks.map((t) => t.label)).toEqual(info.kpath.map((v) => v.label));
    result.summary.ticks.forEach((t, i) =>
      expect(Math.abs(t.pathDistance - info.kpath[i].path_distance_1_per_angstrom)).toBeLessThan(1e-6),
    );
    // Energies are relative to the VBM, so the lowest is minus the valence bandwidth (JSON sanity values).
    expect(result.summary.energyRange.min).toBeCloseTo(-info.sanity_values_eV.valence_bandwidth_VBM_minus_Gamma1v, 5);
    expect(result.summary.energyRange.max).toBeGreaterThan(0);
    expect(result.warnings).toEqual([]);
  });
});
