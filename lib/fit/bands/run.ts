import { fitLeastSquaresAsync } from "../least-squares";
import { type TraceEntry, assembleBandFitResult } from "./result";
import type { BandFitControl, BandFitInput, BandFitIssue, BandFitResult } from "./schema";
import { type PreparedBandFit, validateBandFit } from "./validate";

/** A band fit input that fails the checks of {@link validateBandFit}; `issues` lists every problem. */
export class BandFitError extends Error {
  readonly issues: BandFitIssue[];

  constructor(issues: BandFitIssue[]) {
    super(issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)).join("; "));
    this.name = "BandFitError";
    this.issues = issues;
  }
}

/**
 * Fits a tight-binding model to band data: checks the input ({@link validateBandFit}), then runs
 * Levenberg–Marquardt (lib/fit/least-squares) on r_p = (f_p(θ) − E_p)/σ_p, yielding to the event loop
 * so that progress and cancellation flow. The same input (and seed) gives the same result, `fitMs` apart.
 * @param input - points (k in 1/Å, energies and σ in eV), model, mapping, window, options; or an
 *   already validated fit
 * @param control - per-iteration progress and an AbortSignal; a cancelled fit returns its best point
 * @throws BandFitError when the input fails the checks
 */
export async function runBandFit(input: BandFitInput | PreparedBandFit, control: BandFitControl = {}): Promise<BandFitResult> {
  const began = performance.now();
  const prepared = isPrepared(input) ? input : validated(input);
  const { options } = prepared;
  const trace: TraceEntry[] = [];
  const fit = await fitLeastSquaresAsync(
    prepared.residualModel.problem(prepared.parameters),
    {
      maxIterations: options.maxIterations,
      timeLimitMs: options.timeLimitMs,
      starts: options.starts,
      seed: options.seed,
      jacobian: options.jacobian,
    },
    {
      signal: control.signal,
      onProgress: (progress) => {
        trace.push({ start: progress.start, iteration: progress.iteration, chiSquared: progress.chiSquared, damping: progress.damping });
        control.onProgress?.(progress);
      },
    },
  );
  return assembleBandFitResult(prepared, fit, trace, performance.now() - began);
}

function validated(input: BandFitInput): PreparedBandFit {
  const validation = validateBandFit(input);
  if (!validation.ok) throw new BandFitError(validation.issues);
  return validation.prepared;
}

function isPrepared(input: BandFitInput | PreparedBandFit): input is PreparedBandFit {
  return "residualModel" in input;
}
