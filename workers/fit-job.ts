import { loadDatasetPoints } from "@/db/queries/fit-data";
import { claimRevision, failRevision, finishRevision, getRevisionForRun, stopReason, writeProgress } from "@/db/queries/fits";
import { type BandFitProgress, type BandFitResult, BandFitError, runBandFit, validateBandFit } from "@/lib/fit/bands";
import { revisionSnapshotSchema, type RevisionProgress } from "@/lib/server/fits/snapshot";
import { failureLog, retryWhileUnreachable } from "./database-outage";
import type { Heartbeat } from "./heartbeat";
import { type LoadedRevision, notifyLauncher } from "./notify";

/** How often a running fit checks the database for a cancel request, ms (cancellation within a second). */
const cancelPollMs = 250;
/** Least time between two progress writes, ms (at most 2 writes per second). */
const progressIntervalMs = 500;

export type FitJobOutcome = {
  revisionId: string;
  outcome: "succeeded" | "cancelled" | "failed" | "skipped" | "handed-back";
  attempt?: number;
};

type FitJobContext = {
  runner: string;
  appUrl: string;
  heartbeat: Heartbeat;
  /** Gives an attempt that met an unexpected error back (workers/hand-back.ts). */
  handBack: (revisionId: string, attempt: number) => Promise<void>;
};

/**
 * Runs one revision job: claims the queued revision, beats for the attempt (workers/heartbeat.ts) while
 * it fits with progress and cancellation flowing, and writes the result and residual rows in one
 * transaction guarded by the attempt. Input the fit refuses ends the revision `failed` at once. Final
 * writes wait for a database that is away (up to 10 min). An unexpected error after the claim gives the
 * attempt back (a new job, up to the attempt limit); one before it throws, so pg-boss retries the job.
 */
export async function runFitJob(revisionId: string, context: FitJobContext): Promise<FitJobOutcome> {
  const loaded = await getRevisionForRun(revisionId);
  if (!loaded) return { revisionId, outcome: "skipped" };
  const attempt = await claimRevision({ revisionId, runner: context.runner });
  if (attempt === null) return { revisionId, outcome: "skipped" };
  const held = { revisionId, attempt };
  context.heartbeat.hold(held);
  try {
    return await runAttempt(loaded, attempt, context);
  } catch (error) {
    console.error(`fit ${revisionId}: attempt ${attempt} failed:`, error);
    await context.handBack(revisionId, attempt).catch((handBackError: unknown) =>
      console.error(`fit ${revisionId}: could not give attempt ${attempt} back (the sweeper will, once its heartbeat is stale):`, handBackError),
    );
    return { revisionId, outcome: "handed-back", attempt };
  } finally {
    context.heartbeat.release(held);
  }
}

async function runAttempt(loaded: LoadedRevision, attempt: number, context: FitJobContext): Promise<FitJobOutcome> {
  const revisionId = loaded.revision.id;
  const fail = async (reason: string): Promise<FitJobOutcome> => {
    if (!(await retryWhileUnreachable(`fit ${revisionId}: failure write`, () => failRevision({ revisionId, attempt, reason }))))
      return { revisionId, outcome: "skipped", attempt };
    await notifyLauncher(loaded, context.appUrl, { status: "failed", reason });
    return { revisionId, outcome: "failed", attempt };
  };

  const snapshot = revisionSnapshotSchema.safeParse(loaded.revision.inputs);
  if (!snapshot.success) return fail("The stored inputs of this revision cannot be read.");
  const { model, mapping, window, options } = snapshot.data;
  const points = await retryWhileUnreachable(`fit ${revisionId}: loading points`, () => loadDatasetPoints(snapshot.data.dataset.id));
  const validation = validateBandFit({ datasetName: snapshot.data.dataset.name, points, model, mapping, window: window ?? undefined, options });
  if (!validation.ok) return fail(`The fit's inputs no longer pass the checks: ${new BandFitError(validation.issues).message}`);

  const controller = new AbortController();
  let superseded = false;
  const pollLog = failureLog(`fit ${revisionId}: cancel poll`);
  const poll = setInterval(() => {
    stopReason({ revisionId, attempt })
      .then((reason) => {
        pollLog.succeeded();
        if (!reason || controller.signal.aborted) return;
        superseded = reason === "superseded";
        controller.abort();
      })
      .catch((error: unknown) => pollLog.failed(error));
  }, cancelPollMs);

  let lastWrite = 0;
  let writing = false;
  const progressLog = failureLog(`fit ${revisionId}: progress write`);
  const onProgress = (p: BandFitProgress) => {
    const now = Date.now();
    if (writing || now - lastWrite < progressIntervalMs) return;
    lastWrite = now;
    writing = true;
    const progress: RevisionProgress = {
      start: p.start,
      starts: options.starts,
      iteration: p.iteration,
      chiSquared: Number.isFinite(p.chiSquared) ? p.chiSquared : -1,
      elapsedMs: p.elapsedMs,
      updatedAt: new Date().toISOString(),
    };
    writeProgress({ revisionId, attempt, progress })
      .then((stillHeld) => {
        progressLog.succeeded();
        if (!stillHeld) {
          superseded = true;
          controller.abort();
        }
      })
      .catch((error: unknown) => progressLog.failed(error))
      .finally(() => (writing = false));
  };

  let result: BandFitResult;
  try {
    result = await runBandFit(validation.prepared, { onProgress, signal: controller.signal });
  } catch (error) {
    if (!(error instanceof BandFitError)) throw error;
    return fail(error.message);
  } finally {
    clearInterval(poll);
  }
  if (superseded) return { revisionId, outcome: "skipped", attempt };

  const status = result.cancelled ? "cancelled" : "succeeded";
  const { residuals, ...stored } = result;
  const rows = residuals.map((r) => {
    const point = points[r.pointIndex];
    return {
      pointIndex: point.index,
      dataBand: r.dataBand,
      modelBand: r.modelBand,
      pathDistance: point.pathDistance,
      energy: r.energy,
      modelEnergy: r.modelEnergy,
      residual: r.residual,
      absResidual: Math.abs(r.residual),
      weightedResidual: r.weightedResidual,
    };
  });
  const written = await retryWhileUnreachable(`fit ${revisionId}: result write`, () =>
    finishRevision({ revisionId, attempt, status, result: stored, residuals: rows }),
  );
  if (!written) return { revisionId, outcome: "skipped", attempt };
  await notifyLauncher(loaded, context.appUrl, { status, rms: result.rms });
  return { revisionId, outcome: status, attempt };
}

/**
 * The dead-letter path: a job whose every try failed before any worker claimed its revision ends that
 * revision `failed` with a reason, never left queued. A claimed revision is the sweeper's.
 */
export async function failUnstartedRevision(revisionId: string, appUrl: string): Promise<void> {
  const reason = "The fit did not start: its queue job failed on every try before a worker could take it (the database or the worker met an error). Launch a new revision to try again.";
  const loaded = await getRevisionForRun(revisionId);
  if (loaded && (await failRevision({ revisionId, reason }))) await notifyLauncher(loaded, appUrl, { status: "failed", reason });
}
