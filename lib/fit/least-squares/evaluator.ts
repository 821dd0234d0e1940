import type { LeastSquaresOptions } from "./options";
import type { PreparedProblem } from "./problem";

/** Whitened model values f_i/σ_i at one point, with χ². */
export interface Evaluation {
  /** f_i(θ)/σ_i, length N. */
  whitenedValues: Float64Array;
  /** Σ ((f_i − y_i)/σ_i)²; +∞ when the model gave a non-finite value. */
  chiSquared: number;
  /** ∂(f_i/σ_i)/∂θ_free, row-major N × P_free; filled on demand. */
  jacobian: Float64Array | null;
}

/** How often the problem's own functions ran. */
export interface EvaluationCounts {
  /** Calls of `evaluate` or `evaluateWithJacobian` (finite-difference evaluations included). */
  evaluations: number;
  /** Jacobians formed, analytic or by finite differences. */
  jacobians: number;
}

// The solver revisits at most the current and the trial point; a few entries make every repeat a hit.
const CACHE_SIZE = 4;

/**
 * Evaluates a prepared problem on its free parameters, whitened by 1/σ, and caches by exact parameter
 * values so that no point is ever evaluated twice (a band model's evaluation is a full
 * diagonalisation). When the problem offers `evaluateWithJacobian` and the analytic Jacobian is asked
 * for, values and derivatives come from the same call.
 */
export class ResidualEvaluator {
  readonly counts: EvaluationCounts = { evaluations: 0, jacobians: 0 };
  private readonly cache = new Map<string, Evaluation>();
  private readonly whitenedObserved: Float64Array;

  constructor(
    private readonly prepared: PreparedProblem,
    private readonly options: LeastSquaresOptions,
  ) {
    const { observed, inverseSigma } = prepared;
    this.whitenedObserved = observed.map((y, i) => y * inverseSigma[i]);
  }

  /** The whitened observations y_i/σ_i. */
  get observed(): Float64Array {
    return this.whitenedObserved;
  }

  /** The full parameter vector θ with `free` written into the free slots. */
  fullParameters(free: ArrayLike<number>): Float64Array {
    const theta = Float64Array.from(this.prepared.initial);
    this.prepared.freeIndices.forEach((j, k) => {
      theta[j] = free[k];
    });
    return theta;
  }

  /** Values and χ² at the free parameters `free` (cached). */
  evaluate(free: ArrayLike<number>): Evaluation {
    const key = Array.prototype.join.call(free, ",");
    const hit = this.cache.get(key);
    if (hit) {
      this.cache.delete(key);
      this.cache.set(key, hit);
      return hit;
    }
    const entry = Array.prototype.every.call(free, Number.isFinite)
      ? this.computeEvaluation(this.fullParameters(free))
      : this.unusablePoint();
    this.cache.set(key, entry);
    if (this.cache.size > CACHE_SIZE) this.cache.delete(this.cache.keys().next().value as string);
    return entry;
  }

  /** ∂(f/σ)/∂θ_free at `free`, row-major N × P_free (cached with the values). */
  jacobian(free: ArrayLike<number>): Float64Array {
    const entry = this.evaluate(free);
    if (!entry.jacobian) {
      entry.jacobian =
        this.options.jacobian === "analytic"
          ? this.whitenJacobian(this.callAnalyticJacobian(this.fullParameters(free)))
          : this.finiteDifferenceJacobian(this.fullParameters(free), entry);
      this.counts.jacobians++;
    }
    return entry.jacobian;
  }

  private computeEvaluation(theta: Float64Array): Evaluation {
    const { problem } = this.prepared;
    this.counts.evaluations++;
    if (this.options.jacobian === "analytic" && problem.evaluateWithJacobian) {
      const both = problem.evaluateWithJacobian(theta);
      const evaluation = this.whitenValues(both.values);
      if (Number.isFinite(evaluation.chiSquared)) {
        evaluation.jacobian = this.whitenJacobian(both.jacobian);
        this.counts.jacobians++;
      }
      return evaluation;
    }
    return this.whitenValues(problem.evaluate(theta));
  }

