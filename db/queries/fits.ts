import { and, asc, desc, eq, max, or, sql } from "drizzle-orm";
import { randomUUID } from "node:crypto";
import { db } from "@/db/client";
import { heartbeatStale } from "@/db/queries/fit-attempts";
import { type QueueSql, queueSqlIn } from "@/db/queue-sql";
import { type NewFitResidual, type RevisionStatus, dataset, fit, fitResidual, fitRevision, organization, user } from "@/db/schema";

// Fits and their revisions: creation, reads for the routes, and the guarded writes of the worker.
// Every final write carries `status = 'running' AND attempts = <the writer's attempt>`, so a superseded or
// cancelled attempt can never overwrite a final state.

type LaunchWarning = { kind: string; message: string };

/**
 * Sends a new revision's queue job through `queue` (pg-boss's way into the revision's own transaction) and
 * returns the job's id; throws when the queue does not take it, which rolls the revision back.
 */
export type SendRevisionJob = (revisionId: string, queue: QueueSql) => Promise<string>;

/**
 * Creates a fit, its revision 1 (status queued) and the revision's job in one transaction: all three
 * or nothing.
 */
export async function createFitWithFirstRevision(params: {
  workspaceId: string;
  datasetId: string;
  name: string;
  notes: string;
  launchedBy: string;
  inputs: unknown;
  launchWarnings: LaunchWarning[];
  sendJob: SendRevisionJob;
}): Promise<{ fitId: string; revisionId: string; number: number }> {
  const fitId = randomUUID();
  const revisionId = randomUUID();
  await db.transaction(async (tx) => {
    await tx.insert(fit).values({
      id: fitId,
      workspaceId: params.workspaceId,
      datasetId: params.datasetId,
      name: params.name,
      notes: params.notes,
      createdBy: params.launchedBy,
    });
    await tx.insert(fitRevision).values({
      id: revisionId,
      fitId,
      number: 1,
      inputs: params.inputs,
      launchedBy: params.launchedBy,
      launchWarnings: params.launchWarnings,
    });
    const jobId = await params.sendJob(revisionId, queueSqlIn(tx));
    await tx.update(fitRevision).set({ jobId }).where(eq(fitRevision.id, revisionId));
  });
  return { fitId, revisionId, number: 1 };
}

/**
 * Adds the next revision of a fit (number = highest + 1, the fit row locked meanwhile) and its job, in
 * one transaction.
 */
export async function createNextRevision(params: {
  fitId: string;
  parentNumber: number;
  launchedBy: string;
  inputs: unknown;
  launchWarnings: LaunchWarning[];
  sendJob: SendRevisionJob;
}): Promise<{ revisionId: string; number: number }> {
  const revisionId = randomUUID();
  const number = await db.transaction(async (tx) => {
    await tx.select({ id: fit.id }).from(fit).where(eq(fit.id, params.fitId)).for("update");
    const [{ highest }] = await tx.select({ highest: max(fitRevision.number) }).from(fitRevision).where(eq(fitRevision.fitId, params.fitId));
    const next = (highest ?? 0) + 1;
    await tx.insert(fitRevision).values({
      id: revisionId,
      fitId: params.fitId,
      number: next,
      parentNumber: params.parentNumber,
      inputs: params.inputs,
      launchedBy: params.launchedBy,
      launchWarnings: params.launchWarnings,
    });
    const jobId = await params.sendJob(revisionId, queueSqlIn(tx));
    await tx.update(fitRevision).set({ jobId }).where(eq(fitRevision.id, revisionId));
    return next;
  });
  return { revisionId, number };
}

const revisionSummaryColumns = {
  id: fitRevision.id,
  number: fitRevision.number,
  parentNumber: fitRevision.parentNumber,
  status: fitRevision.status,
  attempts: fitRevision.attempts,
  launchedBy: user.name,
  createdAt: fitRevision.createdAt,
  startedAt: fitRevision.startedAt,
  finishedAt: fitRevision.finishedAt,
  rms: sql<number | null>`(${fitRevision.result} ->> 'rms')::double precision`,
};

/**
 * The workspace's fits (optionally only those of one dataset), newest first, each with its dataset's
 * name, its creator's name and its latest revision's number, status, RMS (eV) and finish time — one
 * query: the latest revision comes from a lateral subquery on the (fit_id, number) index.
 */
