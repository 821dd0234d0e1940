import { type ParameterSpec, leastSquaresOptionsSchema, solutionStatistics } from "../least-squares";
import type { KeptPoint } from "./points";
import type { BandResidualModel } from "./problem";
import type { BandFitIssue, BandFitWarning } from "./schema";

/** Relative eigenvalue of the normalised JᵀWJ below which a direction counts as undetermined: the engine's default. */
const SINGULAR_TOLERANCE = leastSquaresOptionsSchema.parse({}).singularTolerance;
/** The second look moves each free parameter by this fraction of its size (of 1 in its unit when it is 0). */
const PERTURBATION = 0.1;

export interface SingleKPointInput {
  residualModel: BandResidualModel;
  parameters: readonly ParameterSpec[];
  kept: readonly KeptPoint[];
  /** the one k-point, Cartesian 1/Å */
  k: readonly number[];
  datasetName?: string;
}

/**
 * The rule for a fit whose points all lie at one k-point. Such data hold the band energies at that k and
 * nothing about the dispersion: an on-site energy, or one hopping from two bands at Γ, can be fixed by
 * them; hoppings whose phase sum vanishes there, or more parameters than the energies separate, cannot.
 * The whitened Jacobian of the free parameters is examined at the start and at a point moved by 10 % in
 * every free parameter (its null directions as in `solutionStatistics`): the parameters undetermined at
 * both are undetermined by the data, not by an accident of the start values, and the fit is refused
 * naming them. Otherwise it runs with a warning.
 * @returns an issue that refuses the fit, or a warning
 */
export function checkSingleKPoint(input: SingleKPointInput): { issue: BandFitIssue } | { warning: BandFitWarning } {
  const { residualModel, parameters, kept } = input;
  const free = parameters.map((_, j) => j).filter((j) => isFree(parameters[j]));
  const start = Float64Array.from(parameters, (p) => p.initial);
  const moved = perturbed(parameters, free);
  const sizes = Float64Array.from(free, (j) => Math.max(Math.abs(start[j]), Math.abs(moved[j])));
  const names = free.map((j) => parameters[j].name);
  const undeterminedAtStart = undetermined(residualModel, parameters, kept, free, start, names, sizes);
  const undeterminedMoved = undetermined(residualModel, parameters, kept, free, moved, names, sizes);
  const both = names.filter((name) => undeterminedAtStart.has(name) && undeterminedMoved.has(name));

  const k = input.k.map((x) => Number((x + 0).toPrecision(6))).join(", ");
  const where =
    `${input.datasetName ? `dataset “${input.datasetName}”: ` : ""}all ${kept.length} points the fit uses lie at one k-point, ` +
    `k = (${k}) 1/Å`;
  if (both.length > 0)
    return {
      issue: {
        path: "points",
        message:
          `${where}: a fit needs a dispersion. The energies at one k-point do not determine ${both.join(", ")} ` +
          "(they fix only some combinations); fix these parameters, or fit data at more k-points",
      },
    };
  return {
    warning: {
      kind: "single-k-point",
      parameters: [],
      message: `${where}: the free parameters are set by the energies there alone; the model's dispersion away from it is not tested`,
    },
  };
}

const isFree = (p: ParameterSpec) => p.free !== false && (p.lower ?? -Infinity) < (p.upper ?? Infinity);

/** θ with every free parameter moved by 10 % of its size, alternately up and down, kept within its bounds. */
function perturbed(parameters: readonly ParameterSpec[], free: readonly number[]): Float64Array {
  const theta = Float64Array.from(parameters, (p) => p.initial);
  free.forEach((j, n) => {
    const { initial, lower = -Infinity, upper = Infinity } = parameters[j];
    const step = PERTURBATION * (initial === 0 ? 1 : Math.abs(initial)) * (n % 2 === 0 ? 1 : -1);
    const inside = (v: number) => v >= lower && v <= upper;
    theta[j] = inside(initial + step) ? initial + step : inside(initial - step) ? initial - step : (lower + upper) / 2;
  });
  return theta;
}

/** Names of the free parameters in a null (or no-effect) direction of the whitened Jacobian at θ. */
function undetermined(
  residualModel: BandResidualModel,
  parameters: readonly ParameterSpec[],
  kept: readonly KeptPoint[],
  free: readonly number[],
  theta: Float64Array,
  names: string[],
  sizes: Float64Array,
): Set<string> {
  const { jacobian } = residualModel.problem([...parameters]).evaluateWithJacobian!(theta);
  const width = parameters.length;
  const whitened = new Float64Array(kept.length * free.length);
  kept.forEach((point, i) => free.forEach((j, c) => (whitened[i * free.length + c] = jacobian[i * width + j] / point.sigma)));
  const { warnings } = solutionStatistics({
    jacobian: whitened,
    observations: kept.length,
    chiSquared: 0,
    names,
    sizes,
    singularTolerance: SINGULAR_TOLERANCE,
    correlationWarning: 1,
  });
  return new Set(warnings.filter((w) => w.kind === "no-effect" || w.kind === "undetermined").flatMap((w) => w.parameters));
}
