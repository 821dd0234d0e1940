import { z } from "zod";
import { revisionAlignment } from "@/lib/fit/bands/energy-alignment";
import type { BandMappingInput, FitOptionsInput } from "@/lib/fit/bands/schema";
import { launchFitSchema } from "@/lib/server/fits/inputs";
import type { ModelDocument, ModelParameter, TemplateId } from "@/lib/tb";
import { FieldErrors } from "./number-field";
import type { RevisionDetails } from "./responses";

/** A parameter row of the launch form, as typed (numbers are text until the form is read). */
export interface ParameterDraft {
  name: string;
  unit: ModelParameter["unit"];
  description?: string;
  value: string;
  free: boolean;
  min: string;
  max: string;
}

/** Where the model comes from: a template (with its lattice constant) or an earlier revision's document. */
export type ModelSourceDraft =
  | { kind: "template"; template: TemplateId; latticeConstant: string }
  | { kind: "document"; document: ModelDocument };

/** Everything the launch form holds, as typed. Field keys of errors are listed beside each part. */
export interface LaunchDraft {
  /** key "name" */
  name: string;
  /** key "datasetId" */
  datasetId: string;
  /** key "latticeConstant" for a template */
  source: ModelSourceDraft;
  /** keys "parameters.<name>.value|min|max" */
  parameters: ParameterDraft[];
  /** keys "mapping.firstDataBand|lastDataBand|firstModelBand" */
  mapping: { kind: "offset" | "nearest"; firstDataBand: string; lastDataBand: string; firstModelBand: string };
  /** keys "window.min|max"; both empty means no window */
  window: { min: string; max: string };
  /** keys "options.<name>"; band weights "options.bandWeights.<band>" */
  options: {
    maxIterations: string;
    timeLimitSeconds: string;
    starts: string;
    seed: string;
    sigma: "from-data" | "uniform";
    uniformSigma: string;
    bandWeights: Record<string, string>;
    offsetValue: string;
    offsetFree: boolean;
    renormalisationValue: string;
    renormalisationFree: boolean;
    notifyByEmail: boolean;
  };
}

/** The run options a new launch form starts with (the fit engine's own defaults, as text). */
export const defaultLaunchOptions: LaunchDraft["options"] = {
  maxIterations: "200",
  timeLimitSeconds: "60",
  starts: "1",
  seed: "1",
  sigma: "from-data",
  uniformSigma: "1",
  bandWeights: {},
  offsetValue: "0",
  offsetFree: false,
  renormalisationValue: "1",
  renormalisationFree: false,
  notifyByEmail: false,
};

/** The body of `POST /api/workspaces/{slug}/fits`: the route's own schema. */
export const launchRequestSchema = launchFitSchema;
export type LaunchRequest = z.input<typeof launchFitSchema>;

export type DraftReading = { ok: true; request: LaunchRequest } | { ok: false; errors: Record<string, string[]> };

/** The form's parameter rows for a list of model parameters (values printed in full precision). */
export function parameterDrafts(parameters: readonly ModelParameter[]): ParameterDraft[] {
  return parameters.map((p) => ({
    name: p.name,
    unit: p.unit,
    description: p.description,
    value: String(p.value),
    free: p.free,
    min: p.min === undefined ? "" : String(p.min),
    max: p.max === undefined ? "" : String(p.max),
  }));
}

function readParameters(rows: readonly ParameterDraft[], errors: FieldErrors): ModelParameter[] {
  return rows.map((row) => {
    const key = `parameters.${row.name}`;
    const value = errors.number(`${key}.value`, row.value, true);
    const min = errors.number(`${key}.min`, row.min, false);
    const max = errors.number(`${key}.max`, row.max, false);
    if (min !== undefined && max !== undefined && min > max) errors.add(`${key}.max`, "max must not be below min");
    else if (value !== undefined && ((min !== undefined && value < min) || (max !== undefined && value > max)))
      errors.add(`${key}.value`, "the value must lie within its bounds");
    return { name: row.name, unit: row.unit, description: row.description, value: value ?? 0, free: row.free, min, max };
  });
}

