import type { Vec3 } from "../geometry/vec3";
import { bondIntegralName } from "../model/parameter-names";
import { BOND_TYPES, type BondType, splitBondType } from "../slater-koster/bond-types";
import { HBAR2_OVER_M, harrisonBondIntegrals } from "../slater-koster/harrison";
import type { ModelParameter } from "../model/schema";
import { shellDistances } from "./geometry-hoppings";
import { BCC_PATH, FCC_PATH, bccVectors, fccVectors } from "./simple-lattices";
import { type TemplateDefinition, type TemplateGeometry, parameter } from "./types";

/**
 * Harrison's d-state coefficients (Harrison 1980, Solid State Table; values from memory):
 * V_ldm = η_ldm ħ² r_d^{3/2} / (m d^{7/2}) for l = s, p and V_ddm = η_ddm ħ² r_d³ / (m d⁵).
 */
const ETA_D: Partial<Record<BondType, number>> = {
  "sdσ": -3.16,
  "pdσ": -2.95,
  "pdπ": 1.36,
  "ddσ": -16.2,
  "ddπ": 8.75,
  "ddδ": 0,
};

const SPD_BONDS = BOND_TYPES.filter((b) => !b.includes("*"));

function harrisonSpd(bond: BondType, distance: number, rd: number): number {
  if (bond === "ssσ" || bond === "spσ" || bond === "ppσ" || bond === "ppπ")
    return harrisonBondIntegrals(distance)[bond];
  const eta = ETA_D[bond]!;
  if (bond.startsWith("dd")) return (eta * HBAR2_OVER_M * rd ** 3) / distance ** 5;
  return (eta * HBAR2_OVER_M * rd ** 1.5) / distance ** 3.5;
}

function spdTemplate(
  id: string,
  title: string,
  element: string,
  a0: number,
  rd: number,
  onsite: { s: number; p: number; d: number },
  lattice: (a: number) => Vec3[],
  kPath: TemplateDefinition["kPath"],
): TemplateDefinition {
  return {
    id,
    title,
    description: "One atom with s, p and five d orbitals (9 orbitals); Slater–Koster bond integrals for two neighbour shells.",
    dimension: 3,
    source:
      `Bond integrals from Harrison's scaling (Harrison, Electronic Structure and the Properties of Solids, 1980: ` +
      `universal sp coefficients; d coefficients and r_d = ${rd} Å for ${element} from memory) at each shell's bond length; ` +
      `on-site energies are illustrative (not a fit). No better published set is built in: fit before use. a = ${a0} Å.`,
    latticeConstant: { value: a0, meaning: "cube edge a" },
    lattice,
    sites: [
      {
        label: element,
        species: element,
        position: [0, 0, 0],
        orbitals: ["s", "px", "py", "pz", "dxy", "dyz", "dzx", "dx2-y2", "dz2"],
      },
    ],
    supportsOverlap: false,
    kPath,
    body: (g: TemplateGeometry) => {
      const distances = shellDistances(g, 2);
      const bonds: ModelParameter[] = distances.flatMap((d, i) =>
        SPD_BONDS.map((bond) =>
          parameter(
            bondIntegralName({ matrix: "hamiltonian", ...splitBondType(bond), pair: [element, element], shell: i + 1 }),
            harrisonSpd(bond, d, rd),
            `${bond}, shell ${i + 1}`,
          ),
        ),
      );
      return {
        parameters: [
          parameter(`E_s[${element}]`, onsite.s, "on-site energy of s"),
          parameter(`E_p[${element}]`, onsite.p, "on-site energy of p"),
          parameter(`E_d[${element}]`, onsite.d, "on-site energy of d"),
          ...bonds,
        ],
        slaterKoster: { maxShell: 2, tolerance: 1e-3, overlap: false },
      };
    },
  };
}

export const fccSpd = spdTemplate("fcc-spd", "fcc spd (two shells)", "Cu", 3.61, 0.67, { s: 0, p: 7, d: -2.5 }, fccVectors, FCC_PATH);
export const bccSpd = spdTemplate("bcc-spd", "bcc spd (two shells)", "Fe", 2.87, 0.8, { s: 0, p: 7, d: -1.5 }, bccVectors, BCC_PATH);
