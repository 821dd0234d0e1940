import { describe, expect, it } from "vitest";
import {
  type Vec3,
  buildTemplate,
  compileModel,
  computeBands,
  kPathVertices,
  reciprocalLattice,
  reducedToCartesian,
} from "@/lib/tb";

const bandsAt = (id: string, ks: Vec3[], options: Parameters<typeof buildTemplate>[1] = {}) => {
  const compiled = compileModel(buildTemplate(id, options));
  const { energies } = computeBands(compiled, undefined, ks);
  const n = compiled.orbitalCount;
  return ks.map((_, k) => Array.from(energies.slice(k * n, (k + 1) * n)));
};

describe("single s band closed forms (Ashcroft & Mermin ch. 10; Kittel ch. 9; REFERENCES.md §5)", () => {
  it("chain: E = ε − 2t cos ka, width 4t", () => {
    const a = 2;
    const t = 0.7;
    const ks = [0, 0.3, 1.1, Math.PI / a].map((k) => [k, 0, 0] as Vec3);
    const e = bandsAt("chain-s", ks, { latticeConstant: a, parameters: { t: { value: t }, "E_s[X]": { value: 0.2 } } });
    ks.forEach((k, i) => expect(e[i][0]).toBeCloseTo(0.2 - 2 * t * Math.cos(k[0] * a), 12));
    expect(e[3][0] - e[0][0]).toBeCloseTo(4 * t, 12);
  });

  it("square with t′ and t″: Γ = −4t − 4t′ − 4t″, X = 4t′ − 4t″, M = 4t − 4t′ − 4t″, and the full formula", () => {
    const a = 3.85;
    const [t, tp, tpp] = [0.4, -0.12, 0.06];
    const g = Math.PI / a;
    const random = [0.31, 0.77, 1.9];
    const ks: Vec3[] = [[0, 0, 0], [g, 0, 0], [g, g, 0], [random[0], random[1], 0]];
    const e = bandsAt("square-single", ks).map((b) => b[0]);
    const formula = ([x, y]: Vec3) =>
      -2 * t * (Math.cos(x * a) + Math.cos(y * a)) - 4 * tp * Math.cos(x * a) * Math.cos(y * a) - 2 * tpp * (Math.cos(2 * x * a) + Math.cos(2 * y * a));
    ks.forEach((k, i) => expect(e[i]).toBeCloseTo(formula(k), 12));
    // REFERENCES.md §5 named points (Γ: −4t − 4t′, X: 4t′, M: 4t − 4t′), each with t″'s term −2t″(cos 2k_x a + cos 2k_y a)
    expect(e[0]).toBeCloseTo(-4 * t - 4 * tp - 4 * tpp, 12);
    expect(e[1]).toBeCloseTo(4 * tp - 4 * tpp, 12);
    expect(e[2]).toBeCloseTo(4 * t - 4 * tp - 4 * tpp, 12);
  });

  it("simple cubic, bcc and fcc: band minimum, maximum and width", () => {
    for (const [id, a] of [["cubic-s", 3.35], ["bcc-s", 4.23], ["fcc-s", 4.05]] as const) {
      const doc = buildTemplate(id);
      const compiled = compileModel(doc);
      const vss = doc.parameters[1].value; // hopping −t with t = −V_ssσ
      const t = -vss;
      const g = (2 * Math.PI) / a;
      const points: Record<string, Vec3> = Object.fromEntries(kPathVertices(doc).map((v) => [v.label, v.k]));
      const e = (k: Vec3) => computeBands(compiled, undefined, [k]).energies[0];
      if (id === "cubic-s") {
        expect(e(points["Γ"])).toBeCloseTo(-6 * t, 12);
        expect(e(points["R"])).toBeCloseTo(6 * t, 12);
        expect(e([0.4, 1.2, -0.3])).toBeCloseTo(-2 * t * (Math.cos(0.4 * a) + Math.cos(1.2 * a) + Math.cos(-0.3 * a)), 12);
      } else if (id === "bcc-s") {
        expect(e(points["Γ"])).toBeCloseTo(-8 * t, 12);
        expect(e(points["H"])).toBeCloseTo(8 * t, 12);
        expect(points["H"][2]).toBeCloseTo(g, 12); // H = (2π/a)(0, 0, 1)
        const k: Vec3 = [0.4, 1.2, -0.3];
        expect(e(k)).toBeCloseTo(-8 * t * Math.cos((k[0] * a) / 2) * Math.cos((k[1] * a) / 2) * Math.cos((k[2] * a) / 2), 12);
      } else {
        expect(e(points["Γ"])).toBeCloseTo(-12 * t, 12);
        expect(e(points["X"])).toBeCloseTo(4 * t, 12);
        expect(e(points["W"])).toBeCloseTo(4 * t, 12);
        expect(e(points["L"])).toBeCloseTo(0, 12);
        const [x, y, z] = [0.4, 1.2, -0.3].map((c) => (c * a) / 2);
        expect(e([0.4, 1.2, -0.3])).toBeCloseTo(
          -4 * t * (Math.cos(x) * Math.cos(y) + Math.cos(y) * Math.cos(z) + Math.cos(z) * Math.cos(x)),
          12,
        );
      }
    }
  });
});

