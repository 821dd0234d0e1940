import type { BondType } from "../slater-koster/bond-types";
import type { OrbitalShell } from "./orbitals";

/**
 * Generated parameter names (our own scheme, documented in the README):
 * - on-site energy of shell X on species A: `E_X[A]` — `E_s[Si]`, `E_p[Si]`, `E_s*[Ga]`, `E_d[Cu]`;
 * - Slater–Koster bond integral of type T between species A and B in shell n: `V_T[A-B,n]` — `V_pp_pi[Si-Si,1]`;
 *   for mixed-shell integrals A hosts the lower shell (`V_sp_sigma[Ga-As,1]`: s on Ga, p on As), for
 *   same-shell integrals A and B are in alphabetical order;
 * - the matching overlap integral: `S_T[A-B,n]`.
 */
export function onsiteParameterName(shell: OrbitalShell, species: string): string {
  return `E_${shell}[${species}]`;
}

export function bondIntegralName(
  matrix: "hamiltonian" | "overlap",
  bond: BondType,
  lowerShellSpecies: string,
  upperShellSpecies: string,
  shell: number,
): string {
  return `${matrix === "hamiltonian" ? "V" : "S"}_${bond}[${lowerShellSpecies}-${upperShellSpecies},${shell}]`;
}
