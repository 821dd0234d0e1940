import { ResidualEvaluator } from "./evaluator";
import { LeastSquaresError } from "./errors";
import { normaliseLeastSquaresOptions, type LeastSquaresOptions, type LeastSquaresOptionsInput } from "./options";
import { prepareProblem, type LeastSquaresProblem, type PreparedProblem } from "./problem";
import {
  CONVERGED_STOP_REASONS,
  type FitProgress,
  type FitWarning,
  type LeastSquaresResult,
  type StartSummary,
} from "./result";
import { StartRun } from "./start-run";
import { drawStarts } from "./starts";
import { solutionStatistics } from "./statistics";

/** Callbacks and cancellation of a fit. */
export interface FitControl {
  /** Called at every start (iteration 0, the start's χ², when finite) and after each of its iterations. */
  onProgress?: (progress: FitProgress) => void;
  /** Aborting ends the fit after the current iteration; the best point so far is returned, marked cancelled. */
  signal?: AbortSignal;
}

const now = (): number => performance.now();

/**
 * Lets pending events (an abort message, I/O) run. setImmediate where it exists (Node, the worker):
 * setTimeout(0) is clamped to ≥ 1 ms there, which cost a 70 ms fit ~7 ms of idle time; setTimeout(0) in
 * browsers, which have no setImmediate.
 */
function yieldToEventLoop(): Promise<void> {
  return new Promise<void>((resolve) => {
    if (typeof setImmediate === "function") setImmediate(resolve);
    else setTimeout(resolve, 0);
  });
}

/**
 * Fits a least-squares problem synchronously: Levenberg–Marquardt by ml-levenberg-marquardt, one
 * iteration at a time, from one or several starts; returns the best start with its statistics.
 * Cancellation through `control.signal` only takes effect if something aborts it while the fit runs
 * (for example `onProgress`); in a worker use {@link fitLeastSquaresAsync}.
 * @param problem - observations, σ, parameters and the model
 * @param options - fit options; defaults in {@link leastSquaresOptionsSchema}
 * @throws LeastSquaresError when the problem cannot be fitted (N ≤ P, bad shapes, no Jacobian)
 */
export function fitLeastSquares(
  problem: LeastSquaresProblem,
  options: LeastSquaresOptionsInput = {},
  control: FitControl = {},
): LeastSquaresResult {
  const iterations = runFit(problem, options, control);
  for (;;) {
    const next = iterations.next();
    if (next.done) return next.value;
  }
}

/**
 * As {@link fitLeastSquares}, but yields to the event loop between iterations at least every
 * `yieldIntervalMs`, so that a worker stays responsive and an abort message can arrive.
 */
export async function fitLeastSquaresAsync(
  problem: LeastSquaresProblem,
  options: LeastSquaresOptionsInput = {},
  control: FitControl = {},
): Promise<LeastSquaresResult> {
  const iterations = runFit(problem, options, control);
  const interval = normaliseLeastSquaresOptions(options).yieldIntervalMs;
  let lastYield = now();
  for (;;) {
    const next = iterations.next();
    if (next.done) return next.value;
    if (now() - lastYield >= interval) {
      await yieldToEventLoop();
      lastYield = now();
    }
  }
}

// The fit as a generator that pauses after each iteration; the sync and async drivers above only
// differ in what they do at the pauses.
function* runFit(
  problem: LeastSquaresProblem,
  optionsInput: LeastSquaresOptionsInput,
  control: FitControl,
): Generator<void, LeastSquaresResult> {
  const began = now();
  const options = normaliseLeastSquaresOptions(optionsInput);
  const prepared = prepareProblem(problem);
  if (options.jacobian === "analytic" && !problem.jacobian && !problem.evaluateWithJacobian)
    throw new LeastSquaresError(
      "missing-jacobian",
      'The analytic Jacobian was requested but the problem provides neither jacobian() nor evaluateWithJacobian(); use jacobian: "finite-difference"',
    );
  const evaluator = new ResidualEvaluator(prepared, options);
  const { freeIndices } = prepared;
  const lower = Float64Array.from(freeIndices, (j) => prepared.lower[j]);
  const upper = Float64Array.from(freeIndices, (j) => prepared.upper[j]);
  const initial = Float64Array.from(freeIndices, (j) => prepared.initial[j]);
  const starts = drawStarts({ initial, lower, upper, spread: options.startSpread }, options.starts, options.seed);

  const summaries: StartSummary[] = [];
  let best: StartRun | null = null;
  let bestIndex = 0;
  let cancelled = false;
  let outOfTime = false;
  for (let s = 0; s < starts.length && !cancelled && !outOfTime; s++) {
    const run = new StartRun(evaluator, options, starts[s], lower, upper);
    // Iteration 0 is the start itself, so a trace shows the χ² the fit began from.
    if (Number.isFinite(run.chiSquared))
      control.onProgress?.({ start: s, iteration: 0, chiSquared: run.chiSquared, damping: run.damping, elapsedMs: now() - began });
    while (!run.stopReason) {
      if (control.signal?.aborted) {
        run.stop("cancelled");
        cancelled = true;
        break;
      }
      run.step();
      const elapsedMs = now() - began;
      control.onProgress?.({
        start: s,
        iteration: run.iterations,
        chiSquared: run.chiSquared,
        damping: run.damping,
        elapsedMs,
      });
      if (!run.stopReason && elapsedMs >= options.timeLimitMs) {
        run.stop("time-limit");
        outOfTime = true;
      }
      yield;
    }
    summaries.push({
      index: s,
      initial: Array.from(evaluator.fullParameters(starts[s])),
      final: Array.from(evaluator.fullParameters(run.current)),
      chiSquared: Number.isFinite(run.chiSquared) ? run.chiSquared : null,
      iterations: run.iterations,
      stopReason: run.stopReason ?? "cancelled",
    });
    if (Number.isFinite(run.chiSquared) && run.stopReason !== "non-finite-jacobian" && (!best || run.chiSquared < best.chiSquared)) {
      best = run;
      bestIndex = s;
    }
  }
  if (!best)
    throw new LeastSquaresError(
      "invalid-start",
      `No start gave a finite model: ${summaries.map((summary) => summary.stopReason).join(", ")}`,
    );
  return assembleResult({ prepared, options, evaluator, best, bestIndex, summaries, cancelled, began });
}

