import { levenbergMarquardt } from "ml-levenberg-marquardt";
import type { ResidualEvaluator } from "./evaluator";

/**
 * What ml-levenberg-marquardt 5.1 means by its options, stated once (read from its source):
 * - `weights` are per-point σ values: its step squares and inverts them (W = 1/σ²), but its error sum
 *   MULTIPLIES the squared residuals by σ², so its `parameterError` is Σ((y − f)·σ)², not χ². We
 *   therefore never pass weights: the problem is whitened first (targets y/σ, model f/σ, σ = 1), and
 *   then `parameterError` is exactly χ².
 * - `errorTolerance` is not a convergence test on the change of χ²: the loop stops once the weighted
 *   sum of squares itself falls below it, and a step only counts as an improvement if it lowers the sum
 *   by more than it. We pass 0, so any strict decrease is an improvement.
 * - `damping` λ is added to the diagonal of JᵀJ (λI, not Marquardt's λ·diag JᵀJ); the caller scales the
 *   parameters so that the two agree.
 * - Its loop applies every step, even one that raises the sum, and keeps the best point seen; the result
 *   has no convergence flag, and `timeout` throws instead of returning the best point.
 * So we run it one iteration at a time (`maxIterations: 1`): each call computes a damped Gauss–Newton
 * step by Cholesky, clamps it to the bounds, evaluates the trial point and returns it only if χ² fell.
 * Damping control, stopping rules, time limit and cancellation live in our solver.
 */

/** Outcome of one library step. */
export interface LibraryStepResult {
  /** Whether the trial point lowered χ². */
  accepted: boolean;
  /** Free parameters of the trial point, accepted or not. */
  trial: Float64Array;
  /** χ² at the returned point (the trial if accepted, else the current point). */
  chiSquared: number;
}

/** Inputs of one step; `scale` holds powers of two so that θ = u·scale round-trips exactly. */
export interface LibraryStepInput {
  evaluator: ResidualEvaluator;
  /** Current free parameters θ. */
  current: Float64Array;
  /** Scaled variable u_k = θ_k / scale_k is what the library sees. */
  scale: Float64Array;
  /** λ, added to the diagonal of the scaled JᵀJ; > 0. */
  damping: number;
  /** Bounds of the free parameters, unscaled. */
  lower: Float64Array;
  upper: Float64Array;
}

/**
 * Runs exactly one Levenberg–Marquardt iteration of ml-levenberg-marquardt on the whitened problem.
 * Model values and Jacobians come from the evaluator's cache, so the current point is never
 * re-evaluated: each call costs one new evaluation, at the trial point.
 */
export function libraryStep(input: LibraryStepInput): LibraryStepResult {
  const { evaluator, current, scale, damping, lower, upper } = input;
  const p = current.length;
  const toTheta = (u: ArrayLike<number>): Float64Array => Float64Array.from(u, (value, k) => value * scale[k]);
  const observed = evaluator.observed;
  let lastEvaluated: Float64Array = current;

  const result = levenbergMarquardt(
    { x: Array.from(observed, (_, i) => i), y: observed },
    (u) => {
      lastEvaluated = toTheta(u);
      const values = evaluator.evaluate(lastEvaluated).whitenedValues;
      return (i) => values[i];
    },
    {
      initialValues: Array.from(current, (value, k) => value / scale[k]),
      minValues: Array.from(lower, (value, k) => value / scale[k]),
      maxValues: Array.from(upper, (value, k) => value / scale[k]),
      damping,
      maxIterations: 1,
      errorTolerance: 0,
      jacobianFunction: (u) => {
        const jacobian = evaluator.jacobian(toTheta(u));
        // The library copies each row before asking for the next, so one row buffer serves all N rows.
        const row = new Array<number>(p);
        return (i) => {
          for (let k = 0; k < p; k++) row[k] = jacobian[i * p + k] * scale[k];
          return row;
        };
      },
    },
  );
  const returned = toTheta(result.parameterValues);
  const accepted = returned.some((value, k) => value !== current[k]);
  return { accepted, trial: lastEvaluated, chiSquared: result.parameterError };
}