function readMapping(draft: LaunchDraft["mapping"], errors: FieldErrors): BandMappingInput {
  if (draft.kind === "nearest") return { kind: "nearest" };
  const first = errors.integer("mapping.firstDataBand", draft.firstDataBand, false);
  const last = errors.integer("mapping.lastDataBand", draft.lastDataBand, false);
  const firstModelBand = errors.integer("mapping.firstModelBand", draft.firstModelBand, true);
  if ((first === undefined) !== (last === undefined) && errors.byField["mapping.firstDataBand"] === undefined && errors.byField["mapping.lastDataBand"] === undefined)
    errors.add(first === undefined ? "mapping.firstDataBand" : "mapping.lastDataBand", "give both the first and the last data band, or neither");
  return {
    kind: "offset",
    dataBands: first !== undefined && last !== undefined ? [first, last] : undefined,
    firstModelBand: firstModelBand ?? 1,
  };
}

function readOptions(draft: LaunchDraft["options"], errors: FieldErrors): FitOptionsInput {
  const seconds = errors.number("options.timeLimitSeconds", draft.timeLimitSeconds, true);
  const bandWeights: Record<string, number> = {};
  for (const [band, text] of Object.entries(draft.bandWeights)) {
    const weight = errors.number(`options.bandWeights.${band}`, text, false);
    if (weight !== undefined) bandWeights[band] = weight;
  }
  return {
    maxIterations: errors.integer("options.maxIterations", draft.maxIterations, true),
    timeLimitMs: seconds === undefined ? undefined : seconds * 1000,
    starts: errors.integer("options.starts", draft.starts, true),
    seed: errors.integer("options.seed", draft.seed, true),
    sigma: draft.sigma,
    uniformSigma: errors.number("options.uniformSigma", draft.uniformSigma, true),
    bandWeights: Object.keys(bandWeights).length ? bandWeights : undefined,
    energyOffset: { value: errors.number("options.offsetValue", draft.offsetValue, true) ?? 0, free: draft.offsetFree },
    renormalisation: {
      value: errors.number("options.renormalisationValue", draft.renormalisationValue, true) ?? 1,
      free: draft.renormalisationFree,
    },
    notifyByEmail: draft.notifyByEmail,
  };
}

/** Where each schema issue's path is shown in the form. */
function fieldKeyOf(section: string, path: readonly PropertyKey[], draft: LaunchDraft): string {
  const [head, second] = path.map(String);
  if (section === "window") return `window.${head === "min" ? "min" : "max"}`;
  if (section === "mapping") return head === "firstModelBand" ? "mapping.firstModelBand" : second === "0" ? "mapping.firstDataBand" : "mapping.lastDataBand";
  if (section === "options") {
    if (head === "timeLimitMs") return "options.timeLimitSeconds";
    if (head === "energyOffset") return "options.offsetValue";
    if (head === "renormalisation") return "options.renormalisationValue";
    if (head === "bandWeights" && second) return `options.bandWeights.${second}`;
    return `options.${head}`;
  }
  if (section === "model") {
    if (head === "parameters" && second !== undefined) {
      const name = /^\d+$/.test(second) ? draft.parameters[Number(second)]?.name : second;
      return `parameters.${name}.value`;
    }
    return head === "latticeConstant" ? "latticeConstant" : "model";
  }
  return section;
}

/**
 * Reads the launch form: every number parsed, then the request checked with the fit's own zod schemas.
 * All problems are returned at once, keyed by field (see {@link LaunchDraft}); nothing is sent while any remains.
 */