describe("honeycomb pz (graphene)", () => {
  const lattice = buildTemplate("honeycomb-pz").lattice;
  const b = reciprocalLattice(lattice);
  const at = (reduced: number[]) => reducedToCartesian(reduced, b);
  const [G, M, K] = [at([0, 0]), at([0.5, 0]), at([2 / 3, 1 / 3])];

  it("nearest neighbours: Γ ±3t, M ±t, K 0 (Castro Neto et al., RMP 81, 109 (2009); REFERENCES.md §4)", () => {
    const t = 2.8;
    const [g, m, k] = bandsAt("honeycomb-pz", [G, M, K]);
    expect(g).toEqual([-3 * t, 3 * t].map((x) => expect.closeTo(x, 12)));
    expect(m).toEqual([-t, t].map((x) => expect.closeTo(x, 12)));
    expect(k).toEqual([0, 0].map((x) => expect.closeTo(x, 12)));
  });

  it("with t′: Γ ±3t − 6t′ (sign convention −t′), M ±t + 2t′, K 3t′ (REFERENCES.md §4, computed closed forms)", () => {
    // Castro Neto's E± = ±t√(3 + f) − t′f with H = −t′ Σ: our t2 = t′ with the same −t convention.
    const [t, tp] = [2.8, 0.2];
    const [g, m, k] = bandsAt("honeycomb-pz", [G, M, K], { parameters: { t2: { value: tp } } });
    expect(g).toEqual([-3 * t - 6 * tp, 3 * t - 6 * tp].map((x) => expect.closeTo(x, 12)));
    expect(m).toEqual([-t + 2 * tp, t + 2 * tp].map((x) => expect.closeTo(x, 12)));
    expect(k).toEqual([3 * tp, 3 * tp].map((x) => expect.closeTo(x, 12)));
  });

  it("non-orthogonal nearest-neighbour model: E± = (E2p ± γ0 w)/(1 ± s0 w) (REFERENCES.md §4, computed)", () => {
    const options = { overlap: true, parameters: { t2: { value: 0 }, t3: { value: 0 }, s2: { value: 0 }, s3: { value: 0 } } };
    const [e2p, gamma0, s0] = [-0.28, -2.97, 0.073];
    for (const [k, w] of [[G, 3], [M, 1]] as const) {
      const [lo, hi] = bandsAt("honeycomb-pz", [k], options)[0];
      const expected = [(e2p + gamma0 * w) / (1 + s0 * w), (e2p - gamma0 * w) / (1 - s0 * w)].sort((x, y) => x - y);
      expect(lo).toBeCloseTo(expected[0], 12);
      expect(hi).toBeCloseTo(expected[1], 12);
    }
  });

  it("third-neighbour non-orthogonal set reproduces Γ −7.5573/+11.3218, M −2.2044/+1.9051, K −0.0645 (REFERENCES.md §4, computed from Reich et al. 2002)", () => {
    const [g, m, k] = bandsAt("honeycomb-pz", [G, M, K], { overlap: true });
    expect(g[0]).toBeCloseTo(-7.5573, 3);
    expect(g[1]).toBeCloseTo(11.3218, 3);
    expect(m[0]).toBeCloseTo(-2.2044, 3);
    expect(m[1]).toBeCloseTo(1.9051, 3);
    expect(k[0]).toBeCloseTo(-0.0645, 3);
    expect(k[1]).toBeCloseTo(-0.0645, 3);
  });
});
