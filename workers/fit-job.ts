import { loadDatasetPoints } from "@/db/queries/fit-data";
import { claimRevision, failRevision, finishRevision, getRevisionForRun, stopReason, writeProgress } from "@/db/queries/fits";
import { fitFinishedMessage } from "@/lib/email";
import { sendMail } from "@/lib/email/send";
import { type BandFitProgress, type BandFitResult, BandFitError, runBandFit, validateBandFit } from "@/lib/fit/bands";
import { revisionSnapshotSchema, type RevisionProgress } from "@/lib/server/fits/snapshot";

/** How often a running fit checks the database for a cancel request, ms (cancellation within a second). */
const cancelPollMs = 250;
/** Least time between two progress writes, ms (at most 2 writes per second). */
const progressIntervalMs = 500;

export type FitJobOutcome = { revisionId: string; outcome: "succeeded" | "cancelled" | "failed" | "skipped"; attempt?: number };

type FitJobContext = { runner: string; appUrl: string };
type LoadedRevision = NonNullable<Awaited<ReturnType<typeof getRevisionForRun>>>;

/**
 * Tells the launcher how the revision ended when its options ask for it (`notifyByEmail`). A mail that
 * cannot be sent is logged, never fails the job.
 */
async function notifyLauncher(
  loaded: LoadedRevision,
  appUrl: string,
  outcome: { status: "succeeded" | "cancelled" | "failed"; rms?: number; reason?: string },
): Promise<void> {
  const notify = revisionSnapshotSchema.safeParse(loaded.revision.inputs).data?.options.notifyByEmail;
  if (!notify || !loaded.launcherEmail) return;
  const { fit, revision, workspaceSlug } = loaded;
  await sendMail(
    fitFinishedMessage({
      to: loaded.launcherEmail,
      fitName: fit.name,
      revision: revision.number,
      ...outcome,
      revisionUrl: `${appUrl}/w/${encodeURIComponent(workspaceSlug)}/fits/${fit.id}/revisions/${revision.number}`,
    }),
  ).catch((error: unknown) => console.error(`fit ${revision.id}: finish e-mail failed:`, error));
}

/**
 * Runs one revision job: claims the revision (only from queued, or running after a dead attempt), fits
 * with progress and cancellation flowing, and writes the result and residual rows in one transaction
 * guarded by the attempt. Input the fit refuses ends the revision `failed` at once (no retry); anything
 * unexpected (e.g. the database going away) throws, so pg-boss retries the job.
 */
export async function runFitJob(revisionId: string, context: FitJobContext): Promise<FitJobOutcome> {
  const loaded = await getRevisionForRun(revisionId);
  if (!loaded) return { revisionId, outcome: "skipped" };
  const attempt = await claimRevision({ revisionId, runner: context.runner });
  if (attempt === null) return { revisionId, outcome: "skipped" };
  const fail = async (reason: string): Promise<FitJobOutcome> => {
    if (!(await failRevision({ revisionId, attempt, reason }))) return { revisionId, outcome: "skipped", attempt };
    await notifyLauncher(loaded, context.appUrl, { status: "failed", reason });
    return { revisionId, outcome: "failed", attempt };
  };

  const snapshot = revisionSnapshotSchema.safeParse(loaded.revision.inputs);
  if (!snapshot.success) return fail("The stored inputs of this revision cannot be read.");
  const { model, mapping, window, options } = snapshot.data;
  const points = await loadDatasetPoints(snapshot.data.dataset.id);
  const validation = validateBandFit({ points, model, mapping, window: window ?? undefined, options });
  if (!validation.ok) return fail(`The fit's inputs no longer pass the checks: ${new BandFitError(validation.issues).message}`);

  const controller = new AbortController();
  let superseded = false;
  const poll = setInterval(() => {
    stopReason({ revisionId, attempt })
      .then((reason) => {
        if (!reason || controller.signal.aborted) return;
        superseded = reason === "superseded";
        controller.abort();
      })
      .catch((error: unknown) => console.error(`fit ${revisionId}: cancel poll failed:`, error));
  }, cancelPollMs);

  let lastWrite = 0;
  let writing = false;
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
      .then((held) => {
        if (!held) {
          superseded = true;
          controller.abort();
        }
      })
      .catch((error: unknown) => console.error(`fit ${revisionId}: progress write failed:`, error))
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
  const written = await finishRevision({
    revisionId,
    attempt,
    status,
    result: stored,
    residuals: residuals.map((r) => {
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
    }),
  });
  if (!written) return { revisionId, outcome: "skipped", attempt };
  await notifyLauncher(loaded, context.appUrl, { status, rms: result.rms });
  return { revisionId, outcome: status, attempt };
}

/**
 * The dead-letter path: a job whose every attempt ended without a result (the worker died each time, or
 * the handler kept failing) ends its revision `failed` with a reason, never stuck in running.
 */
export async function failAbandonedRevision(revisionId: string, appUrl: string): Promise<void> {
  const loaded = await getRevisionForRun(revisionId);
  if (!loaded) return;
  const attempts = loaded.revision.attempts;
  const reason = `The fit did not finish: ${attempts} attempt${attempts === 1 ? "" : "s"} ended without a result (the worker stopped or met an error). Launch a new revision to try again.`;
  if (await failRevision({ revisionId, reason })) await notifyLauncher(loaded, appUrl, { status: "failed", reason });
}
