import { complex, eigs, type Complex } from "mathjs";
import { describe, expect, it } from "vitest";
import {
  type ComplexMatrix,
  createComplexMatrix,
  createEigenOutput,
  createGeneralisedEigenSolver,
  createHermitianEigenSolver,
  createRandom,
  eigenHermitian,
} from "@/lib/linalg";

function randomHermitian(n: number, random: () => number): ComplexMatrix {
  const m = createComplexMatrix(n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++) {
      const re = 2 * random() - 1;
      const im = i === j ? 0 : 2 * random() - 1;
      m.re[i * n + j] = re;
      m.im[i * n + j] = im;
      m.re[j * n + i] = re;
      m.im[j * n + i] = -im;
    }
  return m;
}

/** U diag(λ) U† with a random unitary U (Gram–Schmidt of random complex columns): a chosen spectrum. */
function hermitianWithSpectrum(spectrum: number[], random: () => number): ComplexMatrix {
  const n = spectrum.length;
  const uRe: number[][] = [];
  const uIm: number[][] = [];
  for (let c = 0; c < n; c++) {
    const r = Array.from({ length: n }, () => 2 * random() - 1);
    const i = Array.from({ length: n }, () => 2 * random() - 1);
    for (let p = 0; p < c; p++) {
      let sr = 0;
      let si = 0;
      for (let k = 0; k < n; k++) {
        sr += uRe[p][k] * r[k] + uIm[p][k] * i[k];
        si += uRe[p][k] * i[k] - uIm[p][k] * r[k];
      }
      for (let k = 0; k < n; k++) {
        r[k] -= sr * uRe[p][k] - si * uIm[p][k];
        i[k] -= sr * uIm[p][k] + si * uRe[p][k];
      }
    }
    const norm = Math.sqrt(r.reduce((s, x, k) => s + x * x + i[k] * i[k], 0));
    uRe.push(r.map((x) => x / norm));
    uIm.push(i.map((x) => x / norm));
  }
  const m = createComplexMatrix(n);
  for (let a = 0; a < n; a++)
    for (let b = 0; b < n; b++) {
      let sr = 0;
      let si = 0;
      for (let c = 0; c < n; c++) {
        // u_c[a] λ_c conj(u_c[b])
        sr += spectrum[c] * (uRe[c][a] * uRe[c][b] + uIm[c][a] * uIm[c][b]);
        si += spectrum[c] * (uIm[c][a] * uRe[c][b] - uRe[c][a] * uIm[c][b]);
      }
      m.re[a * n + b] = sr;
      m.im[a * n + b] = si;
    }
  return m;
}

/** max |H v_m − λ_m v_m| and max |v_m† v_n − δ_mn| over all eigenpairs. */
function residuals(h: ComplexMatrix, values: Float64Array, vr: Float64Array, vi: Float64Array) {
  const n = h.size;
  let eigen = 0;
  let ortho = 0;
  for (let m = 0; m < n; m++) {
    for (let i = 0; i < n; i++) {
      let sr = 0;
      let si = 0;
      for (let j = 0; j < n; j++) {
        sr += h.re[i * n + j] * vr[m * n + j] - h.im[i * n + j] * vi[m * n + j];
        si += h.re[i * n + j] * vi[m * n + j] + h.im[i * n + j] * vr[m * n + j];
      }
      eigen = Math.max(eigen, Math.hypot(sr - values[m] * vr[m * n + i], si - values[m] * vi[m * n + i]));
    }
    for (let p = 0; p < n; p++) {
      let sr = 0;
      let si = 0;
      for (let j = 0; j < n; j++) {
        sr += vr[m * n + j] * vr[p * n + j] + vi[m * n + j] * vi[p * n + j];
        si += vr[m * n + j] * vi[p * n + j] - vi[m * n + j] * vr[p * n + j];
      }
      ortho = Math.max(ortho, Math.hypot(sr - (m === p ? 1 : 0), si));
    }
  }
  return { eigen, ortho };
}

function mathjsEigenvalues(h: ComplexMatrix): number[] {
  const n = h.size;
  const rows: Complex[][] = [];
  for (let i = 0; i < n; i++) rows.push(Array.from({ length: n }, (_, j) => complex(h.re[i * n + j], h.im[i * n + j])));
  const { values } = eigs(rows, { eigenvectors: false });
  return (values as unknown as (number | Complex)[])
    .map((v) => (typeof v === "number" ? v : v.re))
    .sort((a, b) => a - b);
}

