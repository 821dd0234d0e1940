import { describe, expect, it } from "vitest";
import {
  fitLeastSquares,
  fitLeastSquaresAsync,
  LeastSquaresError,
  type LeastSquaresProblem,
  type LeastSquaresResult,
} from "@/lib/fit/least-squares";
import { ResidualEvaluator } from "@/lib/fit/least-squares/evaluator";
import { normaliseLeastSquaresOptions } from "@/lib/fit/least-squares/options";
import { prepareProblem } from "@/lib/fit/least-squares/problem";
import { createRandom } from "@/lib/linalg";
import { mgh09, misra1a, nistProblem, thurber } from "./nist-strd";

/** Every number anywhere in the result is finite (no NaN, no ±Infinity). */
function expectAllFinite(value: unknown): void {
  if (typeof value === "number") expect(Number.isFinite(value)).toBe(true);
  else if (Array.isArray(value)) value.forEach(expectAllFinite);
  else if (value && typeof value === "object") Object.values(value).forEach(expectAllFinite);
}

/** A straight line y = a + b·x with a third parameter c entering as `extra(θ, x)`. */
function lineProblem(extra: (theta: Float64Array, x: number) => number, extraGradient: (x: number) => number[]) {
  const random = createRandom(11);
  const xs = Array.from({ length: 20 }, (_, i) => i / 4);
  const problem: LeastSquaresProblem = {
    parameters: [
      { name: "a", initial: 0.5 },
      { name: "b", initial: 1.5 },
      { name: "c", initial: 0.3 },
    ],
    // Truth a = 1, b = 2, with seeded noise σ = 0.01.
    observed: xs.map((x) => 1 + 2 * x + 0.01 * random.gaussian()),
    sigma: xs.map(() => 0.01),
    evaluate: (theta) => xs.map((x) => theta[0] + theta[1] * x + extra(theta, x)),
    jacobian: () => xs.flatMap((x) => [1, x, ...extraGradient(x)]),
  };
  return problem;
}

describe("analytic and finite-difference Jacobians", () => {
  // Finite-difference errors: O(h) forward, O(h²) central (Nocedal & Wright, Numerical Optimization, §8.1).
  it.each([
    ["central", 1e-7],
    ["forward", 1e-5],
  ] as const)("agree on Thurber at NIST start 1 (%s differences)", (finiteDifference, tolerance) => {
    const prepared = prepareProblem(nistProblem(thurber, 0));
    const analytic = new ResidualEvaluator(prepared, normaliseLeastSquaresOptions({ jacobian: "analytic" }));
    const numeric = new ResidualEvaluator(
      prepared,
      normaliseLeastSquaresOptions({ jacobian: "finite-difference", finiteDifference }),
    );
    const start = Float64Array.from(thurber.starts[0]);
    const exact = analytic.jacobian(start);
    const approx = numeric.jacobian(start);
    const p = 7;
    for (let k = 0; k < p; k++) {
      let columnNorm = 0;
      for (let i = 0; i < exact.length / p; i++) columnNorm = Math.max(columnNorm, Math.abs(exact[i * p + k]));
      for (let i = 0; i < exact.length / p; i++)
        expect(Math.abs(approx[i * p + k] - exact[i * p + k])).toBeLessThanOrEqual(tolerance * columnNorm);
    }
  });

  it("give the same Misra1a fit to 8 digits", () => {
    const analytic = fitLeastSquares(nistProblem(misra1a, 1));
    const numeric = fitLeastSquares(nistProblem(misra1a, 1, false), { jacobian: "finite-difference" });
    analytic.parameters.forEach((parameter, j) => {
      expect(numeric.parameters[j].value).toBeCloseTo(parameter.value, 6 - Math.round(Math.log10(Math.abs(parameter.value))));
      expect(Math.abs(numeric.parameters[j].standardError! / parameter.standardError! - 1)).toBeLessThan(1e-8);
    });
  });
});

describe("caching", () => {
  it("never evaluates the same parameters twice and gets the Jacobian from the same call", () => {
    const base = nistProblem(mgh09, 1);
    const seen = new Set<string>();
    let calls = 0;
    const problem: LeastSquaresProblem = {
      ...base,
      jacobian: undefined,
      evaluateWithJacobian: (theta) => {
        const key = theta.join(",");
        expect(seen.has(key)).toBe(false);
        seen.add(key);
        calls++;
        return { values: base.evaluate(theta), jacobian: base.jacobian!(theta) };
      },
    };
    const result = fitLeastSquares(problem);
    expect(result.converged).toBe(true);
    // One evaluation at the start, then exactly one per iteration (the trial point).
    expect(calls).toBe(result.iterations + 1);
    expect(result.evaluations).toBe(calls);
  });
});

