import "server-only";
import { getDatasetForFit, loadDatasetPoints } from "@/db/queries/fit-data";
import { type SendRevisionJob, createFitWithFirstRevision, createNextRevision } from "@/db/queries/fits";
import {
  type BandFitIssue,
  DEFAULT_BAND_MAPPING,
  type BandMapping,
  type EnergyWindow,
  type FitOptions,
  type ModelSpec,
  type StoredResult,
  fitOptionsSchema,
  resolveModelSpec,
  validateBandFit,
} from "@/lib/fit/bands";
import { env } from "@/lib/env";
import { type ModelDocument, ModelError, canonicalParameterName } from "@/lib/tb";
import { AppError } from "../errors";
import { getQueue } from "../job-queue";
import { sendFitJob } from "../queues";
import { type LaunchWarning, checkFrame } from "./frame-check";
import type { LaunchFitInput, NewRevisionInput } from "./inputs";
import { type RevisionSnapshot, revisionSnapshotSchema } from "./snapshot";

type RevisionRequest = {
  workspaceId: string;
  datasetId: string;
  model: ModelSpec;
  mapping?: BandMapping;
  window?: EnergyWindow;
  options?: FitOptions;
};

function refuse(issues: BandFitIssue[]): never {
  const grouped: Record<string, string[]> = {};
  for (const { path, message } of issues) (grouped[path || "_form"] ??= []).push(message);
  const first = issues[0];
  throw new AppError("validation_failed", first ? (first.path ? `${first.path}: ${first.message}` : first.message) : undefined, { issues: grouped });
}

/**
 * Resolves a model spec (a document, or a template request) into a document.
 * @throws AppError validation_failed with the model's issues under `model.…`
 */
function resolveModel(spec: ModelSpec): ModelDocument {
  try {
    return resolveModelSpec(spec);
  } catch (error) {
    if (error instanceof ModelError) refuse(error.issues.map((i) => ({ path: i.path ? `model.${i.path}` : "model", message: i.message })));
    throw error;
  }
}

/**
 * Every check BEFORE a revision is created: the dataset belongs to the workspace, the model resolves, and
 * `validateBandFit` passes on the dataset's own points (mapping onto bands that exist, a window that keeps
 * points, …). Returns the snapshot to store and the frame check's warnings.
 * @throws AppError validation_failed listing every problem; nothing is written
 */
async function prepareSnapshot(request: RevisionRequest): Promise<{ snapshot: RevisionSnapshot; warnings: LaunchWarning[] }> {
  const dataset = await getDatasetForFit({ workspaceId: request.workspaceId, datasetId: request.datasetId });
  if (!dataset) refuse([{ path: "datasetId", message: "there is no dataset with this id in the workspace" }]);
  const model = resolveModel(request.model);
  const points = await loadDatasetPoints(dataset.id);
  const mapping = request.mapping ?? DEFAULT_BAND_MAPPING;
  const options = request.options ?? fitOptionsSchema.parse({});
  const validation = validateBandFit({ datasetName: dataset.name, points, model, mapping, window: request.window, options });
  if (!validation.ok) refuse(validation.issues);
  const snapshot = revisionSnapshotSchema.parse({
    model,
    mapping,
    window: request.window ?? null,
    options,
    dataset: { id: dataset.id, name: dataset.name, sha256: dataset.sha256 },
  });
  return { snapshot, warnings: checkFrame(dataset.summary.ticks, points, model) };
}

/**
 * The job sender for a new revision: pg-boss is started before the revision's transaction opens, and a
 * job the queue refuses (or a send that fails) rolls the revision back and answers 503.
 */
async function jobSender(snapshot: RevisionSnapshot): Promise<SendRevisionJob> {
  const boss = await getQueue().catch((error: unknown) => {
    console.error("fit launch: the job queue is unavailable:", error);
    throw new AppError("unavailable", "The job queue did not accept the fit; try again.");
  });
  return async (revisionId, queue) => {
    try {
      return await sendFitJob(boss, { revisionId, timeLimitMs: snapshot.options.timeLimitMs, marginSeconds: env.FIT_JOB_EXPIRY_MARGIN_SECONDS, db: queue });
    } catch (error) {
      console.error(`fit launch: revision ${revisionId}: the job was not sent:`, error);
      throw new AppError("unavailable", "The job queue did not accept the fit; try again.");
    }
  };
}

