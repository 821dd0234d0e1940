import { type Vec3, add, norm, scale, sub } from "@/lib/tb/geometry/vec3";
import { labelledPointToCartesian } from "./kCoordinates";
import type { LabelledKPoint } from "./mapping";

/** A vertex of a k-path with its Cartesian k (1/Å) and its distance from the first vertex (1/Å). */
export interface PathVertex {
  label: string;
  k: Vec3;
  distance: number;
}

/**
 * Places labelled points along a polyline: distance = cumulative |Δk| between consecutive vertices.
 * @param points - the vertices in path order
 * @param lattice - real-space lattice in Å (for reduced vertices)
 */
export function placePathVertices(points: readonly LabelledKPoint[], lattice: readonly Vec3[] | undefined): PathVertex[] {
  const vertices: PathVertex[] = [];
  for (const p of points) {
    const k = labelledPointToCartesian(p, lattice);
    const previous = vertices.at(-1);
    const distance = previous ? previous.distance + norm(sub(k, previous.k)) : 0;
    vertices.push({ label: p.label, k, distance });
  }
  return vertices;
}

/**
 * The Cartesian k at distance s along a path, by linear interpolation inside the segment that holds s.
 * Distances before the start or past the end are clamped to the end vertices.
 * @param path - vertices from {@link placePathVertices} (total length > 0)
 * @param s - distance along the path in 1/Å
 * @param hint - segment index to start searching from (the previous call's answer; files are mostly sorted)
 * @returns Cartesian k in 1/Å and the segment index used
 */
export function interpolateAlongPath(path: readonly PathVertex[], s: number, hint = 0): { k: Vec3; segment: number } {
  const last = path.length - 2;
  let i = Math.min(Math.max(hint, 0), last);
  while (i > 0 && s < path[i].distance) i--;
  while (i < last && s > path[i + 1].distance) i++;
  const from = path[i];
  const to = path[i + 1];
  const length = to.distance - from.distance;
  const t = length > 0 ? Math.min(Math.max((s - from.distance) / length, 0), 1) : 0;
  return { k: add(from.k, scale(sub(to.k, from.k), t)), segment: i };
}
