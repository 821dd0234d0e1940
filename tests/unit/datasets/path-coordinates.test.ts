import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { CUT_GAP_FRACTION, type DataPoint, type DispersionParseResult, datasetMappingSchema, parseDispersionFile } from "@/lib/datasets";
import { longMapping } from "./helpers";

// The path coordinate shared by all bands (lib/datasets/pathCoordinates.ts). Every expected distance below
// is hand-computed from the file's k: projection on a straight cut, or cumulative |Δk| along a polyline.

const accepted = (result: DispersionParseResult) => {
  if (!result.ok) throw new Error(`refused: ${JSON.stringify(result.issues)}`);
  return result;
};
const csv = (header: string, rows: (string | number)[][]) => [header, ...rows.map((r) => r.join(","))].join("\n") + "\n";
const distanceAt = (points: DataPoint[], band: number, kx: number, ky = 0) =>
  points.find((p) => p.band === band && Math.abs(p.k[0] - kx) < 1e-12 && Math.abs(p.k[1] - ky) < 1e-12)?.pathDistance;

describe("photoemission branches on one straight cut", () => {
  // Branch 1 from kx = −0.2 to 0.2, branch 2 from 0 to 0.3 listed right to left, on the line ky = kx/2
  // (direction (2, 1)/√5): distances are |k − k_min| = (kx + 0.2)·√5/2 for both branches.
  const along = (kx: number) => ((kx + 0.2) * Math.sqrt(5)) / 2;
  const rows: (string | number)[][] = [];
  for (const kx of [-0.2, -0.1, 0, 0.1, 0.2]) rows.push([kx, kx / 2, 1, -1 + kx]);
  for (const kx of [0.3, 0.2, 0.1, 0]) rows.push([kx, kx / 2, 2, -0.5 + kx]);
  const file = csv("kx,ky,branch,E", rows);
  const mapping = longMapping({ band: { column: "branch" } });

  it("gives both branches one axis, ordered by k, starting at the cut's smallest projection", async () => {
    const { points } = accepted(await parseDispersionFile(file, mapping));
    for (const kx of [-0.2, -0.1, 0, 0.1, 0.2]) expect(distanceAt(points, 1, kx, kx / 2)).toBeCloseTo(along(kx), 12);
    for (const kx of [0.3, 0.2, 0.1, 0]) expect(distanceAt(points, 2, kx, kx / 2)).toBeCloseTo(along(kx), 12);
    // Branch 2 starts at kx = 0.3 (its first row), yet its point at kx = 0 sits where branch 1's does.
    expect(distanceAt(points, 2, 0)).toBe(distanceAt(points, 1, 0));
  });

  it("treats k printed to 5 decimals as collinear (tolerance 0.1 % of the cut's length)", async () => {
    // ky rounded to 1e-5 1/Å: off the line by at most 5e-6, far below 0.1 % of the 0.56 1/Å cut.
    const rounded = csv("kx,ky,branch,E", rows.map(([kx, ky, b, e]) => [kx, Number(ky).toFixed(5), b, e]));
    const { points } = accepted(await parseDispersionFile(rounded, mapping));
    expect(distanceAt(points, 2, 0.3, 0.15)).toBeCloseTo(along(0.3), 5);
    expect(Math.min(...points.map((p) => p.pathDistance))).toBe(0);
  });
});

describe("two cuts, each with two branches", () => {
  // Cut A along kx (ky = 0): branch 1 at kx = 0…0.4, branch 2 at kx = 0.2…0.4. Cut B along ky (kx = 1):
  // branch 1 at ky = 0.1…0.3, branch 2 at ky = 0…0.2. Lengths 0.4 and 0.3; the gap is 5 % of 0.7 = 0.035.
  const rows: (string | number)[][] = [];
  for (const kx of [0, 0.1, 0.2, 0.3, 0.4]) rows.push(["A", kx, 0, 1, -1]);
  for (const kx of [0.2, 0.3, 0.4]) rows.push(["A", kx, 0, 2, -0.5]);
  for (const ky of [0.1, 0.2, 0.3]) rows.push(["B", 1, ky, 1, -1]);
  for (const ky of [0, 0.1, 0.2]) rows.push(["B", 1, ky, 2, -0.5]);
  const file = csv("cut,kx,ky,branch,E", rows);
  const mapping = longMapping({ band: { column: "branch" }, label: { column: "cut" } });
  const gap = CUT_GAP_FRACTION * (0.4 + 0.3);
  const startOfB = 0.4 + gap;

  it("puts cut B after cut A with the documented gap; branches share each cut's axis", async () => {
    const { points } = accepted(await parseDispersionFile(file, mapping));
    expect(gap).toBeCloseTo(0.035, 15);
    expect(distanceAt(points, 2, 0.2)).toBeCloseTo(0.2, 12);
    expect(distanceAt(points, 1, 0.2)).toBe(distanceAt(points, 2, 0.2));
    // Cut B's smallest ky is branch 2's 0 (not branch 1's first point, 0.1).
    expect(distanceAt(points, 2, 1, 0)).toBeCloseTo(startOfB, 12);
    expect(distanceAt(points, 1, 1, 0.1)).toBeCloseTo(startOfB + 0.1, 12);
    expect(distanceAt(points, 2, 1, 0.1)).toBe(distanceAt(points, 1, 1, 0.1));
    expect(Math.max(...points.map((p) => p.pathDistance))).toBeCloseTo(startOfB + 0.3, 12);
  });

  it("labels each cut with a tick at its start", async () => {
    const { summary } = accepted(await parseDispersionFile(file, mapping));
    expect(summary.ticks.map((t) => t.label)).toEqual(["A", "B"]);
    expect(summary.ticks[0].pathDistance).toBe(0);
    expect(summary.ticks[1].pathDistance).toBeCloseTo(startOfB, 12);
  });
});

