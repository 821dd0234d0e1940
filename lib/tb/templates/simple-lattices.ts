import type { Vec3 } from "../geometry/vec3";
import { harrisonBondIntegrals } from "../slater-koster/harrison";
import { shellDistances, shellHoppings } from "./geometry-hoppings";
import { type TemplateDefinition, parameter } from "./types";

const S3 = Math.sqrt(3);

export const chainS: TemplateDefinition = {
  id: "chain-s",
  title: "1D chain, one s orbital",
  description: "One s orbital per site, nearest-neighbour hopping: E(k) = E_s − 2t cos ka.",
  dimension: 1,
  source: "Ashcroft & Mermin, Solid State Physics, ch. 10 (form of the model); t = 1 eV is illustrative (common practice)",
  latticeConstant: { value: 2.5, meaning: "site spacing a" },
  lattice: (a) => [[a, 0, 0]],
  sites: [{ label: "A", species: "X", position: [0, 0, 0], orbitals: ["s"] }],
  supportsOverlap: false,
  kPath: [
    { label: "Γ", reduced: [0, 0, 0] },
    { label: "X", reduced: [0.5, 0, 0] },
  ],
  body: (g) => ({
    parameters: [parameter("E_s[X]", 0, "on-site energy of the s orbital"), parameter("t", 1, "nearest-neighbour hopping; H = −t Σ c†c")],
    hoppings: shellHoppings(g, "s", ["t"], -1),
  }),
};

export const squareSingle: TemplateDefinition = {
  id: "square-single",
  title: "Square lattice, single band (t, t′, t″)",
  description:
    "One orbital per site with first, second and third-neighbour hoppings, the one-band model of the cuprate planes: " +
    "E = E_0 − 2t(cos k_x a + cos k_y a) − 4t′ cos k_x a cos k_y a − 2t″(cos 2k_x a + cos 2k_y a).",
  dimension: 2,
  source:
    "t = 0.40 eV, t′ = −0.12 eV, t″ = 0.06 eV: typical one-band cuprate values (from memory; cf. Pavarini et al., " +
    "Phys. Rev. Lett. 87, 047003 (2001)); a = 3.85 Å",
  latticeConstant: { value: 3.85, meaning: "square lattice constant a" },
  lattice: (a) => [
    [a, 0, 0],
    [0, a, 0],
  ],
  sites: [{ label: "Cu", species: "Cu", position: [0, 0, 0], orbitals: ["dx2-y2"] }],
  supportsOverlap: false,
  kPath: [
    { label: "Γ", reduced: [0, 0, 0] },
    { label: "X", reduced: [0.5, 0, 0] },
    { label: "M", reduced: [0.5, 0.5, 0] },
    { label: "Γ", reduced: [0, 0, 0] },
  ],
  body: (g) => ({
    parameters: [
      parameter("E_d[Cu]", 0, "on-site energy of the band (sets the zero)"),
      parameter("t", 0.4, "first-neighbour hopping; H = −t Σ c†c"),
      parameter("t'", -0.12, "second-neighbour (diagonal) hopping, same sign convention"),
      parameter("t''", 0.06, "third-neighbour hopping (2a), same sign convention"),
    ],
    hoppings: shellHoppings(g, "dx2-y2", ["t", "t'", "t''"], -1),
  }),
};

export const honeycombPz: TemplateDefinition = {
  id: "honeycomb-pz",
  title: "Honeycomb pz (graphene) up to third neighbours",
  description:
    "Two carbon sites with one pz orbital each and hoppings t1, t2, t3 (H = −t Σ c†c). With the overlap option, " +
    "overlaps s1, s2, s3 give a non-orthogonal model.",
  dimension: 2,
  source:
    "Orthogonal: t1 = 2.8 eV, C–C 1.42 Å (Castro Neto et al., Rev. Mod. Phys. 81, 109 (2009)), t2 = t3 = 0 fixed. " +
    "With overlap: E_pz = −0.28 eV, γ0,1,2 = −2.97, −0.073, −0.33 eV (t = −γ), s = 0.073, 0.018, 0.026 (Reich, " +
    "Maultzsch, Thomsen & Ordejón, Phys. Rev. B 66, 035412 (2002); attribution from memory)",
  latticeConstant: { value: S3 * 1.42, meaning: "lattice constant |a1| = √3 × C–C distance" },
  // Castro Neto's frame: a1 = (a/2)(3, √3), a2 = (a/2)(3, −√3) with a the C–C distance.
  lattice: (a) => [
    [(S3 / 2) * a, a / 2, 0],
    [(S3 / 2) * a, -a / 2, 0],
  ],
  sites: [
    { label: "A", species: "C", position: [0, 0, 0], orbitals: ["pz"] },
    { label: "B", species: "C", position: [1 / 3, 1 / 3, 0], orbitals: ["pz"] },
  ],
  supportsOverlap: true,
  kPath: [
    { label: "Γ", reduced: [0, 0, 0] },
    { label: "M", reduced: [0.5, 0, 0] },
    { label: "K", reduced: [2 / 3, 1 / 3, 0] },
    { label: "Γ", reduced: [0, 0, 0] },
  ],
  body: (g) => {
    const names = ["t1", "t2", "t3"];
    if (!g.overlap)
      return {
        parameters: [
          parameter("E_p[C]", 0, "on-site energy of pz (sets the zero)"),
          parameter("t1", 2.8, "first-neighbour hopping (H = −t Σ c†c)"),
          parameter("t2", 0, "second-neighbour hopping", { free: false }),
          parameter("t3", 0, "third-neighbour hopping", { free: false }),
        ],
        hoppings: shellHoppings(g, "pz", names, -1),
      };
    return {
      parameters: [
        parameter("E_p[C]", -0.28, "on-site energy of pz"),
        parameter("t1", 2.97, "first-neighbour hopping (H = −t Σ c†c)"),
        parameter("t2", 0.073, "second-neighbour hopping"),
        parameter("t3", 0.33, "third-neighbour hopping"),
        parameter("s1", 0.073, "first-neighbour overlap", { unit: "1" }),
        parameter("s2", 0.018, "second-neighbour overlap", { unit: "1" }),
        parameter("s3", 0.026, "third-neighbour overlap", { unit: "1" }),
      ],
      hoppings: shellHoppings(g, "pz", names, -1),
      overlaps: shellHoppings(g, "pz", ["s1", "s2", "s3"], 1),
    };
  },
};

