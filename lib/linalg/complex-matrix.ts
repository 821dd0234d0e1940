/**
 * A dense complex square matrix stored as two row-major Float64Arrays: element (i, j) is
 * `re[i * size + j] + i·im[i * size + j]`. Split storage keeps the hot loops on plain doubles.
 */
export interface ComplexMatrix {
  readonly size: number;
  readonly re: Float64Array;
  readonly im: Float64Array;
}

/** A zero complex matrix of the given size. */
export function createComplexMatrix(size: number): ComplexMatrix {
  return { size, re: new Float64Array(size * size), im: new Float64Array(size * size) };
}

/** Builds a complex matrix from nested rows of real parts and (optionally) imaginary parts. */
export function complexMatrixFromRows(re: readonly number[][], im?: readonly number[][]): ComplexMatrix {
  const size = re.length;
  const m = createComplexMatrix(size);
  for (let i = 0; i < size; i++)
    for (let j = 0; j < size; j++) {
      m.re[i * size + j] = re[i][j];
      m.im[i * size + j] = im ? im[i][j] : 0;
    }
  return m;
}

/** The largest |A_ij − conj(A_ji)|: zero for an exactly Hermitian matrix. */
export function hermiticityDefect(m: ComplexMatrix): number {
  const n = m.size;
  let worst = 0;
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++) {
      const dr = m.re[i * n + j] - m.re[j * n + i];
      const di = m.im[i * n + j] + m.im[j * n + i];
      worst = Math.max(worst, Math.hypot(dr, di));
    }
  return worst;
}
