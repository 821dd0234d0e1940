import { Matrix, SingularValueDecomposition } from "ml-matrix";
import type { FitWarning } from "./result";

/** What the statistics need about the solution. */
export interface StatisticsInput {
  /** Whitened Jacobian ∂r/∂θ_free, row-major N × P. */
  jacobian: Float64Array;
  observations: number;
  chiSquared: number;
  /** Names of the free parameters. */
  names: string[];
  /**
   * A typical size of each free parameter in its own unit (the larger of |value| and |start|; 0 when
   * both are 0): ‖J_k‖·size_k is the change of the whitened model for a 100 % change of θ_k, which
   * compares across units.
   */
  sizes: Float64Array;
  /** Relative eigenvalue of the normalised JᵀWJ below which a direction is undetermined. */
  singularTolerance: number;
  /** |correlation| above which a pair is reported. */
  correlationWarning: number;
}

/** Standard errors, correlations and the warnings they raise. */
export interface SolutionStatistics {
  /** Per free parameter; null when undetermined. */
  standardErrors: (number | null)[];
  correlation: (number | null)[][];
  warnings: FitWarning[];
}

// A parameter counts as part of an undetermined direction when its share of it exceeds this (common practice).
const NULL_SPACE_COMPONENT = 0.01;

/**
 * Asymptotic covariance s²(JᵀWJ)⁻¹ with s² = χ²/(N − P) (GSL reference manual, "Nonlinear Least-Squares
 * Fitting: Covariance matrix of best fit parameters"; the NIST StRD convention), computed from the SVD
 * of the column-normalised Jacobian J·D, D = diag(1/‖J_k‖), so that parameters of any unit compare:
 * JᵀWJ = D⁻¹ V Σ² Vᵀ D⁻¹. Directions with σ_i² < tol·σ_max² are undetermined; a parameter with a share
 * in them gets no standard error, the others get theirs from the pseudo-inverse (exact for parameters
 * orthogonal to the undetermined directions). A zero Jacobian column, or one whose effect (‖J_k‖ times the
 * parameter's size) is negligible beside the others', is a parameter with no effect.
 */
export function solutionStatistics(input: StatisticsInput): SolutionStatistics {
  const { jacobian, observations: n, chiSquared, names, sizes, singularTolerance, correlationWarning } = input;
  const p = names.length;
  const warnings: FitWarning[] = [];
  const s2 = chiSquared / (n - p);

  const columnNorms = new Float64Array(p);
  for (let i = 0; i < n; i++) for (let k = 0; k < p; k++) columnNorms[k] += jacobian[i * p + k] ** 2;
  columnNorms.forEach((squared, k) => (columnNorms[k] = Math.sqrt(squared)));
  // A vanishing effect relative to the others (same tolerance as the SVD's, on squared norms) is as
  // undetermined as a zero column, but the column normalisation below would hide it.
  const effects = Float64Array.from(columnNorms, (norm, k) => norm * sizes[k]);
  const largestEffect = Math.max(...effects);
  const negligible = (k: number) =>
    columnNorms[k] === 0 || (sizes[k] > 0 && effects[k] ** 2 < singularTolerance * largestEffect ** 2);
  const active = names.map((_, k) => k).filter((k) => !negligible(k));
  for (let k = 0; k < p; k++)
    if (negligible(k))
      warnings.push({
        kind: "no-effect",
        parameters: [names[k]],
        message:
          columnNorms[k] === 0
            ? `${names[k]} has no effect on the model at the solution (zero Jacobian column): the data do not determine it`
            : `${names[k]} has almost no effect on the model at the solution (changing it by 100 % moves the fit ` +
              `${(effects[k] / largestEffect).toExponential(1)} times as much as the most effective parameter): the data do not determine it`,
      });

  // (JᵀWJ)⁺ without the factor s², so correlations stay defined when χ² = 0 (exact data).
  const unscaled: (number | null)[][] = names.map(() => names.map(() => null));
  const determined = new Array<boolean>(p).fill(false);
  if (active.length > 0) {
    const normalised = new Matrix(n, active.length);
    for (let i = 0; i < n; i++)
      active.forEach((k, a) => normalised.set(i, a, jacobian[i * p + k] / columnNorms[k]));
    const svd = new SingularValueDecomposition(normalised, { computeLeftSingularVectors: false });
    const singular = svd.diagonal;
    const v = svd.rightSingularVectors;
    const largest = Math.max(...singular);
    const kept = singular.map((s) => s * s >= singularTolerance * largest * largest);
    const undetermined = new Set<number>();
    singular.forEach((s, i) => {
      if (kept[i]) return;
      const involved = active.filter((_, a) => Math.abs(v.get(a, i)) > NULL_SPACE_COMPONENT);
      involved.forEach((k) => undetermined.add(k));
      const list = involved.map((k) => names[k]);
      warnings.push({
        kind: "undetermined",
        parameters: list,
        message: `JᵀWJ is near-singular (relative eigenvalue ${((s / largest) ** 2).toExponential(2)}): the data determine only a combination of ${list.join(", ")}, not each one`,
      });
    });
    active.forEach((k, a) => {
      determined[k] = !undetermined.has(k);
      active.forEach((l, b) => {
        let sum = 0;
        singular.forEach((s, i) => {
          if (kept[i]) sum += (v.get(a, i) * v.get(b, i)) / (s * s);
        });
        unscaled[k][l] = sum / (columnNorms[k] * columnNorms[l]);
      });
    });
  }

  const usable = (k: number): number | null => {
    const u = unscaled[k][k];
    return determined[k] && u !== null && u > 0 && Number.isFinite(u) ? u : null;
  };
  const standardErrors = names.map((_, k) => {
    const u = usable(k);
    return u === null ? null : Math.sqrt(s2 * u);
  });
  const correlation = names.map((_, k) =>
    names.map((__, l) => {
      const uk = usable(k);
      const ul = usable(l);
      const c = unscaled[k][l];
      if (uk === null || ul === null || c === null) return null;
      return k === l ? 1 : Math.max(-1, Math.min(1, c / Math.sqrt(uk * ul)));
    }),
  );
  for (let k = 0; k < p; k++)
    for (let l = k + 1; l < p; l++) {
      const c = correlation[k][l];
      if (c !== null && Math.abs(c) > correlationWarning)
        warnings.push({
          kind: "strong-correlation",
          parameters: [names[k], names[l]],
          message: `${names[k]} and ${names[l]} are correlated (${c.toFixed(4)}): the data barely separate them`,
        });
    }
  return { standardErrors, correlation, warnings };
}