describe("σ weighting", () => {
  // GSL manual, "Covariance matrix of best fit parameters": s²(JᵀWJ)⁻¹ is unchanged when every σ is
  // scaled by the same factor, while χ² scales by 1/factor².
  it("a uniform σ leaves parameters and standard errors unchanged and divides χ² by σ²", () => {
    const plain = fitLeastSquares(nistProblem(misra1a, 1));
    const weighted = fitLeastSquares({ ...nistProblem(misra1a, 1), sigma: misra1a.data.map(() => 0.1) });
    expect(weighted.chiSquared).toBeCloseTo(plain.chiSquared / 0.01, 8);
    weighted.parameters.forEach((parameter, j) => {
      expect(Math.abs(parameter.value / plain.parameters[j].value - 1)).toBeLessThan(1e-9);
      expect(Math.abs(parameter.standardError! / plain.parameters[j].standardError! - 1)).toBeLessThan(1e-7);
    });
    expect(weighted.residuals[0]).toBeCloseTo(plain.residuals[0] / 0.1, 10);
    expect(weighted.modelValues[0]).toBeCloseTo(plain.modelValues[0], 10);
  });
});

describe("undetermined parameters", () => {
  it("flags a parameter whose effect is negligible beside the others' (tiny but non-zero Jacobian column)", () => {
    // c enters as 1e-9·c·x² and is bounded to [0.1, 0.5] (so it cannot wander off to fit the noise): a
    // 100 % change of c moves the model ~1e-9 times as much as one of b, a squared ratio ~1e-18, below the
    // default singularTolerance 1e-12 (constructed case).
    const base = lineProblem((theta, x) => 1e-9 * theta[2] * x * x, (x) => [1e-9 * x * x]);
    const result = fitLeastSquares({
      ...base,
      parameters: base.parameters.map((p) => (p.name === "c" ? { ...p, lower: 0.1, upper: 0.5 } : p)),
    });
    const warning = result.warnings.find((w) => w.kind === "no-effect");
    expect(warning?.parameters).toEqual(["c"]);
    expect(warning?.message).toContain("almost no effect");
    expect(result.parameters[2].standardError).toBeNull();
    // a and b keep their errors: truth a = 1, b = 2 within 4 standard errors (normal theory).
    expect(Math.abs(result.parameters[0].value - 1)).toBeLessThan(4 * result.parameters[0].standardError!);
    expect(Math.abs(result.parameters[1].value - 2)).toBeLessThan(4 * result.parameters[1].standardError!);
    expectAllFinite(result);
  });

  it("flags a parameter with no effect, gives it no standard error and keeps every number finite", () => {
    const result = fitLeastSquares(lineProblem(() => 0, () => [0]));
    expect(result.warnings.map((w) => [w.kind, w.parameters])).toContainEqual(["no-effect", ["c"]]);
    const [a, b, c] = result.parameters;
    expect(c.standardError).toBeNull();
    expect(c.value).toBe(0.3);
    // Truth a = 1, b = 2 with σ = 0.01 noise: within 4 standard errors (normal theory).
    expect(Math.abs(a.value - 1)).toBeLessThan(4 * a.standardError!);
    expect(Math.abs(b.value - 2)).toBeLessThan(4 * b.standardError!);
    expect(result.correlation[2]).toEqual([null, null, null]);
    expectAllFinite(result);
  });

  it("flags two perfectly correlated parameters by name and leaves the determined one its error", () => {
    // y = a + (b + c)·x: only b + c is determined.
    const result = fitLeastSquares(lineProblem((theta, x) => theta[2] * x, (x) => [x]));
    const undetermined = result.warnings.filter((w) => w.kind === "undetermined");
    expect(undetermined).toHaveLength(1);
    expect(undetermined[0].parameters).toEqual(["b", "c"]);
    expect(undetermined[0].message).toMatch(/determine only a combination of b, c/);
    const [a, b, c] = result.parameters;
    expect(b.standardError).toBeNull();
    expect(c.standardError).toBeNull();
    expect(a.standardError).not.toBeNull();
    expect(b.value + c.value).toBeCloseTo(2, 1);
    expectAllFinite(result);
  });
});

