import { z } from "zod";
import type { StopReason } from "../least-squares";
import { type ModelDocument, ModelError, TEMPLATE_IDS, buildTemplate, modelDocumentSchema } from "@/lib/tb";

/**
 * The one set of schemas for a band fit, shared by the fit routes, the forms, the worker and the command
 * line. Energies in eV, k in Cartesian 1/Å (2π included), bands numbered from 1 in increasing energy.
 */

const finite = z.number().refine(Number.isFinite, "must be a finite number");
const vec3 = z.tuple([finite, finite, finite]);
const bandNumber = z.int().min(1, "bands are numbered from 1");

/** Overrides of one template parameter (value in the parameter's unit: eV, or 1 for overlaps). */
const parameterOverrideSchema = z
  .object({ value: finite.optional(), free: z.boolean().optional(), min: finite.optional(), max: finite.optional() })
  .strict();

/** A model built from a template: `{ template, latticeConstant?, lattice?, sites?, overlap?, parameters? }`. */
export const templateModelSpecSchema = z
  .object({
    template: z.enum(TEMPLATE_IDS),
    /** lattice constant, Å (its meaning depends on the template); ignored when `lattice` is given */
    latticeConstant: z.number().positive("the lattice constant must be positive (Å)").optional(),
    /** the user's own lattice vectors, Cartesian Å, in the template's order */
    lattice: z.array(vec3).min(1).max(3).optional(),
    /** fractional positions of the template's sites in the user's cell, in template order */
    sites: z.array(vec3).optional(),
    /** include the overlap S(k) (templates that support it) */
    overlap: z.boolean().optional(),
    /** per-parameter overrides of the template's defaults, by parameter name */
    parameters: z.record(z.string(), parameterOverrideSchema).optional(),
  })
  .strict();

/** A full model document, or a template request. */
export const modelSpecSchema = z.union([modelDocumentSchema, templateModelSpecSchema]);
export type ModelSpec = z.output<typeof modelSpecSchema>;
export type ModelSpecInput = z.input<typeof modelSpecSchema>;
export type TemplateModelSpec = z.output<typeof templateModelSpecSchema>;

/**
 * The model document a spec stands for (a template request is built with `buildTemplate`).
 * @throws ModelError with the template's own messages (unknown parameter, wrong lattice, …)
 */
export function resolveModelSpec(spec: ModelSpec): ModelDocument {
  if ("format" in spec) return spec;
  const { template, latticeConstant, lattice, sites, overlap, parameters } = spec;
  try {
    return buildTemplate(template, { latticeConstant, lattice, sites, overlap, parameters });
  } catch (error) {
    if (error instanceof ModelError) throw error;
    throw new ModelError([{ path: "template", message: (error as Error).message }]);
  }
}

/**
 * Which model band each data band is compared with.
 * - `offset`: data bands `dataBands[0]..dataBands[1]` map to model bands `firstModelBand`, `firstModelBand + 1`, …
 *   (`dataBands` defaults to every data band present, `firstModelBand` to 1); data bands outside the range
 *   are dropped as unmapped.
 * - `nearest`: each point is compared with the model band closest to it in energy at the current
 *   parameters, among `modelBands` (default all) — for photoemission branches whose band index is unknown.
 */
export const bandMappingSchema = z.discriminatedUnion("kind", [
  z
    .object({
      kind: z.literal("offset").describe("data bands map to consecutive model bands"),
      dataBands: z
        .tuple([bandNumber, bandNumber])
        .refine(([first, last]) => first <= last, "the first data band must not be above the last")
        .optional()
        .describe("[first, last] data band mapped (default: every data band present); others are dropped"),
      firstModelBand: bandNumber.default(1).describe("the model band the first data band maps to (from 1)"),
    })
    .strict(),
  z
    .object({
      kind: z.literal("nearest").describe("each point is compared with the model band nearest to it"),
      modelBands: z
        .tuple([bandNumber, bandNumber])
        .refine(([first, last]) => first <= last, "the first model band must not be above the last")
        .optional()
        .describe("[first, last] model bands considered (default: all)"),
    })
    .strict(),
]);
export type BandMapping = z.output<typeof bandMappingSchema>;
export type BandMappingInput = z.input<typeof bandMappingSchema>;

