import { BOND_KINDS, type BondKind, SHELL_PAIRS, type ShellPair, bondTypeOf } from "../slater-koster/bond-types";
import type { OrbitalShell } from "./orbitals";

/**
 * Generated parameter names (our own scheme, documented in the README's model-document section):
 * - on-site energy of shell X on species A: `E_X[A]` — `E_s[Si]`, `E_p[Si]`, `E_s*[Ga]`, `E_d[Cu]`;
 * - Slater–Koster bond integral: `V_<shells><kind>[A–B,n]` — `V_ppπ[Si–Si,1]`, `V_spσ[Ga–As,1]`, with the
 *   shell pair lower shell first, the kind σ, π or δ, the species joined by an en dash (U+2013) and n the
 *   neighbour shell; for mixed-shell integrals A hosts the lower shell (`V_spσ[Ga–As,1]`: s on Ga, p on
 *   As), for same-shell integrals A and B are in alphabetical order;
 * - the matching overlap integral: `S_<shells><kind>[A–B,n]`.
 * Documents written before this scheme spelled the kind `_sigma`, `_pi`, `_delta` and joined the species
 * with a hyphen (`V_pp_pi[Si-Si,1]`); {@link canonicalParameterName} reads both.
 */

/** Which matrix a parameter belongs to. */
export type ModelMatrix = "hamiltonian" | "overlap";

/** A bond integral's structured key: the name's parts as fields. */
export interface BondIntegralKey {
  matrix: ModelMatrix;
  /** shell pair, lower shell first: "ss", "ss*", "sp", "pp", "pd", "dd", … */
  bond: ShellPair;
  /** σ, π or δ */
  kind: BondKind;
  /** [species of the lower shell, species of the upper shell] (alphabetical for same-shell integrals) */
  pair: [string, string];
  /** neighbour shell, from 1 */
  shell: number;
}

/** The species separator in bond-integral names: an en dash. */
export const SPECIES_SEPARATOR = "–";

export function onsiteParameterName(shell: OrbitalShell, species: string): string {
  return `E_${shell}[${species}]`;
}

export function bondIntegralName(key: BondIntegralKey): string {
  return `${key.matrix === "hamiltonian" ? "V" : "S"}_${key.bond}${key.kind}[${key.pair[0]}${SPECIES_SEPARATOR}${key.pair[1]},${key.shell}]`;
}

const SPECIES = "[A-Za-z][A-Za-z0-9_]*";
const PAIRS = [...SHELL_PAIRS].sort((a, b) => b.length - a.length).map((p) => p.replace(/\*/g, "\\*")).join("|");
const LEGACY_KINDS: Record<string, BondKind> = { _sigma: "σ", _pi: "π", _delta: "δ" };
// Today's spelling (Greek kind, en dash) and the earlier one (`_sigma`…, hyphen), in any mix.
const INTEGRAL = new RegExp(`^([VS])_(${PAIRS})(${BOND_KINDS.join("|")}|_sigma|_pi|_delta)\\[(${SPECIES})[-–](${SPECIES}),([1-9][0-9]*)\\]$`);
const ONSITE = new RegExp(`^E_(s\\*|s|p|d)\\[(${SPECIES})\\]$`);

/** The bond integral a parameter name stands for (either spelling), or null when it names none. */
export function bondIntegralOf(name: string): BondIntegralKey | null {
  const match = INTEGRAL.exec(name);
  if (!match) return null;
  const [, letter, bond, kindText, first, second, shell] = match;
  const kind = LEGACY_KINDS[kindText] ?? (kindText as BondKind);
  if (!bondTypeOf(bond as ShellPair, kind)) return null;
  return { matrix: letter === "V" ? "hamiltonian" : "overlap", bond: bond as ShellPair, kind, pair: [first, second], shell: Number(shell) };
}

/** The on-site energy a parameter name stands for, or null. */
export function onsiteOf(name: string): { shell: OrbitalShell; species: string } | null {
  const match = ONSITE.exec(name);
  return match ? { shell: match[1] as OrbitalShell, species: match[2] } : null;
}

/**
 * The name in today's spelling: a bond integral written the earlier way (`V_pp_pi[Si-Si,1]`) becomes
 * `V_ppπ[Si–Si,1]`; every other name is returned as it is. Stored revisions, demo documents and user
 * documents written before the change are read through this.
 */
export function canonicalParameterName(name: string): string {
  const integral = bondIntegralOf(name);
  return integral ? bondIntegralName(integral) : name;
}