describe("bounds and fixed parameters", () => {
  it("keeps every evaluated point within the bounds and reports a parameter on its bound", () => {
    const base = nistProblem(misra1a, 0);
    const problem: LeastSquaresProblem = {
      ...base,
      parameters: [
        { name: "b1", initial: 200, lower: 100, upper: 230 },
        { name: "b2", initial: 1e-4, lower: 0 },
      ],
      evaluate: (theta) => {
        expect(theta[0]).toBeGreaterThanOrEqual(100);
        expect(theta[0]).toBeLessThanOrEqual(230);
        expect(theta[1]).toBeGreaterThanOrEqual(0);
        return base.evaluate(theta);
      },
    };
    // Misra1a's optimum b1 = 238.94 (NIST StRD) lies above the upper bound 230, so b1 must end on it.
    const result = fitLeastSquares(problem);
    expect(result.parameters[0].value).toBe(230);
    expect(result.parameters[0].atBound).toBe("upper");
    expect(result.warnings.map((w) => [w.kind, w.parameters])).toContainEqual(["at-bound", ["b1"]]);
    expectAllFinite(result);
  });

  it("leaves a fixed parameter out: Misra1a with b2 fixed gives the linear least-squares b1", () => {
    const b2 = misra1a.certifiedValues[1];
    const base = nistProblem(misra1a, 0);
    const result = fitLeastSquares({
      ...base,
      parameters: [
        { name: "b1", initial: 500 },
        { name: "b2", initial: b2, free: false },
      ],
    });
    // Normal equation of a one-parameter linear model y = b1·g(x): b1 = Σ g y / Σ g² (textbook linear
    // least squares); with b2 at its certified value it equals the certified b1 (NIST StRD Misra1a).
    const g = misra1a.data.map(([, x]) => 1 - Math.exp(-b2 * x));
    const b1 = misra1a.data.reduce((sum, [y], i) => sum + g[i] * y, 0) / g.reduce((sum, gi) => sum + gi * gi, 0);
    expect(Math.abs(result.parameters[0].value / b1 - 1)).toBeLessThan(1e-9);
    expect(result.parameters[0].value).toBeCloseTo(misra1a.certifiedValues[0], 5);
    expect(result.parameters[1]).toEqual({ name: "b2", value: b2, standardError: null, free: false, atBound: null });
    expect(result.freeParameters).toEqual(["b1"]);
    expect(result.degreesOfFreedom).toBe(13);
  });
});

describe("several starts", () => {
  const bounded = (): LeastSquaresProblem => ({
    ...nistProblem(mgh09, 1),
    parameters: mgh09.starts[1].map((initial, j) => ({ name: `b${j + 1}`, initial, lower: 0, upper: 1 })),
  });
  const withoutTimes = (result: LeastSquaresResult) => ({ ...result, elapsedMs: 0 });

  it("gives the same result for the same seed and different starts for another seed", () => {
    const first = fitLeastSquares(bounded(), { starts: 4, seed: 7 });
    const again = fitLeastSquares(bounded(), { starts: 4, seed: 7 });
    const other = fitLeastSquares(bounded(), { starts: 4, seed: 8 });
    expect(withoutTimes(again)).toEqual(withoutTimes(first));
    expect(other.starts[1].initial).not.toEqual(first.starts[1].initial);
  });

  it("draws starts within the bounds, reports them all and keeps the lowest χ²", () => {
    const result = fitLeastSquares(bounded(), { starts: 5, seed: 3 });
    expect(result.starts).toHaveLength(5);
    expect(result.starts[0].initial).toEqual(mgh09.starts[1]);
    for (const start of result.starts) for (const value of start.initial) expect(value >= 0 && value <= 1).toBe(true);
    const lowest = Math.min(...result.starts.map((s) => s.chiSquared ?? Infinity));
    expect(result.chiSquared).toBe(lowest);
    expect(result.starts[result.bestStart].chiSquared).toBe(lowest);
    // NIST StRD MGH09 certified RSS.
    expect(result.chiSquared).toBeCloseTo(mgh09.certifiedResidualSumOfSquares, 12);
  });

  it("draws unbounded starts within ±spread of the start", () => {
    const result = fitLeastSquares(nistProblem(misra1a, 1), { starts: 6, seed: 5, startSpread: 0.2 });
    for (const start of result.starts.slice(1))
      start.initial.forEach((value, j) => expect(Math.abs(value / misra1a.starts[1][j] - 1)).toBeLessThanOrEqual(0.2));
  });

  it("reports a start where the model is not finite and fits from the others", () => {
    const base = nistProblem(misra1a, 1);
    const result = fitLeastSquares(
      { ...base, evaluate: (theta) => (theta[0] > 300 ? Array.from(base.evaluate(theta), () => NaN) : base.evaluate(theta)) },
      { starts: 4, seed: 2, startSpread: 0.5 },
    );
    const reasons = result.starts.map((s) => s.stopReason);
    expect(reasons).toContain("non-finite-start");
    expect(result.starts.find((s) => s.stopReason === "non-finite-start")!.chiSquared).toBeNull();
    expect(result.converged).toBe(true);
  });
});

