import type { IssueCollector } from "./issues";
import { columnsToCartesianInPlace } from "./kCoordinates";
import { KPointIndex } from "./kPointIndex";
import { placePathVertices, interpolateAlongPath } from "./kPath";
import type { DatasetMapping } from "./mapping";
import { type AxisTick, assignPathCoordinates } from "./pathCoordinates";
import type { PointTable, PointTableBuilder } from "./pointTable";

export interface ResolvedTable {
  table: PointTable;
  ticks: AxisTick[];
  warnings: string[];
}

/** File distances within this fraction of the path length are taken as given (1/Å), not rescaled. */
const PATH_LENGTH_TOLERANCE = 1e-3;

/**
 * Turns the rows' k values into Cartesian k, numbers the distinct k-points and gives every point its path
 * coordinate.
 *
 * k given as coordinates: the path coordinate is shared by all bands at one k (see `assignPathCoordinates`:
 * collinear cuts by projection, polylines by cumulative |Δk|, cuts laid end to end).
 *
 * k given as path distance: vertices are placed at their cumulative Cartesian distances; file distances
 * that span the vertices' length (within 0.1 %) are used as given, otherwise they are shifted to start at
 * 0 and scaled to the path's length, with a warning; k is interpolated linearly inside each segment.
 * @param rows - the points read from the rows, k columns still holding the file's values
 * @param mapping - the validated mapping
 * @param pause - awaited between the steps (each one pass over the points)
 */
export async function resolvePoints(
  rows: PointTableBuilder,
  mapping: DatasetMapping,
  issues: IssueCollector,
  pause: () => Promise<void>,
): Promise<ResolvedTable | null> {
  return mapping.k.kind === "path" ? resolvePathDistances(rows, mapping, issues, pause) : resolveCoordinates(rows, mapping, pause);
}

function numberKPoints(rows: PointTableBuilder): { kIndex: Int32Array; kPoints: KPointIndex } {
  const kPoints = new KPointIndex();
  const kIndex = new Int32Array(rows.length);
  for (let i = 0; i < rows.length; i++) kIndex[i] = kPoints.indexOf(rows.kx[i], rows.ky[i], rows.kz[i]);
  return { kIndex, kPoints };
}

async function resolveCoordinates(rows: PointTableBuilder, mapping: DatasetMapping, pause: () => Promise<void>): Promise<ResolvedTable> {
  columnsToCartesianInPlace(mapping.k, rows);
  await pause();
  const { kIndex, kPoints } = numberKPoints(rows);
  await pause();
  const band = rows.band.subarray(0, rows.length);
  const coordinates = assignPathCoordinates({
    kIndex,
    band,
    cut: rows.labelId?.subarray(0, rows.length) ?? null,
    cutNames: rows.labels,
    kx: kPoints.xs,
    ky: kPoints.ys,
    kz: kPoints.zs,
    kCount: kPoints.size,
    vertices: mapping.k.path ? placePathVertices(mapping.k.path, mapping.k.lattice) : [],
  });
  return { table: rows.finish(kIndex, coordinates.pathDistance), ticks: coordinates.ticks, warnings: coordinates.warnings };
}

async function resolvePathDistances(
  rows: PointTableBuilder,
  mapping: DatasetMapping,
  issues: IssueCollector,
  pause: () => Promise<void>,
): Promise<ResolvedTable | null> {
  const vertices = placePathVertices(mapping.k.path ?? [], mapping.k.lattice);
  const length = vertices.at(-1)?.distance ?? 0;
  if (!(length > 0)) {
    issues.addRow(null, "the labelled points of the path all lie at the same k; the path has no length");
    return null;
  }
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < rows.length; i++) {
    min = Math.min(min, rows.kx[i]);
    max = Math.max(max, rows.kx[i]);
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
  const pathDistance = new Float64Array(rows.length);
  let segment = 0;
  for (let i = 0; i < rows.length; i++) {
    const s = (rows.kx[i] - offset) * factor;
    const at = interpolateAlongPath(vertices, s, segment);
    segment = at.segment;
    pathDistance[i] = s;
    [rows.kx[i], rows.ky[i], rows.kz[i]] = at.k;
  }
  await pause();
  const { kIndex } = numberKPoints(rows);
  return {
    table: rows.finish(kIndex, pathDistance),
    ticks: vertices.map((v) => ({ label: v.label, pathDistance: v.distance })),
    warnings,
  };
}
