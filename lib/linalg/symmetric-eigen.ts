import { createTridiagonalWork, implicitQL, sortAscending } from "./tridiagonal-ql";

/** A reusable solver for real symmetric matrices of one size: work arrays allocated once, none in `solve`. */
export interface SymmetricEigenSolver {
  readonly size: number;
  /**
   * Diagonalises the real symmetric matrix `a` (row-major; only the lower triangle and the diagonal are
   * read; not modified). Writes ascending eigenvalues into `values` and, when `vectors` is given,
   * orthonormal eigenvectors (vector m contiguous at `[m * size + j]`) for bands `vectorBands` =
   * [first, last] (0-based, inclusive; default all), leaving the other rows as they were.
   */
  solve(a: Float64Array, values: Float64Array, vectors: Float64Array | null, vectorBands?: readonly [number, number]): void;
}

/**
 * Creates a real symmetric eigen-solver: Householder tridiagonalisation from the lower triangle
 * (Golub & Van Loan, *Matrix Computations*, 4th ed., §8.3.1, as LAPACK's dsytrd), the implicit QL
 * algorithm shared with the Hermitian solver, and the reflectors applied back to the eigenvectors.
 * About a quarter of the Hermitian solver's arithmetic outside the QL stage.
 */
export function createSymmetricEigenSolver(size: number): SymmetricEigenSolver {
  const n = size;
  const a = new Float64Array(n * n);
  const v = new Float64Array(n * n); // reflector k in row k, components k+1..n-1
  const tau = new Float64Array(n);
  const p = new Float64Array(n);
  const work = createTridiagonalWork(n);
  const { diag, off, z, order } = work;

  function tridiagonalise(): void {
    for (let k = 0; k < n - 2; k++) {
      const below = k + 1;
      let tailNorm2 = 0;
      for (let j = below + 1; j < n; j++) tailNorm2 += a[j * n + k] ** 2;
      const x0 = a[below * n + k];
      if (tailNorm2 === 0) {
        tau[k] = 0; // already reduced
        continue;
      }
      const xNorm = Math.sqrt(tailNorm2 + x0 * x0);
      const alpha = x0 >= 0 ? -xNorm : xNorm;
      // v = x − α e1; vᵀv = 2‖x‖(‖x‖ + |x0|).
      const row = k * n;
      v[row + below] = x0 - alpha;
      for (let j = below + 1; j < n; j++) v[row + j] = a[j * n + k];
      const t = 1 / (xNorm * (xNorm + Math.abs(x0)));
      tau[k] = t;
      // p = τ B v over the trailing block, from its lower triangle only.
      for (let i = below; i < n; i++) p[i] = 0;
      for (let i = below; i < n; i++) {
        const ri = i * n;
        const vi = v[row + i];
        let sum = a[ri + i] * vi;
        for (let j = below; j < i; j++) {
          const b = a[ri + j];
          sum += b * v[row + j];
          p[j] += b * vi;
        }
        p[i] += sum;
      }
      let c = 0;
      for (let i = below; i < n; i++) {
        p[i] *= t;
        c += v[row + i] * p[i];
      }
      const half = 0.5 * t * c;
      for (let i = below; i < n; i++) p[i] -= half * v[row + i]; // w = p − (τ vᵀp / 2) v
      // B ← B − v wᵀ − w vᵀ, lower triangle only
      for (let i = below; i < n; i++) {
        const vi = v[row + i];
        const wi = p[i];
        const ri = i * n;
        for (let j = below; j <= i; j++) a[ri + j] -= vi * p[j] + wi * v[row + j];
      }
      a[below * n + k] = alpha;
    }
    for (let j = 0; j < n; j++) diag[j] = a[j * n + j];
    for (let j = 0; j < n - 1; j++) off[j] = a[(j + 1) * n + j];
    off[n - 1] = 0;
  }

  function backTransform(vectors: Float64Array, first: number, last: number): void {
    for (let m = first; m <= last; m++) {
      const src = order[m] * n;
      const dst = m * n;
      for (let j = 0; j < n; j++) vectors[dst + j] = z[src + j];
      // y ← H_k y = y − τ v (vᵀ y), last reflector first.
      for (let k = n - 3; k >= 0; k--) {
        const t = tau[k];
        if (t === 0) continue;
        const row = k * n;
        let s = 0;
        for (let j = k + 1; j < n; j++) s += v[row + j] * vectors[dst + j];
        s *= t;
        for (let j = k + 1; j < n; j++) vectors[dst + j] -= v[row + j] * s;
      }
    }
  }

  return {
    size,
    solve(input, values, vectors, vectorBands) {
      a.set(input);
      tridiagonalise();
      implicitQL(work, vectors !== null);
      sortAscending(work);
      for (let m = 0; m < n; m++) values[m] = diag[order[m]];
      if (vectors) backTransform(vectors, vectorBands ? vectorBands[0] : 0, vectorBands ? vectorBands[1] : n - 1);
    },
  };
}
