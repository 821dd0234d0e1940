import { z } from "zod";

/**
 * Options of a least-squares fit, as accepted from callers (routes, the worker, the command line).
 * Every field is optional; {@link normaliseLeastSquaresOptions} fills the defaults documented here.
 */
export const leastSquaresOptionsSchema = z
  .object({
    /** Levenberg–Marquardt steps allowed per start (accepted and rejected steps both count). Default 200. */
    maxIterations: z.int().min(1).max(100_000).default(200),
    /** Wall-clock budget for the whole fit, all starts together, in ms. Default 60 000. */
    timeLimitMs: z.number().positive().max(86_400_000).default(60_000),
    /**
     * Stop when an accepted step lowers χ² by a relative amount below this, and the linearised model
     * predicted no more (MINPACK's ftol rule). Default 1e-12 (gives ≥ 6 significant digits on the NIST StRD
     * problems; 1e-10 gives only ≈ 5 on MGH09 and Thurber).
     */
    chiSquaredRelativeTolerance: z.number().min(0).max(1).default(1e-12),
    /**
     * Stop when a step, in scaled parameters, is smaller than this relative to the scaled parameter
     * vector, ‖DΔθ‖ ≤ tol·(‖Dθ‖ + tol) (MINPACK's xtol rule). Default 1e-10.
     */
    stepTolerance: z.number().min(0).max(1).default(1e-10),
    /** Number of starts; the first is the given start, the others are drawn (see `startSpread`). Default 1. */
    starts: z.int().min(1).max(1000).default(1),
    /**
     * Half-width of the drawn starts around the given start, as a fraction of |θ₀| (in the parameter's
     * own unit when θ₀ = 0), for parameters without both bounds. Default 0.5.
     */
    startSpread: z.number().positive().max(100).default(0.5),
    /** Seed of the generator that draws extra starts. Default 1. */
    seed: z.int().default(1),
    /** Derivatives from the problem ("analytic") or by finite differences. Default "analytic". */
    jacobian: z.enum(["analytic", "finite-difference"]).default("analytic"),
    /** Difference scheme when `jacobian` is "finite-difference". Default "central". */
    finiteDifference: z.enum(["forward", "central"]).default("central"),
    /**
     * Relative finite-difference step h_j = step·|θ_j| (step itself when θ_j = 0). Default √ε ≈ 1.5e-8
     * for forward and ∛ε ≈ 6.1e-6 for central differences (Nocedal & Wright, Numerical Optimization,
     * 2nd ed., §8.1).
     */
    finiteDifferenceStep: z.number().positive().max(0.1).optional(),
    /**
     * Relative eigenvalue of the normalised JᵀWJ below which a direction counts as undetermined by the
     * data; the parameters along it get no standard error. Default 1e-12.
     */
    singularTolerance: z.number().positive().max(1e-2).default(1e-12),
    /** |correlation| above which a pair of parameters is reported as strongly correlated. Default 0.99. */
    correlationWarning: z.number().positive().max(1).default(0.99),
    /** The async fit yields to the event loop at least this often, in ms. Default 10. */
    yieldIntervalMs: z.number().min(0).max(10_000).default(10),
  })
  .strict();

/** Options as callers pass them: every field optional. */
export type LeastSquaresOptionsInput = z.input<typeof leastSquaresOptionsSchema>;

/** Options with every default filled in. */
export type LeastSquaresOptions = Omit<z.output<typeof leastSquaresOptionsSchema>, "finiteDifferenceStep"> & {
  finiteDifferenceStep: number;
};

const EPSILON = Number.EPSILON;

/**
 * Validates fit options and fills every default, once, so the engine never sees an absent option.
 * @param input - options from a caller; unknown keys are rejected
 * @throws ZodError listing every invalid field
 */
export function normaliseLeastSquaresOptions(input: LeastSquaresOptionsInput = {}): LeastSquaresOptions {
  const parsed = leastSquaresOptionsSchema.parse(input);
  const defaultStep = parsed.finiteDifference === "forward" ? Math.sqrt(EPSILON) : Math.cbrt(EPSILON);
  return { ...parsed, finiteDifferenceStep: parsed.finiteDifferenceStep ?? defaultStep };
}
