import type { Vec3 } from "@/lib/tb/geometry/vec3";
import type { PathVertex } from "./kPath";

/** A labelled position on the path-distance axis. */
export interface AxisTick {
  label: string;
  /** 1/Å */
  pathDistance: number;
}

/**
 * A cut's distinct k-points count as collinear when none lies farther from the line through them than this
 * fraction of the cut's length: 0.1 % absorbs the rounding of k printed to 4–6 digits (a 0.5 1/Å cut
 * printed to 1e-5 1/Å deviates by about 1e-5), while a polyline's corner deviates by a sizeable part of its
 * length.
 */
export const COLLINEAR_TOLERANCE = 1e-3;
/** Space left between consecutive cuts on the axis: this fraction of the summed cut lengths (1/Å). */
export const CUT_GAP_FRACTION = 0.05;
/** The gap when every cut is a single k-point (summed length 0), 1/Å. */
const SINGLE_POINT_CUTS_GAP = 1;
/** Cartesian k closer than this (1/Å) counts as the same labelled point; files print about 6–8 digits. */
const LABELLED_POINT_TOLERANCE = 1e-5;

/** What the path coordinate needs of the parsed points. */
export interface PathCoordinateInput {
  /** Points in file order: their distinct-k index, band, and cut (−1: no cut); null cut = one group. */
  kIndex: Int32Array;
  band: Int32Array;
  cut: Int32Array | null;
  /** Names of the cuts by id. */
  cutNames: readonly string[];
  /** Cartesian components of the distinct k-points (1/Å), by k index; `kCount` entries used. */
  kx: Float64Array;
  ky: Float64Array;
  kz: Float64Array;
  kCount: number;
  /** Labelled points of the mapping (Cartesian k): ticks where the axis passes them. */
  vertices: readonly PathVertex[];
}

export interface PathCoordinates {
  /** Per point, 1/Å. */
  pathDistance: Float64Array;
  /** Cut names at the start of their cuts and labelled points, ordered along the axis. */
  ticks: AxisTick[];
  warnings: string[];
}

/** The positions of one cut's k-points along its own axis, before the cuts are laid end to end. */
interface CutAxis {
  /** Distinct k index of each station (position on the axis) in axis order, and its distance (1/Å). */
  stationK: number[];
  stationDistance: number[];
  length: number;
}

/**
 * One path coordinate per distinct k-point, shared by all bands, so that branches starting at different k
 * line up on the chart's x axis.
 *
 * Points are grouped by cut (the mapping's label column; without one the file is a single cut), cuts in
 * order of first appearance. Within a cut:
 * - when its distinct k-points are collinear (within {@link COLLINEAR_TOLERANCE}), a point's coordinate is
 *   its k projected onto the cut's direction, measured from the cut's smallest projection; the direction
 *   points the way its largest Cartesian component grows, so the axis is ordered by k (photoemission cuts);
 * - otherwise (a polyline such as L–Γ–X–W–K–Γ) the k-points are put in order of first appearance in the file
 *   and the coordinate is the cumulative |Δk| along them. Each band walks forward along that sequence: a
 *   k-point the band reaches again after leaving it (the second Γ) is a new position, so k-major and
 *   band-major files give the same axis and a revisited vertex keeps both positions.
 * Cuts follow each other with a gap of {@link CUT_GAP_FRACTION} of the summed cut lengths and a tick with
 * the cut's name at its start. Labelled points become ticks where the axis first passes them, in order.
 */
export function assignPathCoordinates(input: PathCoordinateInput): PathCoordinates {
  const n = input.kIndex.length;
  const { order, starts, cutOfGroup, groupOfPoint } = groupByCut(input);
  const pathDistance = new Float64Array(n);
  const axes: CutAxis[] = [];
  const seen = new Int32Array(input.kCount).fill(-1);
  const scratch = new Float64Array(input.kCount);
  for (let g = 0; g < cutOfGroup.length; g++) {
    const points = order.subarray(starts[g], starts[g + 1]);
    const distinct: number[] = [];
    for (const i of points) {
      const k = input.kIndex[i];
      if (seen[k] !== g) {
        seen[k] = g;
        distinct.push(k);
      }
    }
    axes.push(
      collinearAxis(input, distinct, points, scratch, pathDistance) ?? polylineAxis(input, points, pathDistance),
    );
  }

  const total = axes.reduce((sum, a) => sum + a.length, 0);
  const gap = total > 0 ? CUT_GAP_FRACTION * total : SINGLE_POINT_CUTS_GAP;
  const offsets: number[] = [];
  let offset = 0;
  for (const axis of axes) {
    offsets.push(offset);
    offset += axis.length + gap;
  }
  for (let i = 0; i < n; i++) pathDistance[i] += offsets[groupOfPoint[i]];

  const ticks: AxisTick[] = [];
  cutOfGroup.forEach((cut, g) => {
    if (cut >= 0) ticks.push({ label: input.cutNames[cut], pathDistance: offsets[g] });
  });
  const warnings = vertexTicks(input, axes, offsets, ticks);
  ticks.sort((a, b) => a.pathDistance - b.pathDistance);
  return { pathDistance, ticks, warnings };
}

