import { z } from "zod";
import type { BandFitResult } from "@/lib/fit/bands";
import type { EnergyAlignment } from "@/lib/fit/bands/energy-alignment";
import { type RealSpaceElement, compileModel, expandHoppings } from "@/lib/tb";

/**
 * The exported parameter set (format "bandwright-parameter-set", version 1): everything needed to rebuild
 * H(k) — and S(k) when the model has overlaps — without Slater–Koster code, plus where the numbers came from.
 * Energies in eV, lengths in Å, wave vectors in 1/Å with 2π included.
 */

/** The phase convention, stated in every document so that a reader needs nothing else. */
export const PHASE_CONVENTION =
  "H_ij(k) = δ_ij onsite[i] + Σ over hoppings with from = i, to = j of (value + i·imaginary) · exp(i k·(R1·a1 + R2·a2 + R3·a3 + τ_j − τ_i)); " +
  "S_ij(k) = δ_ij + the same sum over overlaps. R = translation, a = lattice, τ = orbital positions (Cartesian Å), k Cartesian 1/Å. " +
  "Both directions of every hopping are listed, so the sum is Hermitian as written.";

const finite = z.number().refine(Number.isFinite, "must be a finite number");
const vec3 = z.tuple([finite, finite, finite]);

const realSpaceElementSchema = z.object({
  /** orbital index (0-based, into `orbitals`) */
  from: z.int().min(0),
  to: z.int().min(0),
  /** lattice translation of the `to` orbital, integer multiples of the lattice vectors */
  translation: z.tuple([z.int(), z.int(), z.int()]),
  /** real part (eV for hoppings, dimensionless for overlaps) */
  value: finite,
  /** imaginary part */
  imaginary: finite,
});

export const parameterSetSchema = z
  .object({
    format: z.literal("bandwright-parameter-set"),
    version: z.literal(1),
    units: z.object({ energy: z.literal("eV"), length: z.literal("Å"), wavevector: z.literal("1/Å, 2π included") }),
    phaseConvention: z.string(),
    /** lattice vectors, Cartesian Å (1–3) */
    lattice: z.array(vec3).min(1).max(3),
    sites: z.array(
      z.object({
        label: z.string(),
        species: z.string(),
        /** fractional coordinates of the lattice vectors */
        position: vec3,
        orbitals: z.array(z.string()).min(1),
      }),
    ),
    /** the basis, in the order of every matrix index */
    orbitals: z.array(
      z.object({
        index: z.int().min(0),
        /** "site:orbital" */
        label: z.string(),
        site: z.string(),
        orbital: z.string(),
        /** τ, Cartesian Å */
        position: vec3,
      }),
    ),
    parameters: z.array(
      z.object({
        name: z.string(),
        value: finite,
        unit: z.enum(["eV", "1"]),
        /** one standard error; null when fixed or not determined by the data */
        standardError: finite.nullable(),
        free: z.boolean(),
        determined: z.boolean(),
      }),
    ),
    /**
     * The fit compared data with E_ref + (E_model − E_ref)/Z + δ; these are δ (eV), Z and E_ref (eV). The
     * hopping list gives E_model (δ = 0, Z = 1 change nothing).
     */
    energyAlignment: z.object({ offset: finite, renormalisation: finite, reference: finite }),
    /** on-site energy of every orbital, eV (index = orbital index) */
    onsite: z.array(finite),
    hoppings: z.array(realSpaceElementSchema),
    /** overlaps beyond the on-site identity; empty for orthogonal models */
    overlaps: z.array(realSpaceElementSchema),
    statistics: z.object({ rms: finite, reducedChiSquared: finite, pointsUsed: z.int(), converged: z.boolean(), stopReason: z.string() }),
    provenance: z.object({
      dataset: z.object({ id: z.string(), name: z.string(), sha256: z.string().regex(/^[0-9a-f]{64}$/) }),
      fit: z.object({ id: z.string(), name: z.string() }),
      revision: z.int().min(1),
      launchedBy: z.string().nullable(),
      launchedAt: z.iso.datetime(),
      finishedAt: z.iso.datetime().nullable(),
      exportedAt: z.iso.datetime(),
      software: z.object({ name: z.literal("bandwright"), version: z.string() }),
    }),
  })
  .strict();