/** The mapping used when none is given: every data band from model band 1. */
export const DEFAULT_BAND_MAPPING: BandMapping = { kind: "offset", firstModelBand: 1 };

/** Points whose data energy lies outside [min, max] (eV, inclusive) are dropped and counted. */
export const energyWindowSchema = z
  .object({ min: finite.describe("lowest data energy kept, eV"), max: finite.describe("highest data energy kept, eV") })
  .strict()
  .refine((w) => w.min < w.max, { message: "the window's min must be below its max (eV)", path: ["max"] });
export type EnergyWindow = z.output<typeof energyWindowSchema>;

/**
 * The energy offset δ (eV) and the renormalisation factor Z (dimensionless) enter every predicted energy
 * as energy-alignment.ts states and applies it, with E_ref = `renormalisation.reference` (eV, default 0:
 * the data's own energy zero, e.g. E_F or the VBM). Fixed at δ = 0 and Z = 1 they change nothing.
 */
const energyOffsetSchema = z
  .object({
    /** δ, eV. Default 0. */
    value: finite.default(0),
    /** fit δ. Default false. */
    free: z.boolean().default(false),
    min: finite.optional(),
    max: finite.optional(),
  })
  .strict();

const renormalisationSchema = z
  .object({
    /** Z, dimensionless. Default 1. */
    value: z.number().positive("the renormalisation factor must be positive").default(1),
    /** fit Z. Default false. */
    free: z.boolean().default(false),
    /** E_ref, eV, the energy that stays in place when Z changes. Default 0. */
    reference: finite.default(0),
    /** bounds of Z. Default [0.01, 100]: Z → 0 would make every energy infinite. */
    min: z.number().positive().default(0.01),
    max: z.number().positive().default(100),
  })
  .strict();

/**
 * The longest time limit of a band fit, ms (19 h): a server-side fit's queue job expires after 1.25 × its
 * limit plus a margin, and the job queue (pg-boss 10) refuses expiries of 24 h or more.
 */
export const MAX_FIT_TIME_LIMIT_MS = 68_400_000;

/**
 * Options of a band fit. Every field is optional; the defaults below are filled once by the schema.
 * Per-point σ: with `sigma: "from-data"` a point's own σ (eV) is used and `uniformSigma` where it has
 * none; with `sigma: "uniform"` every point gets `uniformSigma`. A weight w (the point's own times its
 * band's) scales σ to σ/√w; a point of weight 0 is dropped.
 */
