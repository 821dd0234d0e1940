import { z } from "zod";
import { bandMappingSchema, energyWindowSchema } from "@/lib/fit/bands/schema";
import { ORBITAL_NAMES, bondIntegralKeySchema } from "@/lib/tb";
import { CONVENTIONS } from "./conventions";

/**
 * The exported parameter set, format "bandwright-parameter-set", version 2: everything needed to rebuild
 * H(k) — and S(k) when the model has overlaps — and to propagate its errors, with where the numbers came
 * from. Every field carries its description, which the generated JSON Schema publishes.
 */

const finite = z.number().refine(Number.isFinite, "must be a finite number");
const vec3 = (what: string) => z.tuple([finite, finite, finite]).describe(what);
const complexValue = (what: string) =>
  z.union([finite, z.tuple([finite, finite])]).describe(`${what}: a number when real, [real, imaginary] when complex`);

const contributionSchema = z
  .object({
    name: z.string().describe("the parameter's name (an entry of parameters)"),
    coefficient: complexValue("what one unit of the parameter adds to the element"),
  })
  .strict()
  .describe("one parameter's share of an element: the element is Σ coefficient × parameter value over its parameters");

const bondSchema = z
  .object({
    key: z.string().describe('unique key of the entry: "from→to@n1,n2,n3"'),
    from: z.string().describe('orbital label ("site:orbital") of the row, in the home cell'),
    to: z.string().describe('orbital label ("site:orbital") of the column, in the cell translated by translation'),
    matrixEntry: z.tuple([z.int().min(0), z.int().min(0)]).describe("[row, column] of the matrix element, 0-based orbital indices"),
    translation: z.tuple([z.int(), z.int(), z.int()]).describe("lattice translation R of the `to` orbital, integer multiples of a1, a2, a3"),
    vector: vec3("the bond vector R·a + τ_to − τ_from, Cartesian Å: the vector in the Bloch phase"),
    length: finite.describe("|vector|, Å"),
    value: complexValue("the element at the fitted parameters (eV for bonds, dimensionless for overlaps)"),
    parameters: z.array(contributionSchema).describe("the parameters the element is made of, for propagating errors (see covariance)"),
    partner: z.string().describe("key of the Hermitian partner (to→from at −R, complex-conjugate value), also listed"),
  })
  .strict();

const onsiteSchema = z
  .object({
    value: finite.describe("on-site energy, eV"),
    parameters: z.array(contributionSchema).describe("the parameters it is made of (usually one, coefficient 1)"),
  })
  .strict();

const nullableMatrix = (what: string) => z.array(z.array(finite.nullable())).describe(what);

const globalParameterSchema = (what: string) =>
  z
    .object({
      value: finite.describe(what),
      free: z.boolean().describe("fitted (true) or held at value (false)"),
      standardError: finite.nullable().describe("one standard error; null when fixed or not determined by the data"),
    })
    .strict();

