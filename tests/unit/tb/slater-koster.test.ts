import { describe, expect, it } from "vitest";
import { createRandom, eigenHermitian, complexMatrixFromRows } from "@/lib/linalg";
import { type BondType, type OrbitalName, type Vec3, slaterKosterElement } from "@/lib/tb";

const V: Record<BondType, number> = {
  "ssσ": -1.3,
  "ss*σ": -0.4,
  "s*s*σ": -0.2,
  "spσ": 1.7,
  "s*pσ": 1.1,
  "sdσ": -0.9,
  "s*dσ": -0.3,
  "ppσ": 2.9,
  "ppπ": -0.8,
  "pdσ": -1.6,
  "pdπ": 0.7,
  "ddσ": -0.55,
  "ddπ": 0.31,
  "ddδ": -0.07,
};
const v = (b: BondType) => V[b];
const P: OrbitalName[] = ["px", "py", "pz"];
const D: OrbitalName[] = ["dxy", "dyz", "dzx", "dx2-y2", "dz2"];

function randomDirection(random: () => number): Vec3 {
  const x: Vec3 = [2 * random() - 1, 2 * random() - 1, 2 * random() - 1];
  const n = Math.hypot(...x);
  return [x[0] / n, x[1] / n, x[2] / n];
}

const block = (rows: OrbitalName[], cols: OrbitalName[], c: Vec3) =>
  rows.map((a) => cols.map((b) => slaterKosterElement(a, b, c, v)));

function symmetricEigenvalues(m: number[][]): number[] {
  return Array.from(eigenHermitian(complexMatrixFromRows(m)).values);
}

