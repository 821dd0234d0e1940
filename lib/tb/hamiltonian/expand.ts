import type { Translation } from "../geometry/shells";
import type { CompiledModel, ModelMatrix } from "../model/compile";
import { checkParameterVector } from "./prepare";

/** One real-space matrix element t_from,to(R) (eV for H, dimensionless for S). */
export interface RealSpaceElement {
  /** orbital indices into `compiled.orbitals` */
  from: number;
  to: number;
  /** lattice translation of the `to` orbital, multiples of a1, a2, a3 */
  translation: Translation;
  /** real part */
  value: number;
  /** imaginary part (0 for real models) */
  imaginary: number;
}

export interface RealSpaceModel {
  /** on-site energy of every orbital, eV (index = orbital index) */
  onsite: number[];
  /** every directed hopping, both partners listed: t_ji(−R) = conj(t_ij(R)) appears explicitly */
  hoppings: RealSpaceElement[];
  /** overlaps beyond the on-site identity, both partners listed (empty for orthogonal models) */
  overlaps: RealSpaceElement[];
}

/**
 * Expands the parameters into the real-space lists that rebuild H(k) without Slater–Koster code:
 * H_ij(k) = δ_ij onsite_i + Σ_{hoppings from i to j} t e^{ik·(R·a + τ_j − τ_i)}, and likewise
 * S_ij(k) = δ_ij + Σ_{overlaps} s e^{ik·(R·a + τ_j − τ_i)}. Elements with the same (from, to, R) are merged;
 * elements smaller than 1e-14 are dropped.
 * @param theta - parameter vector in `compiled.parameters` order
 */
export function expandHoppings(compiled: CompiledModel, theta: ArrayLike<number>): RealSpaceModel {
  checkParameterVector(compiled, theta);
  const onsite = new Array<number>(compiled.orbitalCount).fill(0);
  const merged: Record<ModelMatrix, Map<string, RealSpaceElement>> = { hamiltonian: new Map(), overlap: new Map() };
  for (const t of compiled.terms) {
    const value = theta[t.parameter];
    const isOnsite = t.from === t.to && t.translation.every((n) => n === 0);
    if (isOnsite && t.matrix === "hamiltonian") {
      onsite[t.from] += value * t.re;
      continue;
    }
    const key = `${t.from}|${t.to}|${t.translation.join(",")}`;
    const list = merged[t.matrix];
    const existing = list.get(key) ?? { from: t.from, to: t.to, translation: t.translation, value: 0, imaginary: 0 };
    existing.value += value * t.re;
    existing.imaginary += value * t.im;
    list.set(key, existing);
  }
  const keep = (m: Map<string, RealSpaceElement>) =>
    [...m.values()].filter((e) => Math.hypot(e.value, e.imaginary) > 1e-14);
  return { onsite, hoppings: keep(merged.hamiltonian), overlaps: keep(merged.overlap) };
}