export type ParameterSet = z.output<typeof parameterSetSchema>;

/** Where an export came from (the routes fill it from the revision). */
export interface ParameterSetProvenance {
  dataset: { id: string; name: string; sha256: string };
  fit: { id: string; name: string };
  revision: number;
  launchedBy: string | null;
  launchedAt: Date;
  finishedAt: Date | null;
  exportedAt: Date;
  /** package.json's version */
  softwareVersion: string;
}

const plainElement = (e: RealSpaceElement) => ({ from: e.from, to: e.to, translation: e.translation, value: e.value, imaginary: e.imaginary });

/**
 * Builds the parameter set of a finished fit from its fitted model document (the real-space list comes from
 * `expandHoppings` at the fitted values).
 * @param result - the fit's result without per-point residuals (what a revision stores)
 * @param alignment - the δ (eV), Z and E_ref (eV) the fit used (fitted values, or the fixed options)
 */
export function buildParameterSet(
  result: Omit<BandFitResult, "residuals">,
  alignment: EnergyAlignment,
  provenance: ParameterSetProvenance,
): ParameterSet {
  const compiled = compileModel(result.fittedModel);
  const realSpace = expandHoppings(compiled, compiled.initialValues);
  const byName = new Map(result.parameters.map((p) => [p.name, p]));
  const document: ParameterSet = {
    format: "bandwright-parameter-set",
    version: 1,
    units: { energy: "eV", length: "Å", wavevector: "1/Å, 2π included" },
    phaseConvention: PHASE_CONVENTION,
    lattice: compiled.lattice.map((v) => [v[0], v[1], v[2]]),
    sites: result.fittedModel.sites.map((s) => ({ label: s.label, species: s.species, position: s.position, orbitals: [...s.orbitals] })),
    orbitals: compiled.orbitals.map((o) => ({ index: o.index, label: o.label, site: o.site, orbital: o.orbital, position: [...o.position] })),
    parameters: compiled.parameters.map((p) => {
      const fitted = byName.get(p.name);
      return {
        name: p.name,
        value: p.value,
        unit: p.unit,
        standardError: fitted?.standardError ?? null,
        free: p.free,
        determined: fitted?.determined ?? !p.free,
      };
    }),
    energyAlignment: { offset: alignment.offset, renormalisation: alignment.renormalisation, reference: alignment.reference },
    onsite: realSpace.onsite,
    hoppings: realSpace.hoppings.map(plainElement),
    overlaps: realSpace.overlaps.map(plainElement),
    statistics: {
      rms: result.rms,
      reducedChiSquared: result.reducedChiSquared,
      pointsUsed: result.pointsUsed,
      converged: result.converged,
      stopReason: result.stopReason,
    },
    provenance: {
      dataset: provenance.dataset,
      fit: provenance.fit,
      revision: provenance.revision,
      launchedBy: provenance.launchedBy,
      launchedAt: provenance.launchedAt.toISOString(),
      finishedAt: provenance.finishedAt?.toISOString() ?? null,
      exportedAt: provenance.exportedAt.toISOString(),
      software: { name: "bandwright", version: provenance.softwareVersion },
    },
  };
  return parameterSetSchema.parse(document);
}

/** The JSON Schema (draft 2020-12) of the parameter set, generated from {@link parameterSetSchema}. */
export function parameterSetJsonSchema(): Record<string, unknown> {
  return {
    ...z.toJSONSchema(parameterSetSchema, { target: "draft-2020-12", io: "output" }),
    $id: "https://bandwright.invalid/schemas/parameter-set-v1.json",
    title: "Bandwright parameter set, version 1",
    description: "A fitted tight-binding parameter set with its real-space hopping list and provenance. " + PHASE_CONVENTION,
  };
}
