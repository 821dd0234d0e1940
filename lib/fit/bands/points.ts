import type { Vec3 } from "@/lib/tb";
import type { BandFitIssue, BandMapping, EnergyWindow, FitOptions, ParsedBandFitInput } from "./schema";

/** A data point kept for the fit, with everything the residual needs. */
export interface KeptPoint {
  /** index into the input's points */
  pointIndex: number;
  dataBand: number;
  /** data energy, eV */
  energy: number;
  /** effective uncertainty σ/√w, eV */
  sigma: number;
  /** index into {@link PointSelection.kPoints} */
  kIndex: number;
  /** mapped model band, 0-based; −1 for nearest mapping (chosen at every evaluation) */
  modelBand: number;
}

/** Counts of points left out, by reason. */
export interface DroppedCounts {
  /** data energy outside the energy window */
  window: number;
  /** data band outside the offset mapping's range */
  unmapped: number;
  /** weight 0 (the point's own or its band's) */
  zeroWeight: number;
}

/** The points a fit uses, with their distinct k-points (each diagonalised once per evaluation). */
export interface PointSelection {
  kept: KeptPoint[];
  /** distinct Cartesian k-points of the kept points, 1/Å, in order of first appearance */
  kPoints: Vec3[];
  dropped: DroppedCounts;
}

type Points = ParsedBandFitInput["points"];

/**
 * Applies the energy window, the band mapping and the weights to the points, and groups the kept points
 * by k. Order of the rules: window, then mapping, then weight (each dropped point is counted once).
 * @param modelBandCount - number of model bands (orbitals)
 * @returns the selection, or the issues that make the mapping impossible
 */
export function selectPoints(
  points: Points,
  mapping: BandMapping,
  window: EnergyWindow | undefined,
  options: FitOptions,
  modelBandCount: number,
): { selection: PointSelection; issues: BandFitIssue[] } {
  const issues: BandFitIssue[] = [];
  const dropped: DroppedCounts = { window: 0, unmapped: 0, zeroWeight: 0 };
  const inWindow = points
    .map((point, pointIndex) => ({ point, pointIndex }))
    .filter(({ point }) => {
      const keep = !window || (point.energy >= window.min && point.energy <= window.max);
      if (!keep) dropped.window++;
      return keep;
    });
  const modelBandOf = bandMapper(mapping, inWindow.map(({ point }) => point.band), modelBandCount, issues);

  const kIndexByKey = new Map<string, number>();
  const kPoints: Vec3[] = [];
  const kept: KeptPoint[] = [];
  for (const { point, pointIndex } of inWindow) {
    const modelBand = modelBandOf(point.band);
    if (modelBand === null) {
      dropped.unmapped++;
      continue;
    }
    const weight = (point.weight ?? 1) * (options.bandWeights?.[String(point.band)] ?? 1);
    if (weight === 0) {
      dropped.zeroWeight++;
      continue;
    }
    const key = `${point.k[0]},${point.k[1]},${point.k[2]}`;
    let kIndex = kIndexByKey.get(key);
    if (kIndex === undefined) {
      kIndex = kPoints.length;
      kIndexByKey.set(key, kIndex);
      kPoints.push([point.k[0], point.k[1], point.k[2]]);
    }
    const sigma = options.sigma === "from-data" ? (point.sigma ?? options.uniformSigma) : options.uniformSigma;
    kept.push({ pointIndex, dataBand: point.band, energy: point.energy, sigma: sigma / Math.sqrt(weight), kIndex, modelBand });
  }
  return { selection: { kept, kPoints, dropped }, issues };
}

/** data band → 0-based model band, −1 for "nearest", null for unmapped; checks the mapping fits the model. */
function bandMapper(
  mapping: BandMapping,
  bands: number[],
  modelBandCount: number,
  issues: BandFitIssue[],
): (dataBand: number) => number | null {
  if (mapping.kind === "nearest") {
    const [, last] = mapping.modelBands ?? [1, modelBandCount];
    if (last > modelBandCount)
      issues.push({ path: "mapping.modelBands", message: `the model has ${modelBandCount} bands; model band ${last} does not exist` });
    return () => -1;
  }
  if (bands.length === 0) return () => null;
  // A loop, not Math.min(...bands): spreading hundreds of thousands of arguments overflows the stack.
  const present = { low: bands[0], high: bands[0] };
  for (const band of bands) {
    if (band < present.low) present.low = band;
    else if (band > present.high) present.high = band;
  }
  const [first, last] = mapping.dataBands ?? [present.low, present.high];
  const lastModelBand = mapping.firstModelBand + (last - first);
  if (lastModelBand > modelBandCount)
    issues.push({
      path: mapping.dataBands ? "mapping.dataBands" : "mapping",
      message:
        `data bands ${first}–${last} would map to model bands ${mapping.firstModelBand}–${lastModelBand}, ` +
        `but the model has ${modelBandCount} bands` +
        (mapping.dataBands ? "" : ": give mapping.dataBands, or an energy window that leaves out the extra bands"),
    });
  return (band) => (band < first || band > last ? null : mapping.firstModelBand - 1 + (band - first));
}
