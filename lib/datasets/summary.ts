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
  /** What the upload warned about (path rescaled, one k-point, …); absent in datasets stored before. */
  warnings?: string[];
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
 * Summarises parsed points, one pass per column, with the warnings of the parse and those about the
 * summary itself (points that all share one k-point).
 * @param table - at least one point
 * @param warnings - the warnings of the k resolution
 */
export function summariseTable(table: PointTable, ticks: AxisTick[], delimiter: Delimiter, warnings: readonly string[]): DatasetSummary {
  const bands = new Set<number>();
  for (let i = 0; i < table.length; i++) bands.add(table.band[i]);
  let kPointCount = 0;
  for (let i = 0; i < table.length; i++) if (table.kIndex[i] >= kPointCount) kPointCount = table.kIndex[i] + 1;
  const kx = range(table.kx), ky = range(table.ky), kz = range(table.kz);
  const singleK =
    kPointCount === 1
      ? [
          `all ${table.length} points share one k-point, k = (${[table.kx[0], table.ky[0], table.kz[0]].map((x) => Number((x + 0).toPrecision(6))).join(", ")}) 1/Å: ` +
            "the file holds band energies but no dispersion. A fit can determine from it only what the energies at " +
            "that k-point fix (often the on-site energies), and refuses parameters they cannot separate",
        ]
      : [];
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
    warnings: [...warnings, ...singleK],
  };
}
