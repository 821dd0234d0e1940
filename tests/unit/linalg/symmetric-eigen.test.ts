import { eigs } from "mathjs";
import { describe, expect, it } from "vitest";
import { createRandom } from "@/lib/linalg";
import { createSymmetricEigenSolver } from "@/lib/linalg";

function randomSymmetric(n: number, seed: number): Float64Array {
  const random = createRandom(seed);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++) a[i * n + j] = a[j * n + i] = random.uniformIn(-1, 1);
  return a;
}

describe("real symmetric eigen-solver", () => {
  // Independent reference: mathjs 15 `eigs` on the real matrix (as STACK.md suggests).
  it.each([1, 2, 3, 5, 8, 10, 18, 25])("agrees with mathjs eigs and gives orthonormal eigenvectors at size %i", (n) => {
    const a = randomSymmetric(n, 4000 + n);
    const rows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
    const reference = (eigs(rows, { eigenvectors: false }).values as unknown as number[]).slice().sort((x, y) => x - y);
    const values = new Float64Array(n);
    const vectors = new Float64Array(n * n);
    createSymmetricEigenSolver(n).solve(a, values, vectors);
    const scale = Math.max(...reference.map(Math.abs));
    for (let m = 0; m < n; m++) expect(Math.abs(values[m] - reference[m])).toBeLessThan(1e-10 * scale);
    for (let m = 0; m < n; m++)
      for (let i = 0; i < n; i++) {
        let av = 0;
        for (let j = 0; j < n; j++) av += a[i * n + j] * vectors[m * n + j];
        expect(Math.abs(av - values[m] * vectors[m * n + i])).toBeLessThan(1e-11 * scale * n); // A v = λ v
      }
    for (let m = 0; m < n; m++)
      for (let l = 0; l < n; l++) {
        let dot = 0;
        for (let j = 0; j < n; j++) dot += vectors[m * n + j] * vectors[l * n + j];
        expect(Math.abs(dot - (m === l ? 1 : 0))).toBeLessThan(1e-12 * n); // VᵀV = I
      }
  });

  it("reads only the lower triangle and, with a band range, writes only those eigenvectors", () => {
    const n = 6;
    const a = randomSymmetric(n, 77);
    const lowerOnly = a.map((x, e) => (Math.floor(e / n) >= e % n ? x : 1e6));
    const solver = createSymmetricEigenSolver(n);
    const full = new Float64Array(n * n);
    const values = new Float64Array(n);
    const valuesLower = new Float64Array(n);
    solver.solve(a, values, full);
    const partial = new Float64Array(n * n).fill(-7);
    solver.solve(lowerOnly, valuesLower, partial, [1, 3]);
    expect(Array.from(valuesLower)).toEqual(Array.from(values));
    for (let e = 0; e < n * n; e++) {
      const m = Math.floor(e / n);
      expect(partial[e]).toBe(m >= 1 && m <= 3 ? full[e] : -7);
    }
  });
});
