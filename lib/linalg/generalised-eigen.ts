import { type EigenOutput, createHermitianEigenSolver } from "./hermitian-eigen";

/** A reusable solver of H c = E S c for Hermitian H and Hermitian positive-definite S of one size. */
export interface GeneralisedEigenSolver {
  readonly size: number;
  /**
   * Solves H c = E S c. Inputs are row-major with both triangles filled and are not modified.
   * Writes ascending E into `out.values` and, if `withVectors`, S-orthonormal c (c_m† S c_n = δ_mn),
   * vector m stored contiguously as in {@link EigenOutput}.
   * @throws Error when S is not positive definite
   */
  solve(
    hRe: Float64Array,
    hIm: Float64Array,
    sRe: Float64Array,
    sIm: Float64Array,
    out: EigenOutput,
    withVectors: boolean,
  ): void;
}

/**
 * Creates a generalised Hermitian eigen-solver by Cholesky reduction: S = L L†, A = L⁻¹ H L⁻†,
 * A y = E y, c = L⁻† y (Golub & Van Loan, *Matrix Computations*, 4th ed., §8.7.2).
 */
export function createGeneralisedEigenSolver(size: number): GeneralisedEigenSolver {
  const n = size;
  const lRe = new Float64Array(n * n);
  const lIm = new Float64Array(n * n);
  const yRe = new Float64Array(n * n);
  const yIm = new Float64Array(n * n);
  const aRe = new Float64Array(n * n);
  const aIm = new Float64Array(n * n);
  const standard = createHermitianEigenSolver(n);

  function cholesky(sRe: Float64Array, sIm: Float64Array): void {
    lRe.fill(0);
    lIm.fill(0);
    for (let j = 0; j < n; j++) {
      let d = sRe[j * n + j];
      for (let k = 0; k < j; k++) d -= lRe[j * n + k] ** 2 + lIm[j * n + k] ** 2;
      if (!(d > 0)) throw new Error("overlap matrix S(k) is not positive definite");
      const ljj = Math.sqrt(d);
      lRe[j * n + j] = ljj;
      for (let i = j + 1; i < n; i++) {
        let r = sRe[i * n + j];
        let m = sIm[i * n + j];
        for (let k = 0; k < j; k++) {
          // − L_ik conj(L_jk)
          const ar = lRe[i * n + k];
          const ai = lIm[i * n + k];
          const br = lRe[j * n + k];
          const bi = lIm[j * n + k];
          r -= ar * br + ai * bi;
          m -= ai * br - ar * bi;
        }
        lRe[i * n + j] = r / ljj;
        lIm[i * n + j] = m / ljj;
      }
    }
  }

  /** X ← L⁻¹ B for all columns at once, rows of X written in order (B and X may alias). */
  function forwardSubstitute(bRe: Float64Array, bIm: Float64Array, xRe: Float64Array, xIm: Float64Array): void {
    for (let i = 0; i < n; i++) {
      const ri = i * n;
      for (let j = 0; j < n; j++) {
        xRe[ri + j] = bRe[ri + j];
        xIm[ri + j] = bIm[ri + j];
      }
      for (let k = 0; k < i; k++) {
        const cr = lRe[ri + k];
        const ci = lIm[ri + k];
        const rk = k * n;
        for (let j = 0; j < n; j++) {
          const xr = xRe[rk + j];
          const xi = xIm[rk + j];
          xRe[ri + j] -= cr * xr - ci * xi;
          xIm[ri + j] -= cr * xi + ci * xr;
        }
      }
      const inv = 1 / lRe[ri + i];
      for (let j = 0; j < n; j++) {
        xRe[ri + j] *= inv;
        xIm[ri + j] *= inv;
      }
    }
  }

  return {
    size,
    solve(hRe, hIm, sRe, sIm, out, withVectors) {
      cholesky(sRe, sIm);
      forwardSubstitute(hRe, hIm, yRe, yIm); // Y = L⁻¹ H
      // A = L⁻¹ Y† (A is Hermitian, so A = (Y L⁻†)† = L⁻¹ Y†)
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) {
          aRe[i * n + j] = yRe[j * n + i];
          aIm[i * n + j] = -yIm[j * n + i];
        }
      forwardSubstitute(aRe, aIm, aRe, aIm);
      standard.solve(aRe, aIm, out, withVectors);
      if (!withVectors) return;
      const cr = out.vectorsRe;
      const ci = out.vectorsIm;
      for (let m = 0; m < n; m++) {
        const base = m * n;
        // c = L⁻† y by back substitution with the upper-triangular L†.
        for (let i = n - 1; i >= 0; i--) {
          let r = cr[base + i];
          let s = ci[base + i];
          for (let j = i + 1; j < n; j++) {
            // − conj(L_ji) c_j
            const lr = lRe[j * n + i];
            const li = lIm[j * n + i];
            r -= lr * cr[base + j] + li * ci[base + j];
            s -= lr * ci[base + j] - li * cr[base + j];
          }
          const inv = 1 / lRe[i * n + i];
          cr[base + i] = r * inv;
          ci[base + i] = s * inv;
        }
      }
    },
  };
}
