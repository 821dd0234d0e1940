import type { LeastSquaresResult } from "../least-squares";
import { dataEnergyScale, implausibleParameterWarnings } from "./plausibility";
import type { PreparedBandFit } from "./validate";
import type { BandFitResult, BandFitWarning } from "./schema";

/** One iteration as recorded for the convergence trace. */
export interface TraceEntry {
  start: number;
  iteration: number;
  chiSquared: number;
  damping: number;
}

// Warnings that name a parameter whose value the data do not set (a bound does, or nothing does): not a result.
const UNDETERMINING: readonly BandFitWarning["kind"][] = ["no-effect", "undetermined", "at-bound"];

/**
 * Turns the engine's result into the band fit's: parameters with units and starts (global ones only
 * when free or not neutral), residuals and per-band statistics in eV, the correlation matrix, the trace
 * of the best start, and the model document with the fitted values.
 */
export function assembleBandFitResult(
  prepared: PreparedBandFit,
  fit: LeastSquaresResult,
  trace: readonly TraceEntry[],
  fitMs: number,
): BandFitResult {
  const { parameters: specs, units, selection, residualModel, compiled } = prepared;
  const modelCount = compiled.parameters.length;
  const plausibility = fit.parameters.map((parameter, j) => ({
    parameter,
    unit: units[j],
    isOverlap: j < modelCount && compiled.parameterMatrix[j] === "overlap",
  }));
  const scale = dataEnergyScale(selection.kept.map((point) => point.energy));
  const solution = Float64Array.from(fit.parameters, (p) => p.value);
  const crossings = { tolerance: prepared.options.crossingTolerance, points: residualModel.crossingPoints(solution) };
  const warnings: BandFitWarning[] = [
    ...prepared.warnings,
    ...fit.warnings,
    ...implausibleParameterWarnings(plausibility, scale),
    ...crossingWarnings(crossings, selection.kept.length, prepared.options.jacobian),
  ];
  const undetermined = new Set(warnings.filter((w) => UNDETERMINING.includes(w.kind)).flatMap((w) => w.parameters));

  const parameters = fit.parameters
    .map((p, j) => ({
      name: p.name,
      value: p.value,
      standardError: p.standardError,
      start: specs[j].initial,
      ...(specs[j].lower !== undefined ? { min: specs[j].lower } : {}),
      ...(specs[j].upper !== undefined ? { max: specs[j].upper } : {}),
      free: p.free,
      determined: p.free && p.standardError !== null && !undetermined.has(p.name),
      unit: units[j],
      atBound: p.atBound,
    }))
    .filter((p, j) => j < modelCount || p.free || p.value !== (j === modelCount ? 0 : 1));

  // An offset mapping fixes every point's model band; only the nearest mapping needs the bands at the solution.
  const modelBands = selection.kept.every((point) => point.modelBand >= 0)
    ? Int32Array.from(selection.kept, (point) => point.modelBand)
    : residualModel.predict(solution).modelBands;
  const residuals = selection.kept.map((point, i) => {
    const modelEnergy = fit.modelValues[i];
    return {
      pointIndex: point.pointIndex,
      dataBand: point.dataBand,
      modelBand: modelBands[i] + 1,
      energy: point.energy,
      modelEnergy,
      residual: modelEnergy - point.energy,
      weightedResidual: fit.residuals[i],
    };
  });

  const byBand = new Map<number, number[]>();
  residuals.forEach((r) => byBand.set(r.dataBand, [...(byBand.get(r.dataBand) ?? []), r.residual]));
  const bands = [...byBand.entries()]
    .sort(([a], [b]) => a - b)
    .map(([dataBand, values]) => {
      const first = selection.kept.find((p) => p.dataBand === dataBand)!;
      return { dataBand, modelBand: first.modelBand >= 0 ? first.modelBand + 1 : null, points: values.length, ...summary(values) };
    });
  const overall = summary(residuals.map((r) => r.residual));

  const bestTrace = trace
    .filter((t) => t.start === fit.bestStart && Number.isFinite(t.chiSquared) && Number.isFinite(t.damping))
    .map(({ iteration, chiSquared, damping }) => ({ iteration, chiSquared, damping }));
  const fitted = new Map(fit.parameters.map((p) => [p.name, p.value]));

  return {
    parameters,
    chiSquared: fit.chiSquared,
    reducedChiSquared: fit.reducedChiSquared,
    rms: overall.rms,
    maxAbsResidual: overall.maxAbs,
    weightedRms: Math.sqrt(fit.chiSquared / fit.observations),
    bands,
    residuals,
    pointsUsed: selection.kept.length,
    crossings,
    pointsDropped: { ...selection.dropped },
    correlation: { names: fit.freeParameters, matrix: fit.correlation },
    trace: bestTrace,
    iterations: fit.iterations,
    stopReason: fit.stopReason,
    converged: fit.converged,
    cancelled: fit.cancelled,
    warnings,
    starts: fit.starts.map((s) => ({ ...s })),
    fitMs,
    fittedModel: {
      ...prepared.document,
      parameters: prepared.document.parameters.map((p) => ({ ...p, value: fitted.get(p.name) ?? p.value })),
    },
  };
}

/** The warning that says how many points sit at accidental band crossings and how the fit treats them. */
function crossingWarnings(crossings: { tolerance: number; points: number }, used: number, jacobian: "analytic" | "finite-difference"): BandFitWarning[] {
  if (crossings.points === 0) return [];
  const treatment =
    jacobian === "analytic"
      ? "the Jacobian uses the two-sided degenerate-subspace derivative (the mean of the derivatives for an increase and a decrease of each parameter)"
      : "the finite-difference Jacobian straddles the crossing there";
  return [
    {
      kind: "band-crossings",
      parameters: [],
      message:
        `${crossings.points} of ${used} points lie where their model band meets another within ${Number((crossings.tolerance * 1000).toPrecision(12))} meV ` +
        `(accidental crossings): a band's own derivative is not defined there, so ${treatment}`,
    },
  ];
}

/** RMS, max |x| and mean of residuals, eV. */
function summary(values: number[]): { rms: number; maxAbs: number; mean: number } {
  if (values.length === 0) return { rms: 0, maxAbs: 0, mean: 0 };
  let squares = 0;
  let maxAbs = 0;
  let sum = 0;
  for (const v of values) {
    squares += v * v;
    maxAbs = Math.max(maxAbs, Math.abs(v));
    sum += v;
  }
  return { rms: Math.sqrt(squares / values.length), maxAbs, mean: sum / values.length };
}
