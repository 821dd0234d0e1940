import { describe, expect, it } from "vitest";
import { buildTemplate, kPathVertices, norm, sub } from "@/lib/tb";

// The segment lengths of the standard cubic k-paths, in units of 2π/a (a = cube edge), follow from the
// textbook coordinates of the high-symmetry points (Bradley & Cracknell, The Mathematical Theory of Symmetry
// in Solids (1972), ch. 3; the same points in Setyawan & Curtarolo, Comput. Mater. Sci. 49, 299 (2010) —
// coordinates from memory, lengths computed from them):
//   fcc: X (0,0,1), W (1/2,0,1), K (3/4,3/4,0), L (1/2,1/2,1/2), U (1/4,1/4,1) and their images;
//   bcc: H (0,0,1), N (1/2,0,1/2), P (1/2,1/2,1/2); simple cubic: X (0,1/2,0), M (1/2,1/2,0), R (1/2,1/2,1/2).
// A path whose consecutive points are not neighbours on the zone boundary cuts through the zone and shows
// up as a wrong length here.
const r2 = Math.SQRT2;
const r3 = Math.sqrt(3);
const r6 = Math.sqrt(6);

const expected: Record<string, { labels: string; lengths: number[] }> = {
  "fcc-s": {
    labels: "Γ X W K Γ L U W L K U X",
    // Γ–X, X–W, W–K, K–Γ, Γ–L, L–U, U–W, W–L, L–K, (jump K|U), U–X
    lengths: [1, 1 / 2, r2 / 4, (3 * r2) / 4, r3 / 2, r6 / 4, r2 / 4, r2 / 2, r6 / 4, 0, r2 / 4],
  },
  "bcc-s": {
    labels: "Γ H N Γ P H P N",
    lengths: [1, r2 / 2, r2 / 2, r3 / 2, r3 / 2, 0, 1 / 2],
  },
  "cubic-s": {
    labels: "Γ X M Γ R X M R",
    lengths: [1 / 2, 1 / 2, r2 / 2, r3 / 2, r2 / 2, 0, 1 / 2],
  },
};

describe("template k-paths run along the zone boundary", () => {
  for (const id of ["fcc-s", "diamond-sp3s-star", "zincblende-sp3s-star", "fcc-spd", "bcc-s", "bcc-spd", "cubic-s"]) {
    it(`${id}: each segment has its textbook length`, () => {
      const a = 5; // Å; lengths are compared in units of 2π/a
      const doc = buildTemplate(id, { latticeConstant: a });
      const key = id.startsWith("bcc") ? "bcc-s" : id === "cubic-s" ? "cubic-s" : "fcc-s";
      const { labels, lengths } = expected[key];
      const vertices = kPathVertices(doc);
      expect(vertices.map((v) => v.label).join(" ")).toBe(labels);
      const unit = (2 * Math.PI) / a;
      vertices.slice(1).forEach((v, i) => {
        // A jump starts a new segment: nothing is drawn between the two points.
        const length = v.jump ? 0 : norm(sub(v.k, vertices[i].k)) / unit;
        expect(length, `${vertices[i].label}–${v.label}`).toBeCloseTo(lengths[i], 10);
      });
    });
  }
});