describe("progress, limits and cancellation", () => {
  it("reports the start (iteration 0) and every iteration with χ² not increasing", () => {
    const progress: { iteration: number; chiSquared: number; damping: number; elapsedMs: number }[] = [];
    const result = fitLeastSquares(nistProblem(thurber, 0), {}, { onProgress: (p) => progress.push(p) });
    expect(progress.map((p) => p.iteration)).toEqual(Array.from({ length: result.iterations + 1 }, (_, i) => i));
    for (let i = 1; i < progress.length; i++) {
      expect(progress[i].chiSquared).toBeLessThanOrEqual(progress[i - 1].chiSquared);
      expect(progress[i].elapsedMs).toBeGreaterThanOrEqual(progress[i - 1].elapsedMs);
    }
    expect(progress.every((p) => p.damping > 0)).toBe(true);
    expect(progress.at(-1)!.chiSquared).toBe(result.chiSquared);
  });

  it("stops at the iteration limit and says so", () => {
    const result = fitLeastSquares(nistProblem(mgh09, 0), { maxIterations: 3 });
    expect(result.stopReason).toBe("max-iterations");
    expect(result.iterations).toBe(3);
    expect(result.converged).toBe(false);
    expect(result.warnings.map((w) => w.kind)).toContain("not-converged");
    expectAllFinite(result);
  });

  it("stops at the time limit and says so", () => {
    const result = fitLeastSquares(nistProblem(mgh09, 0), { timeLimitMs: 1e-9, starts: 3 });
    expect(result.stopReason).toBe("time-limit");
    expect(result.iterations).toBe(1);
    expect(result.warnings.map((w) => w.kind)).toEqual(expect.arrayContaining(["not-converged", "starts-incomplete"]));
  });

  it("returns the best point so far when cancelled, marked cancelled", () => {
    const controller = new AbortController();
    let chiSquaredAtAbort = NaN;
    const result = fitLeastSquares(
      nistProblem(thurber, 0),
      {},
      {
        signal: controller.signal,
        onProgress: (p) => {
          if (p.iteration === 3) {
            chiSquaredAtAbort = p.chiSquared;
            controller.abort();
          }
        },
      },
    );
    expect(result.cancelled).toBe(true);
    expect(result.stopReason).toBe("cancelled");
    expect(result.iterations).toBe(3);
    expect(result.chiSquared).toBe(chiSquaredAtAbort);
    expect(result.starts[0].stopReason).toBe("cancelled");
    expectAllFinite(result);
  });

  it("the async fit yields to the event loop, so a callback queued before it can cancel it", async () => {
    const controller = new AbortController();
    // Queued first, so it runs at the fit's first yield (after iteration 1), before the fit resumes.
    setImmediate(() => controller.abort());
    const result = await fitLeastSquaresAsync(nistProblem(thurber, 0), { yieldIntervalMs: 0 }, { signal: controller.signal });
    expect(result.cancelled).toBe(true);
    expect(result.iterations).toBe(1);
  });

  it("the async fit lets a due timer run between iterations, so a timer can cancel it", async () => {
    const controller = new AbortController();
    setTimeout(() => controller.abort(), 0);
    const busyUntil = (ms: number) => {
      const end = performance.now() + ms;
      while (performance.now() < end);
    };
    // Each iteration takes ≥ 2 ms, so the timer (due after ≥ 1 ms) is due at the first yield; Node runs
    // due timers at the latest on the loop turn after that yield's setImmediate: at most two iterations.
    const result = await fitLeastSquaresAsync(
      nistProblem(thurber, 0),
      { yieldIntervalMs: 0 },
      { signal: controller.signal, onProgress: () => busyUntil(2) },
    );
    expect(result.cancelled).toBe(true);
    expect(result.iterations).toBeLessThanOrEqual(2);
  });

  it("the async fit gives the same answer as the synchronous one", async () => {
    const asynchronous = await fitLeastSquaresAsync(nistProblem(mgh09, 1));
    const synchronous = fitLeastSquares(nistProblem(mgh09, 1));
    expect({ ...asynchronous, elapsedMs: 0 }).toEqual({ ...synchronous, elapsedMs: 0 });
  });
});

