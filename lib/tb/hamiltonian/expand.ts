import type { Translation } from "../geometry/shells";
import type { Vec3 } from "../geometry/vec3";
import type { CompiledModel, ModelMatrix } from "../model/compile";
import { checkParameterVector } from "./prepare";

/** How much one parameter contributes to a real-space element: element += (re + i·im) × θ_parameter. */
export interface RealSpaceContribution {
  /** parameter index into `compiled.parameters` */
  parameter: number;
  re: number;
  im: number;
}

/** One real-space matrix element t_from,to(R) (eV for H, dimensionless for S). */
export interface RealSpaceElement {
  /** orbital indices into `compiled.orbitals` */
  from: number;
  to: number;
  /** lattice translation of the `to` orbital, multiples of a1, a2, a3 */
  translation: Translation;
  /** R + τ_to − τ_from, Cartesian Å */
  bond: Vec3;
  /** real part */
  value: number;
  /** imaginary part (0 for real models) */
  imaginary: number;
  /** the element as a linear combination of the parameters (its value at θ is Σ coefficient × θ) */
  contributions: RealSpaceContribution[];
}

export interface RealSpaceModel {
  /** on-site energy of every orbital, eV (index = orbital index) */
  onsite: number[];
  /** each on-site energy as a linear combination of the parameters */
  onsiteContributions: RealSpaceContribution[][];
  /** every directed hopping, both partners listed: t_ji(−R) = conj(t_ij(R)) appears explicitly */
  hoppings: RealSpaceElement[];
  /** overlaps beyond the on-site identity, both partners listed (empty for orthogonal models) */
  overlaps: RealSpaceElement[];
}

const NEGLIGIBLE = 1e-14;

/**
 * Expands the parameters into the real-space lists that rebuild H(k) without Slater–Koster code:
 * H_ij(k) = δ_ij onsite_i + Σ_{hoppings from i to j} t e^{ik·(R·a + τ_j − τ_i)}, and likewise
 * S_ij(k) = δ_ij + Σ_{overlaps} s e^{ik·(R·a + τ_j − τ_i)}. Elements with the same (from, to, R) are merged,
 * each keeping the parameters it is made of. An element is listed when its value is not negligible
 * (> 1e-14) or a free parameter contributes to it (so that errors propagate to it even at a value of 0);
 * an element of fixed zero parameters only is left out.
 * @param theta - parameter vector in `compiled.parameters` order
 */
export function expandHoppings(compiled: CompiledModel, theta: ArrayLike<number>): RealSpaceModel {
  checkParameterVector(compiled, theta);
  const onsite = new Array<number>(compiled.orbitalCount).fill(0);
  const onsiteByParameter = compiled.orbitals.map(() => new Map<number, RealSpaceContribution>());
  const merged: Record<ModelMatrix, Map<string, { element: RealSpaceElement; byParameter: Map<number, RealSpaceContribution> }>> = {
    hamiltonian: new Map(),
    overlap: new Map(),
  };
  const add = (into: Map<number, RealSpaceContribution>, parameter: number, re: number, im: number) => {
    const c = into.get(parameter) ?? { parameter, re: 0, im: 0 };
    c.re += re;
    c.im += im;
    into.set(parameter, c);
  };
  for (const t of compiled.terms) {
    const value = theta[t.parameter];
    const isOnsite = t.from === t.to && t.translation.every((n) => n === 0);
    if (isOnsite && t.matrix === "hamiltonian") {
      onsite[t.from] += value * t.re;
      add(onsiteByParameter[t.from], t.parameter, t.re, t.im);
      continue;
    }
    const key = `${t.from}|${t.to}|${t.translation.join(",")}`;
    const list = merged[t.matrix];
    const entry = list.get(key) ?? {
      element: { from: t.from, to: t.to, translation: t.translation, bond: t.bond, value: 0, imaginary: 0, contributions: [] },
      byParameter: new Map(),
    };
    entry.element.value += value * t.re;
    entry.element.imaginary += value * t.im;
    add(entry.byParameter, t.parameter, t.re, t.im);
    list.set(key, entry);
  }
  const significant = (byParameter: Map<number, RealSpaceContribution>) =>
    [...byParameter.values()].filter((c) => Math.hypot(c.re, c.im) > NEGLIGIBLE);
  const keep = (m: (typeof merged)[ModelMatrix]) =>
    [...m.values()]
      .map(({ element, byParameter }) => ({ ...element, contributions: significant(byParameter) }))
      .filter((e) => Math.hypot(e.value, e.imaginary) > NEGLIGIBLE || e.contributions.some((c) => compiled.parameters[c.parameter].free));
  return {
    onsite,
    onsiteContributions: onsiteByParameter.map(significant),
    hoppings: keep(merged.hamiltonian),
    overlaps: keep(merged.overlap),
  };
}
