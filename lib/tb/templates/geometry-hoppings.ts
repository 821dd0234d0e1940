import { findNeighbourShells } from "../geometry/shells";
import type { HoppingEntry } from "../model/schema";
import type { TemplateGeometry } from "./types";

/**
 * Explicit hoppings between one orbital per site for shells 1..names.length, found from the geometry so
 * that any cell (rotated, other primitive vectors) gets the right neighbours. One entry per Hermitian
 * pair: the partner is added by the compiler.
 * @param names - parameter of each shell (shell 1 first)
 * @param factor - multiplies each parameter (−1 for the convention H = −t Σ c†c)
 */
export function shellHoppings(geometry: TemplateGeometry, orbital: string, names: string[], factor: number): HoppingEntry[] {
  const shells = findNeighbourShells(geometry.lattice, geometry.sites.map((s) => s.position), { maxShell: names.length });
  return shells.bonds
    .filter((b) => b.from < b.to || (b.from === b.to && isPositive(b.translation)))
    .map((b) => ({
      from: `${geometry.sites[b.from].label}:${orbital}`,
      to: `${geometry.sites[b.to].label}:${orbital}`,
      translation: b.translation,
      parameter: names[b.shell - 1],
      factor,
    }));
}

/** Lexicographically positive translations pick one of ±R. */
function isPositive(t: [number, number, number]): boolean {
  for (const n of t) if (n !== 0) return n > 0;
  return false;
}

/** Shell distances (Å) of a geometry, for distance-scaled default values. */
export function shellDistances(geometry: TemplateGeometry, maxShell: number): number[] {
  return findNeighbourShells(geometry.lattice, geometry.sites.map((s) => s.position), { maxShell }).distances;
}
