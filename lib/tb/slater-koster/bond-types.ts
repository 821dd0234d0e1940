import type { OrbitalShell } from "../model/orbitals";

/**
 * Slater–Koster bond integrals (Slater & Koster, Phys. Rev. 94, 1498 (1954)), in ASCII form: shells in
 * ascending order (s, s*, p, d) followed by the angular-momentum component along the bond.
 * "ss*_sigma" couples s on the first atom with s* on the second.
 */
export const BOND_TYPES = [
  "ss_sigma",
  "ss*_sigma",
  "s*s*_sigma",
  "sp_sigma",
  "s*p_sigma",
  "sd_sigma",
  "s*d_sigma",
  "pp_sigma",
  "pp_pi",
  "pd_sigma",
  "pd_pi",
  "dd_sigma",
  "dd_pi",
  "dd_delta",
] as const;
export type BondType = (typeof BOND_TYPES)[number];

/** The bond integrals that couple two shells (given in ascending order). */
export function bondTypesBetween(first: OrbitalShell, second: OrbitalShell): BondType[] {
  const pair = `${first}${second}`;
  switch (pair) {
    case "ss":
      return ["ss_sigma"];
    case "ss*":
      return ["ss*_sigma"];
    case "s*s*":
      return ["s*s*_sigma"];
    case "sp":
      return ["sp_sigma"];
    case "s*p":
      return ["s*p_sigma"];
    case "sd":
      return ["sd_sigma"];
    case "s*d":
      return ["s*d_sigma"];
    case "pp":
      return ["pp_sigma", "pp_pi"];
    case "pd":
      return ["pd_sigma", "pd_pi"];
    case "dd":
      return ["dd_sigma", "dd_pi", "dd_delta"];
    default:
      throw new Error(`shells ${first} and ${second} are not in ascending order`);
  }
}
