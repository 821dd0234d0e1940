import { LeastSquaresError } from "./errors";

/** One fit parameter: its start, its bounds and whether the fit may change it. */
export interface ParameterSpec {
  /** Name used in results and warnings, unique within the problem. */
  name: string;
  /** Starting value, in the parameter's own unit. */
  initial: number;
  /** Lower bound, same unit. Default −∞. */
  lower?: number;
  /** Upper bound, same unit. Default +∞. */
  upper?: number;
  /** False keeps the parameter at `initial`, outside the optimisation. Default true. */
  free?: boolean;
}

/** Model values together with their derivatives, from one evaluation. */
export interface ValuesWithJacobian {
  /** Model values f_i(θ), length N. */
  values: ArrayLike<number>;
  /** ∂f_i/∂θ_j, row-major N × P over ALL parameters (fixed ones included). */
  jacobian: ArrayLike<number>;
}

/**
 * A generic weighted least-squares problem: N observations y_i with uncertainties σ_i, a model
 * f(θ) of P parameters. The engine minimises χ² = Σ r_i², r_i = (f_i(θ) − y_i)/σ_i.
 *
 * Every function receives the full parameter vector (fixed parameters at their values) and must not
 * keep or modify it.
 */
export interface LeastSquaresProblem {
  /** The parameters, in the order of θ. */
  parameters: readonly ParameterSpec[];
  /** Observed values y_i, length N. */
  observed: ArrayLike<number>;
  /** Standard uncertainty σ_i > 0 of each observation, same unit as y. Default 1 for every point. */
  sigma?: ArrayLike<number>;
  /** Model values f(θ), length N. */
  evaluate(parameters: Float64Array): ArrayLike<number>;
  /** ∂f/∂θ, row-major N × P. Optional; used when the options ask for the analytic Jacobian. */
  jacobian?(parameters: Float64Array): ArrayLike<number>;
  /**
   * Values and Jacobian from one evaluation. Optional; preferred over `evaluate` + `jacobian` when
   * both come from the same expensive step (for bands: one diagonalisation per k-point).
   */
  evaluateWithJacobian?(parameters: Float64Array): ValuesWithJacobian;
}

/** A problem checked and reduced to arrays: what the solver works on. */
export interface PreparedProblem {
  names: string[];
  /** Full start vector θ₀. */
  initial: Float64Array;
  lower: Float64Array;
  upper: Float64Array;
  /** Indices of the free parameters in θ. */
  freeIndices: number[];
  observed: Float64Array;
  /** 1/σ_i, the whitening factors. */
  inverseSigma: Float64Array;
  problem: LeastSquaresProblem;
}

const invalid = (message: string): never => {
  throw new LeastSquaresError("invalid-problem", message);
};

/**
 * Checks a problem's shapes and values once and converts it to typed arrays.
 * @throws LeastSquaresError with a message naming the offending entry
 */
export function prepareProblem(problem: LeastSquaresProblem): PreparedProblem {
  const specs = problem.parameters;
  const count = specs.length;
  const names = specs.map((spec) => spec.name);
  if (new Set(names).size !== count) invalid("Parameter names must be unique");
  const initial = new Float64Array(count);
  const lower = new Float64Array(count);
  const upper = new Float64Array(count);
  const freeIndices: number[] = [];
  specs.forEach((spec, j) => {
    const low = spec.lower ?? -Infinity;
    const high = spec.upper ?? Infinity;
    if (!Number.isFinite(spec.initial)) invalid(`Parameter "${spec.name}" needs a finite initial value`);
    if (Number.isNaN(low) || Number.isNaN(high) || low > high)
      invalid(`Parameter "${spec.name}" has invalid bounds [${low}, ${high}]`);
    if (spec.initial < low || spec.initial > high)
      invalid(`Parameter "${spec.name}" starts at ${spec.initial}, outside its bounds [${low}, ${high}]`);
    initial[j] = spec.initial;
    lower[j] = low;
    upper[j] = high;
    if (spec.free !== false && low < high) freeIndices.push(j);
  });

  const observed = Float64Array.from(problem.observed);
  const n = observed.length;
  if (observed.some((y) => !Number.isFinite(y))) invalid("Every observed value must be finite");
  const inverseSigma = new Float64Array(n).fill(1);
  if (problem.sigma) {
    if (problem.sigma.length !== n)
      invalid(`sigma has ${problem.sigma.length} entries but there are ${n} observations`);
    for (let i = 0; i < n; i++) {
      const s = problem.sigma[i];
      if (!(s > 0) || !Number.isFinite(s)) invalid(`sigma[${i}] = ${s}: every σ must be finite and > 0`);
      inverseSigma[i] = 1 / s;
    }
  }

  if (freeIndices.length === 0)
    throw new LeastSquaresError("no-free-parameters", "No free parameters: nothing to fit");
  if (n <= freeIndices.length)
    throw new LeastSquaresError(
      "too-few-observations",
      `${n} observations cannot determine ${freeIndices.length} free parameters: need more observations than free parameters`,
    );
  return { names, initial, lower, upper, freeIndices, observed, inverseSigma, problem };
}
