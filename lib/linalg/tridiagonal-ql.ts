/** Work arrays of the tridiagonal stage shared by the Hermitian and the real symmetric solver. */
export interface TridiagonalWork {
  readonly size: number;
  /** diagonal; eigenvalues (unsorted) after {@link implicitQL} */
  readonly diag: Float64Array;
  /** sub-diagonal off[j] = T[j+1, j], off[n−1] = 0 */
  readonly off: Float64Array;
  /** row m: eigenvector m of the tridiagonal matrix (unsorted) */
  readonly z: Float64Array;
  /** ascending order of the eigenvalues after {@link sortAscending} */
  readonly order: Int32Array;
}

const MAX_QL_ITERATIONS = 60;

/** Allocates the work arrays for `size` × `size` matrices. */
export function createTridiagonalWork(size: number): TridiagonalWork {
  return {
    size,
    diag: new Float64Array(size),
    off: new Float64Array(size),
    z: new Float64Array(size * size),
    order: new Int32Array(size),
  };
}

// √(a² + b²) without Math.hypot's cost (variadic, it was the QL loop's largest single expense); falls
// back to Math.hypot only where a² + b² would overflow or lose precision to underflow.
export function hypot2(a: number, b: number): number {
  const sum = a * a + b * b;
  return sum < 1e300 && sum > 1e-300 ? Math.sqrt(sum) : Math.hypot(a, b);
}

/**
 * Implicit QL with Wilkinson-type shifts on the real symmetric tridiagonal matrix in `diag` / `off`
 * (Numerical Recipes, 3rd ed., §11.4, tqli); with `withVectors` the rotations are accumulated into z.
 */
export function implicitQL(work: TridiagonalWork, withVectors: boolean): void {
  const { size: n, diag, off, z } = work;
  if (withVectors) {
    z.fill(0);
    for (let i = 0; i < n; i++) z[i * n + i] = 1;
  }
  for (let l = 0; l < n; l++) {
    let iterations = 0;
    let m: number;
    do {
      for (m = l; m < n - 1; m++) {
        const dd = Math.abs(diag[m]) + Math.abs(diag[m + 1]);
        if (Math.abs(off[m]) <= Number.EPSILON * dd) break;
      }
      if (m !== l) {
        if (iterations++ === MAX_QL_ITERATIONS) throw new Error("Hermitian eigen-solver did not converge");
        let g = (diag[l + 1] - diag[l]) / (2 * off[l]);
        let r = hypot2(g, 1);
        g = diag[m] - diag[l] + off[l] / (g + (g >= 0 ? Math.abs(r) : -Math.abs(r)));
        let s = 1;
        let c = 1;
        let p = 0;
        let i: number;
        for (i = m - 1; i >= l; i--) {
          let f = s * off[i];
          const b = c * off[i];
          r = hypot2(f, g);
          off[i + 1] = r;
          if (r === 0) {
            diag[i + 1] -= p;
            off[m] = 0;
            break;
          }
          s = f / r;
          c = g / r;
          g = diag[i + 1] - p;
          r = (diag[i] - g) * s + 2 * c * b;
          p = s * r;
          diag[i + 1] = g + p;
          g = c * r - b;
          if (withVectors) {
            const ri = i * n;
            const rn = ri + n;
            for (let k = 0; k < n; k++) {
              f = z[rn + k];
              z[rn + k] = s * z[ri + k] + c * f;
              z[ri + k] = c * z[ri + k] - s * f;
            }
          }
        }
        if (r === 0 && i >= l) continue;
        diag[l] -= p;
        off[l] = g;
        off[m] = 0;
      }
    } while (m !== l);
  }
}

/** Fills `order` with the indices of `diag` in ascending order (insertion sort: n is small). */
export function sortAscending(work: TridiagonalWork): void {
  const { size: n, diag, order } = work;
  for (let i = 0; i < n; i++) order[i] = i;
  for (let i = 1; i < n; i++) {
    const idx = order[i];
    const value = diag[idx];
    let j = i - 1;
    while (j >= 0 && diag[order[j]] > value) {
      order[j + 1] = order[j];
      j--;
    }
    order[j + 1] = idx;
  }
}
