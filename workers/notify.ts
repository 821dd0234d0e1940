import { getRevisionForRun } from "@/db/queries/fits";
import { fitFinishedMessage } from "@/lib/email";
import { sendMail } from "@/lib/email/send";
import { revisionSnapshotSchema } from "@/lib/server/fits/snapshot";

/** A revision as the worker loads it (with its fit, workspace slug and launcher). */
export type LoadedRevision = NonNullable<Awaited<ReturnType<typeof getRevisionForRun>>>;

/** How a revision ended, as its e-mail tells it. */
export type EndedOutcome = { status: "succeeded" | "cancelled" | "failed"; rms?: number; reason?: string };

/**
 * Tells the launcher how the revision ended when its options ask for it (`notifyByEmail`). A mail that
 * cannot be sent is logged, never fails the job.
 */
export async function notifyLauncher(loaded: LoadedRevision, appUrl: string, outcome: EndedOutcome): Promise<void> {
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

/** {@link notifyLauncher} for a revision known by id only (the sweeper's and the dead-letter path). */
export async function notifyRevisionEnded(revisionId: string, appUrl: string, outcome: EndedOutcome): Promise<void> {
  const loaded = await getRevisionForRun(revisionId);
  if (loaded) await notifyLauncher(loaded, appUrl, outcome);
}
