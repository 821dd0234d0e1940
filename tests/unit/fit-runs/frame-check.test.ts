import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { checkFrame } from "@/lib/server/fits/frame-check";
import { dftDataPath } from "@/tests/support/dft-data";
import { type ModelDocument, type Vec3, add, buildTemplate, kPathVertices, norm, reciprocalLattice, templateKPath } from "@/lib/tb";

const honeycomb = buildTemplate("honeycomb-pz");

/** The model's own k-path as a dataset would store it: points (k, path distance) and labelled ticks. */
function pathData(model: ModelDocument, moveK: (k: Vec3) => Vec3 = (k) => k) {
  const path = templateKPath(model, { totalPoints: 40 });
  return {
    points: path.k.map((k, i) => ({ k: moveK(k), pathDistance: path.distance[i] })),
    ticks: path.ticks.map((t) => ({ label: t.label, pathDistance: t.distance })),
  };
}

const rotateAboutZ = (degrees: number) => (k: Vec3): Vec3 => {
  const c = Math.cos((degrees * Math.PI) / 180);
  const s = Math.sin((degrees * Math.PI) / 180);
  return [c * k[0] - s * k[1], s * k[0] + c * k[1], k[2]];
};

const vertex = (model: ModelDocument, label: string) => {
  const found = kPathVertices(model).find((v) => v.label === label);
  if (!found) throw new Error(`no ${label} on the model's path`);
  return found.k;
};

describe("checkFrame", () => {
  it("accepts data whose labelled ticks sit at the model's k-path points", () => {
    const { points, ticks } = pathData(honeycomb);
    expect(ticks.map((t) => t.label)).toEqual(["Γ", "M", "K", "Γ"]);
    expect(checkFrame(ticks, points, honeycomb)).toEqual([]);
  });

  it("warns, naming the labels and their distances, when the data's frame is rotated by 30°", () => {
    const { points, ticks } = pathData(honeycomb, rotateAboutZ(30));
    const warnings = checkFrame(ticks, points, honeycomb);
    expect(warnings).toHaveLength(1);
    expect(warnings[0].kind).toBe("frame-mismatch");
    // A 30° turn puts the data's M on the model's Γ–K line and its K on the Γ–M line. The nearest
    // equivalent M (K) lies 30° away on the same circle: chord 2|k| sin 15° (elementary geometry; the
    // M and K stars of the hexagonal zone are 60° apart, Ashcroft & Mermin, Solid State Physics, ch. 5).
    const chord = (k: Vec3) => 2 * norm(k) * Math.sin((15 * Math.PI) / 180);
    const message = warnings[0].message;
    expect(message).toContain(`M at k = `);
    expect(message).toContain(`is ${chord(vertex(honeycomb, "M")).toFixed(4)} 1/Å from the model's nearest M`);
    expect(message).toContain(`is ${chord(vertex(honeycomb, "K")).toFixed(4)} 1/Å from the model's nearest K`);
    expect(message).not.toContain("nearest Γ");
  });

  it("treats G, Gamma, $\\Gamma$ and Γ as one label", () => {
    const m = vertex(honeycomb, "M");
    const points = [
      { k: [0, 0, 0] as Vec3, pathDistance: 0 },
      { k: m, pathDistance: norm(m) },
    ];
    for (const label of ["G", "Gamma", "$\\Gamma$", "gamma", "Γ"]) {
      expect(checkFrame([{ label, pathDistance: 0 }], points, honeycomb)).toEqual([]);
      // the same spelling on a point that is not Γ is compared with the model's Γ, and refused
      const [warning] = checkFrame([{ label, pathDistance: norm(m) }], points, honeycomb);
      expect(warning?.message).toContain(`${label} at k = `);
    }
  });

  it("accepts data shifted by a reciprocal lattice vector", () => {
    const [b1, b2] = reciprocalLattice(honeycomb.lattice);
    const { points, ticks } = pathData(honeycomb, (k) => add(add(k, b1), b2));
    expect(checkFrame(ticks, points, honeycomb)).toEqual([]);
    // the same shift by half a reciprocal vector is not a lattice translation
    const half = pathData(honeycomb, (k) => add(k, [b1[0] / 2, b1[1] / 2, b1[2] / 2]));
    expect(checkFrame(half.ticks, half.points, honeycomb)).toHaveLength(1);
  });

  it("accepts the real Si data, also turned into a point-group image of the template's frame", () => {
    // all-electron PBE band structure of Si computed with Elk 8.4.30 (shared/data): L–Γ–X–W–K–Γ
    const file = dftDataPath("silicon-pbe-bands.json");
    const info = JSON.parse(readFileSync(file, "utf8")) as {
      kpath: { label: string; k_cart_1_per_angstrom: Vec3; path_distance_1_per_angstrom: number }[];
    };
    const points = info.kpath.map((v) => ({ k: v.k_cart_1_per_angstrom, pathDistance: v.path_distance_1_per_angstrom }));
    const ticks = info.kpath.map((v) => ({ label: v.label, pathDistance: v.path_distance_1_per_angstrom }));
    const silicon = buildTemplate("diamond-sp3s-star");
    expect(checkFrame(ticks, points, silicon)).toEqual([]);
    // a quarter turn about z is a symmetry of the cubic lattice: the data's X becomes 2π/a (0,1,0), another
    // member of the star of the template's X, not the same vector — still the same frame
    const quarter = points.map((p) => ({ ...p, k: rotateAboutZ(90)(p.k) }));
    expect(norm(vertex(silicon, "X").map((c, i) => c - quarter[2].k[i]) as Vec3)).toBeGreaterThan(1);
    expect(checkFrame(ticks, quarter, silicon)).toEqual([]);
    // the same data turned by 45° about z is in another frame
    const turned = points.map((p) => ({ ...p, k: rotateAboutZ(45)(p.k) }));
    expect(checkFrame(ticks, turned, silicon)[0]?.message).toMatch(/X at k = .* from the model's nearest X/);
  });

  it("has nothing to compare without ticks or without a model k-path", () => {
    const { points, ticks } = pathData(honeycomb, rotateAboutZ(30));
    expect(checkFrame([], points, honeycomb)).toEqual([]);
    expect(checkFrame(ticks, points, { ...honeycomb, kPath: undefined })).toEqual([]);
  });
});
