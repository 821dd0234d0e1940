import type { OrbitalShell } from "../model/orbitals";

/**
 * Slater–Koster two-centre bond integrals (Slater & Koster, Phys. Rev. 94, 1498 (1954)), in our own
 * structure: the pair of shells they couple, lower shell first (s < s* < p < d), and the component of
 * angular momentum about the bond, σ (0), π (1) or δ (2). "ss*" couples s on the first atom with s* on
 * the second.
 */
export const SHELL_PAIRS = ["ss", "ss*", "s*s*", "sp", "s*p", "sd", "s*d", "pp", "pd", "dd"] as const;
export type ShellPair = (typeof SHELL_PAIRS)[number];

/** Angular momentum about the bond axis: σ (m = 0), π (|m| = 1), δ (|m| = 2). */
export const BOND_KINDS = ["σ", "π", "δ"] as const;
export type BondKind = (typeof BOND_KINDS)[number];

/** Every bond integral, written shell pair then kind: "ssσ", "ppπ", "ddδ". */
export const BOND_TYPES = ["ssσ", "ss*σ", "s*s*σ", "spσ", "s*pσ", "sdσ", "s*dσ", "ppσ", "ppπ", "pdσ", "pdπ", "ddσ", "ddπ", "ddδ"] as const;
export type BondType = (typeof BOND_TYPES)[number];

/** The shell pair and kind of a bond integral: "ppπ" → { bond: "pp", kind: "π" }. */
export function splitBondType(type: BondType): { bond: ShellPair; kind: BondKind } {
  return { bond: type.slice(0, -1) as ShellPair, kind: type.slice(-1) as BondKind };
}

/** The bond integral of a shell pair and kind, or null when the pair has no such integral (ssπ). */
export function bondTypeOf(bond: ShellPair, kind: BondKind): BondType | null {
  const type = `${bond}${kind}`;
  return (BOND_TYPES as readonly string[]).includes(type) ? (type as BondType) : null;
}

/** The bond integrals that couple two shells (given in ascending order). */
export function bondTypesBetween(first: OrbitalShell, second: OrbitalShell): BondType[] {
  const pair = `${first}${second}`;
  const types = BOND_TYPES.filter((t) => splitBondType(t).bond === pair);
  if (types.length === 0) throw new Error(`shells ${first} and ${second} are not in ascending order`);
  return types;
}
