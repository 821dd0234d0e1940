import { reciprocalLattice, reducedToCartesian } from "@/lib/tb/geometry/lattice";
import type { Vec3 } from "@/lib/tb/geometry/vec3";
import { twoPiOverAToInverseAngstrom } from "@/lib/units";
import type { DatasetMapping, LabelledKPoint } from "./mapping";

type KMapping = DatasetMapping["k"];

const padded = (values: readonly number[]): Vec3 => [values[0] ?? 0, values[1] ?? 0, values[2] ?? 0];

/**
 * The linear map from a file's k columns to Cartesian k, as the images of the unit columns: k = Σ v_i m_i.
 * Reduced: m_i = b_i with a_i · b_j = 2π δ_ij; twoPiOverA: m_i = (2π/a) e_i; Cartesian: m_i = e_i.
 * @param k - the validated k mapping (kind reduced, cartesian or twoPiOverA)
 * @returns three vectors in 1/Å (rows beyond the lattice's dimension are 0)
 */
export function kColumnsBasis(k: KMapping): [Vec3, Vec3, Vec3] {
  switch (k.kind) {
    case "cartesian":
      return [[1, 0, 0], [0, 1, 0], [0, 0, 1]];
    case "twoPiOverA": {
      const s = twoPiOverAToInverseAngstrom(1, k.latticeConstant as number);
      return [[s, 0, 0], [0, s, 0], [0, 0, s]];
    }
    case "reduced": {
      const b = reciprocalLattice(k.lattice as Vec3[]);
      return [b[0] ?? [0, 0, 0], b[1] ?? [0, 0, 0], b[2] ?? [0, 0, 0]];
    }
    case "path":
      throw new Error("a path-distance k has no coordinate columns");
  }
}

/**
 * Builds the converter from a file's k columns to Cartesian k, for the coordinate kinds of a mapping
 * (see {@link kColumnsBasis}). Missing components are 0.
 * @param k - the validated k mapping (kind reduced, cartesian or twoPiOverA)
 * @returns a function of the k columns' values → Cartesian k in 1/Å (2π included)
 */
export function kColumnsToCartesian(k: KMapping): (values: readonly number[]) => Vec3 {
  if (k.kind === "cartesian") return padded;
  const [m0, m1, m2] = kColumnsBasis(k);
  return (values) => {
    const [v0, v1, v2] = padded(values);
    return [v0 * m0[0] + v1 * m1[0] + v2 * m2[0], v0 * m0[1] + v1 * m1[1] + v2 * m2[1], v0 * m0[2] + v1 * m1[2] + v2 * m2[2]];
  };
}

/**
 * Turns k columns holding the file's values into Cartesian k in place (no per-point arrays).
 * @param k - the validated k mapping (kind reduced, cartesian or twoPiOverA)
 * @param columns - the three k columns, first `length` entries used; Cartesian 1/Å afterwards
 */
export function columnsToCartesianInPlace(k: KMapping, columns: { kx: Float64Array; ky: Float64Array; kz: Float64Array; length: number }): void {
  if (k.kind === "cartesian") return;
  const [m0, m1, m2] = kColumnsBasis(k);
  const { kx, ky, kz } = columns;
  for (let i = 0; i < columns.length; i++) {
    const v0 = kx[i], v1 = ky[i], v2 = kz[i];
    kx[i] = v0 * m0[0] + v1 * m1[0] + v2 * m2[0];
    ky[i] = v0 * m0[1] + v1 * m1[1] + v2 * m2[1];
    kz[i] = v0 * m0[2] + v1 * m1[2] + v2 * m2[2];
  }
}

/**
 * A labelled point's Cartesian k.
 * @param point - its components, reduced or Cartesian (1/Å)
 * @param lattice - real-space lattice in Å; needed for reduced components
 * @returns Cartesian k in 1/Å (2π included)
 */
export function labelledPointToCartesian(point: LabelledKPoint, lattice: readonly Vec3[] | undefined): Vec3 {
  if (point.coordinates === "cartesian") return padded(point.k);
  if (!lattice) throw new Error(`labelled point ${point.label} is reduced but no lattice was given`);
  return reducedToCartesian(point.k, reciprocalLattice(lattice));
}
