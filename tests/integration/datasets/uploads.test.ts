import { readFileSync } from "node:fs";
import { inject } from "vitest";
import { beforeAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { HARTREE_IN_EV } from "@/lib/units";
import type { Vec3 } from "@/lib/tb";
import { createUploadTeam, fixtureBytes, fixtureMappings, storedRows, upload, type UploadTeam } from "./helpers";
import { dftDataPath } from "@/tests/support/dft-data";

type Accepted = { id: string; pointCount: number; bandCount: number; warnings: string[] };
type Point = { index: number; row: number; kx: number; ky: number; kz: number; band: number; energy: number; sigma: number | null; label: string | null; pathDistance: number };
type PointsPage = { points: Point[]; total: number; page: number; pageSize: number };

let team: UploadTeam;
beforeAll(async () => {
  team = await createUploadTeam("Uploads Lab");
});

const pointsOf = async (id: string, query: string) =>
  (await team.viewer.get(`/api/workspaces/${team.slug}/datasets/${id}/points?${query}`)).body as PointsPage;

describe("fixture uploads", () => {
  let photoemission: Accepted;

  it("stores the 2D photoemission file with σ converted from meV to eV", async () => {
    const name = "hq12-photoemission-cuts.csv";
    const response = await upload(team, { name, bytes: fixtureBytes(name) }, fixtureMappings[name]);
    expect(response.status).toBe(201);
    photoemission = response.body as Accepted;
    expect(photoemission).toMatchObject({ bandCount: 2, warnings: [] });

    // The fixture's first data line (fixtures/hq12-photoemission-cuts.csv, line 6): A,1.32493,0.85155,1,-1083.9,20.4.
    const page = await pointsOf(photoemission.id, "pageSize=1");
    expect(page.total).toBe(photoemission.pointCount);
    const [first] = page.points;
    expect(first).toMatchObject({ row: 6, band: 1, label: "A", kz: 0 });
    expect(first.kx).toBeCloseTo(1.32493, 10);
    expect(first.ky).toBeCloseTo(0.85155, 10);
    // 1 meV = 10⁻³ eV (SI prefix): σ 20.4 meV → 0.0204 eV, E −1083.9 meV → −1.0839 eV.
    expect(first.sigma).toBeCloseTo(0.0204, 12);
    expect(first.energy).toBeCloseTo(-1.0839, 12);
  });

  it("reports the dataset with its summary, hash and uploader", async () => {
    const name = "hq12-photoemission-cuts.csv";
    const response = await team.viewer.get(`/api/workspaces/${team.slug}/datasets/${photoemission.id}`);
    expect(response.status).toBe(200);
    const dataset = (response.body as { dataset: Record<string, unknown> }).dataset;
    expect(dataset).toMatchObject({
      name: fixtureMappings[name].name,
      source: "photoemission",
      fileName: name,
      fileSha256: createHash("sha256").update(fixtureBytes(name)).digest("hex"),
      pointCount: photoemission.pointCount,
      uploaderName: "Test editor",
    });
    expect(dataset).not.toHaveProperty("fileBytes");
    const list = await team.viewer.get(`/api/workspaces/${team.slug}/datasets`);
    expect((list.body as { datasets: { id: string }[] }).datasets.map((d) => d.id)).toContain(photoemission.id);
  });

  it("refuses the same bytes again with 409 and a link to the existing dataset", async () => {
    const name = "hq12-photoemission-cuts.csv";
    const before = await storedRows(team);
    const again = await upload(team, { name: "renamed-copy.csv", bytes: fixtureBytes(name) }, { ...fixtureMappings[name], name: "copy" });
    expect(again.status).toBe(409);
    expect(again.body).toMatchObject({
      error: { code: "conflict", datasetId: photoemission.id, href: `/w/${team.slug}/datasets/${photoemission.id}` },
    });
    expect(await storedRows(team)).toEqual(before);
  });

  it("serves the original bytes with the file name", async () => {
    const response = await fetch(new URL(`/api/workspaces/${team.slug}/datasets/${photoemission.id}/file`, inject("baseUrl")), {
      headers: { authorization: `Bearer ${team.editorKey}` },
    });
    expect(response.status).toBe(200);
    expect(new Uint8Array(await response.arrayBuffer())).toEqual(fixtureBytes("hq12-photoemission-cuts.csv"));
    expect(response.headers.get("content-disposition")).toContain("hq12-photoemission-cuts.csv");
  });

  it("stores the wide honeycomb file (2 bands per row) and the Ry silicon-like TSV", async () => {
    const honeycomb = await upload(team, { name: "h.csv", bytes: fixtureBytes("hq07-honeycomb-monolayer-dft.csv") }, fixtureMappings["hq07-honeycomb-monolayer-dft.csv"]);
    expect(honeycomb.body).toMatchObject({ pointCount: 242, bandCount: 2 });
    const tsv = "hq-s3-silicon-like-sp3s-star.tsv";
    const silicon = await upload(team, { name: tsv, bytes: fixtureBytes(tsv) }, fixtureMappings[tsv]);
    expect(silicon.body).toMatchObject({ pointCount: 1600, bandCount: 10 });
    // Line 5 of the TSV: Γ, band 1, −0.918989 Ry; 1 Ry = 13.605693122994 eV (CODATA 2018, via lib/units).
    const page = await pointsOf((silicon.body as Accepted).id, "pageSize=1");
    expect(page.points[0].energy).toBeCloseTo(-0.918989 * 13.605693122994, 9);
  });

  it("pages, filters by band and sorts on the server", async () => {
    const id = photoemission.id;
    const all = await pointsOf(id, "pageSize=500");
    const band2 = all.points.filter((p) => p.band === 2);
    const filtered = await pointsOf(id, "band=2&pageSize=10&page=2");
    expect(filtered.total).toBe(band2.length);
    expect(filtered.points.map((p) => p.index)).toEqual(band2.slice(10, 20).map((p) => p.index));
    const byEnergy = await pointsOf(id, "sort=-energy&pageSize=5");
    const expected = [...all.points].sort((a, b) => b.energy - a.energy || a.index - b.index).slice(0, 5);
    expect(byEnergy.points.map((p) => p.index)).toEqual(expected.map((p) => p.index));
    const bad = await team.viewer.get(`/api/workspaces/${team.slug}/datasets/${id}/points?sort=colour&pageSize=9999`);
    expect(bad.status).toBe(422);
  });

  it("renames (editor) and deletes (editor), removing the points", async () => {
    const renamed = await team.editor.request("PATCH", `/api/workspaces/${team.slug}/datasets/${photoemission.id}`, { name: "HQ-12 renamed", description: "two cuts" });
    expect(renamed.status).toBe(200);
    expect(renamed.body).toMatchObject({ dataset: { name: "HQ-12 renamed", description: "two cuts" } });
    const empty = await team.editor.request("PATCH", `/api/workspaces/${team.slug}/datasets/${photoemission.id}`, { name: " " });
    expect(empty.status).toBe(422);
    const before = await storedRows(team);
    const deleted = await team.editor.request("DELETE", `/api/workspaces/${team.slug}/datasets/${photoemission.id}`);
    expect(deleted.status).toBe(204);
    expect(await storedRows(team)).toEqual({ datasets: before.datasets - 1, points: before.points - photoemission.pointCount });
    const gone = await team.viewer.get(`/api/workspaces/${team.slug}/datasets/${photoemission.id}`);
    expect(gone.status).toBe(404);
  });
});

describe("the real silicon DFT file", () => {
  // Source: all-electron PBE band structure of Si computed with Elk 8.4.30 (shared/data): 240 k-points × 12
  // bands; k_frac in the basis of the JSON's reciprocal lattice, k_cart in 1/Å with 2π included.
  const bytes = new Uint8Array(readFileSync(dftDataPath("silicon-pbe-bands.csv")));
  const info = JSON.parse(readFileSync(dftDataPath("silicon-pbe-bands.json"), "utf8")) as { "lattice_vectors_angstrom (rows a1,a2,a3)": Vec3[] };
  const base = { name: "Si PBE", source: "calculation", format: "long", band: { column: "band" }, energy: { column: "energy_eV", unit: "eV" } };

  it("gives the same points with Cartesian k and with reduced k plus the lattice", async () => {
    const cartesian = await upload(team, { name: "si.csv", bytes }, { ...base, k: { kind: "cartesian", columns: ["k_cart_x", "k_cart_y", "k_cart_z"] } });
    expect(cartesian.status).toBe(201);
    expect(cartesian.body).toMatchObject({ pointCount: 2880, bandCount: 12 });
    // The hash repeats, so the second reading goes to a second workspace.
    const other = await createUploadTeam("Second Si Lab");
    const reduced = await upload(other, { name: "si.csv", bytes }, {
      ...base,
      k: { kind: "reduced", columns: ["k_frac_1", "k_frac_2", "k_frac_3"], lattice: info["lattice_vectors_angstrom (rows a1,a2,a3)"] },
    });
    expect(reduced.status).toBe(201);
    const read = async (t: UploadTeam, id: string) => {
      const points: Point[] = [];
      for (let page = 1; points.length < 2880; page++)
        points.push(...((await t.viewer.get(`/api/workspaces/${t.slug}/datasets/${id}/points?pageSize=500&page=${page}`)).body as PointsPage).points);
      return points;
    };
    const a = await read(team, (cartesian.body as Accepted).id);
    const b = await read(other, (reduced.body as Accepted).id);
    expect(b).toHaveLength(a.length);
    // The file prints k_cart to 8 decimals, so both readings agree to ~1e-7 1/Å.
    a.forEach((p, i) => {
      const q = b[i];
      expect([q.row, q.band, q.energy]).toEqual([p.row, p.band, p.energy]);
      for (const c of ["kx", "ky", "kz", "pathDistance"] as const) expect(Math.abs(q[c] - p[c])).toBeLessThan(1e-6);
    });
  });

  it("converts Hartree energies with the CODATA factor", async () => {
    // 1 Ha = 27.211386245988 eV (CODATA 2018), the factor lib/units names.
    expect(HARTREE_IN_EV).toBeCloseTo(27.211386245988, 9);
    const response = await upload(team, { name: "ha.csv", bytes: "kx,band,E_Ha\n0,1,-0.5\n0.1,1,-0.25\n" }, { ...base, k: { kind: "cartesian", columns: ["kx"] }, energy: { column: "E_Ha", unit: "Ha" } });
    expect(response.status).toBe(201);
    const page = await pointsOf((response.body as Accepted).id, "");
    expect(page.points.map((p) => p.energy)).toEqual([-0.5 * HARTREE_IN_EV, -0.25 * HARTREE_IN_EV]);
  });
});
