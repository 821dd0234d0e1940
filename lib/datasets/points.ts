import type { Vec3 } from "@/lib/tb/geometry/vec3";
import { norm, sub } from "@/lib/tb/geometry/vec3";
import type { IssueCollector } from "./issues";
import { kColumnsToCartesian } from "./kCoordinates";
import { placePathVertices, interpolateAlongPath } from "./kPath";
import type { DatasetMapping } from "./mapping";
import type { RawPoint } from "./rowReader";

/** One band energy of a dataset. */
export interface DataPoint {
  /** Cartesian wave vector in 1/Å (2π included); components the file does not give are 0. */
  k: Vec3;
  /** Distance along the data's own k sequence in 1/Å (see {@link resolvePoints}). */
  pathDistance: number;
  /** Data band index, 1-based, as in the file (wide format: the energy column's position). */
  band: number;
  /** Energy in eV. */
  energy: number;
  /** Uncertainty of the energy in eV, when the file gives one. */
  sigma?: number;
  /** User weight (≥ 0), when the file gives one. */
  weight?: number;
  /** Branch or cut label, when the file gives one. */
  label?: string;
  /** Index (0-based) of the distinct k-point: points with equal k share it, whichever band or row. */
  kIndex: number;
  /** Line of the file the point was read from (1-based). */
  row: number;
}

/** A labelled position on the path-distance axis. */
export interface AxisTick {
  label: string;
  /** 1/Å */
  pathDistance: number;
}

export interface ResolvedPoints {
  points: DataPoint[];
  ticks: AxisTick[];
  warnings: string[];
}

/** Cartesian k closer than this (1/Å) counts as the same labelled point; files print about 6–8 digits. */
const LABELLED_POINT_TOLERANCE = 1e-5;
/** File distances within this fraction of the path length are taken as given (1/Å), not rescaled. */
const PATH_LENGTH_TOLERANCE = 1e-3;

const kKey = (k: Vec3): string => `${k[0]},${k[1]},${k[2]}`;

class KPointIndex {
  private readonly byKey = new Map<string, number>();
  get size(): number {
    return this.byKey.size;
  }
  indexOf(k: Vec3): number {
    const key = kKey(k);
    let index = this.byKey.get(key);
    if (index === undefined) this.byKey.set(key, (index = this.byKey.size));
    return index;
  }
}

const withOptionalFields = (raw: RawPoint, k: Vec3, pathDistance: number, kIndex: number): DataPoint => {
  const point: DataPoint = { k, pathDistance, band: raw.band, energy: raw.energy, kIndex, row: raw.row };
  if (raw.sigma !== undefined) point.sigma = raw.sigma;
  if (raw.weight !== undefined) point.weight = raw.weight;
  if (raw.label !== undefined) point.label = raw.label;
  return point;
};

/**
 * Turns raw rows into points with Cartesian k, path distance and distinct-k index.
 *
 * k given as coordinates: each band's path distance is the cumulative |Δk| over that band's own points in
 * file order, starting at 0. So a k-major file (all bands at one k, then the next k) and a band-major file
 * (one band along the whole path, then the next) give the same axis, and a vertex visited twice (Γ in
 * L–Γ–X–W–K–Γ) keeps both its positions. A jump between two cuts counts with its full |Δk|, leaving a gap
 * on the axis. Labelled points of the mapping become ticks where the first band passes them, in order.
 *
 * k given as path distance: vertices are placed at their cumulative Cartesian distances; file distances
 * that span the vertices' length (within 0.1 %) are used as given, otherwise they are shifted to start at
 * 0 and scaled to the path's length, with a warning; k is interpolated linearly inside each segment.
 * @param raw - points read from the rows, in file order
 * @param mapping - the validated mapping
 */
export function resolvePoints(raw: readonly RawPoint[], mapping: DatasetMapping, issues: IssueCollector): ResolvedPoints | null {
  return mapping.k.kind === "path" ? resolvePathDistances(raw, mapping, issues) : resolveCoordinates(raw, mapping);
}

function resolveCoordinates(raw: readonly RawPoint[], mapping: DatasetMapping): ResolvedPoints {
  const toCartesian = kColumnsToCartesian(mapping.k);
  const kPoints = new KPointIndex();
  const lastOfBand = new Map<number, { k: Vec3; distance: number }>();
  let previousValues: readonly number[] | null = null;
  let previousK: Vec3 = [0, 0, 0];
  const points = raw.map((r) => {
    // Wide rows share one k array across their bands: convert it once.
    const k = r.kValues === previousValues ? previousK : toCartesian(r.kValues);
    previousValues = r.kValues;
    previousK = k;
    const last = lastOfBand.get(r.band);
    const distance = last ? last.distance + norm(sub(k, last.k)) : 0;
    lastOfBand.set(r.band, { k, distance });
    return withOptionalFields(r, k, distance, kPoints.indexOf(k));
  });

  const ticks: AxisTick[] = [];
  const warnings: string[] = [];
  const labelled = mapping.k.path;
  if (labelled && points.length > 0) {
    const lattice = mapping.k.lattice;
    const firstBand = points.filter((p) => p.band === points[0].band);
    const vertices = placePathVertices(labelled, lattice);
    let from = 0;
    for (const v of vertices) {
      const at = firstBand.findIndex((p, i) => i >= from && norm(sub(p.k, v.k)) < LABELLED_POINT_TOLERANCE);
      if (at === -1) {
        warnings.push(`labelled point ${v.label} is not among the file's k-points (after the previous one); it has no tick`);
        continue;
      }
      ticks.push({ label: v.label, pathDistance: firstBand[at].pathDistance });
      from = at + 1;
    }
  }
  return { points, ticks, warnings };
}

function resolvePathDistances(raw: readonly RawPoint[], mapping: DatasetMapping, issues: IssueCollector): ResolvedPoints | null {
  const vertices = placePathVertices(mapping.k.path ?? [], mapping.k.lattice);
  const length = vertices.at(-1)?.distance ?? 0;
  if (!(length > 0)) {
    issues.addRow(null, "the labelled points of the path all lie at the same k; the path has no length");
    return null;
  }
  let min = Infinity;
  let max = -Infinity;
  for (const r of raw) {
    min = Math.min(min, r.kValues[0]);
    max = Math.max(max, r.kValues[0]);
  }
  if (!(max > min)) {
    issues.addRow(null, "every row has the same path distance; a path needs points at two distances at least");
    return null;
  }
  const tolerance = PATH_LENGTH_TOLERANCE * length;
  const asGiven = Math.abs(min) <= tolerance && Math.abs(max - length) <= tolerance;
  const offset = asGiven ? 0 : min;
  const factor = asGiven ? 1 : length / (max - min);
  const warnings = asGiven
    ? []
    : [
        `the file's distances run from ${min} to ${max}, but the labelled points span ${length.toFixed(6)} 1/Å: ` +
          `distances were shifted by ${-min} and scaled by ${factor.toPrecision(6)} to fit the path`,
      ];
  const kPoints = new KPointIndex();
  let segment = 0;
  const points = raw.map((r) => {
    const s = (r.kValues[0] - offset) * factor;
    const at = interpolateAlongPath(vertices, s, segment);
    segment = at.segment;
    return withOptionalFields(r, at.k, s, kPoints.indexOf(at.k));
  });
  return { points, ticks: vertices.map((v) => ({ label: v.label, pathDistance: v.distance })), warnings };
}
