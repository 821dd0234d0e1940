import { describe, expect, it } from "vitest";
import { createRandom } from "@/lib/linalg";

// Sample-moment checks with bounds of 5 standard errors of the estimator (central limit theorem;
// for U(0,1): mean 1/2, variance 1/12; for N(0,1): mean 0, variance 1, var of s² ≈ 2/n).
describe("seeded random numbers", () => {
  const n = 100_000;

  it("repeats the same sequence for the same seed and differs for another", () => {
    const a = createRandom(42);
    const b = createRandom(42);
    const c = createRandom(43);
    const seqA = Array.from({ length: 20 }, () => a.uniform());
    expect(Array.from({ length: 20 }, () => b.uniform())).toEqual(seqA);
    expect(Array.from({ length: 20 }, () => c.uniform())).not.toEqual(seqA);
  });

  it("draws uniform deviates in [0, 1) with mean 1/2 and variance 1/12", () => {
    const random = createRandom(1);
    let sum = 0;
    let sumSquares = 0;
    for (let i = 0; i < n; i++) {
      const u = random.uniform();
      expect(u >= 0 && u < 1).toBe(true);
      sum += u;
      sumSquares += u * u;
    }
    const mean = sum / n;
    const variance = sumSquares / n - mean * mean;
    expect(Math.abs(mean - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / n));
    // Var of the sample variance of U(0,1) is (1/80 − 1/144)/n (fourth central moment 1/80).
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(5 * Math.sqrt((1 / 80 - 1 / 144) / n));
  });

  it("draws uniformIn within its range", () => {
    const random = createRandom(9);
    for (let i = 0; i < 1000; i++) {
      const v = random.uniformIn(-3, 2);
      expect(v >= -3 && v < 2).toBe(true);
    }
  });

  it("draws Gaussian deviates with mean 0 and variance 1", () => {
    const random = createRandom(2);
    let sum = 0;
    let sumSquares = 0;
    let beyondTwo = 0;
    for (let i = 0; i < n; i++) {
      const g = random.gaussian();
      sum += g;
      sumSquares += g * g;
      if (Math.abs(g) > 2) beyondTwo++;
    }
    expect(Math.abs(sum / n)).toBeLessThan(5 / Math.sqrt(n));
    expect(Math.abs(sumSquares / n - 1)).toBeLessThan(5 * Math.sqrt(2 / n));
    // P(|Z| > 2) = 0.0455 (standard normal table); binomial standard error √(p(1−p)/n).
    expect(Math.abs(beyondTwo / n - 0.0455)).toBeLessThan(5 * Math.sqrt((0.0455 * 0.9545) / n));
  });

  it("refuses a non-integer seed", () => {
    expect(() => createRandom(1.5)).toThrow("The random seed must be an integer, got 1.5");
  });
});
