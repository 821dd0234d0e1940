import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { buildParameterSet, parameterSetJsonSchema, parameterSetSchema } from "@/lib/export";
import { runBandFit } from "@/lib/fit/bands";
import { buildTemplate, compileModel, computeBands, templateKPath, type Vec3 } from "@/lib/tb";
import { rebuiltBands } from "./rebuild";

const provenance = {
  dataset: { id: "ds-1", name: "Halvorsen graphene cut 3", sha256: "a".repeat(64) },
  fit: { id: "fit-1", name: "pz nearest neighbour" },
  revision: 1,
  launchedBy: "Halvorsen lab member",
  launchedAt: new Date("2031-03-01T10:00:00Z"),
  finishedAt: new Date("2031-03-01T10:00:02Z"),
  exportedAt: new Date("2031-03-01T10:05:00Z"),
  softwareVersion: "0.1.0",
};
const neutral = { offset: 0, renormalisation: 1, reference: 0 };

describe("parameter-set JSON Schema", () => {
  it("the committed file is the one generated from the zod schema", () => {
    const committed = JSON.parse(readFileSync("lib/export/parameter-set.schema.json", "utf8"));
    expect(committed).toEqual(parameterSetJsonSchema());
    expect(committed.$schema).toBe("https://json-schema.org/draft/2020-12/schema");
  });
});

async function fittedExport(template: "honeycomb-pz" | "diamond-sp3s-star", truth: Record<string, number>) {
  const truthDoc = buildTemplate(template, { parameters: Object.fromEntries(Object.entries(truth).map(([n, value]) => [n, { value }])) });
  const k = templateKPath(truthDoc, { totalPoints: 40 }).k;
  const compiled = compileModel(truthDoc);
  const { energies } = computeBands(compiled, undefined, k);
  const n = compiled.orbitalCount;
  const points = k.flatMap((kk, i) => Array.from({ length: n }, (_, b) => ({ k: kk, band: b + 1, energy: energies[i * n + b] })));
  const { residuals, ...result } = await runBandFit({ points, model: { template } });
  return { set: buildParameterSet(result, neutral, provenance), result, residuals, k };
}

describe("buildParameterSet", () => {
  // Rebuilding H(k) from the hopping list alone must reproduce the fitted model's bands: both are the same
  // Bloch sum (phase convention of the document), so agreement is to rounding, 1e-9 eV (issue 5).
  it.each([
    // graphene-like: t1 from 2.8 eV (template default) to 2.6 eV, E_p shifted by 0.1 eV
    ["honeycomb-pz" as const, { t1: 2.6, "E_p[C]": 0.1 }],
  ])("%s: validates, and H(k) from its hopping list gives the fitted bands to 1e-9 eV", async (template, truth) => {
    const { set, result, k } = await fittedExport(template, truth);
    expect(parameterSetSchema.safeParse(JSON.parse(JSON.stringify(set))).success).toBe(true);
    // the fit recovers the generating values (exact data, so to the engine's tolerance)
    for (const [name, value] of Object.entries(truth)) expect(set.parameters.find((p) => p.name === name)?.value).toBeCloseTo(value, 6);
    const fitted = compileModel(result.fittedModel);
    const { energies } = computeBands(fitted, undefined, k);
    const n = fitted.orbitalCount;
    for (const index of [0, 7, 19, 33]) {
      const rebuilt = rebuiltBands(set, k[index] as [number, number, number]);
      rebuilt.forEach((e, b) => expect(Math.abs(e - energies[index * n + b])).toBeLessThan(1e-9));
    }
  });

  it("sp3s* silicon: a 10-orbital export rebuilds the template bands to 1e-9 eV at Γ and at general k-points", () => {
    // Vogl, Hjalmarson & Dow (1983) parameters are the template's defaults; no fit needed for the check.
    const doc = buildTemplate("diamond-sp3s-star");
    const compiled = compileModel(doc);
    const result = {
      parameters: compiled.parameters.map((p) => ({ name: p.name, value: p.value, standardError: null, start: p.value, free: p.free, determined: !p.free, unit: p.unit, atBound: null })),
      fittedModel: doc,
      rms: 0,
      reducedChiSquared: 0,
      pointsUsed: 0,
      converged: true,
      stopReason: "chi-squared-tolerance",
    } as unknown as Parameters<typeof buildParameterSet>[0];
    const set = buildParameterSet(result, neutral, provenance);
    // mathjs eigs loses accuracy at exactly degenerate points such as X (seen: 1e-3 eV), so away from Γ
    // the k-points are general ones.
    const ks: Vec3[] = [[0, 0, 0], [1.1, 0.05, 0], [0.31, -0.17, 0.52]];
    const { energies } = computeBands(compiled, undefined, ks);
    ks.forEach((k, i) => rebuiltBands(set, k).forEach((e, b) => expect(Math.abs(e - energies[i * 10 + b])).toBeLessThan(1e-9)));
    expect(set.overlaps).toEqual([]);
    expect(set.phaseConvention).toContain("exp(i k·(R1·a1");
  });
});