export const fitOptionsSchema = z
  .object({
    /** Levenberg–Marquardt steps per start. Default 200. */
    maxIterations: z.int().min(1).max(100_000).default(200),
    /** Wall-clock budget of the whole fit, all starts, ms. Default 60 000; at most {@link MAX_FIT_TIME_LIMIT_MS}. */
    timeLimitMs: z.number().positive().max(MAX_FIT_TIME_LIMIT_MS, "at most 68 400 000 ms (19 h)").default(60_000),
    /** Number of starts (the first is the model's own values; others drawn within bounds). Default 1. */
    starts: z.int().min(1).max(1000).default(1),
    /** Seed of the generator that draws extra starts. Default 1. */
    seed: z.int().default(1),
    energyOffset: energyOffsetSchema.default({ value: 0, free: false }),
    renormalisation: renormalisationSchema.default({ value: 1, free: false, reference: 0, min: 0.01, max: 100 }),
    /** Weight per data band (keys are data band numbers, "1", "2", …), ≥ 0; bands not listed weigh 1. */
    bandWeights: z
      .record(z.string().regex(/^[1-9][0-9]*$/, "keys are data band numbers (1, 2, …)"), z.number().min(0).refine(Number.isFinite))
      .optional(),
    /** Where σ comes from (see above). Default "from-data". */
    sigma: z.enum(["from-data", "uniform"]).default("from-data"),
    /** σ of points without their own (and of all points when `sigma` is "uniform"), eV. Default 1 eV. */
    uniformSigma: z.number().positive().refine(Number.isFinite).default(1),
    /**
     * eV. Where a point's model band is closer than this to another band at its k-point and some parameter
     * moves the two apart (an accidental crossing), the band's own derivative is not defined: the analytic
     * Jacobian then uses the two-sided degenerate-subspace derivative, and the result counts the point.
     * 0 turns this off. Default 1e-5 eV: the size of the rounding-level gaps at exact crossings and of the
     * band shifts a finite-difference step makes (∛ε·|θ|·|∂E/∂θ|); wider gaps keep their own, exact
     * derivative (averaging them slowed the sp3s* benchmark fit from 7 to 13 iterations at 1e-3 eV).
     */
    crossingTolerance: z.number().min(0).max(1).default(1e-5),
    /** Analytic (Hellmann–Feynman) or finite-difference Jacobian. Default "analytic". */
    jacobian: z.enum(["analytic", "finite-difference"]).default("analytic"),
    /** Send an e-mail when a server-side fit ends. Ignored by the engine. Default false. */
    notifyByEmail: z.boolean().default(false),
    /** Replace the ssσ, spσ, ppσ, ppπ starting values by Harrison's universal values. Default false. */
    harrisonStart: z.boolean().default(false),
  })
  .strict();
export type FitOptions = z.output<typeof fitOptionsSchema>;
export type FitOptionsInput = z.input<typeof fitOptionsSchema>;

/**
 * One data point. The same fields as `DataPoint` from lib/datasets (extra fields are ignored), so parsed
 * dataset points can be passed directly.
 */
export const bandFitPointSchema = z.object({
  /** Cartesian wave vector, 1/Å (2π included) */
  k: vec3,
  /** data band, 1-based, in increasing energy at each k */
  band: bandNumber,
  /** eV */
  energy: finite,
  /** uncertainty, eV (> 0) */
  sigma: z.number().positive().refine(Number.isFinite).optional(),
  /** user weight, ≥ 0 */
  weight: z.number().min(0).refine(Number.isFinite).optional(),
});
export type BandFitPoint = z.input<typeof bandFitPointSchema>;

/** Everything a band fit needs. */
export const bandFitInputSchema = z.object({
  /** the dataset's name, for messages about its points */
  datasetName: z.string().optional(),
  points: z.array(bandFitPointSchema).min(1, "a fit needs at least one data point"),
  model: modelSpecSchema,
  mapping: bandMappingSchema.optional(),
  window: energyWindowSchema.optional(),
  options: fitOptionsSchema.optional(),
});
export type BandFitInput = z.input<typeof bandFitInputSchema>;
export type ParsedBandFitInput = z.output<typeof bandFitInputSchema>;

/** Progress of a running fit, once per iteration. */
export interface BandFitProgress {
  /** start being run, 0-based */
  start: number;
  /** iterations of this start so far */
  iteration: number;
  /** best χ² of this start so far */
  chiSquared: number;
  /** Levenberg–Marquardt damping λ about to be used */
  damping: number;
  /** wall time since the fit began, ms */
  elapsedMs: number;
}

/** Callbacks and cancellation of {@link runBandFit}. */
export interface BandFitControl {
  onProgress?: (progress: BandFitProgress) => void;
  /** aborting ends the fit after the current iteration; the best point so far is returned, `cancelled: true` */
  signal?: AbortSignal;
}

const nullableNumber = finite.nullable();

export const bandFitWarningKinds = [
  "no-effect",
  "undetermined",
  "strong-correlation",
  "at-bound",
  "not-converged",
  "starts-incomplete",
  "points-dropped",
  "band-crossings",
  "single-k-point",
] as const;