/** Launches a new fit: checks, then the fit, its revision 1 and the job, together. */
export async function launchFit(params: { workspaceId: string; userId: string; input: LaunchFitInput }) {
  const { input } = params;
  const { snapshot, warnings } = await prepareSnapshot({ workspaceId: params.workspaceId, ...input });
  const created = await createFitWithFirstRevision({
    workspaceId: params.workspaceId,
    datasetId: input.datasetId,
    name: input.name,
    notes: input.notes,
    launchedBy: params.userId,
    inputs: snapshot,
    launchWarnings: warnings,
    sendJob: await jobSender(snapshot),
  });
  return { fitId: created.fitId, revision: created.number, warnings };
}

/** Applies per-name edits to a model's parameters (names in either spelling, `V_ppπ[Si–Si,1]` or `V_pp_pi[Si-Si,1]`). */
function withParameters(model: ModelDocument, changes: NewRevisionInput["parameters"]): ModelDocument {
  const known = new Set(model.parameters.map((p) => p.name));
  const byName = new Map(Object.entries(changes ?? {}).map(([name, change]) => [canonicalParameterName(name), { name, change }]));
  const unknown = [...byName].filter(([canonical]) => !known.has(canonical)).map(([, { name }]) => name);
  if (unknown.length)
    refuse(unknown.map((name) => ({ path: `parameters.${name}`, message: `the model has no parameter "${name}"` })));
  return {
    ...model,
    parameters: model.parameters.map((p) => {
      const change = byName.get(p.name)?.change;
      return change ? { ...p, ...Object.fromEntries(Object.entries(change).filter(([, v]) => v !== undefined)) } : p;
    }),
  };
}

/** The parent's options with its fitted offset and renormalisation as start values, then the changes. */
function nextOptions(parent: RevisionSnapshot, result: StoredResult | null, changes: Record<string, unknown> | undefined): FitOptions {
  const fitted = (name: string) => result?.parameters.find((p) => p.name === name)?.value;
  const offset = fitted("energy offset");
  const scale = fitted("renormalisation");
  const base: FitOptions = {
    ...parent.options,
    // the parent's values are already fitted; Harrison's would overwrite them
    harrisonStart: false,
    energyOffset: { ...parent.options.energyOffset, ...(offset === undefined ? {} : { value: offset }) },
    renormalisation: { ...parent.options.renormalisation, ...(scale === undefined ? {} : { value: scale }) },
  };
  const parsed = fitOptionsSchema.safeParse({ ...base, ...changes });
  if (!parsed.success) refuse(parsed.error.issues.map((i) => ({ path: ["options", ...i.path.map(String)].join("."), message: i.message })));
  return parsed.data;
}

/**
 * Launches revision n+1 of a fit from revision `from`: its snapshot, with its fitted model (when it has a
 * result) as the start, plus the changes in `input`. A `model` in `input` replaces that start, and the
 * `parameters` edits apply to whichever model the revision starts from.
 */
export async function launchRevision(params: {
  workspaceId: string;
  userId: string;
  fitId: string;
  datasetId: string;
  /** the parent's stored inputs, and its result in today's names (`resultOf`) */
  parent: { inputs: unknown; result: StoredResult | null };
  input: NewRevisionInput;
}) {
  const { input } = params;
  const parentSnapshot = revisionSnapshotSchema.parse(params.parent.inputs);
  const parentResult = params.parent.result;
  const baseModel = input.model ? resolveModel(input.model) : (parentResult?.fittedModel ?? parentSnapshot.model);
  const startModel = withParameters(baseModel, input.parameters);
  const window = input.window === null ? undefined : (input.window ?? parentSnapshot.window ?? undefined);
  const { snapshot, warnings } = await prepareSnapshot({
    workspaceId: params.workspaceId,
    datasetId: params.datasetId,
    model: startModel,
    mapping: input.mapping ?? parentSnapshot.mapping,
    window,
    options: nextOptions(parentSnapshot, parentResult, input.options),
  });
  const created = await createNextRevision({
    fitId: params.fitId,
    parentNumber: input.from,
    launchedBy: params.userId,
    inputs: snapshot,
    launchWarnings: warnings,
    sendJob: await jobSender(snapshot),
  });
  return { fitId: params.fitId, revision: created.number, warnings };
}
