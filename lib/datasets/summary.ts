import type { Vec3 } from "@/lib/tb/geometry/vec3";
import type { Delimiter } from "./delimiter";
import type { AxisTick } from "./pathCoordinates";
import type { PointTable } from "./pointTable";

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

const range = (values: Float64Array) => {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (values[i] < min) min = values[i];
    if (values[i] > max) max = values[i];
  }
  return { min, max };
};

/**
 * Summarises parsed points, one pass per column.
 * @param table - at least one point
 */
export function summariseTable(table: PointTable, ticks: AxisTick[], delimiter: Delimiter): DatasetSummary {
  const bands = new Set<number>();
  for (let i = 0; i < table.length; i++) bands.add(table.band[i]);
  let kPointCount = 0;
  for (let i = 0; i < table.length; i++) if (table.kIndex[i] >= kPointCount) kPointCount = table.kIndex[i] + 1;
  const kx = range(table.kx), ky = range(table.ky), kz = range(table.kz);
  return {
    pointCount: table.length,
    bandCount: bands.size,
    bands: [...bands].sort((a, b) => a - b),
    kPointCount,
    kRange: { min: [kx.min, ky.min, kz.min], max: [kx.max, ky.max, kz.max] },
    pathDistanceRange: range(table.pathDistance),
    energyRange: range(table.energy),
    ticks,
    hasSigma: table.sigma !== null,
    hasWeight: table.weight !== null,
    hasLabel: table.labelId?.some((id) => id >= 0) ?? false,
    delimiter,
  };
}
