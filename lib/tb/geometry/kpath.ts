import { type Vec3, norm, sub } from "./vec3";

/** A labelled vertex of a k-path. */
export interface KPathVertex {
  /** point label, e.g. "Γ", "X", "K" */
  label: string;
  /** Cartesian wave vector, 1/Å (2π included) */
  k: Vec3;
  /** true: the path jumps to this vertex from the previous one (no points between, no distance added) */
  jump?: boolean;
}

/** Point density of a k-path: either per unit path length or a total count. */
export type KPathDensity = { pointsPerInverseAngstrom: number } | { totalPoints: number };

export interface KPathTick {
  /** the vertex label; at a jump the two labels are joined, "U|K" */
  label: string;
  /** path distance of the tick, 1/Å */
  distance: number;
  /** index into `k` of the point at the tick (at a jump: the first point after it) */
  index: number;
}

export interface KPath {
  /** Cartesian k-points, 1/Å */
  k: Vec3[];
  /** cumulative path distance of each point, 1/Å */
  distance: number[];
  ticks: KPathTick[];
}

/**
 * Samples a piecewise-linear path through labelled vertices. Each segment gets at least one interval;
 * both ends of every segment are included once (segment ends are shared), and at a jump both the
 * vertex before and the vertex after appear as points at the same distance.
 * @param vertices - at least two vertices, Cartesian 1/Å; the first must not be a jump
 * @param density - points per 1/Å of path, or the total number of points (≥ number of vertices)
 */
export function buildKPath(vertices: readonly KPathVertex[], density: KPathDensity): KPath {
  if (vertices.length < 2) throw new Error("a k-path needs at least two vertices");
  if (vertices[0].jump) throw new Error("the first vertex of a k-path cannot be a jump");
  const lengths = vertices.slice(1).map((v, i) => (v.jump ? 0 : norm(sub(v.k, vertices[i].k))));
  const drawn = lengths.filter((l, i) => !vertices[i + 1].jump);
  const totalLength = drawn.reduce((s, l) => s + l, 0);
  const intervals = intervalsPerSegment(lengths, vertices, density, totalLength);

  const k: Vec3[] = [vertices[0].k];
  const distance: number[] = [0];
  const ticks: KPathTick[] = [{ label: vertices[0].label, distance: 0, index: 0 }];
  let travelled = 0;
  for (let s = 0; s < lengths.length; s++) {
    const start = vertices[s].k;
    const end = vertices[s + 1];
    if (end.jump) {
      k.push(end.k);
      distance.push(travelled);
      const last = ticks[ticks.length - 1];
      ticks[ticks.length - 1] = { label: `${last.label}|${end.label}`, distance: travelled, index: k.length - 1 };
      continue;
    }
    const steps = intervals[s];
    for (let i = 1; i <= steps; i++) {
      const t = i / steps;
      k.push([start[0] + t * (end.k[0] - start[0]), start[1] + t * (end.k[1] - start[1]), start[2] + t * (end.k[2] - start[2])]);
      distance.push(travelled + t * lengths[s]);
    }
    travelled += lengths[s];
    ticks.push({ label: end.label, distance: travelled, index: k.length - 1 });
  }
  return { k, distance, ticks };
}

function intervalsPerSegment(
  lengths: number[],
  vertices: readonly KPathVertex[],
  density: KPathDensity,
  totalLength: number,
): number[] {
  const segments = lengths.filter((_, i) => !vertices[i + 1].jump).length;
  const jumps = lengths.length - segments;
  let perLength: number;
  if ("totalPoints" in density) {
    // points = 1 + Σ intervals + jumps
    const available = density.totalPoints - 1 - jumps;
    if (available < segments) throw new Error(`totalPoints must be at least ${segments + 1 + jumps} for this path`);
    perLength = totalLength > 0 ? available / totalLength : 0;
    const raw = lengths.map((l, i) => (vertices[i + 1].jump ? 0 : Math.max(1, Math.round(l * perLength))));
    // Correct rounding so the total is exact: adjust the longest segments first.
    let excess = raw.reduce((s, x) => s + x, 0) - available;
    const byLength = lengths.map((l, i) => i).filter((i) => !vertices[i + 1].jump).sort((a, b) => lengths[b] - lengths[a]);
    for (let pass = 0; excess !== 0 && pass < 10 * byLength.length; pass++) {
      const i = byLength[pass % byLength.length];
      if (excess > 0 && raw[i] > 1) {
        raw[i]--;
        excess--;
      } else if (excess < 0) {
        raw[i]++;
        excess++;
      }
    }
    return raw;
  }
  perLength = density.pointsPerInverseAngstrom;
  if (!(perLength > 0)) throw new Error("pointsPerInverseAngstrom must be positive");
  return lengths.map((l, i) => (vertices[i + 1].jump ? 0 : Math.max(1, Math.round(l * perLength))));
}
