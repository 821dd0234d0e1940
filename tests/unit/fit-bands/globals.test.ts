// The two global parameters on exact data: E_pred = E_ref + (E_model − E_ref)/Z + δ (lib/fit/bands/schema.ts).
// With the model's own bands shifted or scaled exactly, the fit must return δ or Z to rounding
// (the closed forms of the shifted/scaled data; common practice).
import { describe, expect, it } from "vitest";
import { runBandFit } from "@/lib/fit";
import { type ModelDocument, buildTemplate } from "@/lib/tb";
import { pathPoints, syntheticPoints } from "./synthetic";

const fixedModel = (doc: ModelDocument): ModelDocument => ({ ...doc, parameters: doc.parameters.map((p) => ({ ...p, free: false })) });

describe("energy offset and renormalisation", () => {
  const truth = buildTemplate("diamond-sp3s-star");
  const exact = syntheticPoints(truth, pathPoints(truth, 40), [1, 2, 3, 4, 5, 6, 7, 8], 0, 1);

  it("recovers an energy offset alone exactly", async () => {
    const points = exact.map((p) => ({ ...p, energy: p.energy + 0.37 }));
    const result = await runBandFit({ points, model: fixedModel(truth), options: { energyOffset: { value: 0, free: true } } });
    const offset = result.parameters.find((p) => p.name === "energy offset")!;
    expect(offset.value).toBeCloseTo(0.37, 12);
    expect(result.rms).toBeLessThan(1e-12);
  });

  it("recovers the factor of a renormalised copy about the reference", async () => {
    const reference = 0.5;
    const points = exact.map((p) => ({ ...p, energy: reference + (p.energy - reference) / 1.6 }));
    const result = await runBandFit({
      points,
      model: fixedModel(truth),
      options: { renormalisation: { value: 1, free: true, reference } },
    });
    expect(result.parameters.find((p) => p.name === "renormalisation")!.value).toBeCloseTo(1.6, 10);
    expect(result.maxAbsResidual).toBeLessThan(1e-9);
  });

  it("recovers offset and factor together with the model free, the hoppings fitted too", async () => {
    const points = exact.map((p) => ({ ...p, energy: p.energy / 1.25 - 0.2 }));
    const result = await runBandFit({
      points,
      model: { template: "diamond-sp3s-star", parameters: { "E_s[Si]": { free: false }, "V_ssσ[Si–Si,1]": { free: false } } },
      options: { energyOffset: { value: 0, free: true }, renormalisation: { value: 1, free: true } },
    });
    expect(result.parameters.find((p) => p.name === "renormalisation")!.value).toBeCloseTo(1.25, 8);
    expect(result.parameters.find((p) => p.name === "energy offset")!.value).toBeCloseTo(-0.2, 8);
  });

  it("leaves neutral fixed globals out of the parameter list", async () => {
    const result = await runBandFit({ points: exact, model: { template: "diamond-sp3s-star" } });
    expect(result.parameters.map((p) => p.name)).not.toContain("energy offset");
    expect(result.parameters.map((p) => p.name)).not.toContain("renormalisation");
  });
});
