import { describe, expect, it } from "vitest";
import { clusterDerivatives, createRandom, eigenHermitian, complexMatrixFromRows, nearDegenerateClusters } from "@/lib/linalg";

describe("nearDegenerateClusters", () => {
  it("groups chains of neighbours closer than the tolerance, and nothing at tolerance 0", () => {
    const values = [0, 4e-4, 8e-4, 1, 2, 2 + 1e-5, 3, 3];
    expect(nearDegenerateClusters(values, 1e-3)).toEqual([[0, 2], [4, 5], [6, 7]]);
    expect(nearDegenerateClusters(values, 5e-4)).toEqual([[0, 2], [4, 5], [6, 7]]);
    expect(nearDegenerateClusters(values, 1e-6)).toEqual([[6, 7]]);
    expect(nearDegenerateClusters(values, 0)).toEqual([]);
  });
});

describe("clusterDerivatives (degenerate perturbation theory, Sakurai & Napolitano, Modern Quantum Mechanics, §5.2)", () => {
  it("two crossing branches with slopes 1 and 0: 0 and 1 going up, 1 and 0 going down, ½ both ways", () => {
    const d = clusterDerivatives(Float64Array.from([1, 0, 0, 0]), new Float64Array(4), 2);
    expect([...d.increase]).toEqual([0, 1]);
    expect([...d.decrease]).toEqual([1, 0]);
    expect([...d.twoSided]).toEqual([0.5, 0.5]);
    expect(d.spread).toBe(1);
  });

  it("matches the one-sided differences of the sorted eigenvalues of E₀ + tP, for a random Hermitian P", () => {
    // A(t) = E₀·I + tP is exactly degenerate at t = 0; its sorted eigenvalues are E₀ + t·(sorted eigenvalues of P)
    // for t > 0 and reversed for t < 0, so one-sided differences are exact (common practice).
    const random = createRandom(11);
    const size = 3;
    const re = Array.from({ length: size }, () => new Array<number>(size).fill(0));
    const im = Array.from({ length: size }, () => new Array<number>(size).fill(0));
    for (let i = 0; i < size; i++)
      for (let j = 0; j <= i; j++) {
        re[i][j] = re[j][i] = random.uniformIn(-1, 1);
        if (i !== j) im[j][i] = -(im[i][j] = random.uniformIn(-1, 1));
      }
    const p = complexMatrixFromRows(re, im);
    const d = clusterDerivatives(p.re, p.im, size);
    const sorted = (t: number) => {
      const a = complexMatrixFromRows(re.map((row, i) => row.map((x, j) => (i === j ? 2 : 0) + t * x)), im.map((row) => row.map((x) => t * x)));
      return [...eigenHermitian(a).values];
    };
    const h = 1e-3;
    const up = sorted(h).map((e) => (e - 2) / h);
    const down = sorted(-h).map((e) => (2 - e) / h);
    up.forEach((v, i) => expect(d.increase[i]).toBeCloseTo(v, 10));
    down.forEach((v, i) => expect(d.decrease[i]).toBeCloseTo(v, 10));
    up.forEach((v, i) => expect(d.twoSided[i]).toBeCloseTo((v + down[i]) / 2, 10));
    // the trace (the cluster's summed derivative) is the projected matrix's trace
    expect(d.twoSided.reduce((a, b) => a + b, 0)).toBeCloseTo(re[0][0] + re[1][1] + re[2][2], 12);
  });

  it("a cluster moved rigidly (P ∝ I, a degeneracy by symmetry) has no spread", () => {
    const d = clusterDerivatives(Float64Array.from([0.7, 0, 0, 0.7]), new Float64Array(4), 2);
    expect([...d.twoSided]).toEqual([0.7, 0.7]);
    expect(d.spread).toBe(0);
  });
});
