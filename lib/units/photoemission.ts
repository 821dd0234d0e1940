import { z } from "zod";

/**
 * Photoemission kinematics: from what an angle-resolved photoemission measurement records (emission
 * angles, kinetic energy, photon energy, work function) to the electron's wave vector in the crystal and
 * its energy below the Fermi level — Damascelli, Hussain & Shen, Rev. Mod. Phys. 75, 473 (2003), eqs. (1)–(4)
 * (REFERENCES.md §9).
 *
 * Geometry (our convention, stated once here): the sample's surface normal is z, the analyser's slit lies
 * along the sample's x axis. θ is the emission angle along the slit, measured from the normal; the tilt τ
 * turns the emission direction about the slit axis (x), perpendicular to the slit. The photoelectron then
 * leaves in the sample frame along the unit vector
 *
 *     (sin θ,  cos θ · sin τ,  cos θ · cos τ),
 *
 * so with τ = 0 the slit measures k_x alone, and ϑ, the polar angle from the normal, has cos ϑ = cos θ cos τ.
 * Parallel momentum is conserved across the surface, so the in-plane components are those of the
 * electron in vacuum:
 *
 *     k_x = K sin θ,  k_y = K cos θ sin τ,  K = √(2 m_e E_kin)/ħ = 0.5123 Å⁻¹ eV^(−1/2) · √E_kin,
 *
 * and, with the inner potential V₀ (free-electron final state), k⊥ = √(2 m_e (E_kin cos²ϑ + V₀))/ħ.
 * Energies: E_kin = hν − φ − |E_B|, so the state's energy relative to the Fermi level is
 * E − E_F = E_kin + φ − hν (negative below E_F) and the binding energy is |E_B| = hν − φ − E_kin.
 */

/** Electron mass, kg — CODATA 2018 recommended value. */
const ELECTRON_MASS_KG = 9.1093837015e-31;
/** Elementary charge, C (exact in the 2019 SI): 1 eV = 1.602176634 × 10⁻¹⁹ J. */
const ELEMENTARY_CHARGE_C = 1.602176634e-19;
/** Reduced Planck constant, J s — CODATA 2018 (exact h = 6.62607015 × 10⁻³⁴ J s divided by 2π). */
const REDUCED_PLANCK_J_S = 1.054571817e-34;

/**
 * √(2 m_e · 1 eV)/ħ in Å⁻¹ (≈ 0.512317): the "0.5123 Å⁻¹ eV^(−1/2)" of Damascelli et al. (2003), eq. (2),
 * from the CODATA 2018 constants.
 */
export const FREE_ELECTRON_WAVE_VECTOR_PER_SQRT_EV = Math.sqrt(2 * ELECTRON_MASS_KG * ELEMENTARY_CHARGE_C) / REDUCED_PLANCK_J_S / 1e10;

const DEGREE = Math.PI / 180;

/** One photoemission measurement; angles in degrees, energies in eV. */
export const photoemissionPointSchema = z.object({
  /** emission angle along the slit from the surface normal, degrees, in (−90, 90) */
  thetaDegrees: z.number().gt(-90).lt(90),
  /** tilt about the slit axis, degrees, in (−90, 90); default 0 (the slit passes through normal emission) */
  tiltDegrees: z.number().gt(-90).lt(90).default(0),
  /** kinetic energy of the photoelectron, eV, > 0 (measured from the vacuum level of the sample) */
  kineticEnergy: z.number().positive(),
  /** photon energy hν, eV, > 0 */
  photonEnergy: z.number().positive(),
  /** work function φ, eV, ≥ 0 */
  workFunction: z.number().nonnegative(),
  /** inner potential V₀, eV, ≥ 0; only needed for k⊥ (a photon-energy scan); omitted → no k⊥ */
  innerPotential: z.number().nonnegative().optional(),
});
export type PhotoemissionPoint = z.input<typeof photoemissionPointSchema>;

