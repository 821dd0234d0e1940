import type { CompiledModel } from "@/lib/tb";

/**
 * Directions in parameter space that change nothing the data can see, found from the model's terms
 * before a fit (the statistics would find them afterwards as a singular JᵀWJ):
 * - a rigid shift: in an orthogonal model, adding c to every on-site energy adds c·I to H(k) and c to
 *   every band, exactly what a free energy offset does;
 * - an overall scale: multiplying every H parameter by c multiplies every band by c (with or without
 *   overlap, since Hψ = ESψ), exactly what a free renormalisation factor undoes when E_ref = 0, and
 *   together with a rigid shift for any E_ref.
 * @param free - whether each model parameter is free, in `compiled.parameters` order
 * @returns the names of the model parameters that make each global parameter redundant, or null
 */
export function redundantWithGlobals(
  compiled: CompiledModel,
  free: readonly boolean[],
): { onsiteShift: string[] | null; overallScale: string[] | null } {
  const n = compiled.orbitalCount;
  const pureOnsite = compiled.parameters.map(() => true);
  const onsiteOf: (number | null)[] = new Array(n).fill(null);
  let onsiteCovered = true;
  for (const t of compiled.terms) {
    const isOnsite = t.matrix === "hamiltonian" && t.from === t.to && t.translation.every((x) => x === 0) && t.re === 1 && t.im === 0;
    if (!isOnsite) {
      pureOnsite[t.parameter] = false;
      continue;
    }
    if (onsiteOf[t.from] !== null) onsiteCovered = false;
    onsiteOf[t.from] = t.parameter;
  }
  const onsiteParameters = [...new Set(onsiteOf)];
  const shiftable =
    !compiled.hasOverlap &&
    onsiteCovered &&
    onsiteParameters.every((p) => p !== null && pureOnsite[p] && free[p]);
  const hamiltonianParameters = compiled.parameters.map((_, i) => i).filter((i) => compiled.parameterMatrix[i] === "hamiltonian");
  const scalable = hamiltonianParameters.every((i) => free[i] || compiled.parameters[i].value === 0);
  const names = (indices: (number | null)[]) => indices.map((i) => compiled.parameters[i as number].name);
  return {
    onsiteShift: shiftable ? names(onsiteParameters) : null,
    overallScale: scalable ? names(hamiltonianParameters.filter((i) => free[i])) : null,
  };
}
