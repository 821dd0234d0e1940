import type { z } from "zod";
import {
  type CompiledModel,
  type ModelDocument,
  ModelError,
  type PreparedHamiltonian,
  compileModel,
  prepareHamiltonian,
  withHarrisonStartingValues,
} from "@/lib/tb";
import type { ParameterSpec } from "../least-squares";
import { type PointSelection, selectPoints } from "./points";
import { ENERGY_OFFSET, RENORMALISATION } from "./energy-alignment";
import { BandResidualModel } from "./problem";
import { redundantWithGlobals } from "./redundancy";
import { checkSingleKPoint } from "./single-k-point";
import {
  type BandFitIssue,
  type BandFitWarning,
  type BandMapping,
  DEFAULT_BAND_MAPPING,
  type FitOptions,
  type ParsedBandFitInput,
  bandFitInputSchema,
  fitOptionsSchema,
  resolveModelSpec,
} from "./schema";

/** A fit input that passed every check, compiled and ready to run. */
export interface PreparedBandFit {
  input: ParsedBandFitInput;
  options: FitOptions;
  mapping: BandMapping;
  /** the model document the fit starts from (Harrison values applied when asked for) */
  document: ModelDocument;
  compiled: CompiledModel;
  selection: PointSelection;
  hamiltonian: PreparedHamiltonian;
  /** θ = [model parameters…, δ, Z] as the engine sees them */
  parameters: ParameterSpec[];
  /** unit of each entry of `parameters` */
  units: ("eV" | "1")[];
  residualModel: BandResidualModel;
  /** what the checks noticed but did not refuse */
  warnings: BandFitWarning[];
}

export type BandFitValidation = { ok: true; prepared: PreparedBandFit } | { ok: false; issues: BandFitIssue[] };

const zodIssues = (error: z.ZodError, prefix = ""): BandFitIssue[] =>
  error.issues.map((i) => ({ path: [prefix, ...i.path.map(String)].filter(Boolean).join("."), message: i.message }));

/**
 * Every check a band fit needs BEFORE it runs, with messages that say what to change: the input's shape,
 * the model (it must compile), the mapping (model bands that exist), the window and weights (they must
 * leave more points than free parameters), the global parameters (bounds, names, redundancy with the
 * model: a free offset with every on-site energy free, or a free renormalisation with every H parameter
 * free, determines nothing and is refused); and, for points that all lie at one k-point, whether their
 * energies determine the free parameters (refused if not, a warning if so: `single-k-point.ts`).
 * @param input - untrusted input (parsed JSON), shape {@link bandFitInputSchema}
 */
export function validateBandFit(input: unknown): BandFitValidation {
  const parsed = bandFitInputSchema.safeParse(input);
  if (!parsed.success) return { ok: false, issues: zodIssues(parsed.error) };
  const data = parsed.data;
  const options = data.options ?? fitOptionsSchema.parse({});
  const mapping = data.mapping ?? DEFAULT_BAND_MAPPING;

  let compiled: CompiledModel;
  try {
    const resolved = compileModel(resolveModelSpec(data.model));
    if (options.harrisonStart && resolved.bondIntegrals.length === 0)
      return fail("options.harrisonStart", "Harrison starting values need a Slater–Koster model (this one has no bond integrals)");
    compiled = options.harrisonStart ? compileModel(withHarrisonStartingValues(resolved)) : resolved;
  } catch (error) {
    if (error instanceof ModelError)
      return { ok: false, issues: error.issues.map((i) => ({ path: i.path ? `model.${i.path}` : "model", message: i.message })) };
    throw error;
  }

  const issues: BandFitIssue[] = [];
  const { selection, issues: mappingIssues } = selectPoints(data.points, mapping, data.window, options, compiled.orbitalCount);
  issues.push(...mappingIssues);
  const parameters = fitParameters(compiled, options, issues);
  const freeCount = parameters.filter((p) => p.free !== false && (p.lower ?? -Infinity) < (p.upper ?? Infinity)).length;
  const kept = selection.kept.length;
  const { dropped } = selection;
  const droppedText = `${dropped.window} outside the window, ${dropped.unmapped} unmapped, ${dropped.zeroWeight} of weight 0`;
  if (freeCount === 0) issues.push({ path: "model.parameters", message: "no parameter is free: nothing to fit" });
  if (kept === 0) issues.push({ path: data.window ? "window" : "points", message: `no point is left to fit (${droppedText})` });
  else if (kept <= freeCount)
    issues.push({
      path: data.window ? "window" : "points",
      message: `${kept} points are left (${droppedText}) for ${freeCount} free parameters: a fit needs more points than free parameters`,
    });
  issues.push(...redundancyIssues(compiled, options));
  if (issues.length > 0) return { ok: false, issues };

  const hamiltonian = prepareHamiltonian(compiled, selection.kPoints);
  const np = compiled.parameters.length;
  const residualModel = new BandResidualModel(
    hamiltonian,
    selection.kept,
    { offset: np, renormalisation: np + 1, reference: options.renormalisation.reference },
    mapping,
    options.crossingTolerance,
  );
  const warnings: BandFitWarning[] = [];
  if (selection.kPoints.length === 1) {
    const single = checkSingleKPoint({ residualModel, parameters, kept: selection.kept, k: selection.kPoints[0], datasetName: data.datasetName });
    if ("issue" in single) return { ok: false, issues: [single.issue] };
    warnings.push(single.warning);
  }
  if (dropped.window + dropped.unmapped + dropped.zeroWeight > 0)
    warnings.push({ kind: "points-dropped", parameters: [], message: `${kept} of ${data.points.length} points used: ${droppedText}` });
  return {
    ok: true,
    prepared: {
      input: data,
      options,
      mapping,
      document: compiled.document,
      compiled,
      selection,
      hamiltonian,
      parameters,
      units: [...compiled.parameters.map((p) => p.unit), "eV", "1"],
      residualModel,
      warnings,
    },
  };
}

