import { type Vec3, combine, cross, dot, norm, scale } from "./vec3";

/**
 * Completes 1 or 2 lattice vectors to three, so that lower-dimensional crystals share the 3D formulas.
 * Added vectors are unit-length (Å) and perpendicular to the given ones; they never enter a Bloch phase
 * because lower-dimensional models have no translations along them.
 * @param lattice - 1, 2 or 3 lattice vectors a_i in Å (Cartesian)
 */
export function completeLattice(lattice: readonly Vec3[]): [Vec3, Vec3, Vec3] {
  if (lattice.length === 3) return [lattice[0], lattice[1], lattice[2]];
  if (lattice.length === 2) {
    const n = cross(lattice[0], lattice[1]);
    return [lattice[0], lattice[1], scale(n, 1 / norm(n))];
  }
  if (lattice.length === 1) {
    const a = lattice[0];
    // Any vector not parallel to a gives a perpendicular pair.
    const helper: Vec3 = Math.abs(a[0]) < 0.9 * norm(a) ? [1, 0, 0] : [0, 1, 0];
    const u = cross(a, helper);
    const uHat = scale(u, 1 / norm(u));
    const v = cross(a, uHat);
    return [a, uHat, scale(v, 1 / norm(v))];
  }
  throw new Error(`a lattice has 1, 2 or 3 vectors, got ${lattice.length}`);
}

/**
 * Reciprocal lattice vectors b_j with a_i · b_j = 2π δ_ij (Ashcroft & Mermin, ch. 5, eq. 5.3).
 * @param lattice - 1, 2 or 3 lattice vectors in Å
 * @returns as many reciprocal vectors as lattice vectors, in 1/Å (2π included)
 */
export function reciprocalLattice(lattice: readonly Vec3[]): Vec3[] {
  const [a1, a2, a3] = completeLattice(lattice);
  const volume = dot(a1, cross(a2, a3));
  if (Math.abs(volume) < 1e-12) throw new Error("lattice vectors are linearly dependent (zero cell volume)");
  const f = (2 * Math.PI) / volume;
  const b: Vec3[] = [scale(cross(a2, a3), f), scale(cross(a3, a1), f), scale(cross(a1, a2), f)];
  return b.slice(0, lattice.length);
}

/**
 * Reduced (fractional) k → Cartesian k in 1/Å: k = Σ_i κ_i b_i.
 * @param reduced - coordinates κ_i in the reciprocal basis (as many as reciprocal vectors; missing ones 0)
 * @param reciprocal - reciprocal vectors b_i in 1/Å (2π included)
 */
export function reducedToCartesian(reduced: readonly number[], reciprocal: readonly Vec3[]): Vec3 {
  return combine(reduced.slice(0, reciprocal.length), reciprocal);
}

/**
 * Cartesian k (1/Å, 2π included) → reduced coordinates κ_i = k · a_i / 2π.
 * @param k - Cartesian wave vector in 1/Å
 * @param lattice - the real-space lattice vectors a_i in Å
 */
export function cartesianToReduced(k: Vec3, lattice: readonly Vec3[]): number[] {
  return lattice.map((a) => dot(k, a) / (2 * Math.PI));
}
