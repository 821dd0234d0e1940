import { type EigenOutput, type HermitianEigenSolver, createEigenOutput, createHermitianEigenSolver } from "./hermitian-eigen";

/**
 * Near-degenerate clusters of ascending eigenvalues: maximal runs in which each value is closer than
 * `tolerance` to the next (a chain counts as one cluster), with at least two members.
 * @param values - ascending eigenvalues
 * @param tolerance - gap below which neighbours count as degenerate (same unit as `values`); 0 finds none
 * @returns [first, last] index pairs (inclusive), ascending
 */
export function nearDegenerateClusters(values: ArrayLike<number>, tolerance: number): [number, number][] {
  const clusters: [number, number][] = [];
  let first = 0;
  for (let i = 1; i <= values.length; i++) {
    if (i < values.length && values[i] - values[i - 1] < tolerance) continue;
    if (i - 1 > first) clusters.push([first, i - 1]);
    first = i;
  }
  return clusters;
}

/** How the sorted eigenvalues of one (near-)degenerate cluster move along one parameter. */
export interface ClusterDerivatives {
  /** ∂E_i/∂θ for an increase of θ: the projected derivative's eigenvalues μ_1 ≤ … ≤ μ_d */
  increase: Float64Array;
  /** for a decrease: μ_d, …, μ_1 (the order flips when the cluster is passed backwards) */
  decrease: Float64Array;
  /** their mean, (μ_i + μ_{d+1−i})/2: the two-sided derivative central finite differences converge to */
  twoSided: Float64Array;
  /** μ_d − μ_1: 0 when θ moves the cluster rigidly (a degeneracy by symmetry), > 0 at a true crossing */
  spread: number;
}

const solvers = new Map<number, { solver: HermitianEigenSolver; out: EigenOutput }>();

/**
 * Derivatives of the sorted eigenvalues inside a degenerate cluster of a Hermitian family A(θ), by
 * degenerate perturbation theory (Sakurai & Napolitano, *Modern Quantum Mechanics*, §5.2): with Ψ the
 * cluster's orthonormal eigenvectors (S-orthonormal for a generalised problem), the first-order shifts are
 * the eigenvalues of the projected derivative P = Ψ† ∂A/∂θ Ψ (for A − E S: Ψ†(∂A/∂θ − E ∂S/∂θ)Ψ). Exact
 * for one parameter direction; the individual eigenvalue is not differentiable there, so both one-sided
 * derivatives are returned.
 * @param projectedRe - real part of P, d × d row-major (lower triangle and diagonal are read)
 * @param projectedIm - imaginary part of P
 * @param size - d, the cluster's size
 */
export function clusterDerivatives(projectedRe: Float64Array, projectedIm: Float64Array, size: number): ClusterDerivatives {
  let cached = solvers.get(size);
  if (!cached) {
    cached = { solver: createHermitianEigenSolver(size), out: createEigenOutput(size) };
    solvers.set(size, cached);
  }
  cached.solver.solve(projectedRe, projectedIm, cached.out, false);
  const increase = Float64Array.from(cached.out.values);
  const decrease = Float64Array.from(increase).reverse();
  const twoSided = increase.map((mu, i) => (mu + decrease[i]) / 2);
  return { increase, decrease, twoSided, spread: increase[size - 1] - increase[0] };
}