interface AssemblyInput {
  prepared: PreparedProblem;
  options: LeastSquaresOptions;
  evaluator: ResidualEvaluator;
  best: StartRun;
  bestIndex: number;
  summaries: StartSummary[];
  cancelled: boolean;
  began: number;
}

function assembleResult(input: AssemblyInput): LeastSquaresResult {
  const { prepared, options, evaluator, best, bestIndex, summaries, cancelled, began } = input;
  const { names, freeIndices, lower, upper, inverseSigma, observed } = prepared;
  const n = observed.length;
  const freeNames = freeIndices.map((j) => names[j]);
  const statistics = solutionStatistics({
    jacobian: evaluator.jacobian(best.current),
    observations: n,
    chiSquared: best.chiSquared,
    names: freeNames,
    sizes: Float64Array.from(freeIndices, (j, k) => Math.max(Math.abs(best.current[k]), Math.abs(prepared.initial[j]))),
    singularTolerance: options.singularTolerance,
    correlationWarning: options.correlationWarning,
  });
  const theta = evaluator.fullParameters(best.current);
  const whitened = evaluator.evaluate(best.current).whitenedValues;
  const warnings: FitWarning[] = [...statistics.warnings];

  const parameters = names.map((name, j) => {
    const k = freeIndices.indexOf(j);
    const value = theta[j];
    const atBound = k < 0 ? null : boundAt(value, lower[j], upper[j]);
    if (atBound)
      warnings.push({
        kind: "at-bound",
        parameters: [name],
        message: `${name} = ${value} sits on its ${atBound} bound: the fit wanted to go further, and its standard error assumes an interior minimum`,
      });
    return { name, value, standardError: k < 0 ? null : statistics.standardErrors[k], free: k >= 0, atBound };
  });

  const stopReason = cancelled ? "cancelled" : (summaries[bestIndex].stopReason);
  const converged = CONVERGED_STOP_REASONS.includes(summaries[bestIndex].stopReason) && !cancelled;
  if (!converged)
    warnings.push({
      kind: "not-converged",
      parameters: [],
      message: `The fit stopped before converging (${stopReason}): the values are the best found so far`,
    });
  if (summaries.length < options.starts)
    warnings.push({
      kind: "starts-incomplete",
      parameters: [],
      message: `Only ${summaries.length} of ${options.starts} starts ran before the fit stopped`,
    });

  return {
    parameters,
    chiSquared: best.chiSquared,
    reducedChiSquared: best.chiSquared / (n - freeIndices.length),
    degreesOfFreedom: n - freeIndices.length,
    observations: n,
    freeParameters: freeNames,
    correlation: statistics.correlation,
    modelValues: Array.from(whitened, (w, i) => w / inverseSigma[i]),
    residuals: Array.from(whitened, (w, i) => w - observed[i] * inverseSigma[i]),
    iterations: best.iterations,
    evaluations: evaluator.counts.evaluations,
    jacobianEvaluations: evaluator.counts.jacobians,
    stopReason,
    converged,
    cancelled,
    elapsedMs: now() - began,
    warnings,
    starts: summaries,
    bestStart: bestIndex,
  };
}

// Exact after the library's clamp; the relative slack covers bounds that are not powers-of-two multiples.
function boundAt(value: number, lower: number, upper: number): "lower" | "upper" | null {
  const near = (bound: number) => Math.abs(value - bound) <= 1e-12 * Math.max(Math.abs(bound), Number.MIN_VALUE);
  if (Number.isFinite(lower) && near(lower)) return "lower";
  if (Number.isFinite(upper) && near(upper)) return "upper";
  return null;
}