export async function listFits(params: { workspaceId: string; datasetId?: string }) {
  const latest = db
    .select({
      number: fitRevision.number,
      status: fitRevision.status,
      rms: sql<number | null>`(${fitRevision.result} ->> 'rms')::double precision`.as("latest_rms"),
      finishedAt: fitRevision.finishedAt,
    })
    .from(fitRevision)
    .where(eq(fitRevision.fitId, fit.id))
    .orderBy(desc(fitRevision.number))
    .limit(1)
    .as("latest");
  const rows = await db
    .select({
      id: fit.id,
      name: fit.name,
      notes: fit.notes,
      datasetId: fit.datasetId,
      datasetName: dataset.name,
      createdByName: user.name,
      createdAt: fit.createdAt,
      latestRevision: latest.number,
      latestStatus: latest.status,
      latestRms: latest.rms,
      latestFinishedAt: latest.finishedAt,
    })
    .from(fit)
    .innerJoin(dataset, eq(dataset.id, fit.datasetId))
    .leftJoin(user, eq(user.id, fit.createdBy))
    .leftJoinLateral(latest, sql`true`)
    .where(and(eq(fit.workspaceId, params.workspaceId), params.datasetId === undefined ? undefined : eq(fit.datasetId, params.datasetId)))
    .orderBy(desc(fit.createdAt), asc(fit.id));
  return rows;
}

/** One fit of the workspace with its revisions (summaries, oldest first), or null. */
export async function getFit(params: { workspaceId: string; fitId: string }) {
  const rows = await db
    .select()
    .from(fit)
    .where(and(eq(fit.workspaceId, params.workspaceId), eq(fit.id, params.fitId)))
    .limit(1);
  const found = rows[0];
  if (!found) return null;
  const revisions = await db
    .select(revisionSummaryColumns)
    .from(fitRevision)
    .leftJoin(user, eq(user.id, fitRevision.launchedBy))
    .where(eq(fitRevision.fitId, found.id))
    .orderBy(asc(fitRevision.number));
  return { ...found, revisions };
}

/** The revision numbers of a workspace's fit, ascending, or null when the workspace has no such fit (one query). */
export async function listRevisionNumbers(params: { workspaceId: string; fitId: string }): Promise<number[] | null> {
  const rows = await db
    .select({ number: fitRevision.number })
    .from(fit)
    .leftJoin(fitRevision, eq(fitRevision.fitId, fit.id))
    .where(and(eq(fit.workspaceId, params.workspaceId), eq(fit.id, params.fitId)))
    .orderBy(asc(fitRevision.number));
  if (rows.length === 0) return null;
  return rows.flatMap((row) => (row.number === null ? [] : [row.number]));
}

/**
 * One revision of a workspace's fit (all columns, launcher's name and e-mail, and what its dataset says
 * about the data: source and energy reference), or null.
 */
export async function getRevision(params: { workspaceId: string; fitId: string; number: number }) {
  const rows = await db
    .select({
      revision: fitRevision,
      fit,
      launcherName: user.name,
      launcherEmail: user.email,
      datasetSource: dataset.source,
      datasetEnergyReference: dataset.energyReference,
    })
    .from(fitRevision)
    .innerJoin(fit, eq(fit.id, fitRevision.fitId))
    .innerJoin(dataset, eq(dataset.id, fit.datasetId))
    .leftJoin(user, eq(user.id, fitRevision.launchedBy))
    .where(and(eq(fit.workspaceId, params.workspaceId), eq(fit.id, params.fitId), eq(fitRevision.number, params.number)))
    .limit(1);
  return rows[0] ?? null;
}
export type RevisionDetails = NonNullable<Awaited<ReturnType<typeof getRevision>>>;

/**
 * Cancels a revision: a queued one ends `cancelled` at once (no worker will start it), and so does a
 * running one whose runner is gone (heartbeat older than `staleSeconds`; it ends without a result, since
 * only the runner knew its best point); a live running one gets its cancel request stamped, which its
 * worker polls. Returns the status after the request.
 */
export async function requestCancel(params: { revisionId: string; staleSeconds: number }): Promise<RevisionStatus | null> {
  const ended = await db
    .update(fitRevision)
    .set({
      status: "cancelled",
      cancelRequested: sql`coalesce(${fitRevision.cancelRequested}, now())`,
      finishedAt: sql`now()`,
      failureReason: null,
      progress: null,
    })
    .where(
      and(
        eq(fitRevision.id, params.revisionId),
        or(eq(fitRevision.status, "queued"), and(eq(fitRevision.status, "running"), heartbeatStale(params.staleSeconds))),
      ),
    )
    .returning({ status: fitRevision.status });
  if (ended[0]) return ended[0].status;
  const stamped = await db
    .update(fitRevision)
    .set({ cancelRequested: sql`coalesce(${fitRevision.cancelRequested}, now())` })
    .where(and(eq(fitRevision.id, params.revisionId), eq(fitRevision.status, "running")))
    .returning({ status: fitRevision.status });
  if (stamped[0]) return stamped[0].status;
  const rows = await db.select({ status: fitRevision.status }).from(fitRevision).where(eq(fitRevision.id, params.revisionId));
  return rows[0]?.status ?? null;
}

