// Band mapping and the energy window, on exact model bands (closed forms: Castro Neto et al., Rev. Mod.
// Phys. 81, 109 (2009) for graphene; REFERENCES.md §3 for sp3s* Si).
import { describe, expect, it } from "vitest";
import { runBandFit, validateBandFit } from "@/lib/fit";
import { buildTemplate, templateKPath } from "@/lib/tb";
import { pathPoints, perturbed, syntheticPoints } from "./synthetic";

describe("band mapping", () => {
  it("maps data bands 1–8 to model bands 1–8 of the 10-band sp3s* model; bands 9–10 count as unmapped", async () => {
    const truth = buildTemplate("diamond-sp3s-star");
    const points = syntheticPoints(truth, pathPoints(truth, 60), [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], 0, 1);
    const result = await runBandFit({ points, model: perturbed(truth, 0.1, 2), mapping: { kind: "offset", dataBands: [1, 8], firstModelBand: 1 } });
    expect(result.pointsDropped.unmapped).toBe(120);
    expect(result.bands.map((b) => [b.dataBand, b.modelBand])).toEqual([1, 2, 3, 4, 5, 6, 7, 8].map((b) => [b, b]));
    expect(result.rms).toBeLessThan(1e-8);
  });

  it("shifts data bands onto higher model bands (data 1–2 = model bands 5–6)", async () => {
    const truth = buildTemplate("diamond-sp3s-star");
    const points = syntheticPoints(truth, pathPoints(truth, 60), [5, 6], 0, 1).map((p) => ({ ...p, band: p.band - 4 }));
    const result = await runBandFit({ points, model: truth, mapping: { kind: "offset", firstModelBand: 5 } });
    expect(result.bands.map((b) => b.modelBand)).toEqual([5, 6]);
    expect(result.rms).toBeLessThan(1e-6);
  });

  it("validates a dataset of 300 000 points (no argument-spread limit on the band range)", () => {
    // A chain s band (closed form ε − 2t cos ka: Ashcroft & Mermin, ch. 10) sampled at 300 000 k-points:
    // the band range of that many points once overflowed the stack (Math.min over spread arguments).
    const chain = buildTemplate("chain-s");
    const points = syntheticPoints(chain, pathPoints(chain, 300_000), [1], 0, 1);
    const validation = validateBandFit({ points, model: chain, mapping: { kind: "offset", firstModelBand: 1 } });
    expect(validation.ok).toBe(true);
  });

  it("refuses a mapping onto model bands that do not exist", () => {
    const truth = buildTemplate("honeycomb-pz");
    const validation = validateBandFit({
      points: syntheticPoints(truth, pathPoints(truth, 20), [1, 2], 0, 1),
      model: truth,
      mapping: { kind: "offset", firstModelBand: 2 },
    });
    expect(validation.ok).toBe(false);
    if (!validation.ok) expect(validation.issues[0].message).toMatch(/model has 2 bands/);
  });

  it("nearest mapping fits a two-branch photoemission-like set whose band labels are unknown", async () => {
    // Two branches of the graphene cone near K, both labelled band 1, with 10 meV noise.
    const truth = buildTemplate("honeycomb-pz");
    const path = templateKPath(truth, { totalPoints: 200 });
    const nearK = path.k.filter((_, i) => Math.abs(path.distance[i] - path.ticks[2].distance) < 0.25);
    const points = syntheticPoints(truth, nearK, [1, 2], 0.01, 8).map((p) => ({ ...p, band: 1 }));
    const result = await runBandFit({
      points,
      model: { template: "honeycomb-pz", parameters: { "E_p[C]": { free: false }, t1: { value: 2.3 } } },
      mapping: { kind: "nearest" },
    });
    const t1 = result.parameters.find((p) => p.name === "t1")!;
    expect(Math.abs(t1.value - 2.8)).toBeLessThan(3 * t1.standardError!); // Castro Neto et al.: t = 2.8 eV
    expect(new Set(result.residuals.map((r) => r.modelBand))).toEqual(new Set([1, 2]));
    expect(result.bands).toEqual([expect.objectContaining({ dataBand: 1, modelBand: null })]);
  });
});

describe("energy window", () => {
  it("drops and counts the points outside [min, max] and fits the rest", async () => {
    const truth = buildTemplate("diamond-sp3s-star");
    const points = syntheticPoints(truth, pathPoints(truth, 60), [1, 2, 3, 4, 5, 6, 7, 8], 0, 1);
    const window = { min: -6, max: 3 };
    const inside = points.filter((p) => p.energy >= window.min && p.energy <= window.max).length;
    const result = await runBandFit({ points, model: truth, window });
    expect(result.pointsUsed).toBe(inside);
    expect(result.pointsDropped.window).toBe(points.length - inside);
    expect(result.residuals.every((r) => r.energy >= window.min && r.energy <= window.max)).toBe(true);
  });

  it("refuses a window that leaves no more points than free parameters", () => {
    const truth = buildTemplate("diamond-sp3s-star");
    const validation = validateBandFit({
      points: syntheticPoints(truth, pathPoints(truth, 20), [1, 2, 3, 4], 0, 1),
      model: truth,
      window: { min: 50, max: 60 },
    });
    expect(validation.ok).toBe(false);
    if (!validation.ok) expect(validation.issues[0]).toMatchObject({ path: "window", message: expect.stringMatching(/no point is left/) });
  });
});
