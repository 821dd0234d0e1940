import type { CompiledModel, ModelTerm } from "../model/compile";
import { angularMomentum } from "../model/orbitals";

/**
 * An inversion P of the basis — orbital i on site a maps to the same orbital on the inversion image of
 * a, with parity (−1)^l — under which the model is also time-reversal symmetric (every term real):
 * P H(k) P = H(k)* for every k and θ. Then U = ((1 + i)I + (1 − i)P)/2 is unitary, P U* = U, and
 * U†H(k)U = Re H + (Im H·P − P·Im H)/2 is real symmetric: (U†HU)* = UᵀH*U* = UᵀPHPU* = U†HU, since
 * PU* = U and P is real and symmetric. (A basis making an antiunitary symmetry that squares to +1 plain
 * complex conjugation is common practice for inversion × time reversal.)
 */
export interface RealGauge {
  /** P(i): the orbital orbital i is mapped to */
  readonly partner: Int32Array;
  /** ±1: (−1)^l of orbital i (s, s*, d even; p odd) */
  readonly parity: Float64Array;
}

// Bond vectors are compared after rounding to 1e-6 Å; they are sums of a few positions in Å.
const BOND_QUANTUM = 1e6;

const gauges = new WeakMap<CompiledModel, RealGauge | null>();

/**
 * The real gauge of an orthogonal model, or null when it has none (complex hoppings, overlaps, no
 * inversion that maps the model onto itself). Exactness rests on a term-by-term check: every H term
 * (i → j, bond d, parameter p, factor f) must have its image (P(i) → P(j), −d, p, parity_i·parity_j·f),
 * so the symmetry holds for every θ, not only the document's values. Cached per compiled model.
 */
export function realGaugeOf(compiled: CompiledModel): RealGauge | null {
  let gauge = gauges.get(compiled);
  if (gauge === undefined) {
    gauge = findRealGauge(compiled);
    gauges.set(compiled, gauge);
  }
  return gauge;
}

function findRealGauge(compiled: CompiledModel): RealGauge | null {
  if (compiled.hasOverlap || compiled.terms.some((t) => t.im !== 0)) return null;
  const sites = compiled.document.sites;
  const parity = Float64Array.from(compiled.orbitals, (o) => (angularMomentum(o.orbital) % 2 === 0 ? 1 : -1));
  const summed = summedTerms(compiled.terms);
  // An inversion maps site 0 onto some site b; its centre is then (τ_0 + τ_b)/2 modulo the lattice.
  for (let b = 0; b < sites.length; b++) {
    const centreTwice = sites[0].position.map((x, d) => x + sites[b].position[d]);
    const partner = orbitalMapThrough(compiled, centreTwice);
    if (partner && invariant(summed, partner, parity)) return { partner, parity };
  }
  return null;
}

/** Orbital map of the inversion x → c2 − x (fractional, modulo 1), or null if a site has no image. */
function orbitalMapThrough(compiled: CompiledModel, centreTwice: number[]): Int32Array | null {
  const sites = compiled.document.sites;
  const siteImage = sites.map((site) =>
    sites.findIndex(
      (other) =>
        other.species === site.species &&
        other.orbitals.join() === site.orbitals.join() &&
        other.position.every((x, d) => {
          const gap = x - (centreTwice[d] - site.position[d]);
          return Math.abs(gap - Math.round(gap)) < 1e-9;
        }),
    ),
  );
  if (siteImage.includes(-1)) return null;
  const partner = new Int32Array(compiled.orbitalCount);
  for (const orbital of compiled.orbitals) {
    const image = compiled.orbitals.find((o) => o.siteIndex === siteImage[orbital.siteIndex] && o.orbital === orbital.orbital);
    if (!image) return null;
    partner[orbital.index] = image.index;
  }
  return partner;
}

const termKey = (from: number, to: number, parameter: number, bond: readonly number[]): string =>
  `${from}|${to}|${parameter}|${bond.map((x) => Math.round(x * BOND_QUANTUM)).join(",")}`;

/** Real factors of the H terms summed per (from, to, parameter, bond). */
function summedTerms(terms: readonly ModelTerm[]): Map<string, { term: ModelTerm; factor: number }> {
  const summed = new Map<string, { term: ModelTerm; factor: number }>();
  for (const term of terms) {
    if (term.matrix !== "hamiltonian") continue;
    const key = termKey(term.from, term.to, term.parameter, term.bond);
    const entry = summed.get(key);
    if (entry) entry.factor += term.re;
    else summed.set(key, { term, factor: term.re });
  }
  return summed;
}

function invariant(summed: Map<string, { term: ModelTerm; factor: number }>, partner: Int32Array, parity: Float64Array): boolean {
  for (const { term, factor } of summed.values()) {
    const image = summed.get(termKey(partner[term.from], partner[term.to], term.parameter, term.bond.map((x) => -x)));
    const expected = parity[term.from] * parity[term.to] * factor;
    if (!image || Math.abs(image.factor - expected) > 1e-12 * Math.max(1, Math.abs(factor))) return false;
  }
  return true;
}
