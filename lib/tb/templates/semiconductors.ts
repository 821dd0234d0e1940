import { FCC_PATH, fccVectors } from "./simple-lattices";
import { type TemplateDefinition, parameter } from "./types";

const S3 = Math.sqrt(3);

/**
 * Vogl–Hjalmarson–Dow combined elements (multiplying the four-neighbour phase sums normalised to g0(Γ) = 1)
 * converted into two-centre bond integrals: V(s,s) = 4V_ssσ, V(x,x) = (4/3)(V_ppσ + 2V_ppπ),
 * V(x,y) = (4/3)(V_ppσ − V_ppπ), V(sa,pc) = (4/√3)V_spσ (REFERENCES.md §3).
 */
function fromCombined(vss: number, vxx: number, vxy: number) {
  const sumPp = (3 / 4) * vxx; // ppσ + 2ppπ
  const diffPp = (3 / 4) * vxy; // ppσ − ppπ
  const ppPi = (sumPp - diffPp) / 3;
  return { ss: vss / 4, ppSigma: diffPp + ppPi, ppPi };
}
const spFromCombined = (v: number) => (S3 / 4) * v;

const SP3S_ORBITALS = ["s", "px", "py", "pz", "s*"] as const;

/**
 * Default lower bound of an s* on-site energy: the same species' default p level. The s* orbital is
 * Vogl, Hjalmarson & Dow's excited s state, introduced to mimic the higher conduction states, and
 * their E_s* lies above E_p for every material they list (from memory). Without the bound, a fit to
 * valence bands alone pulls s* down into the valence region (a different model); with it, the data's
 * indifference shows as a runaway that the fit flags (valence bands see only V_s*p² / (E_s* − E)).
 */
const sStarAbove = (pLevel: number) => ({ min: pLevel });

export const diamondSp3sStar: TemplateDefinition = {
  id: "diamond-sp3s-star",
  title: "Diamond sp3s* (nearest neighbours)",
  description: "Two atoms per fcc cell with s, p and an excited s* orbital each; nearest-neighbour Slater–Koster bond integrals.",
  dimension: 3,
  source:
    "Silicon parameters of Vogl, Hjalmarson & Dow, J. Phys. Chem. Solids 44, 365 (1983), converted from their combined " +
    "elements to bond integrals; V(s*,s*) = V(s,s*) = 0 as in the paper; a = 5.431 Å. Default bound E_s* ≥ E_p: s* is " +
    "their excited s state above the p level (from memory)",
  latticeConstant: { value: 5.431, meaning: "cube edge a" },
  lattice: fccVectors,
  sites: [
    { label: "Si1", species: "Si", position: [0, 0, 0], orbitals: [...SP3S_ORBITALS] },
    { label: "Si2", species: "Si", position: [0.25, 0.25, 0.25], orbitals: [...SP3S_ORBITALS] },
  ],
  supportsOverlap: false,
  kPath: FCC_PATH,
  body: () => {
    const pp = fromCombined(-8.3, 1.715, 4.575);
    return {
      parameters: [
        parameter("E_s[Si]", -4.2, "on-site energy of s"),
        parameter("E_p[Si]", 1.715, "on-site energy of p"),
        parameter("E_s*[Si]", 6.685, "on-site energy of the excited s*, kept above the p level", sStarAbove(1.715)),
        parameter("V_ssσ[Si–Si,1]", pp.ss, "ssσ, nearest neighbours"),
        parameter("V_spσ[Si–Si,1]", spFromCombined(5.7292), "spσ, nearest neighbours"),
        parameter("V_ppσ[Si–Si,1]", pp.ppSigma, "ppσ, nearest neighbours"),
        parameter("V_ppπ[Si–Si,1]", pp.ppPi, "ppπ, nearest neighbours"),
        parameter("V_s*pσ[Si–Si,1]", spFromCombined(5.3749), "s*pσ, nearest neighbours"),
        parameter("V_ss*σ[Si–Si,1]", 0, "ss*σ (zero in the sp3s* model)", { free: false }),
        parameter("V_s*s*σ[Si–Si,1]", 0, "s*s*σ (zero in the sp3s* model)", { free: false }),
      ],
      slaterKoster: { maxShell: 1, tolerance: 1e-3, overlap: false },
    };
  },
};

export const zincblendeSp3sStar: TemplateDefinition = {
  id: "zincblende-sp3s-star",
  title: "Zinc-blende sp3s* (nearest neighbours)",
  description: "Anion and cation with s, p and s* orbitals each; nearest-neighbour Slater–Koster bond integrals.",
  dimension: 3,
  source:
    "GaAs parameters of Vogl, Hjalmarson & Dow, J. Phys. Chem. Solids 44, 365 (1983) (values from memory, not checked " +
    "against the paper), converted to bond integrals; a = 5.6533 Å (from memory). Default bounds E_s* ≥ E_p of the same species: s* is " +
    "their excited s state above the p level (from memory)",
  latticeConstant: { value: 5.6533, meaning: "cube edge a" },
  lattice: fccVectors,
  sites: [
    { label: "As", species: "As", position: [0, 0, 0], orbitals: [...SP3S_ORBITALS] },
    { label: "Ga", species: "Ga", position: [0.25, 0.25, 0.25], orbitals: [...SP3S_ORBITALS] },
  ],
  supportsOverlap: false,
  kPath: FCC_PATH,
  body: () => {
    const pp = fromCombined(-6.4513, 1.9546, 5.0779);
    return {
      parameters: [
        parameter("E_s[As]", -8.3431, "anion s on-site energy"),
        parameter("E_p[As]", 1.0414, "anion p on-site energy"),
        parameter("E_s*[As]", 8.5914, "anion s* on-site energy, kept above the anion p level", sStarAbove(1.0414)),
        parameter("E_s[Ga]", -2.6569, "cation s on-site energy"),
        parameter("E_p[Ga]", 3.6686, "cation p on-site energy"),
        parameter("E_s*[Ga]", 6.7386, "cation s* on-site energy, kept above the cation p level", sStarAbove(3.6686)),
        parameter("V_ssσ[As–Ga,1]", pp.ss, "ssσ"),
        parameter("V_ppσ[As–Ga,1]", pp.ppSigma, "ppσ"),
        parameter("V_ppπ[As–Ga,1]", pp.ppPi, "ppπ"),
        parameter("V_spσ[As–Ga,1]", spFromCombined(4.48), "s on As, p on Ga"),
        parameter("V_spσ[Ga–As,1]", spFromCombined(5.7839), "s on Ga, p on As"),
        parameter("V_s*pσ[As–Ga,1]", spFromCombined(4.8422), "s* on As, p on Ga"),
        parameter("V_s*pσ[Ga–As,1]", spFromCombined(4.8077), "s* on Ga, p on As"),
        parameter("V_ss*σ[As–Ga,1]", 0, "s on As, s* on Ga (zero in the sp3s* model)", { free: false }),
        parameter("V_ss*σ[Ga–As,1]", 0, "s on Ga, s* on As (zero in the sp3s* model)", { free: false }),
        parameter("V_s*s*σ[As–Ga,1]", 0, "s*s*σ (zero in the sp3s* model)", { free: false }),
      ],
      slaterKoster: { maxShell: 1, tolerance: 1e-3, overlap: false },
    };
  },
};
