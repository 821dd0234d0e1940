import type { AxisTick, DataPoint } from "@/lib/datasets";
import { type ModelDocument, type Vec3, cartesianToReduced, kPathVertices } from "@/lib/tb";

/** A check at launch that did not refuse the fit. */
export type LaunchWarning = { kind: "frame-mismatch"; message: string };

// Γ is written many ways in band files and k-path definitions.
const gammaSpellings = new Set(["g", "gamma", "γ", "\\gamma", "gm"]);
const normaliseLabel = (label: string) => {
  const plain = label.trim().replace(/^\$|\$$/g, "").toLowerCase();
  return gammaSpellings.has(plain) ? "Γ" : plain;
};

/** How far from an integer a reduced coordinate may be and still name the same point (common practice). */
const reducedTolerance = 1e-3;
/** Path distances of a tick and of the point it marks agree to this, 1/Å (both come from one file). */
const tickTolerance = 1e-6;

const formatK = (k: Vec3) => `(${k.map((c) => c.toFixed(4)).join(", ")}) 1/Å`;

/**
 * The frame check: every labelled tick of the data whose label also names a vertex of the model's k-path
 * must sit at the same Cartesian k as that vertex, up to a reciprocal lattice vector of the model. A
 * disagreement is the usual sign that the data and the model use differently oriented cells.
 * @param ticks - the dataset's labelled ticks (path distance, 1/Å)
 * @param points - the dataset's points (Cartesian k, 1/Å) — each tick's k is the k of a point at its distance
 * @param model - the resolved model document; without a k-path there is nothing to compare
 */
export function checkFrame(ticks: readonly AxisTick[], points: readonly DataPoint[], model: ModelDocument): LaunchWarning[] {
  if (!model.kPath || model.kPath.length < 2 || ticks.length === 0) return [];
  const modelPoints = new Map<string, Vec3[]>();
  for (const vertex of kPathVertices(model)) {
    const key = normaliseLabel(vertex.label);
    modelPoints.set(key, [...(modelPoints.get(key) ?? []), vertex.k]);
  }
  const warnings: LaunchWarning[] = [];
  const seen = new Set<string>();
  for (const tick of ticks) {
    const label = normaliseLabel(tick.label);
    const candidates = modelPoints.get(label);
    if (!candidates || seen.has(`${label}@${tick.pathDistance}`)) continue;
    seen.add(`${label}@${tick.pathDistance}`);
    const point = points.find((p) => Math.abs(p.pathDistance - tick.pathDistance) <= tickTolerance);
    if (!point) continue;
    const agrees = candidates.some((k) => {
      const reduced = cartesianToReduced([point.k[0] - k[0], point.k[1] - k[1], point.k[2] - k[2]], model.lattice);
      return reduced.every((c) => Math.abs(c - Math.round(c)) <= reducedTolerance);
    });
    if (!agrees)
      warnings.push({
        kind: "frame-mismatch",
        message:
          `The data's ${tick.label} is at k = ${formatK(point.k)} but the model's ${tick.label} is at ${formatK(candidates[0])}: ` +
          "the data and the model may use differently oriented cells (give the model the data's lattice vectors).",
      });
  }
  return warnings;
}
