import { type SQL, and, eq, or, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { type QueueSql, queueSqlIn } from "@/db/queue-sql";
import { fitRevision } from "@/db/schema";

// Liveness of running attempts: the heartbeat a worker writes for each attempt it holds, the staleness
// rule, and handing an abandoned revision back to the queue. Times are the database's (`now()`), so the
// clocks of the machines the workers run on never matter.

/** A running attempt: the revision and the attempt number its claim returned. */
export type HeldAttempt = { revisionId: string; attempt: number };

/**
 * Whether a running revision's runner is gone: its heartbeat is older than `staleSeconds`. A server
 * restart counts as the latest possible beat (pg_postmaster_start_time), so that live runners get
 * `staleSeconds` after a PostgreSQL outage to beat again before anyone takes their revisions.
 */
export function heartbeatStale(staleSeconds: number): SQL {
  return sql`greatest(${fitRevision.heartbeatAt}, pg_postmaster_start_time()) < now() - make_interval(secs => ${staleSeconds})`;
}

/** Stamps the heartbeat of every attempt in `held` that still holds its revision. */
export async function beatHeldAttempts(held: HeldAttempt[]): Promise<void> {
  if (held.length === 0) return;
  await db
    .update(fitRevision)
    .set({ heartbeatAt: sql`now()` })
    .where(
      and(
        eq(fitRevision.status, "running"),
        or(...held.map((h) => and(eq(fitRevision.id, h.revisionId), eq(fitRevision.attempts, h.attempt)))),
      ),
    );
}

/** Ids of running revisions whose heartbeat is stale, oldest first (at most `limit`). */
export async function listStaleRevisions(params: { staleSeconds: number; limit: number }): Promise<string[]> {
  const rows = await db
    .select({ id: fitRevision.id })
    .from(fitRevision)
    .where(and(eq(fitRevision.status, "running"), heartbeatStale(params.staleSeconds)))
    .orderBy(fitRevision.heartbeatAt)
    .limit(params.limit);
  return rows.map((r) => r.id);
}

/** What handing a revision back did. */
export type HandBackOutcome = { outcome: "requeued" | "failed" | "cancelled"; attempts: number; failureReason: string | null };

/**
 * Hands a running revision back, in one transaction with the queue: when it was asked to cancel it ends
 * `cancelled` (no result: the runner kept its best point to itself); when `attempts` reached
 * `maxAttempts` it ends `failed` with `failureReason(attempts)`; otherwise it returns to `queued` and
 * `resend` (given the revision, its previous job and pg-boss's way into this transaction) cancels the old
 * job and sends a new one, whose id is recorded. Only a revision that `guard` still matches is touched:
 * `{ staleSeconds }` for the sweeper (the runner is gone), `{ attempt }` for a worker giving back its own
 * attempt. Several sweepers may race: the row is locked and re-checked, others skip it.
 * @returns what was done, or null when the revision no longer matched
 */
export async function handBackRevision(params: {
  revisionId: string;
  guard: { staleSeconds: number } | { attempt: number };
  maxAttempts: number;
  failureReason: (attempts: number) => string;
  resend: (job: { revisionId: string; previousJobId: string | null; inputs: unknown }, queue: QueueSql) => Promise<string>;
}): Promise<HandBackOutcome | null> {
  const guard = "attempt" in params.guard ? eq(fitRevision.attempts, params.guard.attempt) : heartbeatStale(params.guard.staleSeconds);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ attempts: fitRevision.attempts, cancelRequested: fitRevision.cancelRequested, jobId: fitRevision.jobId, inputs: fitRevision.inputs })
      .from(fitRevision)
      .where(and(eq(fitRevision.id, params.revisionId), eq(fitRevision.status, "running"), guard))
      // sweepers skip a row another sweeper (or a beat) holds; a worker waits for its own attempt's row
      .for("update", "attempt" in params.guard ? undefined : { skipLocked: true });
    if (!row) return null;
    if (row.cancelRequested !== null || row.attempts >= params.maxAttempts) {
      const cancelled = row.cancelRequested !== null;
      const failureReason = cancelled ? null : params.failureReason(row.attempts);
      await tx
        .update(fitRevision)
        .set({ status: cancelled ? "cancelled" : "failed", failureReason, finishedAt: sql`now()`, progress: null })
        .where(eq(fitRevision.id, params.revisionId));
      return { outcome: cancelled ? "cancelled" : "failed", attempts: row.attempts, failureReason };
    }
    const jobId = await params.resend({ revisionId: params.revisionId, previousJobId: row.jobId, inputs: row.inputs }, queueSqlIn(tx));
    await tx.update(fitRevision).set({ status: "queued", runner: null, progress: null, startedAt: null, jobId }).where(eq(fitRevision.id, params.revisionId));
    return { outcome: "requeued", attempts: row.attempts, failureReason: null };
  });
}
