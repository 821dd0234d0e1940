import { beforeAll, describe, expect, it } from "vitest";
import { type UploadTeam, createUploadTeam, upload } from "./helpers";

// GET …/datasets/{id}/chart-points: the points a chart draws, in one request — every point up to `max`,
// else every stride-th point of each band in file order with the same stride for all bands.

type Point = { index: number; kIndex: number; kx: number; ky: number; kz: number; pathDistance: number; band: number; energy: number; sigma: number | null };
type ChartPoints = { points: Point[]; total: number; stride: number };

// Two bands of very different sizes: band 1 at 100 k-points, band 2 at every 15th of them (7 points),
// rows interleaved in the file so that file order and band order differ.
function unevenBandsCsv(): string {
  const lines = ["kx,ky,kz,band,energy"];
  for (let i = 0; i < 100; i++) {
    const kx = (i * 0.01).toFixed(2);
    lines.push(`${kx},0,0,1,${(-1 + 0.02 * i).toFixed(3)}`);
    if (i % 15 === 0) lines.push(`${kx},0,0,2,${(2 - 0.01 * i).toFixed(3)}`);
  }
  return lines.join("\n") + "\n";
}
const mapping = {
  name: "Halvorsen uneven bands",
  source: "calculation",
  format: "long",
  k: { kind: "cartesian", columns: ["kx", "ky", "kz"] },
  band: { column: "band" },
  energy: { column: "energy", unit: "eV" },
};

let team: UploadTeam;
let other: UploadTeam;
let id: string;
let foreignId: string;
let all: Point[];
const route = (query = "", datasetId = id) => `/api/workspaces/${team.slug}/datasets/${datasetId}/chart-points${query}`;

beforeAll(async () => {
  team = await createUploadTeam("Halvorsen Quantum Materials Lab");
  other = await createUploadTeam("Another lab");
  const uploaded = await upload(team, { name: "uneven.csv", bytes: unevenBandsCsv() }, mapping);
  expect(uploaded.status).toBe(201);
  id = (uploaded.body as { id: string }).id;
  const foreign = await upload(other, { name: "uneven.csv", bytes: unevenBandsCsv() }, mapping);
  expect(foreign.status).toBe(201);
  foreignId = (foreign.body as { id: string }).id;
  const page = await team.owner.get(`/api/workspaces/${team.slug}/datasets/${id}/points?pageSize=500&sort=index`);
  all = (page.body as { points: Point[] }).points;
  expect(all).toHaveLength(107);
});

/** Every stride-th point of each band (ranks 0, stride, 2·stride… in file order), ordered by band then file order. */
function expectedSample(stride: number): Point[] {
  const bands = [...new Set(all.map((p) => p.band))].sort((a, b) => a - b);
  return bands.flatMap((band) => all.filter((p) => p.band === band).filter((_, rank) => rank % stride === 0));
}

const chart = async (query: string) => {
  const response = await team.viewer.get(route(query));
  expect(response.status).toBe(200);
  return response.body as ChartPoints;
};

describe("GET …/datasets/{id}/chart-points", () => {
  it("returns every point, band by band, when the dataset is within max (default 20 000)", async () => {
    const body = await chart("");
    expect(body.stride).toBe(1);
    expect(body.total).toBe(107);
    expect(body.points).toEqual(expectedSample(1).map((p) => ({ index: p.index, kIndex: p.kIndex, kx: p.kx, ky: p.ky, kz: p.kz, pathDistance: p.pathDistance, band: p.band, energy: p.energy, sigma: p.sigma })));
    expect(body.points.every((p) => p.sigma === null)).toBe(true);
    expect((await chart("?max=107")).points).toHaveLength(107);
  });

  it("carries each point's σ in eV, for error bars (photoemission peaks)", async () => {
    const peaks = ["kx,ky,branch,E (meV),dE (meV)", "0.10,0,1,-120,15", "0.20,0,1,-80,20", "0.30,0,1,-35,25"].join("\n") + "\n";
    const uploaded = await upload(
      team,
      { name: "halvorsen-peaks.csv", bytes: peaks },
      {
        name: "Halvorsen peaks with σ",
        source: "photoemission",
        format: "long",
        k: { kind: "cartesian", columns: ["kx", "ky"] },
        band: { column: "branch" },
        energy: { column: "E (meV)", unit: "meV" },
        sigma: { column: "dE (meV)" },
      },
    );
    expect(uploaded.status).toBe(201);
    const response = await team.viewer.get(route("", (uploaded.body as { id: string }).id));
    // σ in meV → eV: 15 meV = 0.015 eV (SI prefix milli = 10⁻³)
    expect((response.body as ChartPoints).points.map((p) => [p.energy, p.sigma])).toEqual([
      [expect.closeTo(-0.12, 12), expect.closeTo(0.015, 12)],
      [expect.closeTo(-0.08, 12), expect.closeTo(0.02, 12)],
      [expect.closeTo(-0.035, 12), expect.closeTo(0.025, 12)],
    ]);
  });

  it("thins with one stride for all bands: every stride-th point of each band, at most max in all", async () => {
    // max = 20, B = 2: stride ⌈107/(20 − 2)⌉ = 6; band 1 keeps ⌈100/6⌉ = 17 points, band 2 ⌈7/6⌉ = 2.
    const body = await chart("?max=20");
    expect(body.stride).toBe(6);
    expect(body.points.map((p) => p.index)).toEqual(expectedSample(6).map((p) => p.index));
    expect(body.points.filter((p) => p.band === 1)).toHaveLength(17);
    expect(body.points.filter((p) => p.band === 2)).toHaveLength(2);
  });

  it.each([2, 3, 10, 50, 106])("max=%i: at most max points, every band kept with its first point", async (max) => {
    const body = await chart(`?max=${max}`);
    expect(body.points.length).toBeLessThanOrEqual(max);
    expect(body.stride).toBeGreaterThan(1);
    expect(body.points.map((p) => p.index)).toEqual(expectedSample(body.stride).map((p) => p.index));
    for (const band of [1, 2]) expect(body.points.find((p) => p.band === band)?.index).toBe(all.find((p) => p.band === band)!.index);
  });

  it("max below the band count still keeps one point per band", async () => {
    const body = await chart("?max=1");
    expect(body.points.map((p) => p.band)).toEqual([1, 2]);
  });

  it.each(["0", "20001", "abc", "2.5"])("refuses max=%s with 422", async (max) => {
    const response = await team.viewer.get(route(`?max=${max}`));
    expect(response.status).toBe(422);
    expect((response.body as { error: { message: string } }).error.message).toMatch(/max/);
  });

  it("members read it; a non-member gets 404, the signed out 401, another workspace's dataset 404", async () => {
    for (const caller of ["owner", "editor", "viewer"] as const) expect([caller, (await team[caller].get(route())).status]).toEqual([caller, 200]);
    expect((await team.outsider.get(route())).status).toBe(404);
    expect((await team.anonymous.get(route())).status).toBe(401);
    expect((await team.owner.get(route("", foreignId))).status).toBe(404);
  });
});
