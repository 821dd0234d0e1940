import { describe, expect, it } from "vitest";
import { cartesianToReduced, reciprocalLattice, reducedToCartesian } from "@/lib/tb/geometry/lattice";
import type { Vec3 } from "@/lib/tb/geometry/vec3";

// Source: Ashcroft & Mermin, Solid State Physics, ch. 5 — a_i · b_j = 2π δ_ij; the reciprocal of an fcc
// lattice of cube edge a is bcc with vectors (2π/a)(−1, 1, 1) and permutations.
describe("reciprocal lattice", () => {
  const a = 5.431; // Si cube edge in Å (shared/data/silicon-pbe-bands.json)
  const fcc: Vec3[] = [
    [0, a / 2, a / 2],
    [a / 2, 0, a / 2],
    [a / 2, a / 2, 0],
  ];

  it("satisfies a_i · b_j = 2π δ_ij for fcc", () => {
    const b = reciprocalLattice(fcc);
    for (let i = 0; i < 3; i++)
      for (let j = 0; j < 3; j++) {
        const d = fcc[i][0] * b[j][0] + fcc[i][1] * b[j][1] + fcc[i][2] * b[j][2];
        expect(d).toBeCloseTo(i === j ? 2 * Math.PI : 0, 12);
      }
    const g = (2 * Math.PI) / a;
    expect(b[0][0]).toBeCloseTo(-g, 12);
    expect(b[0][1]).toBeCloseTo(g, 12);
    expect(b[0][2]).toBeCloseTo(g, 12);
  });

  it("maps the X point (0.5, 0.5, 0) of fcc to (2π/a)(0, 0, 1) and back", () => {
    const b = reciprocalLattice(fcc);
    const k = reducedToCartesian([0.5, 0.5, 0], b);
    expect(k[0]).toBeCloseTo(0, 12);
    expect(k[1]).toBeCloseTo(0, 12);
    expect(k[2]).toBeCloseTo((2 * Math.PI) / a, 12);
    const back = cartesianToReduced(k, fcc);
    expect(back[0]).toBeCloseTo(0.5, 12);
    expect(back[1]).toBeCloseTo(0.5, 12);
    expect(back[2]).toBeCloseTo(0, 12);
  });

  it("handles a 1D chain: b = 2π/a along the chain", () => {
    const b = reciprocalLattice([[2, 0, 0]]);
    expect(b).toHaveLength(1);
    expect(b[0][0]).toBeCloseTo(Math.PI, 12);
    expect(Math.abs(b[0][1]) + Math.abs(b[0][2])).toBeLessThan(1e-12);
  });

  it("refuses linearly dependent vectors", () => {
    expect(() => reciprocalLattice([[1, 0, 0], [2, 0, 0], [0, 0, 1]])).toThrow(/linearly dependent/);
  });
});
