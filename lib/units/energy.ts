/** Energy units accepted in uploaded band files. */
export const energyUnits = ["eV", "meV", "Ry", "Ha"] as const;
export type EnergyUnit = (typeof energyUnits)[number];

/** 1 Hartree in eV — CODATA 2018 recommended value (REFERENCES.md §7). */
export const HARTREE_IN_EV = 27.211386245988;
/** 1 Rydberg energy (Ha/2) in eV — CODATA 2018 recommended value (REFERENCES.md §7). */
export const RYDBERG_IN_EV = 13.605693122994;

/** Multiplier that turns a value in the given unit into eV. */
export const electronvoltsPerUnit: Readonly<Record<EnergyUnit, number>> = {
  eV: 1,
  meV: 1e-3,
  Ry: RYDBERG_IN_EV,
  Ha: HARTREE_IN_EV,
};

/**
 * Converts an energy (or an energy difference such as an uncertainty σ) to eV.
 * @param value - energy in `unit`
 * @param unit - the unit `value` is given in
 * @returns the energy in eV
 */
export function toElectronvolts(value: number, unit: EnergyUnit): number {
  return value * electronvoltsPerUnit[unit];
}
