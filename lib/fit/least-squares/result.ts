/**
 * Why a run from one start stopped.
 * - "chi-squared-tolerance": an accepted step lowered χ² (and was predicted to lower it) by less than
 *   `chiSquaredRelativeTolerance`·χ², or χ² reached 0 — converged.
 * - "step-tolerance": the step became smaller than `stepTolerance` relative to the parameters — converged.
 * - "max-iterations", "time-limit", "cancelled": stopped from outside; the best point so far is kept.
 * - "damping-limit": no downhill step was found even with huge damping — failure.
 * - "non-finite-start": the model gave a non-finite value at the start — failure, nothing fitted.
 * - "non-finite-jacobian": the Jacobian had a non-finite entry at an accepted point — failure.
 */
export type StopReason =
  | "chi-squared-tolerance"
  | "step-tolerance"
  | "max-iterations"
  | "time-limit"
  | "cancelled"
  | "damping-limit"
  | "non-finite-start"
  | "non-finite-jacobian";

/** The stop reasons that mean the fit converged to a (local) minimum. */
export const CONVERGED_STOP_REASONS: readonly StopReason[] = ["chi-squared-tolerance", "step-tolerance"];

/** Kinds of warning about what the data do not determine or how the fit ended. */
export type FitWarningKind =
  | "no-effect"
  | "undetermined"
  | "strong-correlation"
  | "at-bound"
  | "not-converged"
  | "starts-incomplete";

/** A warning naming the parameters concerned. */
export interface FitWarning {
  kind: FitWarningKind;
  /** Names of the parameters concerned (empty for warnings about the fit as a whole). */
  parameters: string[];
  message: string;
}

/** One parameter at the solution. */
export interface FittedParameter {
  name: string;
  /** Fitted value (the start value for a fixed parameter), in the parameter's own unit. */
  value: number;
  /**
   * √(s²·[(JᵀWJ)⁻¹]_jj) with s² = χ²/(N − P); null for a fixed parameter or one the data do not
   * determine (a warning says why).
   */
  standardError: number | null;
  free: boolean;
  /** The bound the value sits on, if any. */
  atBound: "lower" | "upper" | null;
}

/** How a run from one start went. */
export interface StartSummary {
  /** 0 for the given start, then the drawn ones in order. */
  index: number;
  /** Start values of all parameters. */
  initial: number[];
  /** Final values of all parameters. */
  final: number[];
  chiSquared: number | null;
  iterations: number;
  stopReason: StopReason;
}

/** Progress of a fit, reported at each start (iteration 0) and once per iteration. */
export interface FitProgress {
  /** Index of the start being run. */
  start: number;
  /** Iterations of this start so far (0: the start point, before the first step). */
  iteration: number;
  /** Best χ² of this start so far. */
  chiSquared: number;
  /** λ about to be used. */
  damping: number;
  /** Wall time since the fit began, ms. */
  elapsedMs: number;
}

/** Everything a fit reports. Every number is finite; undetermined quantities are null. */
export interface LeastSquaresResult {
  parameters: FittedParameter[];
  /** χ² = Σ ((f_i − y_i)/σ_i)² at the solution. */
  chiSquared: number;
  /** χ²/(N − P). */
  reducedChiSquared: number;
  /** N − P (P = free parameters). */
  degreesOfFreedom: number;
  observations: number;
  /** Names of the free parameters, the order of `correlation`. */
  freeParameters: string[];
  /** Correlation matrix of the free parameters; null where a parameter is undetermined. */
  correlation: (number | null)[][];
  /** Model values f_i at the solution, in the unit of the observations. */
  modelValues: number[];
  /** Weighted residuals (f_i − y_i)/σ_i at the solution. */
  residuals: number[];
  /** Iterations of the best start. */
  iterations: number;
  /** Model evaluations of the whole fit (finite-difference evaluations included). */
  evaluations: number;
  /** Jacobians formed during the whole fit. */
  jacobianEvaluations: number;
  /** Why the best start stopped, or "cancelled" when the fit was cancelled. */
  stopReason: StopReason;
  converged: boolean;
  cancelled: boolean;
  /** Wall time of the fit, ms. */
  elapsedMs: number;
  warnings: FitWarning[];
  /** Every start that ran, in order. */
  starts: StartSummary[];
  /** Index into `starts` of the start whose result this is. */
  bestStart: number;
}
