import type { Vec3 } from "@/lib/tb/geometry/vec3";
import type { Delimiter } from "./delimiter";
import type { AxisTick, DataPoint } from "./points";

/** What a parsed dataset holds, for the upload response and the dataset page. */
export interface DatasetSummary {
  pointCount: number;
  /** Number of distinct band indices. */
  bandCount: number;
  /** The distinct band indices, ascending. */
  bands: number[];
  /** Number of distinct k vectors. */
  kPointCount: number;
  /** Component-wise range of Cartesian k in 1/Å. */
  kRange: { min: Vec3; max: Vec3 };
  /** Range of path distance in 1/Å. */
  pathDistanceRange: { min: number; max: number };
  /** Range of energy in eV. */
  energyRange: { min: number; max: number };
  ticks: AxisTick[];
  hasSigma: boolean;
  hasWeight: boolean;
  hasLabel: boolean;
  /** The delimiter the file was read with (detected when the mapping says "auto"). */
  delimiter: Delimiter;
}

/**
 * Summarises parsed points in one pass.
 * @param points - at least one point
 */
export function summarisePoints(points: readonly DataPoint[], ticks: AxisTick[], delimiter: Delimiter): DatasetSummary {
  const bands = new Set<number>();
  const kMin: Vec3 = [Infinity, Infinity, Infinity];
  const kMax: Vec3 = [-Infinity, -Infinity, -Infinity];
  let kPointCount = 0;
  let dMin = Infinity, dMax = -Infinity, eMin = Infinity, eMax = -Infinity;
  let hasSigma = false, hasWeight = false, hasLabel = false;
  for (const p of points) {
    bands.add(p.band);
    for (let i = 0; i < 3; i++) {
      kMin[i] = Math.min(kMin[i], p.k[i]);
      kMax[i] = Math.max(kMax[i], p.k[i]);
    }
    kPointCount = Math.max(kPointCount, p.kIndex + 1);
    dMin = Math.min(dMin, p.pathDistance);
    dMax = Math.max(dMax, p.pathDistance);
    eMin = Math.min(eMin, p.energy);
    eMax = Math.max(eMax, p.energy);
    hasSigma ||= p.sigma !== undefined;
    hasWeight ||= p.weight !== undefined;
    hasLabel ||= p.label !== undefined;
  }
  return {
    pointCount: points.length,
    bandCount: bands.size,
    bands: [...bands].sort((a, b) => a - b),
    kPointCount,
    kRange: { min: kMin, max: kMax },
    pathDistanceRange: { min: dMin, max: dMax },
    energyRange: { min: eMin, max: eMax },
    ticks,
    hasSigma,
    hasWeight,
    hasLabel,
    delimiter,
  };
}
