import type { ComplexMatrix } from "./complex-matrix";
import { createTridiagonalWork, hypot2, implicitQL, sortAscending } from "./tridiagonal-ql";

/**
 * Eigenvalues (ascending) and, when requested, orthonormal eigenvectors of a Hermitian matrix.
 * Eigenvector m is stored contiguously: component j is `vectorsRe[m * size + j] + i·vectorsIm[m * size + j]`.
 */
export interface EigenOutput {
  readonly values: Float64Array;
  readonly vectorsRe: Float64Array;
  readonly vectorsIm: Float64Array;
}

/** A reusable solver for one matrix size: all work arrays are allocated once, none in `solve`. */
export interface HermitianEigenSolver {
  readonly size: number;
  /**
   * Diagonalises the Hermitian matrix given by `re` and `im` (row-major; only the lower triangle and the
   * diagonal are read, so the upper triangle may hold anything; the input is not modified). Writes ascending eigenvalues into `out.values` and, if `withVectors`,
   * orthonormal eigenvectors into `out.vectorsRe` / `out.vectorsIm`: all of them, or only those of
   * bands `vectorBands` = [first, last] (0-based, inclusive, in ascending order; the others are left as
   * they were).
   */
  solve(re: Float64Array, im: Float64Array, out: EigenOutput, withVectors: boolean, vectorBands?: readonly [number, number]): void;
}

/** Allocates output arrays matching a solver of the given size. */
export function createEigenOutput(size: number): EigenOutput {
  return {
    values: new Float64Array(size),
    vectorsRe: new Float64Array(size * size),
    vectorsIm: new Float64Array(size * size),
  };
}

/**
 * Creates a Hermitian eigen-solver for `size` × `size` matrices: complex Householder reduction to a real
 * symmetric tridiagonal matrix (Householder reflectors as in Golub & Van Loan, *Matrix Computations*,
 * 4th ed., §5.1 and §8.3, with a diagonal phase transform making the off-diagonal real, the approach of
 * EISPACK's htridi), then the implicit QL algorithm with Wilkinson-type shifts (Numerical Recipes, 3rd
 * ed., §11.4, tqli) and the reflectors applied back to the eigenvectors.
 */