export const parameterSetSchema = z
  .object({
    format: z.literal("bandwright-parameter-set").describe("always bandwright-parameter-set"),
    version: z.literal(2).describe("format version; a change of shape is a new version"),
    units: z
      .object({
        energy: z.literal("eV").describe("every energy"),
        length: z.literal("Å").describe("every length and position"),
        wavevector: z.literal("1/Å, 2π included").describe("every k (Cartesian) and reciprocal vector"),
      })
      .strict()
      .describe("units of every number that has one"),
    conventions: z
      .object({
        hamiltonian: z.string().describe("how H(k) is built from orbitals and bonds"),
        overlap: z.string().describe("how S(k) is built from overlaps"),
        phase: z.string().describe("the Bloch phase convention"),
        signs: z.string().describe("how parameter values become element values, with their signs"),
        orbitals: z.string().describe("what the orbitals are and in which frame"),
        slaterKoster: z.string().describe("the Slater–Koster convention the bond integrals follow"),
        orbitalOrder: z.string().describe("the order of matrix indices"),
        energyAlignment: z.string().describe("how the model's energies were compared with the data's"),
      })
      .strict()
      .describe("the conventions, spelled out (the same text in every document of this version)"),
    spin: z
      .literal("spinless")
      .describe('"spinless": each orbital holds one spin state and every band is doubly degenerate in spin; a spinful document (basis doubled) will say "spinful"'),
    lattice: z.array(vec3("a lattice vector, Cartesian Å")).min(1).max(3).describe("lattice vectors a1…, Cartesian Å (1–3): the frame of the model"),
    reciprocalLattice: z.array(vec3("a reciprocal vector, Cartesian 1/Å")).min(1).max(3).describe("b_i with a_i·b_j = 2π δ_ij, Cartesian 1/Å"),
    sites: z
      .array(
        z
          .object({
            label: z.string().describe("site label"),
            species: z.string().describe("chemical symbol or name of the species"),
            position: vec3("fractional coordinates of the lattice vectors"),
            orbitals: z.array(z.enum(ORBITAL_NAMES)).min(1).describe("the site's orbitals, in basis order"),
          })
          .strict(),
      )
      .describe("the sites of the cell"),
    orbitals: z
      .array(
        z
          .object({
            index: z.int().min(0).describe("matrix index, 0-based"),
            label: z.string().describe('"site:orbital"'),
            site: z.string().describe("site label"),
            species: z.string().describe("the site's species"),
            orbital: z.enum(ORBITAL_NAMES).describe("orbital name (see orbitalDefinitions)"),
            position: vec3("τ, the orbital's position, Cartesian Å"),
            onsite: onsiteSchema.describe("the orbital's on-site energy"),
          })
          .strict(),
      )
      .describe("the basis, in matrix order"),
    orbitalDefinitions: z
      .record(z.string(), z.string())
      .describe("angular part of each orbital used, as a function of x, y, z in the lattice's frame (r from the site)"),
    parameters: z
      .array(
        z
          .object({
            name: z.string().describe("the parameter's name, as in the model document"),
            value: finite.describe("fitted value (the start value when fixed); eV, or dimensionless for overlaps"),
            unit: z.enum(["eV", "1"]).describe('"eV" for H parameters, "1" for overlap parameters'),
            standardError: finite.nullable().describe("one standard error √(s²[(JᵀWJ)⁻¹]_jj), s² = χ²/(N − P); null when fixed or not determined"),
            free: z.boolean().describe("fitted (true) or held at value (false)"),
            determined: z.boolean().describe("false for a free parameter the data do not determine: its value is not a result"),
            integral: bondIntegralKeySchema.nullable().describe("for a Slater–Koster bond integral, its structured key; null otherwise"),
            description: z.string().nullable().describe("the model's description of the parameter"),
          })
          .strict(),
      )
      .describe("the model's parameters, in the model's order"),
    covariance: z
      .object({
        parameters: z.array(z.string()).describe('names of the free parameters, the order of both matrices (may include "energy offset" and "renormalisation")'),
        matrix: nullableMatrix("covariance s²(JᵀWJ)⁻¹, entry (i, j) in unit_i × unit_j (eV² between two H parameters); null where a parameter is not determined"),
        correlation: nullableMatrix("correlation coefficients in [−1, 1]; null where a parameter is not determined"),
      })
      .strict()
      .describe("the fit's covariance of the free parameters: propagate it to any element through its parameters' coefficients"),
    energyAlignment: z
      .object({
        formula: z.string().describe("the formula the fit applied"),
        offset: globalParameterSchema("δ, eV").describe("the energy offset δ"),
        renormalisation: globalParameterSchema("Z, dimensionless").describe("the renormalisation factor Z"),
        reference: finite.describe("E_ref, eV, on the data's energy scale: the energy Z leaves in place"),
        dataEnergyZero: z.string().describe('what the data\'s energies are measured from, as the dataset states it ("Fermi level", "valence-band maximum", …), or "unstated"'),
      })
      .strict()
      .describe("how the model's energies were compared with the data's"),
    bonds: z.array(bondSchema).describe("every hopping t_from,to(R) ≠ on-site, both directions (see conventions.hamiltonian)"),
    overlaps: z.array(bondSchema).describe("every overlap beyond the on-site identity, both directions; empty for orthogonal models"),
    kPath: z
      .array(
        z
          .object({
            label: z.string().describe("high-symmetry label"),
            reduced: vec3("reduced coordinates of reciprocalLattice"),
            cartesian: vec3("Cartesian k, 1/Å"),
            jump: z.boolean().describe("true when the path jumps to this point from the previous one"),
          })
          .strict(),
      )
      .nullable()
      .describe("the model's k-path (the path of the model bands CSV), null when the model has none"),
    fit: z
      .object({
        mapping: bandMappingSchema.describe("which model band each data band was compared with"),
        window: energyWindowSchema.nullable().describe("energy window on the data energy, eV (min, max); null: every point"),
        sigma: z
          .object({
            policy: z.enum(["from-data", "uniform"]).describe('"from-data": each point\'s own σ, else uniform; "uniform": uniform for every point'),
            uniform: finite.describe("σ, eV, of points without their own (every point for the uniform policy)"),
          })
          .strict()
          .describe("the uncertainty σ of each point"),
        bandWeights: z.record(z.string(), finite).describe("weight per data band (bands not listed weigh 1); a weight w makes σ count as σ/√w, 0 drops the band"),
        starts: z.int().min(1).describe("number of starts (the first is the model's own values)"),
        seed: z.int().describe("seed of the generator that drew the extra starts"),
        maxIterations: z.int().min(1).describe("Levenberg–Marquardt steps allowed per start"),
        timeLimitMs: finite.describe("wall-clock budget of the fit, ms"),
        jacobian: z.enum(["analytic", "finite-difference"]).describe("how derivatives were formed"),
        harrisonStart: z.boolean().describe("whether ssσ, spσ, ppσ, ppπ started from Harrison's universal values"),
        crossingTolerance: finite
          .nullable()
          .describe("eV: bands closer than this at a point's k took the degenerate-subspace derivative (0: off); null for fits made before crossings were treated"),
      })
      .strict()
      .describe("the settings the fit ran with"),
    statistics: z
      .object({
        rms: finite.describe("unweighted RMS of model − data over the points used, eV"),
        maxAbsResidual: finite.describe("largest |model − data|, eV"),
        chiSquared: finite.describe("χ² = Σ ((model − data)/σ)²"),
        reducedChiSquared: finite.describe("χ²/(N − P)"),
        pointsUsed: z.int().describe("N, the points the fit used"),
        pointsDropped: z
          .object({
            window: z.int().describe("outside the energy window"),
            unmapped: z.int().describe("data bands outside the mapping"),
            zeroWeight: z.int().describe("of weight 0"),
          })
          .strict()
          .describe("points left out, by reason"),
        crossingPoints: z.int().nullable().describe("points at accidental band crossings at the solution; null for fits made before they were counted"),
        converged: z.boolean().describe("whether the fit stopped at a minimum"),
        stopReason: z.string().describe("why the fit stopped"),
      })
      .strict()
      .describe("how well the model fits the data"),
    provenance: z
      .object({
        dataset: z
          .object({
            id: z.string().describe("dataset id"),
            name: z.string().describe("dataset name"),
            sha256: z.string().regex(/^[0-9a-f]{64}$/).describe("SHA-256 of the uploaded file, hex"),
            source: z.enum(["calculation", "photoemission"]).describe("what produced the data"),
          })
          .strict()
          .describe("the data the fit ran on"),
        fit: z.object({ id: z.string().describe("fit id"), name: z.string().describe("fit name") }).strict().describe("the fit"),
        revision: z.int().min(1).describe("the revision's number within its fit"),
        launchedBy: z.string().nullable().describe("who launched the revision; null when the account is gone"),
        launchedAt: z.iso.datetime().describe("when it was launched, UTC"),
        finishedAt: z.iso.datetime().nullable().describe("when it finished, UTC"),
        exportedAt: z.iso.datetime().describe("when this document was made, UTC"),
        software: z
          .object({ name: z.literal("bandwright").describe("always bandwright"), version: z.string().describe("the software's version") })
          .strict()
          .describe("what made the document"),
      })
      .strict()
      .describe("where the numbers came from"),
  })
  .strict();
export type ParameterSet = z.output<typeof parameterSetSchema>;
export type ParameterSetBond = ParameterSet["bonds"][number];

/** The JSON Schema (draft 2020-12) of the parameter set, generated from {@link parameterSetSchema}. */
export function parameterSetJsonSchema(): Record<string, unknown> {
  return {
    ...z.toJSONSchema(parameterSetSchema, { target: "draft-2020-12", io: "output" }),
    $id: "https://bandwright.invalid/schemas/parameter-set-v2.json",
    title: "Bandwright parameter set, version 2",
    description: `A fitted tight-binding parameter set: its bonds, their parameters and covariance, and provenance. ${CONVENTIONS.hamiltonian} ${CONVENTIONS.signs}`,
  };
}