/** Cubic s-band templates: one s orbital, V_ssσ at the nearest-neighbour distance from Harrison's scaling. */
function cubicS(
  id: string,
  title: string,
  a0: number,
  element: string,
  lattice: (a: number) => Vec3[],
  kPath: TemplateDefinition["kPath"],
): TemplateDefinition {
  return {
    id,
    title,
    description: `One s orbital per site with a nearest-neighbour ssσ bond integral (Slater–Koster).`,
    dimension: 3,
    source:
      `V_ssσ from Harrison's universal scaling η_ssσ ħ²/(m d²) at the nearest-neighbour distance (Harrison, Electronic ` +
      `Structure and the Properties of Solids, 1980); a = ${a0} Å as in ${element} (from memory); E_s = 0`,
    latticeConstant: { value: a0, meaning: "cube edge a" },
    lattice,
    sites: [{ label: element, species: element, position: [0, 0, 0], orbitals: ["s"] }],
    supportsOverlap: false,
    kPath,
    body: (g) => ({
      parameters: [
        parameter(`E_s[${element}]`, 0, "on-site energy of s (sets the zero)"),
        parameter(`V_ssσ[${element}–${element},1]`, harrisonBondIntegrals(shellDistances(g, 1)[0])["ssσ"], "ssσ, first shell"),
      ],
      slaterKoster: { maxShell: 1, tolerance: 1e-3, overlap: false },
    }),
  };
}

export const fccVectors = (a: number): Vec3[] => [
  [0, a / 2, a / 2],
  [a / 2, 0, a / 2],
  [a / 2, a / 2, 0],
];
export const bccVectors = (a: number): Vec3[] => [
  [-a / 2, a / 2, a / 2],
  [a / 2, -a / 2, a / 2],
  [a / 2, a / 2, -a / 2],
];

/** Γ–X–W–K–Γ–L–U–W–L–K|U–X in the reduced coordinates of {@link fccVectors}. */
export const FCC_PATH: TemplateDefinition["kPath"] = [
  { label: "Γ", reduced: [0, 0, 0] },
  { label: "X", reduced: [0, 0.5, 0.5] },
  { label: "W", reduced: [0.25, 0.5, 0.75] },
  { label: "K", reduced: [0.375, 0.375, 0.75] },
  { label: "Γ", reduced: [0, 0, 0] },
  { label: "L", reduced: [0.5, 0.5, 0.5] },
  { label: "U", reduced: [0.25, 0.625, 0.625] },
  { label: "W", reduced: [0.25, 0.5, 0.75] },
  { label: "L", reduced: [0.5, 0.5, 0.5] },
  { label: "K", reduced: [0.375, 0.375, 0.75] },
  { label: "U", reduced: [0.25, 0.625, 0.625], jump: true },
  { label: "X", reduced: [0, 0.5, 0.5] },
];

/** Γ–H–N–Γ–P–H|P–N in the reduced coordinates of {@link bccVectors}. */
export const BCC_PATH: TemplateDefinition["kPath"] = [
  { label: "Γ", reduced: [0, 0, 0] },
  { label: "H", reduced: [0.5, 0.5, -0.5] },
  { label: "N", reduced: [0, 0.5, 0] },
  { label: "Γ", reduced: [0, 0, 0] },
  { label: "P", reduced: [0.25, 0.25, 0.25] },
  { label: "H", reduced: [0.5, 0.5, -0.5] },
  { label: "P", reduced: [0.25, 0.25, 0.25], jump: true },
  { label: "N", reduced: [0, 0.5, 0] },
];

export const cubicSimpleS = cubicS(
  "cubic-s",
  "Simple cubic, one s band",
  3.35,
  "Po",
  (a) => [
    [a, 0, 0],
    [0, a, 0],
    [0, 0, a],
  ],
  [
    { label: "Γ", reduced: [0, 0, 0] },
    { label: "X", reduced: [0, 0.5, 0] },
    { label: "M", reduced: [0.5, 0.5, 0] },
    { label: "Γ", reduced: [0, 0, 0] },
    { label: "R", reduced: [0.5, 0.5, 0.5] },
    { label: "X", reduced: [0, 0.5, 0] },
    { label: "M", reduced: [0.5, 0.5, 0], jump: true },
    { label: "R", reduced: [0.5, 0.5, 0.5] },
  ],
);
export const bccS = cubicS("bcc-s", "Body-centred cubic, one s band", 4.23, "Na", bccVectors, BCC_PATH);
export const fccS = cubicS("fcc-s", "Face-centred cubic, one s band", 4.05, "Al", fccVectors, FCC_PATH);