function fail(path: string, message: string): BandFitValidation {
  return { ok: false, issues: [{ path, message }] };
}

/** The engine's parameters: the model's in document order, then δ and Z. */
function fitParameters(compiled: CompiledModel, options: FitOptions, issues: BandFitIssue[]): ParameterSpec[] {
  const names = new Set(compiled.parameters.map((p) => p.name));
  for (const name of [ENERGY_OFFSET, RENORMALISATION])
    if (names.has(name)) issues.push({ path: "model.parameters", message: `"${name}" is reserved for the fit's global parameter: rename the model's` });
  const { energyOffset: offset, renormalisation: z } = options;
  const outside = (value: number, min?: number, max?: number) => (min !== undefined && value < min) || (max !== undefined && value > max);
  if (outside(offset.value, offset.min, offset.max))
    issues.push({ path: "options.energyOffset.value", message: `the energy offset ${offset.value} eV is outside its bounds` });
  if (z.min > z.max) issues.push({ path: "options.renormalisation.min", message: "min is above max" });
  else if (outside(z.value, z.min, z.max))
    issues.push({ path: "options.renormalisation.value", message: `the renormalisation factor ${z.value} is outside [${z.min}, ${z.max}]` });
  return [
    ...compiled.parameters.map((p) => ({ name: p.name, initial: p.value, lower: p.min, upper: p.max, free: p.free })),
    { name: ENERGY_OFFSET, initial: offset.value, lower: offset.min, upper: offset.max, free: offset.free },
    { name: RENORMALISATION, initial: z.value, lower: z.min, upper: z.max, free: z.free },
  ];
}

function redundancyIssues(compiled: CompiledModel, options: FitOptions): BandFitIssue[] {
  const free = compiled.parameters.map((p) => p.free && (p.min ?? -Infinity) < (p.max ?? Infinity));
  const { onsiteShift, overallScale } = redundantWithGlobals(compiled, free);
  const issues: BandFitIssue[] = [];
  if (options.energyOffset.free && onsiteShift)
    issues.push({
      path: "options.energyOffset.free",
      message:
        `a free energy offset together with every on-site energy free (${onsiteShift.join(", ")}) is redundant: ` +
        "shifting all on-site energies shifts every band, so the data cannot separate them; fix the offset or one on-site energy",
    });
  const shiftAvailable = options.energyOffset.free || onsiteShift !== null || options.renormalisation.reference === 0;
  if (options.renormalisation.free && overallScale && shiftAvailable)
    issues.push({
      path: "options.renormalisation.free",
      message:
        `a free renormalisation factor together with every Hamiltonian parameter free (${overallScale.join(", ")}) is ` +
        "redundant: scaling them all scales every band; fix the factor or one hopping",
    });
  return issues;
}