  // A step that produced non-finite parameters (a singular solve) is never passed to the problem.
  private unusablePoint(): Evaluation {
    const whitenedValues = new Float64Array(this.whitenedObserved.length).fill(NaN);
    return { whitenedValues, chiSquared: Infinity, jacobian: null };
  }

  private callAnalyticJacobian(theta: Float64Array): ArrayLike<number> {
    const { problem } = this.prepared;
    if (problem.jacobian) return problem.jacobian(theta);
    // Only reached when evaluateWithJacobian exists but the values came back non-finite.
    this.counts.evaluations++;
    return problem.evaluateWithJacobian!(theta).jacobian;
  }

  private whitenValues(values: ArrayLike<number>): Evaluation {
    const { inverseSigma } = this.prepared;
    const n = inverseSigma.length;
    if (values.length !== n) throw new RangeError(`The model returned ${values.length} values for ${n} observations`);
    const whitenedValues = new Float64Array(n);
    let chiSquared = 0;
    for (let i = 0; i < n; i++) {
      whitenedValues[i] = values[i] * inverseSigma[i];
      const r = whitenedValues[i] - this.whitenedObserved[i];
      chiSquared += r * r;
    }
    return { whitenedValues, chiSquared: Number.isFinite(chiSquared) ? chiSquared : Infinity, jacobian: null };
  }

  private whitenJacobian(full: ArrayLike<number>): Float64Array {
    const { inverseSigma, freeIndices, initial } = this.prepared;
    const n = inverseSigma.length;
    const total = initial.length;
    const p = freeIndices.length;
    if (full.length !== n * total)
      throw new RangeError(`The Jacobian has ${full.length} entries; expected ${n} × ${total} = ${n * total}`);
    const out = new Float64Array(n * p);
    for (let i = 0; i < n; i++)
      for (let k = 0; k < p; k++) out[i * p + k] = full[i * total + freeIndices[k]] * inverseSigma[i];
    return out;
  }

  // Step sizes follow MINPACK's fdjac2 (h = δ·|θ_j|, δ when θ_j = 0); a step that would leave the
  // bounds is taken on the other side.
  private finiteDifferenceJacobian(theta: Float64Array, centre: Evaluation): Float64Array {
    const { freeIndices, lower, upper, problem, inverseSigma } = this.prepared;
    const n = inverseSigma.length;
    const p = freeIndices.length;
    const out = new Float64Array(n * p);
    const shifted = (j: number, value: number): Float64Array => {
      const t = Float64Array.from(theta);
      t[j] = value;
      this.counts.evaluations++;
      return Float64Array.from(problem.evaluate(t), (f, i) => f * inverseSigma[i]);
    };
    freeIndices.forEach((j, k) => {
      const requested = this.options.finiteDifferenceStep * (theta[j] === 0 ? 1 : Math.abs(theta[j]));
      const h = theta[j] + requested - theta[j]; // the step actually representable at θ_j
      const plusFits = theta[j] + h <= upper[j];
      const minusFits = theta[j] - h >= lower[j];
      let derivative: (i: number) => number;
      if (this.options.finiteDifference === "central" && plusFits && minusFits) {
        const plus = shifted(j, theta[j] + h);
        const minus = shifted(j, theta[j] - h);
        derivative = (i) => (plus[i] - minus[i]) / (2 * h);
      } else {
        const signedStep = plusFits ? h : -h;
        const moved = shifted(j, theta[j] + signedStep);
        derivative = (i) => (moved[i] - centre.whitenedValues[i]) / signedStep;
      }
      for (let i = 0; i < n; i++) out[i * p + k] = derivative(i);
    });
    return out;
  }
}