/** Where a photoemission point sits in the crystal: wave vectors in 1/Å (2π included), energies in eV. */
export interface CrystalMomentum {
  /** in-plane component along the slit, 1/Å */
  kx: number;
  /** in-plane component perpendicular to the slit, 1/Å (0 without tilt) */
  ky: number;
  /** |k∥| = √(k_x² + k_y²), 1/Å */
  kParallel: number;
  /** out-of-plane component, 1/Å; null when no inner potential was given */
  kPerpendicular: number | null;
  /** E − E_F, eV: negative for occupied states */
  energy: number;
  /** |E_B| = hν − φ − E_kin, eV: positive for occupied states */
  bindingEnergy: number;
}

/**
 * The free-electron wave vector of a photoelectron of kinetic energy `kineticEnergy`:
 * K = √(2 m_e E_kin)/ħ (Damascelli et al. 2003, eq. (2)).
 * @param kineticEnergy - eV, ≥ 0
 * @returns K in 1/Å
 */
export function photoelectronWaveVector(kineticEnergy: number): number {
  if (!(kineticEnergy >= 0)) throw new RangeError(`the kinetic energy must be ≥ 0 eV, got ${kineticEnergy}`);
  return FREE_ELECTRON_WAVE_VECTOR_PER_SQRT_EV * Math.sqrt(kineticEnergy);
}

/**
 * Converts one measurement (angles, kinetic and photon energy, work function, optionally V₀) to crystal
 * momentum and energy, in the geometry described at the top of this module.
 * @param point - angles in degrees, energies in eV (checked by {@link photoemissionPointSchema})
 * @returns k in 1/Å and E − E_F and |E_B| in eV
 */
export function photoemissionToCrystal(point: PhotoemissionPoint): CrystalMomentum {
  const p = photoemissionPointSchema.parse(point);
  const theta = p.thetaDegrees * DEGREE;
  const tilt = p.tiltDegrees * DEGREE;
  const magnitude = photoelectronWaveVector(p.kineticEnergy);
  const kx = magnitude * Math.sin(theta);
  const ky = magnitude * Math.cos(theta) * Math.sin(tilt);
  const cosPolar = Math.cos(theta) * Math.cos(tilt);
  const kPerpendicular =
    p.innerPotential === undefined ? null : FREE_ELECTRON_WAVE_VECTOR_PER_SQRT_EV * Math.sqrt(p.kineticEnergy * cosPolar ** 2 + p.innerPotential);
  const bindingEnergy = p.photonEnergy - p.workFunction - p.kineticEnergy;
  return { kx, ky, kParallel: Math.hypot(kx, ky), kPerpendicular, energy: -bindingEnergy, bindingEnergy };
}

/**
 * The inverse for the in-plane components: the angles at which a state of in-plane wave vector
 * (k_x, k_y) is seen at kinetic energy `kineticEnergy`, in the same geometry.
 * @param kx - 1/Å, along the slit
 * @param ky - 1/Å, perpendicular to the slit
 * @param kineticEnergy - eV, > 0
 * @returns θ and τ in degrees
 * @throws RangeError when the wave vector lies outside the photoemission horizon (|k∥| ≥ K)
 */
export function anglesForCrystalMomentum(kx: number, ky: number, kineticEnergy: number): { thetaDegrees: number; tiltDegrees: number } {
  const magnitude = photoelectronWaveVector(kineticEnergy);
  if (!(Math.hypot(kx, ky) < magnitude)) {
    throw new RangeError(`|k∥| = ${Math.hypot(kx, ky)} 1/Å is not reached at E_kin = ${kineticEnergy} eV (the most is ${magnitude} 1/Å)`);
  }
  const theta = Math.asin(kx / magnitude);
  const tilt = Math.asin(ky / (magnitude * Math.cos(theta)));
  return { thetaDegrees: theta / DEGREE, tiltDegrees: tilt / DEGREE };
}