describe("Hermitian eigen-solver", () => {
  // Independent reference: mathjs 15 `eigs` (complex Hermitian input), as STACK.md suggests.
  // One seeded matrix per size; mathjs is slow on the larger sizes, hence the generous timeout.
  it.each([1, 2, 3, 4, 5, 7, 8, 10, 13, 18, 25, 32, 40])(
    "agrees with mathjs eigs on a seeded random Hermitian matrix of size %i",
    (n) => {
      const h = randomHermitian(n, createRandom(20261201 + n).uniform);
      const out = eigenHermitian(h);
      const reference = mathjsEigenvalues(h);
      const scale = Math.max(...reference.map(Math.abs));
      for (let m = 0; m < n; m++) expect(Math.abs(out.values[m] - reference[m])).toBeLessThan(1e-10 * scale);
      for (let m = 1; m < n; m++) expect(out.values[m]).toBeGreaterThanOrEqual(out.values[m - 1]);
      const r = residuals(h, out.values, out.vectorsRe, out.vectorsIm);
      expect(r.eigen).toBeLessThan(1e-11 * scale * n); // H·V = V·Λ (backward stability, common practice)
      expect(r.ortho).toBeLessThan(1e-12 * n); // V†V = I
    },
    60_000,
  );

  it("returns a degenerate spectrum exactly and orthonormal vectors inside each degenerate space", () => {
    // Spectrum chosen by construction (U Λ U†), so the exact eigenvalues are known.
    const random = createRandom(7).uniform;
    const spectrum = [-2, -2, -2, 0.5, 1, 1, 3, 3, 3, 3];
    const h = hermitianWithSpectrum(spectrum, random);
    const out = eigenHermitian(h);
    spectrum.forEach((value, m) => expect(out.values[m]).toBeCloseTo(value, 12));
    const r = residuals(h, out.values, out.vectorsRe, out.vectorsIm);
    expect(r.eigen).toBeLessThan(1e-12 * 10);
    expect(r.ortho).toBeLessThan(1e-12 * 10);
  });

  it("handles a diagonal matrix and the all-zero matrix (already tridiagonal input)", () => {
    const h = createComplexMatrix(4);
    [3, -1, 2, 0].forEach((v, i) => (h.re[i * 4 + i] = v));
    expect(Array.from(eigenHermitian(h).values)).toEqual([-1, 0, 2, 3]);
    expect(Array.from(eigenHermitian(createComplexMatrix(3)).values)).toEqual([0, 0, 0]);
  });

  it("reuses one solver without allocating per call and gives the same result each time", () => {
    const random = createRandom(99).uniform;
    const h = randomHermitian(10, random);
    const solver = createHermitianEigenSolver(10);
    const out = createEigenOutput(10);
    solver.solve(h.re, h.im, out, false);
    const first = Array.from(out.values);
    solver.solve(h.re, h.im, out, true);
    expect(Array.from(out.values)).toEqual(first);
  });
});

describe("generalised eigen-solver H c = E S c", () => {
  it("matches the eigenvalues of S^(-1/2) H S^(-1/2) computed independently and gives S-orthonormal c", () => {
    // Reference: with S = U diag(s) U†, S^(-1/2) = U diag(s^(-1/2)) U†; eigenvalues of S^(-1/2) H S^(-1/2)
    // are the generalised eigenvalues (Golub & Van Loan, §8.7). mathjs eigs supplies the standard solve.
    const random = createRandom(4242).uniform;
    for (const n of [1, 3, 6, 12]) {
      const h = randomHermitian(n, random);
      const sSpectrum = Array.from({ length: n }, () => 0.5 + random());
      const sHalfInv = hermitianWithSpectrum(sSpectrum.map((s) => 1 / Math.sqrt(s)), createRandom(n).uniform);
      const s = hermitianWithSpectrum(sSpectrum, createRandom(n).uniform);
      // B = S^(-1/2) H S^(-1/2)
      const b = createComplexMatrix(n);
      const tmp = createComplexMatrix(n);
      const multiply = (x: ComplexMatrix, y: ComplexMatrix, into: ComplexMatrix) => {
        for (let i = 0; i < n; i++)
          for (let j = 0; j < n; j++) {
            let sr = 0;
            let si = 0;
            for (let k = 0; k < n; k++) {
              sr += x.re[i * n + k] * y.re[k * n + j] - x.im[i * n + k] * y.im[k * n + j];
              si += x.re[i * n + k] * y.im[k * n + j] + x.im[i * n + k] * y.re[k * n + j];
            }
            into.re[i * n + j] = sr;
            into.im[i * n + j] = si;
          }
      };
      multiply(sHalfInv, h, tmp);
      multiply(tmp, sHalfInv, b);
      const reference = mathjsEigenvalues(b);
      const out = createEigenOutput(n);
      createGeneralisedEigenSolver(n).solve(h.re, h.im, s.re, s.im, out, true);
      reference.forEach((value, m) => expect(out.values[m]).toBeCloseTo(value, 9));
      // c_m† S c_p = δ_mp and H c_m = E_m S c_m
      for (let m = 0; m < n; m++) {
        for (let p = 0; p < n; p++) {
          let sr = 0;
          let si = 0;
          for (let i = 0; i < n; i++)
            for (let j = 0; j < n; j++) {
              const ar = out.vectorsRe[m * n + i];
              const ai = -out.vectorsIm[m * n + i];
              const sr2 = s.re[i * n + j] * out.vectorsRe[p * n + j] - s.im[i * n + j] * out.vectorsIm[p * n + j];
              const si2 = s.re[i * n + j] * out.vectorsIm[p * n + j] + s.im[i * n + j] * out.vectorsRe[p * n + j];
              sr += ar * sr2 - ai * si2;
              si += ar * si2 + ai * sr2;
            }
          expect(Math.hypot(sr - (m === p ? 1 : 0), si)).toBeLessThan(1e-10);
        }
      }
    }
  });

  it("refuses an overlap matrix that is not positive definite", () => {
    const h = createComplexMatrix(2);
    const s = createComplexMatrix(2);
    s.re.set([1, 2, 2, 1]); // eigenvalues 3 and −1
    expect(() => createGeneralisedEigenSolver(2).solve(h.re, h.im, s.re, s.im, createEigenOutput(2), false)).toThrow(
      /not positive definite/,
    );
  });
});
