// What the data do not determine: a parameter with no effect, two perfectly correlated parameters, and a
// free offset that duplicates the on-site energies. The output must stay finite (no NaN, no ∞) and say so.
import { describe, expect, it } from "vitest";
import { bandFitResultSchema, runBandFit, validateBandFit } from "@/lib/fit";
import { buildTemplate } from "@/lib/tb";

const A = 2.5; // chain site spacing, Å (the chain-s template's default)

describe("warnings for parameters the data do not determine", () => {
  it("flags a parameter with no effect and keeps the output finite", async () => {
    // E(k) = E_s − 2t cos ka (Ashcroft & Mermin, ch. 10): at ka = ±π/2 the hopping drops out (up to the
    // rounding of cos(π/2) ≈ 6e-17, which lets t wander to huge values: it must be flagged, not reported).
    const points = Array.from({ length: 12 }, (_, i) => ({
      k: [((i % 2 ? 1 : -1) * Math.PI) / (2 * A), 0, 0] as [number, number, number],
      band: 1,
      energy: 0.3 + 0.01 * ((i % 3) - 1),
    }));
    const result = await runBandFit({ points, model: { template: "chain-s" } });
    expect(() => bandFitResultSchema.parse(result)).not.toThrow();
    expect(JSON.stringify(result)).not.toMatch(/NaN|Infinity/);
    const t = result.parameters.find((p) => p.name === "t")!;
    expect(t.standardError).toBeNull();
    expect(t.determined).toBe(false);
    expect(result.warnings.some((w) => (w.kind === "no-effect" || w.kind === "undetermined") && w.parameters.includes("t"))).toBe(true);
    // The energies ±0.01 eV about 0.3 eV are still fitted by their mean: RMS = 0.01·√(2/3) eV.
    expect(result.rms).toBeCloseTo(0.01 * Math.sqrt(2 / 3), 10);
  });

  it("flags two perfectly correlated parameters (two hoppings on the same bond)", async () => {
    const chain = buildTemplate("chain-s");
    const model = {
      ...chain,
      hoppings: [
        { from: "A:s", to: "A:s", translation: [1, 0, 0] as [number, number, number], parameter: "t_a", factor: -1 },
        { from: "A:s", to: "A:s", translation: [1, 0, 0] as [number, number, number], parameter: "t_b", factor: -1 },
      ],
      parameters: [
        chain.parameters[0],
        { name: "t_a", value: 0.6, unit: "eV" as const, free: true },
        { name: "t_b", value: 0.3, unit: "eV" as const, free: true },
      ],
    };
    const points = Array.from({ length: 30 }, (_, i) => {
      const k = (Math.PI / A) * (i / 29);
      return { k: [k, 0, 0] as [number, number, number], band: 1, energy: -2 * 1.0 * Math.cos(k * A) };
    });
    const result = await runBandFit({ points, model });
    expect(() => bandFitResultSchema.parse(result)).not.toThrow();
    const warned = result.warnings.filter((w) => w.parameters.includes("t_a") && w.parameters.includes("t_b"));
    expect(warned.length).toBeGreaterThan(0);
    for (const name of ["t_a", "t_b"]) expect(result.parameters.find((p) => p.name === name)!.determined).toBe(false);
    // Only their sum is determined: 1 eV (the data's own hopping).
    const sum = result.parameters.filter((p) => p.name.startsWith("t_")).reduce((s, p) => s + p.value, 0);
    expect(sum).toBeCloseTo(1, 8);
  });

  it("refuses a free offset with every on-site energy free, before the fit", () => {
    const truth = buildTemplate("diamond-sp3s-star");
    const validation = validateBandFit({
      points: [{ k: [0, 0, 0], band: 1, energy: -12 }],
      model: truth,
      options: { energyOffset: { value: 0, free: true } },
    });
    expect(validation.ok).toBe(false);
    if (validation.ok) return;
    const issue = validation.issues.find((i) => i.path === "options.energyOffset.free");
    expect(issue?.message).toMatch(/redundant/);
    expect(issue?.message).toContain("E_s*[Si]");
  });

  it("refuses a free renormalisation with every Hamiltonian parameter free", () => {
    const validation = validateBandFit({
      points: Array.from({ length: 10 }, (_, i) => ({ k: [i * 0.1, 0, 0] as [number, number, number], band: 1, energy: i })),
      model: { template: "chain-s" },
      options: { renormalisation: { value: 1, free: true } },
    });
    expect(validation.ok).toBe(false);
    if (!validation.ok) expect(validation.issues.map((i) => i.path)).toContain("options.renormalisation.free");
  });
});