describe("Slater–Koster table (Slater & Koster, Phys. Rev. 94, 1498 (1954), Table I; REFERENCES.md §1)", () => {
  const random = createRandom(1954).uniform;
  const directions = Array.from({ length: 12 }, () => randomDirection(random));

  it("reproduces the published entries at random directions", () => {
    const s3 = Math.sqrt(3);
    for (const [l, m, n] of directions) {
      const c: Vec3 = [l, m, n];
      expect(slaterKosterElement("s", "px", c, v)).toBeCloseTo(l * V["spσ"], 12);
      expect(slaterKosterElement("px", "s", c, v)).toBeCloseTo(-l * V["spσ"], 12); // E_x,s = −l V_spσ
      expect(slaterKosterElement("px", "px", c, v)).toBeCloseTo(l * l * V["ppσ"] + (1 - l * l) * V["ppπ"], 12);
      expect(slaterKosterElement("px", "py", c, v)).toBeCloseTo(l * m * (V["ppσ"] - V["ppπ"]), 12);
      expect(slaterKosterElement("s", "dxy", c, v)).toBeCloseTo(s3 * l * m * V["sdσ"], 12);
      expect(slaterKosterElement("s", "dz2", c, v)).toBeCloseTo((n * n - (l * l + m * m) / 2) * V["sdσ"], 12);
      expect(slaterKosterElement("px", "dxy", c, v)).toBeCloseTo(s3 * l * l * m * V["pdσ"] + m * (1 - 2 * l * l) * V["pdπ"], 12);
      expect(slaterKosterElement("px", "dyz", c, v)).toBeCloseTo(s3 * l * m * n * V["pdσ"] - 2 * l * m * n * V["pdπ"], 12);
      expect(slaterKosterElement("py", "dx2-y2", c, v)).toBeCloseTo(
        (s3 / 2) * m * (l * l - m * m) * V["pdσ"] - m * (1 + l * l - m * m) * V["pdπ"],
        12,
      );
      expect(slaterKosterElement("pz", "dz2", c, v)).toBeCloseTo(
        n * (n * n - (l * l + m * m) / 2) * V["pdσ"] + s3 * n * (l * l + m * m) * V["pdπ"],
        12,
      );
      expect(slaterKosterElement("dxy", "dxy", c, v)).toBeCloseTo(
        3 * l * l * m * m * V["ddσ"] + (l * l + m * m - 4 * l * l * m * m) * V["ddπ"] + (n * n + l * l * m * m) * V["ddδ"],
        12,
      );
      expect(slaterKosterElement("dxy", "dyz", c, v)).toBeCloseTo(
        3 * l * m * m * n * V["ddσ"] + l * n * (1 - 4 * m * m) * V["ddπ"] + l * n * (m * m - 1) * V["ddδ"],
        12,
      );
      expect(slaterKosterElement("dz2", "dz2", c, v)).toBeCloseTo(
        (n * n - (l * l + m * m) / 2) ** 2 * V["ddσ"] + 3 * n * n * (l * l + m * m) * V["ddπ"] + 0.75 * (l * l + m * m) ** 2 * V["ddδ"],
        12,
      );
      // reversed order: E_d,p = (−1)^(1+2) E_p,d
      expect(slaterKosterElement("dzx", "py", c, v)).toBeCloseTo(-slaterKosterElement("py", "dzx", c, v), 12);
    }
  });

  it("has the block invariants: pp {σ, π, π}, dd {σ, π, π, δ, δ}, pd singular values {|σ|, |π|, |π|}, ‖E_s,p‖ = |spσ|, ‖E_s,d‖ = |sdσ|", () => {
    // Invariants listed in REFERENCES.md §1 (computed): in the bond frame each block is diagonal in m.
    for (const c of directions) {
      expect(symmetricEigenvalues(block(P, P, c))).toEqual(
        [V["ppπ"], V["ppπ"], V["ppσ"]].sort((a, b) => a - b).map((x) => expect.closeTo(x, 10)),
      );
      expect(symmetricEigenvalues(block(D, D, c))).toEqual(
        [V["ddσ"], V["ddπ"], V["ddπ"], V["ddδ"], V["ddδ"]].sort((a, b) => a - b).map((x) => expect.closeTo(x, 10)),
      );
      const pd = block(P, D, c);
      const pdpdT = P.map((_, i) => P.map((__, j) => pd[i].reduce((s, x, k) => s + x * pd[j][k], 0)));
      expect(symmetricEigenvalues(pdpdT)).toEqual(
        [V["pdπ"] ** 2, V["pdπ"] ** 2, V["pdσ"] ** 2].sort((a, b) => a - b).map((x) => expect.closeTo(x, 10)),
      );
      expect(Math.hypot(...block(["s"], P, c)[0])).toBeCloseTo(Math.abs(V["spσ"]), 12);
      expect(Math.hypot(...block(["s"], D, c)[0])).toBeCloseTo(Math.abs(V["sdσ"]), 12);
      expect(Math.hypot(...block(["s*"], P, c)[0])).toBeCloseTo(Math.abs(V["s*pσ"]), 12);
    }
  });

  it("is rotation invariant: rotating the bond and the p orbitals together leaves the matrix unchanged", () => {
    // p orbitals transform like Cartesian vectors, so E(R d) = R E(d) Rᵀ for the s–p and p–p blocks
    // (Slater & Koster 1954, sec. III: the two-centre integrals depend only on the bond frame).
    const random = createRandom(31).uniform;
    for (let trial = 0; trial < 6; trial++) {
      const axis = randomDirection(random);
      const angle = 2 * Math.PI * random();
      const [x, y, z] = axis;
      const cs = Math.cos(angle);
      const sn = Math.sin(angle);
      const R = [
        [cs + x * x * (1 - cs), x * y * (1 - cs) - z * sn, x * z * (1 - cs) + y * sn],
        [y * x * (1 - cs) + z * sn, cs + y * y * (1 - cs), y * z * (1 - cs) - x * sn],
        [z * x * (1 - cs) - y * sn, z * y * (1 - cs) + x * sn, cs + z * z * (1 - cs)],
      ];
      const c = randomDirection(random);
      const rc: Vec3 = [0, 1, 2].map((i) => R[i][0] * c[0] + R[i][1] * c[1] + R[i][2] * c[2]) as Vec3;
      const pp = block(P, P, c);
      const rotated = block(P, P, rc);
      const sp = block(["s"], P, c)[0];
      const spRotated = block(["s"], P, rc)[0];
      for (let i = 0; i < 3; i++) {
        expect(spRotated[i]).toBeCloseTo(R[i][0] * sp[0] + R[i][1] * sp[1] + R[i][2] * sp[2], 12);
        for (let j = 0; j < 3; j++) {
          let expected = 0;
          for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) expected += R[i][a] * pp[a][b] * R[j][b];
          expect(rotated[i][j]).toBeCloseTo(expected, 12);
        }
      }
    }
  });
});