describe("a polyline that revisits Γ", () => {
  // Γ(0,0) → X(1,0) → M(1,1) → Γ: |ΓX| = |XM| = 1, |MΓ| = √2; the second Γ sits at 2 + √2.
  const path = [[0, 0], [0.5, 0], [1, 0], [1, 0.5], [1, 1], [0.5, 0.5], [0, 0]];
  const expected = [0, 0.5, 1, 1.5, 2, 2 + Math.SQRT2 / 2, 2 + Math.SQRT2];
  const kMajor = csv("kx,ky,band,E", path.flatMap(([x, y], i) => [[x, y, 1, i], [x, y, 2, 10 + i]]));
  const bandMajor = csv("kx,ky,band,E", [1, 2].flatMap((b) => path.map(([x, y], i) => [x, y, b, 10 * (b - 1) + i])));

  it.each([
    ["listed k by k", kMajor],
    ["listed band by band", bandMajor],
  ])("gives cumulative |Δk| along the path, %s, Γ at both ends", async (_, file) => {
    const { points, summary } = accepted(await parseDispersionFile(file, longMapping()));
    for (const band of [1, 2]) {
      const own = points.filter((p) => p.band === band).map((p) => p.pathDistance);
      own.forEach((d, i) => expect(d).toBeCloseTo(expected[i], 12));
    }
    expect(summary.kPointCount).toBe(6);
  });

  it("puts labelled points' ticks where the path passes them, in order (the second Γ at the end)", async () => {
    const mapping = longMapping({
      k: {
        kind: "cartesian",
        columns: ["kx", "ky"],
        path: ["Γ", "X", "M", "Γ"].map((label, i) => ({ label, k: [[0, 0], [1, 0], [1, 1], [0, 0]][i], coordinates: "cartesian" as const })),
      },
    });
    const { summary, warnings } = accepted(await parseDispersionFile(bandMajor, mapping));
    expect(warnings).toEqual([]);
    expect(summary.ticks.map((t) => t.label)).toEqual(["Γ", "X", "M", "Γ"]);
    [0, 1, 2, 2 + Math.SQRT2].forEach((d, i) => expect(summary.ticks[i].pathDistance).toBeCloseTo(d, 12));
  });
});

describe("the photoemission fixture (fixtures/hq12-photoemission-cuts.csv)", () => {
  const folder = fileURLToPath(new URL("../../../fixtures/", import.meta.url));
  const mappings = JSON.parse(readFileSync(`${folder}mappings.json`, "utf8")) as Record<string, unknown>;

  it("gives the lower and upper cone one axis per cut: equal k, equal distance", async () => {
    const name = "hq12-photoemission-cuts.csv";
    const { points, summary } = accepted(
      await parseDispersionFile(readFileSync(`${folder}${name}`), datasetMappingSchema.parse(mappings[name])),
    );
    // Keyed by cut and k: the two cuts cross at K, which sits once on each cut's axis.
    const byK = new Map<string, Set<number>>();
    for (const p of points) byK.set(`${p.label} ${p.kIndex}`, (byK.get(`${p.label} ${p.kIndex}`) ?? new Set()).add(p.pathDistance));
    expect([...byK.values()].every((d) => d.size === 1)).toBe(true);
    const shared = [...new Set(points.filter((p) => p.band === 2).map((p) => p.kIndex))].filter((k) =>
      points.some((p) => p.band === 1 && p.kIndex === k),
    );
    expect(shared.length).toBeGreaterThan(0);
    expect(summary.ticks.map((t) => t.label)).toEqual(["A", "B"]);
  });
});
