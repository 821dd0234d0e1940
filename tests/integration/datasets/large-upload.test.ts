import { beforeAll, describe, expect, it } from "vitest";
import { largeBandFile, largeFileMapping } from "@/tests/unit/datasets/large-file";
import { createUploadTeam, storedRows, upload, type UploadTeam } from "./helpers";

// The size goal: a 500 000-point file (the default DATASET_MAX_POINTS) uploads through the route in
// one transaction, and the points route pages and sorts it on the server. Speed is measured by
// `npm run bench` (parse) and reported from this test's duration, never asserted here.

type Point = { index: number; row: number; band: number; energy: number; sigma: number | null; label: string | null; pathDistance: number };
type PointsPage = { points: Point[]; total: number; page: number; pageSize: number };

const POINTS = 500_000;
const BANDS = 10;

let team: UploadTeam;
let datasetId: string;
beforeAll(async () => {
  team = await createUploadTeam("Large Files Lab");
});

const pointsOf = async (query: string) => {
  const response = await team.viewer.get(`/api/workspaces/${team.slug}/datasets/${datasetId}/points?${query}`);
  expect(response.status).toBe(200);
  return response.body as PointsPage;
};

describe("a 500 000-point file", () => {
  it("uploads: every point stored", async () => {
    const bytes = largeBandFile({ points: POINTS, bands: BANDS });
    const response = await upload(team, { name: "large.csv", bytes }, largeFileMapping);
    expect(response.status).toBe(201);
    const body = response.body as { id: string; pointCount: number; bandCount: number };
    expect(body).toMatchObject({ pointCount: POINTS, bandCount: BANDS });
    datasetId = body.id;
    expect(await storedRows(team)).toEqual({ datasets: 1, points: POINTS });
  }, 180_000);

  it("answers the first page in file order", async () => {
    const page = await pointsOf("");
    expect(page).toMatchObject({ total: POINTS, page: 1, pageSize: 50 });
    // Row 2 is the first data line (after the header); it holds bands 1…10 of the first k-point, cut A.
    expect(page.points.map((p) => p.index)).toEqual(Array.from({ length: 50 }, (_, i) => i));
    expect(page.points[0]).toMatchObject({ row: 2, band: 1, label: "A", pathDistance: 0 });
    expect(page.points[0].sigma).toBeCloseTo(0.01, 15);
  });

  it("answers a sorted, band-filtered page deep in the table", async () => {
    const page = await pointsOf("band=7&sort=-energy&page=40&pageSize=100");
    expect(page.total).toBe(POINTS / BANDS);
    expect(page.points).toHaveLength(100);
    expect(page.points.every((p) => p.band === 7)).toBe(true);
    const energies = page.points.map((p) => p.energy);
    expect(energies).toEqual([...energies].sort((a, b) => b - a));
    // E = −5 + 7 + 0.3 cos(3k + 7) lies in [1.7, 2.3] eV (largeBandFile's model).
    expect(Math.max(...energies)).toBeLessThanOrEqual(2.3 + 1e-9);
    expect(Math.min(...energies)).toBeGreaterThanOrEqual(1.7 - 1e-9);
  });
});