// ----- the worker's side -----

/** A revision, its fit, the workspace's slug and the launcher's address, as the worker loads them. */
export async function getRevisionForRun(revisionId: string) {
  const rows = await db
    .select({ revision: fitRevision, fit, workspaceSlug: organization.slug, launcherEmail: user.email, launcherName: user.name })
    .from(fitRevision)
    .innerJoin(fit, eq(fit.id, fitRevision.fitId))
    .innerJoin(organization, eq(organization.id, fit.workspaceId))
    .leftJoin(user, eq(user.id, fitRevision.launchedBy))
    .where(eq(fitRevision.id, revisionId))
    .limit(1);
  return rows[0] ?? null;
}

/**
 * Starts an attempt on a queued revision (a running one belongs to its runner until the sweeper hands it
 * back): `attempts + 1`, the runner's name and a first heartbeat. Returns the new attempt number, or null
 * when the revision is not queued.
 */
export async function claimRevision(params: { revisionId: string; runner: string }): Promise<number | null> {
  const rows = await db
    .update(fitRevision)
    .set({
      status: "running",
      attempts: sql`${fitRevision.attempts} + 1`,
      runner: params.runner,
      startedAt: sql`now()`,
      heartbeatAt: sql`now()`,
      progress: null,
    })
    .where(and(eq(fitRevision.id, params.revisionId), eq(fitRevision.status, "queued")))
    .returning({ attempts: fitRevision.attempts });
  return rows[0]?.attempts ?? null;
}

const heldBy = (revisionId: string, attempt: number) =>
  and(eq(fitRevision.id, revisionId), eq(fitRevision.status, "running"), eq(fitRevision.attempts, attempt));

/** Overwrites the live progress; returns false when the attempt no longer holds the revision. */
export async function writeProgress(params: { revisionId: string; attempt: number; progress: unknown }): Promise<boolean> {
  const rows = await db
    .update(fitRevision)
    .set({ progress: params.progress })
    .where(heldBy(params.revisionId, params.attempt))
    .returning({ id: fitRevision.id });
  return rows.length > 0;
}

/**
 * Why a running attempt should stop: `cancel` when someone asked to cancel (the best point is kept),
 * `superseded` when the revision is final or another attempt holds it (nothing may be written); else null.
 */
export async function stopReason(params: { revisionId: string; attempt: number }): Promise<"cancel" | "superseded" | null> {
  const rows = await db
    .select({ cancelRequested: fitRevision.cancelRequested, status: fitRevision.status, attempts: fitRevision.attempts })
    .from(fitRevision)
    .where(eq(fitRevision.id, params.revisionId));
  const row = rows[0];
  if (!row || row.status !== "running" || row.attempts !== params.attempt) return "superseded";
  return row.cancelRequested === null ? null : "cancel";
}

/** Rows per INSERT of residuals (PostgreSQL allows 65 535 bind parameters; a row has 10). */
const residualChunk = 5000;

/**
 * Writes the final state with its residual rows in ONE transaction, only while `attempt` still holds the
 * revision. Returns false (and writes nothing) when it does not: a retried or cancelled attempt lost.
 */
export async function finishRevision(params: {
  revisionId: string;
  attempt: number;
  status: "succeeded" | "cancelled";
  result: unknown;
  residuals: Omit<NewFitResidual, "revisionId">[];
}): Promise<boolean> {
  return db.transaction(async (tx) => {
    const updated = await tx
      .update(fitRevision)
      .set({ status: params.status, result: params.result, finishedAt: new Date(), progress: null, failureReason: null })
      .where(heldBy(params.revisionId, params.attempt))
      .returning({ id: fitRevision.id });
    if (updated.length === 0) return false;
    for (let i = 0; i < params.residuals.length; i += residualChunk) {
      const chunk = params.residuals.slice(i, i + residualChunk).map((r) => ({ ...r, revisionId: params.revisionId }));
      await tx.insert(fitResidual).values(chunk);
    }
    return true;
  });
}

/**
 * Ends a revision `failed` with a readable reason. With `attempt`, only while that attempt holds it;
 * without (the dead-letter path: its job never got as far as a claim), only while it is still queued.
 * Returns whether it changed anything.
 */
export async function failRevision(params: { revisionId: string; reason: string; attempt?: number }): Promise<boolean> {
  const guard =
    params.attempt === undefined
      ? and(eq(fitRevision.id, params.revisionId), eq(fitRevision.status, "queued"))
      : heldBy(params.revisionId, params.attempt);
  const rows = await db
    .update(fitRevision)
    .set({ status: "failed", failureReason: params.reason, finishedAt: new Date(), progress: null })
    .where(guard)
    .returning({ id: fitRevision.id });
  return rows.length > 0;
}