/** Why a fit stopped; the meanings are those of the least-squares engine (`StopReason`). */
const stopReasons = [
  "chi-squared-tolerance",
  "step-tolerance",
  "max-iterations",
  "time-limit",
  "cancelled",
  "damping-limit",
  "non-finite-start",
  "non-finite-jacobian",
] as const satisfies readonly StopReason[];

/** The result of a band fit: plain JSON (no NaN, no ∞; undetermined quantities are null). */
export const bandFitResultSchema = z.object({
  parameters: z.array(
    z.object({
      name: z.string(),
      value: finite,
      /** null when fixed or not determined by the data (a warning says which) */
      standardError: nullableNumber,
      start: finite,
      min: finite.optional(),
      max: finite.optional(),
      free: z.boolean(),
      /** false for a free parameter the data do not determine (no effect, undetermined, or held by a bound): not a fit result */
      determined: z.boolean(),
      unit: z.enum(["eV", "1"]),
      atBound: z.enum(["lower", "upper"]).nullable(),
    }),
  ),
  chiSquared: finite,
  reducedChiSquared: finite,
  /** unweighted RMS of model − data over the points used, eV */
  rms: finite,
  maxAbsResidual: finite,
  /** √(χ²/N), dimensionless */
  weightedRms: finite,
  bands: z.array(
    z.object({
      dataBand: z.int(),
      /** the mapped model band (offset mapping); null for nearest mapping (it varies per point) */
      modelBand: z.int().nullable(),
      points: z.int(),
      /** eV */
      rms: finite,
      maxAbs: finite,
      /** mean residual (model − data), eV */
      mean: finite,
    }),
  ),
  residuals: z.array(
    z.object({
      /** index into the input's `points` */
      pointIndex: z.int(),
      dataBand: z.int(),
      modelBand: z.int(),
      /** data energy, eV */
      energy: finite,
      /** predicted energy (offset and renormalisation included), eV */
      modelEnergy: finite,
      /** model − data, eV */
      residual: finite,
      /** (model − data)/σ_eff */
      weightedResidual: finite,
    }),
  ),
  pointsUsed: z.int(),
  /**
   * Points at accidental band crossings at the solution (model band within `tolerance` eV of another, moved
   * apart by some parameter); absent in results stored before crossings were counted.
   */
  crossings: z.object({ tolerance: finite, points: z.int() }).optional(),
  pointsDropped: z.object({ window: z.int(), unmapped: z.int(), zeroWeight: z.int() }),
  correlation: z.object({ names: z.array(z.string()), matrix: z.array(z.array(nullableNumber)) }),
  /** χ² of the best start per iteration; iteration 0 is its start point (λ: the damping about to be used) */
  trace: z.array(z.object({ iteration: z.int(), chiSquared: finite, damping: finite })),
  iterations: z.int(),
  stopReason: z.enum(stopReasons),
  converged: z.boolean(),
  cancelled: z.boolean(),
  warnings: z.array(z.object({ kind: z.enum(bandFitWarningKinds), parameters: z.array(z.string()), message: z.string() })),
  starts: z.array(
    z.object({
      index: z.int(),
      chiSquared: nullableNumber,
      iterations: z.int(),
      stopReason: z.enum(stopReasons),
      initial: z.array(finite),
      final: z.array(finite),
    }),
  ),
  /** wall time of the whole fit (checks, preparation, iterations, statistics), ms */
  fitMs: finite,
  /** the model with its fitted values (offset and renormalisation are not part of it) */
  fittedModel: modelDocumentSchema,
});
export type BandFitResult = z.output<typeof bandFitResultSchema>;
export type BandFitWarning = BandFitResult["warnings"][number];
export type BandFitParameter = BandFitResult["parameters"][number];

/** One problem found before a fit: where (dotted path into the input) and what. */
export interface BandFitIssue {
  path: string;
  message: string;
}
