import { describe, expect, it } from "vitest";
import { compareBands, compareParameters } from "@/lib/views/compare";

const p = (name: string, value: number, standardError: number | null, free = true) => ({ name, unit: "eV", value, standardError, free });

describe("compareParameters", () => {
  // Rule: |b − a| > √(σa² + σb²), errors of independent estimates added in quadrature
  // (Taylor, An Introduction to Error Analysis, 2nd ed., ch. 3 — common practice for a 1σ comparison).
  it("flags a difference larger than the combined standard error", () => {
    const [row] = compareParameters([p("t", -2.7, 0.03)], [p("t", -2.6, 0.04)]);
    expect(row.difference).toBeCloseTo(0.1, 12);
    expect(row.combinedError).toBeCloseTo(0.05, 12); // √(0.03² + 0.04²) = 0.05
    expect(row.differsBeyondErrors).toBe(true);
  });

  it("does not flag a difference within the combined standard error", () => {
    const [row] = compareParameters([p("t", -2.7, 0.03)], [p("t", -2.66, 0.04)]);
    expect(row.difference).toBeCloseTo(0.04, 12);
    expect(row.differsBeyondErrors).toBe(false);
  });

  it("counts a fixed side's error as zero and says nothing when neither side has one", () => {
    const rows = compareParameters([p("t", 1, null, false), p("s", 0, null, false)], [p("t", 1.2, 0.1), p("s", 0.5, null, false)]);
    expect(rows[0].combinedError).toBeCloseTo(0.1, 12);
    expect(rows[0].differsBeyondErrors).toBe(true);
    expect(rows[1].combinedError).toBeNull();
    expect(rows[1].differsBeyondErrors).toBeNull();
  });

  it("lists parameters only one revision has, in a's order then b's", () => {
    const rows = compareParameters([p("a1", 1, 0.1), p("a2", 2, 0.1)], [p("b1", 3, 0.1), p("a1", 1, 0.1)]);
    expect(rows.map((r) => r.name)).toEqual(["a1", "a2", "b1"]);
    expect(rows[1].b).toBeNull();
    expect(rows[1].difference).toBeNull();
    expect(rows[2].a).toBeNull();
  });
});

describe("compareBands", () => {
  it("puts RMS per band side by side with the change b − a", () => {
    const rows = compareBands(
      [{ dataBand: 2, points: 10, rms: 0.05 }, { dataBand: 1, points: 10, rms: 0.1 }],
      [{ dataBand: 1, points: 10, rms: 0.04 }, { dataBand: 3, points: 10, rms: 0.2 }],
    );
    expect(rows.map((r) => r.dataBand)).toEqual([1, 2, 3]);
    expect(rows[0].change).toBeCloseTo(-0.06, 12);
    expect(rows[1]).toEqual({ dataBand: 2, rmsA: 0.05, rmsB: null, change: null });
  });
});