describe("refusals", () => {
  const twoPoints: LeastSquaresProblem = {
    parameters: [
      { name: "a", initial: 1 },
      { name: "b", initial: 1 },
    ],
    observed: [1, 2],
    evaluate: (theta) => [theta[0], theta[0] + theta[1]],
    jacobian: () => [1, 0, 1, 1],
  };

  it("refuses N ≤ P with a clear error", () => {
    expect(() => fitLeastSquares(twoPoints)).toThrow(
      "2 observations cannot determine 2 free parameters: need more observations than free parameters",
    );
    try {
      fitLeastSquares(twoPoints);
    } catch (error) {
      expect(error).toBeInstanceOf(LeastSquaresError);
      expect((error as LeastSquaresError).code).toBe("too-few-observations");
    }
  });

  it("refuses an analytic fit without a Jacobian", () => {
    expect(() => fitLeastSquares(nistProblem(misra1a, 0, false))).toThrow(
      /analytic Jacobian was requested but the problem provides neither/,
    );
  });

  it("refuses bad σ, a start outside its bounds, no free parameters and a model that is never finite", () => {
    const base = nistProblem(misra1a, 0);
    expect(() => fitLeastSquares({ ...base, sigma: misra1a.data.map((_, i) => (i === 3 ? 0 : 1)) })).toThrow(
      "sigma[3] = 0: every σ must be finite and > 0",
    );
    expect(() => fitLeastSquares({ ...base, sigma: [1, 2] })).toThrow("sigma has 2 entries but there are 14 observations");
    expect(() =>
      fitLeastSquares({ ...base, parameters: [{ name: "b1", initial: 500, upper: 400 }, { name: "b2", initial: 1e-4 }] }),
    ).toThrow('Parameter "b1" starts at 500, outside its bounds [-Infinity, 400]');
    expect(() =>
      fitLeastSquares({ ...base, parameters: base.parameters.map((p) => ({ ...p, free: false })) }),
    ).toThrow("No free parameters: nothing to fit");
    expect(() => fitLeastSquares({ ...base, evaluate: (theta) => Array.from(base.evaluate(theta), () => Infinity) })).toThrow(
      "No start gave a finite model: non-finite-start",
    );
  });

  it("rejects unknown and invalid options", () => {
    expect(() => fitLeastSquares(nistProblem(misra1a, 0), { maxIteration: 5 } as never)).toThrow(/maxIteration/);
    expect(() => fitLeastSquares(nistProblem(misra1a, 0), { starts: 0 })).toThrow(/starts/);
  });
});

describe("exact data", () => {
  // A model that reproduces its data exactly has χ² = 0 and so s² = 0: zero standard errors (GSL
  // covariance convention), while correlations, which do not depend on s², stay defined.
  it("recovers an exact line with zero standard errors and finite correlations", () => {
    const xs = [0, 1, 2, 3, 4];
    const result = fitLeastSquares({
      parameters: [
        { name: "offset", initial: 0 },
        { name: "slope", initial: 0 },
      ],
      observed: xs.map((x) => -0.25 + 0.5 * x),
      evaluate: (theta) => xs.map((x) => theta[0] + theta[1] * x),
      jacobian: () => xs.flatMap((x) => [1, x]),
    });
    expect(result.converged).toBe(true);
    expect(result.parameters[0].value).toBeCloseTo(-0.25, 12);
    expect(result.parameters[1].value).toBeCloseTo(0.5, 12);
    expect(result.parameters[0].standardError).toBeCloseTo(0, 12);
    // Straight-line fit: corr(offset, slope) = −x̄/√(mean of x²) = −2/√6 (textbook linear regression).
    expect(result.correlation[0][1]).toBeCloseTo(-2 / Math.sqrt(6), 10);
    expectAllFinite(result);
  });
});
