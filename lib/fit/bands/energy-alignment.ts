/**
 * How the fit compares model energies with the data: the ONE place that states and applies it. Model
 * energies E (eigenvalues of H(k), eV) become
 *   E_aligned = E_ref + (E − E_ref)/Z + δ,
 * with δ the energy offset (eV), Z the renormalisation factor (dimensionless; Z > 1 narrows the bands
 * about E_ref, the photoemission convention of bands measured narrower than calculated) and E_ref its
 * reference energy (eV, on the data's energy scale). At δ = 0 and Z = 1 nothing changes. The band fit, its
 * Jacobian, the bands CSV, the charts and the exported parameter set all go through this module.
 */

/** Names of the two global parameters in results and warnings. */
export const ENERGY_OFFSET = "energy offset";
export const RENORMALISATION = "renormalisation";

/** δ (eV), Z and E_ref (eV). */
export interface EnergyAlignment {
  offset: number;
  renormalisation: number;
  reference: number;
}

/** The alignment that changes nothing. */
export const NEUTRAL_ALIGNMENT: EnergyAlignment = { offset: 0, renormalisation: 1, reference: 0 };

/** The formula as written into exports and documentation. */
export const ENERGY_ALIGNMENT_FORMULA = "E_aligned = E_ref + (E − E_ref)/Z + δ";

/**
 * A model energy as the fit compares it with the data.
 * @param energy - model eigenvalue, eV
 * @returns the aligned energy, eV
 */
export function alignEnergy(energy: number, alignment: EnergyAlignment): number {
  return alignment.reference + (energy - alignment.reference) / alignment.renormalisation + alignment.offset;
}

/**
 * Partial derivatives of {@link alignEnergy}: with respect to the model energy (dimensionless), the
 * offset δ (dimensionless) and the renormalisation Z (eV).
 * @param energy - model eigenvalue, eV
 */
export function alignmentDerivatives(energy: number, alignment: EnergyAlignment): { energy: number; offset: number; renormalisation: number } {
  const z = alignment.renormalisation;
  return { energy: 1 / z, offset: 1, renormalisation: -(energy - alignment.reference) / (z * z) };
}

/**
 * The alignment a revision used: δ and Z from its fitted parameters named {@link ENERGY_OFFSET} and
 * {@link RENORMALISATION} (a result lists them when free or not neutral), else from its options; E_ref
 * from the options.
 */
export function revisionAlignment(
  parameters: readonly { name: string; value: number }[],
  options: { energyOffset: { value: number }; renormalisation: { value: number; reference: number } },
): EnergyAlignment {
  const fitted = (name: string) => parameters.find((p) => p.name === name)?.value;
  return {
    offset: fitted(ENERGY_OFFSET) ?? options.energyOffset.value,
    renormalisation: fitted(RENORMALISATION) ?? options.renormalisation.value,
    reference: options.renormalisation.reference,
  };
}
