import { completeLattice, reciprocalLattice } from "./lattice";
import { type Vec3, combine, norm, sub } from "./vec3";

/** Integer multiples [n1, n2, n3] of the lattice vectors (components beyond the dimension are 0). */
export type Translation = [number, number, number];

/** One directed bond: site `from` in the home cell to site `to` in the cell displaced by `translation`. */
export interface NeighbourBond {
  readonly from: number;
  readonly to: number;
  readonly translation: Translation;
  /** R + τ_to − τ_from, Cartesian Å */
  readonly vector: Vec3;
  /** |vector|, Å */
  readonly distance: number;
  /** 1 for the nearest-neighbour shell, 2 for the next, … */
  readonly shell: number;
}

export interface NeighbourShells {
  /** shell distances in Å, ascending; `distances[s - 1]` is the distance of shell s */
  readonly distances: number[];
  /** every directed bond of shells 1..maxShell (both directions of each pair are listed) */
  readonly bonds: NeighbourBond[];
}

/** Options of {@link findNeighbourShells}. */
export interface ShellSearchOptions {
  /** number of distance shells to collect, ≥ 1 */
  maxShell: number;
  /** distances closer than this are one shell, Å; default 1e-3 */
  tolerance?: number;
}

/**
 * Neighbour shells found from geometry: all site pairs and translations, grouped by distance into shells
 * (distances within `tolerance` are one shell). Shell numbering is global over all site pairs, so in
 * zinc-blende shell 1 is the anion–cation bond and shell 2 the like-atom bond.
 * @param lattice - 1–3 lattice vectors, Cartesian Å
 * @param positions - site positions, fractional coordinates of the (completed) lattice vectors
 */
export function findNeighbourShells(
  lattice: readonly Vec3[],
  positions: readonly Vec3[],
  options: ShellSearchOptions,
): NeighbourShells {
  const tolerance = options.tolerance ?? 1e-3;
  const full = completeLattice(lattice);
  const cartesian = positions.map((p) => combine(p, full));
  const reciprocal = reciprocalLattice(lattice);
  const cellSpan = full.reduce((sum, a) => sum + norm(a), 0); // bounds |τ_j − τ_i| for positions in [0, 1)
  let cutoff = Math.max(...lattice.map(norm)) * 1.01;
  for (;;) {
    const candidates = bondsWithin(cutoff);
    const distances = groupDistances(candidates.map((b) => b.distance), tolerance);
    // Shells are complete only if a further shell lies inside the cutoff (or the search is exhaustive).
    if (distances.length > options.maxShell || cutoff > 1e3) {
      const kept = distances.slice(0, options.maxShell);
      const bonds = candidates
        .map((b) => ({ ...b, shell: kept.findIndex((d) => Math.abs(d - b.distance) <= tolerance) + 1 }))
        .filter((b) => b.shell > 0);
      return { distances: kept, bonds };
    }
    cutoff *= 1.6;
  }

  function bondsWithin(cutoff: number): Omit<NeighbourBond, "shell">[] {
    const ranges = reciprocal.map((b) => Math.ceil(((cutoff + cellSpan) * norm(b)) / (2 * Math.PI)));
    const found: Omit<NeighbourBond, "shell">[] = [];
    const [r1, r2 = 0, r3 = 0] = ranges;
    for (let n1 = -r1; n1 <= r1; n1++)
      for (let n2 = -r2; n2 <= r2; n2++)
        for (let n3 = -r3; n3 <= r3; n3++) {
          const translation: Translation = [n1, n2, n3];
          const shift = combine(translation, full);
          for (let i = 0; i < cartesian.length; i++)
            for (let j = 0; j < cartesian.length; j++) {
              const vector = sub([shift[0] + cartesian[j][0], shift[1] + cartesian[j][1], shift[2] + cartesian[j][2]], cartesian[i]);
              const distance = norm(vector);
              if (distance > tolerance && distance <= cutoff)
                found.push({ from: i, to: j, translation, vector, distance });
            }
        }
    return found;
  }
}

/** Zero-length separations between distinct sites (or a site and its own image): pairs that coincide. */
export function coincidentSites(lattice: readonly Vec3[], positions: readonly Vec3[], tolerance = 1e-3) {
  const full = completeLattice(lattice);
  const cartesian = positions.map((p) => combine(p, full));
  const pairs: [number, number][] = [];
  for (let i = 0; i < cartesian.length; i++)
    for (let j = i + 1; j < cartesian.length; j++) {
      // Reduce the fractional difference into the home cell to catch images too.
      const diff = positions[j].map((x, c) => (c < lattice.length ? x - positions[i][c] - Math.round(x - positions[i][c]) : x - positions[i][c])) as Vec3;
      if (norm(combine(diff, full)) <= tolerance) pairs.push([i, j]);
    }
  return pairs;
}

function groupDistances(values: number[], tolerance: number): number[] {
  const sorted = [...values].sort((a, b) => a - b);
  const shells: number[] = [];
  for (const d of sorted) if (shells.length === 0 || d - shells[shells.length - 1] > tolerance) shells.push(d);
  return shells;
}
