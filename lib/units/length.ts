/** 1 bohr (Bohr radius a₀) in Å — CODATA 2018 recommended value (REFERENCES.md §7). */
export const BOHR_IN_ANGSTROM = 0.529177210903;

/**
 * Converts a length from bohr to Å.
 * @param bohr - length in bohr (a₀)
 * @returns length in Å
 */
export function bohrToAngstrom(bohr: number): number {
  return bohr * BOHR_IN_ANGSTROM;
}

/**
 * Converts a wave-vector component from 1/bohr to 1/Å.
 * @param perBohr - wave-vector component in 1/bohr
 * @returns the component in 1/Å
 */
export function inverseBohrToInverseAngstrom(perBohr: number): number {
  return perBohr / BOHR_IN_ANGSTROM;
}

/**
 * Converts a wave-vector component given in units of 2π/a to 1/Å (2π included).
 * @param value - component in units of 2π/a
 * @param latticeConstant - the lattice constant a in Å
 * @returns the component in 1/Å
 */
export function twoPiOverAToInverseAngstrom(value: number, latticeConstant: number): number {
  return (value * 2 * Math.PI) / latticeConstant;
}
