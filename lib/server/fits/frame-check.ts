import type { AxisTick, DataPoint } from "@/lib/datasets";
import { type ModelDocument, type Vec3, cartesianToReduced, norm, reciprocalLattice, reducedToCartesian } from "@/lib/tb";

// Pure (no server imports), so that unit tests can call it directly.

/** A check at launch that did not refuse the fit. */
export type LaunchWarning = { kind: "frame-mismatch"; message: string };

// Γ is written many ways in band files and k-path definitions.
const gammaSpellings = new Set(["g", "gamma", "γ", "\\gamma", "gm"]);
const normaliseLabel = (label: string) => {
  const plain = label.trim().replace(/^\$|\$$/g, "").toLowerCase();
  return gammaSpellings.has(plain) ? "Γ" : plain;
};

/** Two k name the same point when closer than this fraction of the shortest reciprocal vector (common practice). */
const kTolerance = 1e-3;
/** Path distances of a tick and of the points it marks agree to this, 1/Å (both come from one file). */
const tickTolerance = 1e-6;
/** Relative tolerance on the metric a_i·a_j when testing a lattice symmetry (files print 6–8 digits). */
const metricTolerance = 1e-4;

type Matrix = number[][];

/**
 * The point group of the lattice as integer matrices M in the basis of the lattice vectors (R a_i = Σ_j
 * M_ij a_j): those with entries −1, 0, 1 that keep the metric G_ij = a_i·a_j, M G Mᵀ = G. For a reduced
 * basis (every template's) that is the whole holohedry; an unreduced user basis may yield fewer, which only
 * makes the check stricter.
 */
function latticePointGroup(lattice: readonly Vec3[]): Matrix[] {
  const d = lattice.length;
  const metric = lattice.map((a) => lattice.map((b) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2]));
  const scaleOfMetric = Math.max(...metric.map((row, i) => row[i]));
  const group: Matrix[] = [];
  const entries = d * d;
  for (let code = 0; code < 3 ** entries; code++) {
    const m: Matrix = Array.from({ length: d }, (_, i) => Array.from({ length: d }, (_, j) => (Math.floor(code / 3 ** (i * d + j)) % 3) - 1));
    let keeps = true;
    for (let i = 0; i < d && keeps; i++)
      for (let j = 0; j < d && keeps; j++) {
        let g = 0;
        for (let p = 0; p < d; p++) for (let q = 0; q < d; q++) g += m[i][p] * metric[p][q] * m[j][q];
        keeps = Math.abs(g - metric[i][j]) <= metricTolerance * scaleOfMetric;
      }
    if (keeps) group.push(m);
  }
  return group;
}

/**
 * Distance (1/Å) from `data` to the nearest point equivalent to the model's point `model`: its images under
 * the lattice's point group, each shifted by the nearest reciprocal lattice vector. Band energies are the
 * same at all of them (E(Rk + G) = E(k), Ashcroft & Mermin, Solid State Physics, ch. 8 and 9), so a data
 * set in the model's frame may label any of them.
 * @param data - reduced coordinates of the data's point in the model's reciprocal basis
 * @param model - reduced coordinates of the model's point
 */
function distanceToStar(data: readonly number[], model: readonly number[], group: readonly Matrix[], reciprocal: readonly Vec3[]): number {
  let best = Infinity;
  for (const m of group) {
    const delta = m.map((row, i) => {
      const image = row.reduce((s, mij, j) => s + mij * model[j], 0);
      const d = data[i] - image;
      return d - Math.round(d);
    });
    best = Math.min(best, norm(reducedToCartesian(delta, reciprocal)));
  }
  return best;
}

const formatK = (k: Vec3) => `(${k.map((c) => c.toFixed(4)).join(", ")}) 1/Å`;

/**
 * The frame check: every labelled tick of the data whose label (Γ written as G, Gamma, Γ, \Gamma …) also
 * names a vertex of the model's k-path must sit, in the data's Cartesian frame, at a point equivalent to
 * that vertex in the model's frame — the same point up to a rotation of the lattice's point group and a
 * reciprocal lattice vector. A disagreement is the usual sign that the data and the model use differently
 * oriented cells; all disagreements go into one warning with their distances.
 * @param ticks - the dataset's labelled ticks (path distance, 1/Å)
 * @param points - the dataset's points (Cartesian k and path distance, 1/Å); a tick's k is the k of the
 *   points at its distance (at a jump two points share it: either may match)
 * @param model - the resolved model document; without a k-path there is nothing to compare
 * @returns no warning, or one `frame-mismatch` warning naming each disagreeing label
 */
export function checkFrame(
  ticks: readonly AxisTick[],
  points: readonly Pick<DataPoint, "k" | "pathDistance">[],
  model: ModelDocument,
): LaunchWarning[] {
  if (!model.kPath || model.kPath.length < 2 || ticks.length === 0) return [];
  const reciprocal = reciprocalLattice(model.lattice);
  const tolerance = kTolerance * Math.min(...reciprocal.map(norm));
  const group = latticePointGroup(model.lattice);
  const modelPoints = new Map<string, number[][]>();
  for (const vertex of model.kPath) {
    const key = normaliseLabel(vertex.label);
    modelPoints.set(key, [...(modelPoints.get(key) ?? []), vertex.reduced.slice(0, reciprocal.length)]);
  }

  const mismatches: string[] = [];
  const checked = new Set<string>();
  for (const tick of ticks) {
    const label = normaliseLabel(tick.label);
    const candidates = modelPoints.get(label);
    const key = `${label}@${tick.pathDistance}`;
    if (!candidates || checked.has(key)) continue;
    checked.add(key);
    const marked = points.filter((p) => Math.abs(p.pathDistance - tick.pathDistance) <= tickTolerance);
    if (marked.length === 0) continue;
    let nearest = { distance: Infinity, k: marked[0].k };
    for (const point of marked) {
      const reduced = cartesianToReduced(point.k, model.lattice);
      for (const vertex of candidates) {
        const distance = distanceToStar(reduced, vertex, group, reciprocal);
        if (distance < nearest.distance) nearest = { distance, k: point.k };
      }
    }
    if (nearest.distance > tolerance)
      mismatches.push(`${tick.label} at k = ${formatK(nearest.k)} is ${nearest.distance.toFixed(4)} 1/Å from the model's nearest ${tick.label}`);
  }
  if (mismatches.length === 0) return [];
  return [
    {
      kind: "frame-mismatch",
      message:
        `The data's labelled points do not sit at the model's points of the same label: ${mismatches.join("; ")}. ` +
        "The data and the model may use differently oriented cells (give the model the data's lattice vectors).",
    },
  ];
}
