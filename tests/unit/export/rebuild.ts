// Rebuilds H(k) from an exported parameter set ALONE (its orbitals' on-site energies and its bond list, with
// the phase convention the document states: value · exp(i k·vector)) and diagonalises it with mathjs `eigs`
// (complex Hermitian input): an independent path from the one the fitted model's bands take.
import { type Complex, add, complex, eigs, exp, multiply } from "mathjs";
import type { ParameterSet } from "@/lib/export";

type Vec3 = [number, number, number];

const asComplex = (v: number | [number, number]) => (typeof v === "number" ? complex(v, 0) : complex(v[0], v[1]));

/** Sorted eigenvalues (eV) of H(k) built from the document's bonds, at Cartesian k (1/Å). */
export function rebuiltBands(set: ParameterSet, k: Vec3): number[] {
  const n = set.orbitals.length;
  const h: Complex[][] = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => complex(i === j ? set.orbitals[i].onsite.value : 0, 0)));
  for (const b of set.bonds) {
    const [i, j] = b.matrixEntry;
    const phase = exp(complex(0, k[0] * b.vector[0] + k[1] * b.vector[1] + k[2] * b.vector[2]));
    h[i][j] = add(h[i][j], multiply(asComplex(b.value), phase)) as Complex;
  }
  const { values } = eigs(h, { eigenvectors: false });
  return (values as unknown as (number | Complex)[]).map((v) => (typeof v === "number" ? v : v.re)).sort((a, b) => a - b);
}
