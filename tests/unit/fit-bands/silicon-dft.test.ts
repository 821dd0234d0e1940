// Real data: all-electron PBE band structure of Si computed with Elk 8.4.30 (shared/data), 240 k × 12
// bands, energies from the valence-band maximum, fitted with the sp3s* template (Vogl, Hjalmarson & Dow,
// J. Phys. Chem. Solids 44, 365 (1983)) from its defaults.
import { describe, expect, it } from "vitest";
import { runBandFit } from "@/lib/fit";
import { siliconDftPoints } from "./silicon-data";

describe("silicon DFT bands and the sp3s* template", () => {
  it("8 bands with an energy window converge from the template defaults with a sensible per-band table", async () => {
    const points = await siliconDftPoints();
    const result = await runBandFit({
      points,
      model: { template: "diamond-sp3s-star" },
      mapping: { kind: "offset", dataBands: [1, 8], firstModelBand: 1 },
      window: { min: -13, max: 4 },
    });
    expect(result.converged).toBe(true);
    // The window is applied first: bands 9–12 lie above 4 eV, so they count as outside the window.
    expect(result.pointsDropped.unmapped).toBe(0);
    expect(result.pointsUsed + result.pointsDropped.window + result.pointsDropped.unmapped).toBe(points.length);
    expect(result.bands.map((b) => [b.dataBand, b.modelBand])).toEqual([1, 2, 3, 4, 5, 6, 7, 8].map((b) => [b, b]));
    // A nearest-neighbour sp3s* model cannot follow PBE everywhere (common practice: a few tenths of an eV
    // RMS); valence bands fit better than conduction bands, and no band is wildly off.
    expect(result.rms).toBeLessThan(0.5);
    const valence = result.bands.filter((b) => b.dataBand <= 4);
    const conduction = result.bands.filter((b) => b.dataBand > 4);
    for (const b of valence) expect(b.rms).toBeLessThan(0.45);
    for (const b of result.bands) expect(b.maxAbs).toBeLessThan(3);
    expect(Math.max(...valence.map((b) => b.rms))).toBeLessThan(Math.max(...conduction.map((b) => b.rms)));
    // Every sp3 parameter comes out determined and within a factor of 2 of Vogl et al.'s silicon values.
    for (const p of result.parameters.filter((q) => q.free)) {
      expect(p.determined, p.name).toBe(true);
      expect(p.value / p.start, p.name).toBeGreaterThan(0.5);
      expect(p.value / p.start, p.name).toBeLessThan(2);
    }
  });

  it("4 valence bands alone leave the s* parameters undetermined, and the result says so (template defaults, no bounds set)", async () => {
    const points = await siliconDftPoints();
    const result = await runBandFit({
      points,
      model: { template: "diamond-sp3s-star" },
      mapping: { kind: "offset", dataBands: [1, 4], firstModelBand: 1 },
      options: { maxIterations: 40 },
    });
    // The template's only bound is its documented E_s* ≥ E_p (s* is Vogl et al.'s excited level); no bound is set here.
    const sStar = result.parameters.filter((p) => p.name.includes("s*") && p.free);
    const sp3 = result.parameters.filter((p) => !p.name.includes("s*") && p.free);
    expect(sStar.map((p) => p.name).sort()).toEqual(["E_s*[Si]", "V_s*pσ[Si–Si,1]"]);
    const energy = sStar.find((p) => p.name === "E_s*[Si]")!;
    const coupling = sStar.find((p) => p.name === "V_s*pσ[Si–Si,1]")!;
    expect([energy.min, energy.max, coupling.min, coupling.max]).toEqual([1.715, undefined, undefined, undefined]);
    // Valence bands feel s* only through V_s*p² / (E_s* − E) (second-order perturbation theory, common
    // practice), so E_s* and V_s*p run away together: both flagged, neither reported as determined.
    for (const p of sStar) {
      expect(p.determined, p.name).toBe(false);
      expect(
        result.warnings.some((w) => w.kind === "undetermined" && w.parameters.includes(p.name)),
        p.name,
      ).toBe(true);
    }
    expect(energy.atBound).toBeNull();
    expect(energy.value).toBeGreaterThan(10 * 11.96); // beyond 10 × the data's energy scale (valence bands span 11.96 eV)
    // The sp3 parameters stay determined, with relative standard errors below 10 %.
    for (const p of sp3) {
      expect(p.determined, p.name).toBe(true);
      expect(p.standardError! / Math.abs(p.value), p.name).toBeLessThan(0.1);
    }
    expect(JSON.stringify(result)).not.toMatch(/NaN|Infinity/);
  });
});
