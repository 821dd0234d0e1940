import { describe, expect, it } from "vitest";
import { type Vec3, buildTemplate, compileModel, computeBands, kPathVertices } from "@/lib/tb";

const rotateZ = (v: Vec3, angle: number): Vec3 => [
  Math.cos(angle) * v[0] - Math.sin(angle) * v[1],
  Math.sin(angle) * v[0] + Math.cos(angle) * v[1],
  v[2],
];

describe("the model's Cartesian frame is explicit", () => {
  // Graphene cells are written with a1 along x or rotated by 30° (ISSUE 3); a 30° rotation puts M on Γ–K.
  const angle = Math.PI / 6;
  const standard = buildTemplate("honeycomb-pz");
  const rotated = buildTemplate("honeycomb-pz", { lattice: standard.lattice.map((a) => rotateZ(a, angle)) });
  const bands = (doc: typeof standard, k: Vec3) => Array.from(computeBands(compileModel(doc), undefined, [k]).energies);

  it("a template on rotated lattice vectors gives the same bands at rotated k-points", () => {
    for (const k of [[0.31, -0.52, 0], [1.1, 0.4, 0], [-0.7, 0.9, 0]] as Vec3[])
      expect(bands(rotated, rotateZ(k, angle))).toEqual(bands(standard, k).map((e) => expect.closeTo(e, 12)));
  });

  it("and the wrong bands at unrotated k-points: the standard frame's M is no longer M", () => {
    // Castro Neto et al. (2009): E(M) = ±t with t = 2.8 eV, E(K) = 0.
    const M = kPathVertices(standard).find((v) => v.label === "M")!.k;
    expect(bands(standard, M)).toEqual([-2.8, 2.8].map((e) => expect.closeTo(e, 12)));
    const wrong = bands(rotated, M);
    expect(Math.abs(wrong[1] - 2.8)).toBeGreaterThan(0.5);
    // the rotated document's own k-path follows its frame
    const rotatedM = kPathVertices(rotated).find((v) => v.label === "M")!.k;
    rotatedM.forEach((x, i) => expect(x).toBeCloseTo(rotateZ(M, angle)[i], 12));
    expect(bands(rotated, rotatedM)).toEqual([-2.8, 2.8].map((e) => expect.closeTo(e, 12)));
  });

  it("a different choice of primitive vectors (120° instead of 60°) still finds the right neighbours", () => {
    const [a1, a2] = standard.lattice;
    const other = buildTemplate("honeycomb-pz", { lattice: [a1, [a2[0] - a1[0], a2[1] - a1[1], 0]], sites: [[0, 0, 0], [2 / 3, 1 / 3, 0]] });
    for (const k of [[0.31, -0.52, 0], [1.1, 0.4, 0]] as Vec3[])
      expect(bands(other, k)).toEqual(bands(standard, k).map((e) => expect.closeTo(e, 12)));
  });
});