/** Point indices ordered by cut (stable), the cuts' start offsets in that order, and each point's group. */
function groupByCut(input: PathCoordinateInput) {
  const n = input.kIndex.length;
  const groupOfPoint = new Int32Array(n);
  const cutOfGroup: number[] = [];
  if (input.cut) {
    const groupOfCut = new Int32Array(input.cutNames.length + 1).fill(-1);
    for (let i = 0; i < n; i++) {
      const key = input.cut[i] + 1;
      if (groupOfCut[key] === -1) groupOfCut[key] = cutOfGroup.push(input.cut[i]) - 1;
      groupOfPoint[i] = groupOfCut[key];
    }
  } else if (n > 0) cutOfGroup.push(-1);
  const starts = new Int32Array(cutOfGroup.length + 1);
  for (let i = 0; i < n; i++) starts[groupOfPoint[i] + 1]++;
  for (let g = 0; g < cutOfGroup.length; g++) starts[g + 1] += starts[g];
  const next = starts.slice(0, cutOfGroup.length);
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[next[groupOfPoint[i]]++] = i;
  return { order, starts, cutOfGroup, groupOfPoint };
}

/**
 * The projection axis of a collinear cut, writing each point's distance; null when the cut is not
 * collinear. A cut of one k-point is collinear with length 0.
 */
function collinearAxis(
  input: PathCoordinateInput,
  distinct: readonly number[],
  points: Int32Array,
  projection: Float64Array,
  pathDistance: Float64Array,
): CutAxis | null {
  const { kx, ky, kz } = input;
  const p0 = distinct[0];
  let far = p0;
  let farDistance = 0;
  for (const k of distinct) {
    const d = Math.hypot(kx[k] - kx[p0], ky[k] - ky[p0], kz[k] - kz[p0]);
    if (d > farDistance) {
      far = k;
      farDistance = d;
    }
  }
  if (farDistance === 0) return { stationK: [p0], stationDistance: [0], length: 0 };
  let u: Vec3 = [(kx[far] - kx[p0]) / farDistance, (ky[far] - ky[p0]) / farDistance, (kz[far] - kz[p0]) / farDistance];
  const largest = [0, 1, 2].reduce((best, c) => (Math.abs(u[c]) > Math.abs(u[best]) ? c : best), 0);
  if (u[largest] < 0) u = [-u[0], -u[1], -u[2]];

  let min = Infinity;
  let max = -Infinity;
  let worstOffLine = 0;
  for (const k of distinct) {
    const dx = kx[k] - kx[p0], dy = ky[k] - ky[p0], dz = kz[k] - kz[p0];
    const along = dx * u[0] + dy * u[1] + dz * u[2];
    worstOffLine = Math.max(worstOffLine, Math.hypot(dx - along * u[0], dy - along * u[1], dz - along * u[2]));
    projection[k] = along;
    min = Math.min(min, along);
    max = Math.max(max, along);
  }
  if (worstOffLine > COLLINEAR_TOLERANCE * (max - min)) return null;
  for (const i of points) pathDistance[i] = projection[input.kIndex[i]] - min;
  const stationK = [...distinct].sort((a, b) => projection[a] - projection[b]);
  return { stationK, stationDistance: stationK.map((k) => projection[k] - min), length: max - min };
}

/**
 * The polyline axis of a cut: positions in order of first appearance, each band walking forward along them
 * (a k-point met again after the band left it is a new position); cumulative |Δk| along the positions.
 */
function polylineAxis(input: PathCoordinateInput, points: Int32Array, pathDistance: Float64Array): CutAxis {
  const stationK: number[] = [];
  // Positions holding each k index, ascending: the first in `firstStation`, later ones chained in `nextStation`.
  const firstStation = new Map<number, number>();
  const nextStation: number[] = [];
  const lastStation = new Map<number, number>();
  const cursor = new Map<number, number>();
  const stationOfPoint = new Int32Array(points.length);
  points.forEach((i, j) => {
    const k = input.kIndex[i];
    const at = cursor.get(input.band[i]);
    let station = -1;
    if (at !== undefined && stationK[at] === k) station = at;
    else
      for (let s = firstStation.get(k) ?? -1; s !== -1; s = nextStation[s])
        if (at === undefined || s > at) {
          station = s;
          break;
        }
    if (station === -1) {
      station = stationK.push(k) - 1;
      nextStation.push(-1);
      const last = lastStation.get(k);
      if (last === undefined) firstStation.set(k, station);
      else nextStation[last] = station;
      lastStation.set(k, station);
    }
    cursor.set(input.band[i], station);
    stationOfPoint[j] = station;
  });
  const { kx, ky, kz } = input;
  const stationDistance = new Array<number>(stationK.length);
  let distance = 0;
  stationK.forEach((k, s) => {
    if (s > 0) {
      const p = stationK[s - 1];
      distance += Math.hypot(kx[k] - kx[p], ky[k] - ky[p], kz[k] - kz[p]);
    }
    stationDistance[s] = distance;
  });
  points.forEach((i, j) => (pathDistance[i] = stationDistance[stationOfPoint[j]]));
  return { stationK, stationDistance, length: distance };
}

/** Adds a tick per labelled point where the axis first passes it after the previous one; warns for misses. */
function vertexTicks(input: PathCoordinateInput, axes: readonly CutAxis[], offsets: readonly number[], ticks: AxisTick[]): string[] {
  const warnings: string[] = [];
  let fromAxis = 0;
  let fromStation = 0;
  for (const v of input.vertices) {
    let found = false;
    for (let g = fromAxis; g < axes.length && !found; g++) {
      const axis = axes[g];
      for (let s = g === fromAxis ? fromStation : 0; s < axis.stationK.length; s++) {
        const k = axis.stationK[s];
        if (Math.hypot(input.kx[k] - v.k[0], input.ky[k] - v.k[1], input.kz[k] - v.k[2]) >= LABELLED_POINT_TOLERANCE) continue;
        ticks.push({ label: v.label, pathDistance: offsets[g] + axis.stationDistance[s] });
        fromAxis = g;
        fromStation = s + 1;
        found = true;
        break;
      }
    }
    if (!found) warnings.push(`labelled point ${v.label} is not among the file's k-points (after the previous one); it has no tick`);
  }
  return warnings;
}
