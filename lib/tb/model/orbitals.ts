/** Orbital names accepted in a model document (real cubic harmonics, plus the excited s* of sp3s*). */
export const ORBITAL_NAMES = ["s", "px", "py", "pz", "dxy", "dyz", "dzx", "dx2-y2", "dz2", "s*"] as const;
export type OrbitalName = (typeof ORBITAL_NAMES)[number];

/**
 * The shell an orbital belongs to for Slater–Koster purposes and for default on-site parameters.
 * s* is its own shell: it couples like an s orbital but with its own bond integrals.
 */
export type OrbitalShell = "s" | "s*" | "p" | "d";

export function orbitalShell(orbital: OrbitalName): OrbitalShell {
  if (orbital === "s" || orbital === "s*") return orbital;
  return orbital.startsWith("p") ? "p" : "d";
}

/** Angular momentum l: 0 for s and s*, 1 for p, 2 for d. */
export function angularMomentum(orbital: OrbitalName): 0 | 1 | 2 {
  const shell = orbitalShell(orbital);
  return shell === "p" ? 1 : shell === "d" ? 2 : 0;
}

/** Order used to name bond integrals: the lower shell comes first (s < s* < p < d), as in "spσ". */
export const SHELL_ORDER: Record<OrbitalShell, number> = { s: 0, "s*": 1, p: 2, d: 3 };
