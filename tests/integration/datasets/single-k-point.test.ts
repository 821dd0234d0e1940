import { beforeAll, describe, expect, it } from "vitest";
import { type Vec3, buildTemplate, reciprocalLattice, reducedToCartesian } from "@/lib/tb";
import { isFinal, waitForRevision } from "../fits/helpers";
import { type UploadTeam, createUploadTeam, upload } from "./helpers";

// Issue 11, item 11 through the routes: a file whose points share one k-point is stored with a warning
// (upload response, dataset summary, dataset page), and a fit that its energies cannot determine is
// refused at launch naming the dataset; one they can determine runs and says so.
// Honeycomb pz closed forms (Castro Neto et al., Rev. Mod. Phys. 81, 109 (2009); REFERENCES §4, computed):
// E(Γ) = E_p ∓ 3t, E(K) = E_p for both bands (the hopping drops out at K).

const reciprocal = reciprocalLattice(buildTemplate("honeycomb-pz").lattice);
const K = reducedToCartesian([2 / 3, 1 / 3, 0], reciprocal);
const GAMMA: Vec3 = [0, 0, 0];

/** Both bands at one k-point, each three times (repeated measurements); the comment names the sample. */
const oneKFile = (sample: string, k: Vec3, energies: [number, number]) =>
  [`# Halvorsen lab, ${sample}`, "kx,ky,kz,band,energy", ...[0, 1, 2].flatMap(() => energies.map((e, b) => `${k.map(String).join(",")},${b + 1},${e}`))].join("\n") + "\n";

const mapping = (name: string) => ({
  name,
  source: "photoemission",
  format: "long",
  k: { kind: "cartesian", columns: ["kx", "ky", "kz"] },
  band: { column: "band" },
  energy: { column: "energy", unit: "eV" },
});

let team: UploadTeam;
const base = () => `/api/workspaces/${team.slug}`;

beforeAll(async () => {
  team = await createUploadTeam("Halvorsen Quantum Materials Lab");
});

async function uploadOneK(name: string, k: Vec3, energies: [number, number]) {
  const response = await upload(team, { name: `${name}.csv`, bytes: oneKFile(name, k, energies) }, mapping(name));
  expect(response.status).toBe(201);
  return response.body as { id: string; warnings: string[] };
}

describe("a dataset whose points share one k-point", () => {
  it("is stored with a warning in the upload's answer, the dataset's summary and on its page", async () => {
    const stored = await uploadOneK("HQ-09 at Γ", GAMMA, [0.1 - 3 * 2.6, 0.1 + 3 * 2.6]);
    expect(stored.warnings).toHaveLength(1);
    expect(stored.warnings[0]).toMatch(/^all 6 points share one k-point, k = \(0, 0, 0\) 1\/Å: the file holds band energies but no dispersion/);
    const dataset = await team.viewer.get(`${base()}/datasets/${stored.id}`);
    expect((dataset.body as { dataset: { summary: { warnings: string[] } } }).dataset.summary.warnings).toEqual(stored.warnings);
    const page = await team.viewer.get(`/w/${team.slug}/datasets/${stored.id}`);
    expect(page.status).toBe(200);
    expect(page.body as string).toContain("Warnings from the upload");
    expect(page.body as string).toContain("the file holds band energies but no dispersion");
  });

  it("refuses a fit its energies cannot determine (the hopping at K), naming the dataset; nothing is stored", async () => {
    const stored = await uploadOneK("HQ-09 at K", K, [0.1, 0.1]);
    const fitsBefore = ((await team.viewer.get(`${base()}/fits`)).body as { fits: unknown[] }).fits.length;
    const launched = await team.editor.post(`${base()}/fits`, { datasetId: stored.id, name: "pz at K", model: { template: "honeycomb-pz" } });
    expect(launched.status).toBe(422);
    const error = (launched.body as { error: { message: string; issues: Record<string, string[]> } }).error;
    expect(error.message).toMatch(/^points: dataset “HQ-09 at K”: all 6 points the fit uses lie at one k-point, k = \(.*\) 1\/Å: a fit needs a dispersion\./);
    expect(error.issues.points[0]).toContain("do not determine t1");
    expect(((await team.viewer.get(`${base()}/fits`)).body as { fits: unknown[] }).fits).toHaveLength(fitsBefore);
  });

  it("runs a fit its energies determine (E_p and t1 at Γ) and warns in the result", async () => {
    const stored = await uploadOneK("HQ-09 at Γ again", GAMMA, [0.1 - 3 * 2.6, 0.1 + 3 * 2.6]);
    const launched = await team.editor.post(`${base()}/fits`, { datasetId: stored.id, name: "pz at Γ", model: { template: "honeycomb-pz" } });
    expect(launched.status).toBe(201);
    const fitId = (launched.body as { fitId: string }).fitId;
    const revision = await waitForRevision(team.viewer, `${base()}/fits/${fitId}/revisions/1`, isFinal);
    expect(revision.status).toBe("succeeded");
    const warnings = revision.result?.warnings as { kind: string; message: string }[];
    expect(warnings.find((w) => w.kind === "single-k-point")?.message).toMatch(/^dataset “HQ-09 at Γ again”: all 6 points/);
    const value = (name: string) => revision.result?.parameters.find((p) => p.name === name)?.value;
    expect(value("t1")).toBeCloseTo(2.6, 6);
    expect(value("E_p[C]")).toBeCloseTo(0.1, 6);
  });
});
