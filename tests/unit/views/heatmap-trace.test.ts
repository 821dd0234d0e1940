import { describe, expect, it } from "vitest";
import { convergenceSeries, formatLogTick, logAxisTicks } from "@/lib/views/convergence";
import { correlationCells, correlationFill } from "@/lib/views/heatmap";

describe("correlation heatmap", () => {
  it("colours −1 Okabe–Ito blue, +1 vermillion and 0 near white", () => {
    // End colours: Okabe & Ito (2008) blue #0072B2 and vermillion #D55E00.
    expect(correlationFill(-1)).toBe("rgb(0, 114, 178)");
    expect(correlationFill(1)).toBe("rgb(213, 94, 0)");
    expect(correlationFill(0)).toBe("rgb(247, 247, 247)");
    expect(correlationFill(null)).toBe("#d9dce0");
  });

  it("marks off-diagonal pairs beyond the fit's 0.99 warning threshold", () => {
    const cells = correlationCells(["a", "b"], [[1, -0.995], [-0.995, 1]]);
    expect(cells).toHaveLength(4);
    expect(cells.filter((c) => c.strong).map((c) => [c.rowName, c.columnName])).toEqual([["a", "b"], ["b", "a"]]);
  });

  it("refuses a matrix that does not match the names", () => {
    expect(() => correlationCells(["a", "b"], [[1]])).toThrow("2 × 2");
  });
});

describe("convergenceSeries", () => {
  it("drops χ² ≤ 0 and spans whole decades for the log axis", () => {
    const { points, domain } = convergenceSeries([
      { iteration: 0, chiSquared: 340 },
      { iteration: 1, chiSquared: 2.5 },
      { iteration: 2, chiSquared: 0 },
    ]);
    expect(points.map((p) => p.iteration)).toEqual([0, 1]);
    expect(domain[0]).toBeCloseTo(1, 12);
    expect(domain[1]).toBeCloseTo(1000, 9);
  });

  it("gives one decade when all χ² are equal", () => {
    expect(convergenceSeries([{ iteration: 0, chiSquared: 10 }]).domain).toEqual([10, 100]);
  });
});

describe("log-axis ticks", () => {
  // Round steps 1, 2, 5 × 10ⁿ: common practice for readable axes (as for linear axes, niceStep).
  it("puts ticks at 1, 2 and 5 × 10ⁿ inside a domain of up to three decades", () => {
    expect(logAxisTicks([1, 1000])).toEqual([1, 2, 5, 10, 20, 50, 100, 200, 500, 1000]);
    expect(logAxisTicks([1e-3, 1e-2])).toEqual([0.001, 0.002, 0.005, 0.01]);
  });

  it("keeps only the powers of ten over more decades", () => {
    expect(logAxisTicks([1e-6, 1e2])).toEqual([1e-6, 1e-5, 1e-4, 1e-3, 1e-2, 0.1, 1, 10, 100]);
  });

  it("refuses a domain a log axis cannot show", () => {
    expect(() => logAxisTicks([0, 10])).toThrow(/0 < low < high/);
  });

  it("writes ticks as decimals near 1 and as m×10ⁿ far from it", () => {
    expect([0.01, 0.05, 1, 200, 1000].map(formatLogTick)).toEqual(["0.01", "0.05", "1", "200", "1000"]);
    expect([2e-3, 5e-5, 1e-6, 1e4, 2e6].map(formatLogTick)).toEqual(["2×10⁻³", "5×10⁻⁵", "10⁻⁶", "10⁴", "2×10⁶"]);
  });
});
