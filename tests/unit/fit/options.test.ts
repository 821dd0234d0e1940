import { describe, expect, it } from "vitest";
import { leastSquaresOptionsSchema, normaliseLeastSquaresOptions } from "@/lib/fit/least-squares";

describe("least-squares options", () => {
  it("fills every default once", () => {
    const options = normaliseLeastSquaresOptions();
    expect(options).toEqual({
      maxIterations: 200,
      timeLimitMs: 60_000,
      chiSquaredRelativeTolerance: 1e-12,
      stepTolerance: 1e-10,
      starts: 1,
      startSpread: 0.5,
      seed: 1,
      jacobian: "analytic",
      finiteDifference: "central",
      // ∛ε for central differences (Nocedal & Wright, Numerical Optimization, §8.1).
      finiteDifferenceStep: Math.cbrt(Number.EPSILON),
      singularTolerance: 1e-12,
      correlationWarning: 0.99,
      yieldIntervalMs: 10,
    });
    // √ε for forward differences (same source).
    expect(normaliseLeastSquaresOptions({ finiteDifference: "forward" }).finiteDifferenceStep).toBe(
      Math.sqrt(Number.EPSILON),
    );
  });

  it("reports every invalid field at once", () => {
    const parsed = leastSquaresOptionsSchema.safeParse({ maxIterations: 0, jacobian: "numeric", seed: 1.5 });
    expect(parsed.success).toBe(false);
    const paths = parsed.error!.issues.map((issue) => issue.path.join("."));
    expect(paths.sort()).toEqual(["jacobian", "maxIterations", "seed"]);
  });
});
