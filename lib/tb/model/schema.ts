import { z } from "zod";
import { BOND_KINDS, SHELL_PAIRS } from "../slater-koster/bond-types";
import { ORBITAL_NAMES } from "./orbitals";
import { type BondIntegralKey, bondIntegralName, bondIntegralOf, canonicalParameterName } from "./parameter-names";

const vec3 = z.tuple([z.number().finite(), z.number().finite(), z.number().finite()]);
const integer = z.number().int();

/** "site:orbital", e.g. "A:pz" or "Si1:s*". */
const orbitalReference = z.string().regex(/^[^:\s]+:[^:\s]+$/, 'expected "site:orbital", e.g. "A:pz"');

/** A real factor, or a complex one as [real, imaginary]. */
const factorSchema = z.union([z.number().finite(), z.tuple([z.number().finite(), z.number().finite()])]);

/** Units of a parameter: eV for energies (on-site, hopping, bond integral), "1" for dimensionless overlaps. */
export const parameterUnitSchema = z.enum(["eV", "1"]);

/** A parameter name as read: bond integrals in the earlier spelling (`V_pp_pi[Si-Si,1]`) become today's (`V_ppπ[Si–Si,1]`). */
const parameterNameSchema = z.string().min(1).transform(canonicalParameterName);

const speciesSchema = z.string().regex(/^[A-Za-z][A-Za-z0-9_]*$/, "a species is a chemical symbol or a plain name");

/** A bond integral's name as structured fields: `V_ppπ[Si–Si,1]` is { hamiltonian, pp, π, [Si, Si], 1 }. */
export const bondIntegralKeySchema = z
  .object({
    matrix: z.enum(["hamiltonian", "overlap"]).describe('"hamiltonian" (V, eV) or "overlap" (S, dimensionless)'),
    bond: z.enum(SHELL_PAIRS).describe('the shell pair, lower shell first (s < s* < p < d): "ss", "sp", "pp", …'),
    kind: z.enum(BOND_KINDS).describe("angular momentum about the bond: σ, π or δ"),
    pair: z
      .tuple([speciesSchema, speciesSchema])
      .describe("[species of the lower shell, species of the upper shell]; alphabetical for same-shell integrals"),
    shell: z.int().min(1).describe("neighbour shell, from 1"),
  })
  .strict();

const sameKey = (a: BondIntegralKey, b: BondIntegralKey) => bondIntegralName(a) === bondIntegralName(b);

/**
 * A parameter. A bond integral's `integral` is filled in from its name; one given must match the name
 * (the name is what terms refer to, the key is the same thing as fields).
 */
export const modelParameterSchema = z
  .object({
    name: parameterNameSchema,
    value: z.number().finite(),
    unit: parameterUnitSchema,
    free: z.boolean(),
    min: z.number().finite().optional(),
    max: z.number().finite().optional(),
    description: z.string().optional(),
    integral: bondIntegralKeySchema.optional(),
  })
  .superRefine((p, ctx) => {
    if (!p.integral) return;
    const named = bondIntegralOf(p.name);
    if (!named || !sameKey(named, p.integral))
      ctx.addIssue({
        code: "custom",
        path: ["integral"],
        message: `the integral ${bondIntegralName(p.integral)} does not match the parameter's name "${p.name}"`,
      });
  })
  .transform((p) => {
    const integral = p.integral ?? bondIntegralOf(p.name);
    return integral ? { ...p, integral } : p;
  });

export const modelSiteSchema = z.object({
  label: z.string().regex(/^[^:\s]+$/, "a site label has no spaces or colons"),
  species: speciesSchema,
  /** fractional coordinates of the lattice vectors (for 1D/2D the extra components are Å along the completed axes) */
  position: vec3,
  orbitals: z.array(z.enum(ORBITAL_NAMES)).min(1),
});

/** Overrides the default on-site parameter of one orbital; `parameter: null` means zero on-site energy. */
export const onsiteEntrySchema = z.object({
  orbital: orbitalReference,
  parameter: parameterNameSchema.nullable(),
});

/** Slater–Koster hoppings between all site pairs up to a neighbour shell, with bond integrals as parameters. */
export const slaterKosterSchema = z.object({
  /** include shells 1..maxShell (global distance shells) */
  maxShell: integer.min(1).max(6),
  /** distances within this many Å form one shell */
  tolerance: z.number().positive().default(1e-3),
  /** also build S(k) from overlap bond integrals S_…[A-B,n] */
  overlap: z.boolean().default(false),
});

/** An explicit hopping (or overlap) ⟨from, home cell| H |to, cell R⟩ = factor × parameter. */
export const hoppingEntrySchema = z.object({
  from: orbitalReference,
  to: orbitalReference,
  /** lattice translation R of the `to` orbital, integer multiples of a1, a2, a3 */
  translation: z.tuple([integer, integer, integer]),
  parameter: parameterNameSchema,
  factor: factorSchema.default(1),
});

export const kPathPointSchema = z.object({
  label: z.string().min(1),
  /** reduced coordinates in the model's reciprocal basis */
  reduced: vec3,
  /** the path jumps to this point from the previous one */
  jump: z.boolean().optional(),
});

/**
 * A Bandwright model document (format "bandwright-model", version 1). Lengths in Å, energies in eV.
 * See the README section "Model documents" for the meaning of every field and a worked example.
 */
export const modelDocumentSchema = z.object({
  format: z.literal("bandwright-model"),
  version: z.literal(1),
  name: z.string().default(""),
  description: z.string().default(""),
  /** 1–3 lattice vectors, Cartesian Å */
  lattice: z.array(vec3).min(1).max(3),
  sites: z.array(modelSiteSchema).min(1),
  onsite: z.array(onsiteEntrySchema).default([]),
  slaterKoster: slaterKosterSchema.optional(),
  hoppings: z.array(hoppingEntrySchema).default([]),
  overlaps: z.array(hoppingEntrySchema).default([]),
  /** "automatic": list one direction, the Hermitian partner is added; "listed": both directions are listed */
  partners: z.enum(["automatic", "listed"]).default("automatic"),
  parameters: z.array(modelParameterSchema),
  kPath: z.array(kPathPointSchema).optional(),
  /** the template the document was built from, for provenance */
  template: z.string().optional(),
});

/** A validated model document (defaults filled in). */
export type ModelDocument = z.output<typeof modelDocumentSchema>;
/** A model document as written by a user (defaults may be omitted). */
export type ModelDocumentInput = z.input<typeof modelDocumentSchema>;
export type ModelParameter = z.output<typeof modelParameterSchema>;
export type ModelSite = z.output<typeof modelSiteSchema>;
export type HoppingEntry = z.output<typeof hoppingEntrySchema>;
export type KPathPoint = z.output<typeof kPathPointSchema>;
