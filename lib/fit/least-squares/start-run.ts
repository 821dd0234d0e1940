import { initialDamping, updateDamping, type DampingState } from "./damping";
import type { ResidualEvaluator } from "./evaluator";
import { libraryStep } from "./library-step";
import type { LeastSquaresOptions } from "./options";
import type { StopReason } from "./result";

/** One Levenberg–Marquardt run from one start, advanced one iteration at a time. */
export class StartRun {
  /** Best (= current) free parameters. */
  current: Float64Array;
  chiSquared: number;
  iterations = 0;
  stopReason: StopReason | null = null;
  private dampingState: DampingState = { damping: 1, growth: 2 };
  /** Column norms of the scaled Jacobian so far (MINPACK's diag, never decreasing). */
  private readonly columnScale: Float64Array;

  constructor(
    private readonly evaluator: ResidualEvaluator,
    private readonly options: LeastSquaresOptions,
    start: Float64Array,
    private readonly lower: Float64Array,
    private readonly upper: Float64Array,
  ) {
    this.current = start;
    this.columnScale = new Float64Array(start.length);
    this.chiSquared = evaluator.evaluate(start).chiSquared;
    if (!Number.isFinite(this.chiSquared)) {
      this.stopReason = "non-finite-start";
      return;
    }
    if (!this.updateScale()) return;
    const maxDiagonal = Math.max(...this.scaleFactors().map((s, k) => (s * this.columnScale[k]) ** 2));
    this.dampingState = initialDamping(maxDiagonal);
    if (this.chiSquared === 0) this.stopReason = "chi-squared-tolerance";
  }

  /** λ currently in use. */
  get damping(): number {
    return this.dampingState.damping;
  }

  /** Advances one iteration; sets `stopReason` when a stopping rule fires. */
  step(): void {
    if (this.stopReason) return;
    const before = this.chiSquared;
    const jacobian = this.evaluator.jacobian(this.current);
    const residuals = this.residualsAt(this.current);
    const scale = this.scaleFactors();
    const { accepted, trial, chiSquared } = libraryStep({
      evaluator: this.evaluator,
      current: this.current,
      scale,
      damping: this.dampingState.damping,
      lower: this.lower,
      upper: this.upper,
    });
    this.iterations++;

    const stepNorm = this.scaledNorm(trial.map((value, k) => value - this.current[k]));
    const predicted = predictedReduction(jacobian, residuals, trial, this.current);
    const gainRatio = accepted && predicted > 0 ? (before - chiSquared) / predicted : accepted ? 1 : -1;
    this.dampingState = updateDamping(this.dampingState, gainRatio);
    if (accepted) {
      this.current = trial;
      this.chiSquared = chiSquared;
    }
    this.stopReason = this.stoppingRule(accepted, before, predicted, stepNorm);
    if (!this.stopReason && accepted) this.updateScale();
  }

  /** Forces a stop (time limit, cancellation) keeping the current best point. */
  stop(reason: StopReason): void {
    if (!this.stopReason) this.stopReason = reason;
  }

  private stoppingRule(accepted: boolean, before: number, predicted: number, stepNorm: number): StopReason | null {
    const { chiSquaredRelativeTolerance: ftol, stepTolerance: xtol, maxIterations } = this.options;
    if (accepted && (this.chiSquared === 0 || ((before - this.chiSquared) <= ftol * before && predicted <= ftol * before)))
      return "chi-squared-tolerance";
    if (stepNorm <= xtol * (this.scaledNorm(this.current) + xtol)) return "step-tolerance";
    if (!Number.isFinite(this.dampingState.damping) || this.dampingState.damping > 1e30) return "damping-limit";
    if (this.iterations >= maxIterations) return "max-iterations";
    return null;
  }

  // D_k = max(D_k, ‖∂r/∂θ_k‖) as in MINPACK's lmder; false (and a stop) if the Jacobian is not finite.
  private updateScale(): boolean {
    const jacobian = this.evaluator.jacobian(this.current);
    const p = this.current.length;
    const norms = new Float64Array(p);
    for (let i = 0; i < jacobian.length; i += p) for (let k = 0; k < p; k++) norms[k] += jacobian[i + k] ** 2;
    if (!norms.every(Number.isFinite)) {
      this.stopReason = "non-finite-jacobian";
      return false;
    }
    norms.forEach((squared, k) => {
      this.columnScale[k] = Math.max(this.columnScale[k], Math.sqrt(squared));
    });
    return true;
  }

  // θ_k = u_k·scale_k with scale_k ≈ 1/D_k rounded to a power of two, so the conversion is exact.
  private scaleFactors(): Float64Array {
    return this.columnScale.map((d) => (d > 0 && Number.isFinite(Math.log2(d)) ? 2 ** -Math.round(Math.log2(d)) : 1));
  }

  private scaledNorm(vector: ArrayLike<number>): number {
    let sum = 0;
    for (let k = 0; k < vector.length; k++) {
      const d = this.columnScale[k] > 0 ? this.columnScale[k] : 1;
      sum += (vector[k] * d) ** 2;
    }
    return Math.sqrt(sum);
  }

  private residualsAt(free: Float64Array): Float64Array {
    const { whitenedValues } = this.evaluator.evaluate(free);
    const observed = this.evaluator.observed;
    return whitenedValues.map((value, i) => value - observed[i]);
  }
}

/** χ² − ‖r + JΔ‖²: the reduction the linearised model promises for the step Δ = trial − current. */
function predictedReduction(
  jacobian: Float64Array,
  residuals: Float64Array,
  trial: Float64Array,
  current: Float64Array,
): number {
  const p = current.length;
  const delta = trial.map((value, k) => value - current[k]);
  let before = 0;
  let after = 0;
  for (let i = 0; i < residuals.length; i++) {
    let linear = residuals[i];
    for (let k = 0; k < p; k++) linear += jacobian[i * p + k] * delta[k];
    before += residuals[i] * residuals[i];
    after += linear * linear;
  }
  return before - after;
}
