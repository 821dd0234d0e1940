// Rebuilds H(k) from an exported parameter set ALONE (its lattice, orbital positions, on-site list and
// hopping list, with the phase convention the document states) and diagonalises it with mathjs `eigs`
// (complex Hermitian input): an independent path from the one the fitted model's bands take.
import { type Complex, add, complex, eigs, exp, multiply } from "mathjs";
import type { ParameterSet } from "@/lib/export";

type Vec3 = [number, number, number];

/** Sorted eigenvalues (eV) of H(k) built from the document's hopping list, at Cartesian k (1/Å). */
export function rebuiltBands(set: ParameterSet, k: Vec3): number[] {
  const n = set.orbitals.length;
  const h: Complex[][] = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => complex(i === j ? set.onsite[i] : 0, 0)));
  for (const t of set.hoppings) {
    // bond = R1·a1 + R2·a2 + R3·a3 + τ_to − τ_from (only as many lattice vectors as the document has)
    const bond = [0, 1, 2].map((c) => {
      let r = set.orbitals[t.to].position[c] - set.orbitals[t.from].position[c];
      set.lattice.forEach((a, i) => (r += t.translation[i] * a[c]));
      return r;
    });
    const phase = exp(complex(0, k[0] * bond[0] + k[1] * bond[1] + k[2] * bond[2]));
    h[t.from][t.to] = add(h[t.from][t.to], multiply(complex(t.value, t.imaginary), phase)) as Complex;
  }
  const { values } = eigs(h, { eigenvectors: false });
  return (values as unknown as (number | Complex)[]).map((v) => (typeof v === "number" ? v : v.re)).sort((a, b) => a - b);
}
