import { reciprocalLattice, reducedToCartesian } from "@/lib/tb/geometry/lattice";
import type { Vec3 } from "@/lib/tb/geometry/vec3";
import { twoPiOverAToInverseAngstrom } from "@/lib/units";
import type { DatasetMapping, LabelledKPoint } from "./mapping";

type KMapping = DatasetMapping["k"];

const padded = (values: readonly number[]): Vec3 => [values[0] ?? 0, values[1] ?? 0, values[2] ?? 0];

/**
 * Builds the converter from a file's k columns to Cartesian k, for the coordinate kinds of a mapping.
 * Reduced: k = Σ κ_i b_i with a_i · b_j = 2π δ_ij; twoPiOverA: k = (2π/a) κ; Cartesian: as given.
 * Missing components are 0.
 * @param k - the validated k mapping (kind reduced, cartesian or twoPiOverA)
 * @returns a function of the k columns' values → Cartesian k in 1/Å (2π included)
 */
export function kColumnsToCartesian(k: KMapping): (values: readonly number[]) => Vec3 {
  switch (k.kind) {
    case "cartesian":
      return padded;
    case "twoPiOverA": {
      const a = k.latticeConstant as number;
      return (values) => padded(values.map((v) => twoPiOverAToInverseAngstrom(v, a)));
    }
    case "reduced": {
      const reciprocal = reciprocalLattice(k.lattice as Vec3[]);
      return (values) => reducedToCartesian(values, reciprocal);
    }
    case "path":
      throw new Error("a path-distance k has no coordinate columns");
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