export function createHermitianEigenSolver(size: number): HermitianEigenSolver {
  const n = size;
  const aRe = new Float64Array(n * n);
  const aIm = new Float64Array(n * n);
  const vRe = new Float64Array(n * n); // reflector k in row k, components k+1..n-1
  const vIm = new Float64Array(n * n);
  const tau = new Float64Array(n);
  const pRe = new Float64Array(n);
  const pIm = new Float64Array(n);
  const work = createTridiagonalWork(n);
  const { diag, off, z, order } = work;
  const phaseRe = new Float64Array(n);
  const phaseIm = new Float64Array(n);

  function tridiagonalise(): void {
    for (let k = 0; k < n - 2; k++) {
      const below = k + 1;
      let tailNorm2 = 0;
      for (let j = below + 1; j < n; j++) tailNorm2 += aRe[j * n + k] ** 2 + aIm[j * n + k] ** 2;
      const x0Re = aRe[below * n + k];
      const x0Im = aIm[below * n + k];
      const x0Abs = hypot2(x0Re, x0Im);
      if (tailNorm2 === 0) {
        tau[k] = 0; // already reduced: the sub-diagonal x0 stays as it is
        continue;
      }
      const xNorm = Math.sqrt(tailNorm2 + x0Abs * x0Abs);
      const uRe = x0Abs === 0 ? 1 : x0Re / x0Abs;
      const uIm = x0Abs === 0 ? 0 : x0Im / x0Abs;
      const alphaRe = -uRe * xNorm;
      const alphaIm = -uIm * xNorm;
      // v = x − α e1; v†v = 2‖x‖(‖x‖ + |x0|).
      const row = k * n;
      vRe[row + below] = x0Re - alphaRe;
      vIm[row + below] = x0Im - alphaIm;
      for (let j = below + 1; j < n; j++) {
        vRe[row + j] = aRe[j * n + k];
        vIm[row + j] = aIm[j * n + k];
      }
      const t = 1 / (xNorm * (xNorm + x0Abs));
      tau[k] = t;
      // p = τ B v over the trailing block B = A[below.., below..], read from its lower triangle only
      // (B is Hermitian: B_ji = conj(B_ij)), which halves the work as in LAPACK's zhetrd.
      for (let i = below; i < n; i++) {
        pRe[i] = 0;
        pIm[i] = 0;
      }
      for (let i = below; i < n; i++) {
        const ri = i * n;
        const xir = vRe[row + i];
        const xii = vIm[row + i];
        let sr = aRe[ri + i] * xir;
        let si = aRe[ri + i] * xii;
        for (let j = below; j < i; j++) {
          const br = aRe[ri + j];
          const bi = aIm[ri + j];
          const xr = vRe[row + j];
          const xi = vIm[row + j];
          sr += br * xr - bi * xi; // B_ij v_j
          si += br * xi + bi * xr;
          pRe[j] += br * xir + bi * xii; // conj(B_ij) v_i
          pIm[j] += br * xii - bi * xir;
        }
        pRe[i] += sr;
        pIm[i] += si;
      }
      let c = 0;
      for (let i = below; i < n; i++) {
        pRe[i] *= t;
        pIm[i] *= t;
        c += vRe[row + i] * pRe[i] + vIm[row + i] * pIm[i]; // Re(conj(v_i) p_i); v†p is real
      }
      const half = 0.5 * t * c;
      for (let i = below; i < n; i++) {
        pRe[i] -= half * vRe[row + i]; // p becomes w = p − (τ v†p / 2) v
        pIm[i] -= half * vIm[row + i];
      }
      // B ← B − v w† − w v†, lower triangle only
      for (let i = below; i < n; i++) {
        const vir = vRe[row + i];
        const vii = vIm[row + i];
        const wir = pRe[i];
        const wii = pIm[i];
        const ri = i * n;
        for (let j = below; j <= i; j++) {
          const vjr = vRe[row + j];
          const vji = vIm[row + j];
          const wjr = pRe[j];
          const wji = pIm[j];
          aRe[ri + j] -= vir * wjr + vii * wji + wir * vjr + wii * vji;
          aIm[ri + j] -= vii * wjr - vir * wji + wii * vjr - wir * vji;
        }
      }
      aRe[below * n + k] = alphaRe;
      aIm[below * n + k] = alphaIm;
    }
    // Diagonal, and a phase transform D with real non-negative off-diagonal |e_j|.
    phaseRe[0] = 1;
    phaseIm[0] = 0;
    for (let j = 0; j < n; j++) diag[j] = aRe[j * n + j];
    for (let j = 0; j < n - 1; j++) {
      const er = aRe[(j + 1) * n + j];
      const ei = aIm[(j + 1) * n + j];
      const abs = hypot2(er, ei);
      off[j] = abs;
      const ur = abs === 0 ? 1 : er / abs;
      const ui = abs === 0 ? 0 : ei / abs;
      phaseRe[j + 1] = phaseRe[j] * ur - phaseIm[j] * ui;
      phaseIm[j + 1] = phaseRe[j] * ui + phaseIm[j] * ur;
    }
    off[n - 1] = 0;
  }

  function backTransform(out: EigenOutput, first: number, last: number): void {
    const yr = out.vectorsRe;
    const yi = out.vectorsIm;
    for (let m = first; m <= last; m++) {
      const src = order[m] * n;
      const dst = m * n;
      for (let j = 0; j < n; j++) {
        yr[dst + j] = phaseRe[j] * z[src + j];
        yi[dst + j] = phaseIm[j] * z[src + j];
      }
      // y ← H_k y = y − τ v (v† y), last reflector first.
      for (let k = n - 3; k >= 0; k--) {
        const t = tau[k];
        if (t === 0) continue;
        const row = k * n;
        let sr = 0;
        let si = 0;
        for (let j = k + 1; j < n; j++) {
          const vr = vRe[row + j];
          const vi = vIm[row + j];
          sr += vr * yr[dst + j] + vi * yi[dst + j];
          si += vr * yi[dst + j] - vi * yr[dst + j];
        }
        sr *= t;
        si *= t;
        for (let j = k + 1; j < n; j++) {
          const vr = vRe[row + j];
          const vi = vIm[row + j];
          yr[dst + j] -= vr * sr - vi * si;
          yi[dst + j] -= vr * si + vi * sr;
        }
      }
    }
  }

  return {
    size,
    solve(re, im, out, withVectors, vectorBands) {
      aRe.set(re);
      aIm.set(im);
      tridiagonalise();
      implicitQL(work, withVectors);
      sortAscending(work);
      for (let m = 0; m < n; m++) out.values[m] = diag[order[m]];
      if (withVectors) backTransform(out, vectorBands ? vectorBands[0] : 0, vectorBands ? vectorBands[1] : n - 1);
    },
  };
}

/**
 * Convenience wrapper: eigenvalues (ascending) and orthonormal eigenvectors of one Hermitian matrix.
 * Allocates; use {@link createHermitianEigenSolver} in loops.
 */
export function eigenHermitian(matrix: ComplexMatrix): EigenOutput {
  const out = createEigenOutput(matrix.size);
  createHermitianEigenSolver(matrix.size).solve(matrix.re, matrix.im, out, true);
  return out;
}
