import { ENERGY_ALIGNMENT_FORMULA } from "@/lib/fit/bands/energy-alignment";
import type { OrbitalName } from "@/lib/tb";

/**
 * The sentences every parameter set carries so that a reader needs nothing else: how H(k) and S(k) are
 * built from the bond lists, the phase, the signs, the orbitals, Slater–Koster's convention, the basis order
 * and the energy alignment. They describe what lib/tb computes; change them only with the code.
 */
export const CONVENTIONS = {
  hamiltonian:
    "H_ij(k) = δ_ij · orbitals[i].onsite.value + Σ over bonds whose matrixEntry is [i, j] of value · exp(i k·vector), " +
    "with k Cartesian in 1/Å (2π included) and vector the bond's Cartesian vector in Å. Both directions of every bond are " +
    "listed (each entry names its Hermitian partner), so the sum is Hermitian as written.",
  overlap:
    "S_ij(k) = δ_ij + Σ over overlaps whose matrixEntry is [i, j] of value · exp(i k·vector); orbitals on one site are " +
    "orthonormal. With no overlaps S = 1 and the bands are the eigenvalues of H(k); otherwise they solve H c = E S c.",
  phase:
    "The Bloch phase uses the full bond vector R·a + τ_to − τ_from (orbital positions included), so H(k + G) equals H(k) " +
    "only up to a diagonal unitary transform; the eigenvalues are the same. Drop τ from the phase (use translation · lattice) " +
    "for a matrix periodic in k element by element.",
  signs:
    "A bond's value is Σ coefficient × value over its parameters, each parameter's value as listed under parameters. " +
    "Hoppings named freely in the model enter with the model's factor: the templates write H = −t Σ c†c, so t1 = 2.62 eV " +
    "appears as −2.62 eV (coefficient −1). Slater–Koster integrals enter as they are, times the direction-cosine " +
    "coefficients of Slater & Koster's Table I: V(ssσ) = −1.9 eV gives −1.9 eV on an s–s bond.",
  orbitals:
    "Real cubic harmonics (orbitalDefinitions) times one radial function per shell, centred on the orbital's site, with " +
    "x, y, z the Cartesian axes of the lattice's own frame (the frame of lattice and of every vector here).",
  slaterKoster:
    "E_a,b(l, m, n) = ⟨φ_a(r)|H|φ_b(r − d)⟩ for orbital a on the atom at the origin and b on the atom at d = |d|(l, m, n), " +
    "d pointing from a's atom to b's (the bond's vector); entries of Slater & Koster, Phys. Rev. 94, 1498 (1954), Table I, " +
    "others by cyclic permutation of x, y, z and l, m, n, the reversed order by E_b,a = (−1)^(l_a + l_b) E_a,b. No extra " +
    "phase factors: each orbital is the function in orbitalDefinitions, px positive towards +x.",
  orbitalOrder:
    "Matrix indices follow orbitals: sites in the order of sites, and each site's orbitals in the order listed there.",
  energyAlignment: `The fit compared the data with ${ENERGY_ALIGNMENT_FORMULA}, E the eigenvalues of this H(k): the bond lists give E itself. Energies of the data are measured from energyAlignment.dataEnergyZero.`,
} as const;

/** Angular parts of the orbitals (real cubic harmonics, Slater & Koster's normalisation; r from the site). */
export const ORBITAL_DEFINITIONS: Record<OrbitalName, string> = {
  s: "1 (spherical)",
  px: "x/r",
  py: "y/r",
  pz: "z/r",
  dxy: "√3 xy/r²",
  dyz: "√3 yz/r²",
  dzx: "√3 zx/r²",
  "dx2-y2": "(√3/2)(x² − y²)/r²",
  dz2: "(3z² − r²)/(2r²)",
  "s*": "1 (spherical): an excited s-like state above the p level, Vogl, Hjalmarson & Dow, J. Phys. Chem. Solids 44, 365 (1983)",
};
