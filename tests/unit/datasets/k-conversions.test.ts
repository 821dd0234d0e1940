import { describe, expect, it } from "vitest";
import { placePathVertices, datasetMappingSchema, interpolateAlongPath, kColumnsToCartesian, parseDispersionFile } from "@/lib/datasets";
import { cartesianToReduced } from "@/lib/tb/geometry/lattice";
import type { Vec3 } from "@/lib/tb/geometry/vec3";

// Hand-computed on a square lattice of a = 2 Å: b_i = (2π/a) ê_i = π ê_i 1/Å (a_i · b_j = 2π δ_ij,
// Ashcroft & Mermin ch. 5). X = (½, 0) → (π/2, 0); M = (½, ½) → (π/2, π/2); |ΓX| = |XM| = π/2.
const square: Vec3[] = [
  [2, 0, 0],
  [0, 2, 0],
];
const halfPi = Math.PI / 2;
const closeVec = (a: Vec3, b: Vec3, digits = 12) => a.forEach((c, i) => expect(c).toBeCloseTo(b[i], digits));

describe("k conversions", () => {
  it("reduced → Cartesian and back", () => {
    const toCartesian = kColumnsToCartesian({ kind: "reduced", columns: ["k1", "k2"], lattice: square });
    closeVec(toCartesian([0.5, 0]), [halfPi, 0, 0]);
    closeVec(toCartesian([0.5, 0.5]), [halfPi, halfPi, 0]);
    const back = cartesianToReduced([halfPi, halfPi, 0], square);
    expect(back[0]).toBeCloseTo(0.5, 12);
    expect(back[1]).toBeCloseTo(0.5, 12);
  });

  it("2π/a units → Cartesian: (2π/a)(½, ½) with a = 2 Å is (π/2, π/2)", () => {
    closeVec(kColumnsToCartesian({ kind: "twoPiOverA", columns: ["kx", "ky"], latticeConstant: 2 })([0.5, 0.5]), [halfPi, halfPi, 0]);
  });

  it("places path vertices at cumulative |Δk| and interpolates inside segments", () => {
    const path = placePathVertices(
      [
        { label: "Γ", k: [0, 0], coordinates: "reduced" },
        { label: "X", k: [0.5, 0], coordinates: "reduced" },
        { label: "M", k: [0.5, 0.5], coordinates: "reduced" },
      ],
      square,
    );
    expect(path.map((v) => v.distance)).toEqual([0, halfPi, Math.PI]);
    closeVec(interpolateAlongPath(path, halfPi / 2).k, [halfPi / 2, 0, 0]);
    closeVec(interpolateAlongPath(path, 1.5 * halfPi).k, [halfPi, halfPi / 2, 0]);
    closeVec(interpolateAlongPath(path, 10).k, [halfPi, halfPi, 0]); // clamped to M
  });

  const pathMapping = datasetMappingSchema.parse({
    name: "path", source: "calculation", format: "long",
    k: { kind: "path", column: "s", lattice: square, path: [
      { label: "Γ", k: [0, 0], coordinates: "reduced" },
      { label: "X", k: [0.5, 0], coordinates: "reduced" },
      { label: "M", k: [0.5, 0.5], coordinates: "reduced" },
    ] },
    band: { column: "band" }, energy: { column: "E", unit: "eV" },
  });

  it("path distance → Cartesian k for a file in 1/Å, ticks at the vertices", async () => {
    const s = [0, halfPi / 2, halfPi, 1.5 * halfPi, Math.PI];
    const text = "s,band,E\n" + s.map((d, i) => `${d},1,${i}`).join("\n");
    const r = await parseDispersionFile(text, pathMapping);
    if (!r.ok) throw new Error("refused");
    closeVec(r.points[1].k, [halfPi / 2, 0, 0]);
    closeVec(r.points[3].k, [halfPi, halfPi / 2, 0]);
    expect(r.summary.ticks).toEqual([
      { label: "Γ", pathDistance: 0 },
      { label: "X", pathDistance: halfPi },
      { label: "M", pathDistance: Math.PI },
    ]);
    expect(r.warnings).toEqual([]);
  });

  it("scales file distances in other units onto the path, with a warning", async () => {
    const text = "s,band,E\n0,1,0\n1,1,1\n2,1,2\n3,1,3\n4,1,4\n";
    const r = await parseDispersionFile(text, pathMapping);
    if (!r.ok) throw new Error("refused");
    // Span 4 mapped onto π: factor π/4, so s = 1 sits halfway along Γ–X.
    expect(r.points[1].pathDistance).toBeCloseTo(Math.PI / 4, 12);
    closeVec(r.points[1].k, [halfPi / 2, 0, 0]);
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]).toMatch(/scaled by 0\.785398/);
  });
});