export function readLaunchDraft(draft: LaunchDraft): DraftReading {
  const errors = new FieldErrors();
  const parameters = readParameters(draft.parameters, errors);
  const mapping = readMapping(draft.mapping, errors);
  const windowMin = errors.number("window.min", draft.window.min, false);
  const windowMax = errors.number("window.max", draft.window.max, false);
  const windowGiven = draft.window.min.trim() !== "" || draft.window.max.trim() !== "";
  if (windowGiven && windowMin === undefined && !errors.byField["window.min"]) errors.add("window.min", "give both ends of the window, or neither");
  if (windowGiven && windowMax === undefined && !errors.byField["window.max"]) errors.add("window.max", "give both ends of the window, or neither");
  const options = readOptions(draft.options, errors);

  let model: LaunchRequest["model"];
  if (draft.source.kind === "template") {
    const latticeConstant = errors.number("latticeConstant", draft.source.latticeConstant, false);
    const overrides = Object.fromEntries(parameters.map((p) => [p.name, { value: p.value, free: p.free, min: p.min, max: p.max }]));
    model = { template: draft.source.template, latticeConstant, parameters: overrides };
  } else {
    model = { ...draft.source.document, parameters };
  }
  const request: LaunchRequest = {
    datasetId: draft.datasetId,
    name: draft.name,
    model,
    mapping,
    window: windowMin !== undefined && windowMax !== undefined ? { min: windowMin, max: windowMax } : undefined,
    options,
  };
  // The schema runs even when some numbers did not read, so that every problem shows at once; a field
  // whose text did not read keeps only that message.
  const unreadable = new Set(Object.keys(errors.byField));
  const addSchemaIssue = (field: string, message: string) => unreadable.has(field) || errors.add(field, message);
  const parsed = launchRequestSchema.safeParse(request);
  if (parsed.success && errors.empty) return { ok: true, request };
  for (const issue of parsed.error?.issues ?? []) {
    const [section, ...rest] = issue.path;
    if (section === "model" && issue.code === "invalid_union") {
      // The union reports each branch; only the branch of the form's own model source is relevant.
      const branch = "errors" in issue ? (issue.errors as z.core.$ZodIssue[][]) : [];
      for (const inner of branch[draft.source.kind === "template" ? 1 : 0] ?? []) addSchemaIssue(fieldKeyOf("model", inner.path, draft), inner.message);
      continue;
    }
    addSchemaIssue(fieldKeyOf(String(section), rest, draft), issue.message);
  }
  if (errors.empty) errors.add("model", "the model does not validate");
  return { ok: false, errors: errors.byField };
}

/** The form of a new revision: revision n's inputs with its fitted values as start values. */
export function draftFromRevision(revision: RevisionDetails, name: string): LaunchDraft {
  const { inputs } = revision;
  const document: ModelDocument = revision.result?.fittedModel ?? inputs.model;
  const o = inputs.options;
  const alignment = revisionAlignment(revision.result?.parameters ?? [], o);
  return {
    name,
    datasetId: inputs.dataset.id,
    source: { kind: "document", document },
    parameters: parameterDrafts(document.parameters),
    mapping:
      inputs.mapping.kind === "nearest"
        ? { kind: "nearest", firstDataBand: "", lastDataBand: "", firstModelBand: "1" }
        : {
            kind: "offset",
            firstDataBand: inputs.mapping.dataBands ? String(inputs.mapping.dataBands[0]) : "",
            lastDataBand: inputs.mapping.dataBands ? String(inputs.mapping.dataBands[1]) : "",
            firstModelBand: String(inputs.mapping.firstModelBand),
          },
    window: inputs.window ? { min: String(inputs.window.min), max: String(inputs.window.max) } : { min: "", max: "" },
    options: {
      maxIterations: String(o.maxIterations),
      timeLimitSeconds: String(o.timeLimitMs / 1000),
      starts: String(o.starts),
      seed: String(o.seed),
      sigma: o.sigma,
      uniformSigma: String(o.uniformSigma),
      bandWeights: Object.fromEntries(Object.entries(o.bandWeights ?? {}).map(([k, v]) => [k, String(v)])),
      offsetValue: String(alignment.offset),
      offsetFree: o.energyOffset.free,
      renormalisationValue: String(alignment.renormalisation),
      renormalisationFree: o.renormalisation.free,
      notifyByEmail: o.notifyByEmail,
    },
  };
}
