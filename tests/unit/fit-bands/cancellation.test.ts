// Cancellation through an AbortSignal returns the best point so far, marked cancelled, finite.
import { describe, expect, it } from "vitest";
import { bandFitResultSchema, runBandFit } from "@/lib/fit";
import { buildTemplate } from "@/lib/tb";
import { pathPoints, perturbed, syntheticPoints } from "./synthetic";

describe("cancellation", () => {
  it("stops after the iteration in which the signal fired and returns its best point", async () => {
    const truth = buildTemplate("diamond-sp3s-star");
    const points = syntheticPoints(truth, pathPoints(truth, 80), [1, 2, 3, 4, 5, 6, 7, 8], 0.01, 3);
    const controller = new AbortController();
    const seen: number[] = [];
    const result = await runBandFit(
      { points, model: perturbed(truth, 0.2, 1) },
      {
        signal: controller.signal,
        onProgress: (p) => {
          seen.push(p.chiSquared);
          if (p.iteration === 2) controller.abort();
        },
      },
    );
    expect(result.cancelled).toBe(true);
    expect(result.stopReason).toBe("cancelled");
    expect(result.iterations).toBe(2);
    // seen: the start (iteration 0), then iterations 1 and 2
    expect(result.chiSquared).toBe(seen[2]);
    expect(result.chiSquared).toBeLessThan(seen[1] * 1.000001);
    expect(result.chiSquared).toBeLessThan(seen[0]);
    expect(result.trace.map((t) => t.iteration)).toEqual([0, 1, 2]);
    expect(() => bandFitResultSchema.parse(result)).not.toThrow();
  });
});
