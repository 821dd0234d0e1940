import type PgBoss from "pg-boss";
import { handBackRevision } from "@/db/queries/fit-attempts";
import { env } from "@/lib/env";
import { MAX_FIT_TIME_LIMIT_MS } from "@/lib/fit/bands";
import { revisionSnapshotSchema } from "@/lib/server/fits/snapshot";
import { fitMaxAttempts, fitQueue, sendFitJob } from "@/lib/server/queues";
import { notifyRevisionEnded } from "./notify";

/** The reason a revision ends `failed` when its last attempt ended without a result. */
export function abandonedReason(attempts: number): string {
  return `The fit did not finish: ${attempts} attempt${attempts === 1 ? "" : "s"} ended without a result (the worker running it stopped or met an error). Launch a new revision to try again.`;
}

/**
 * Hands a running revision back (db/queries/fit-attempts.ts `handBackRevision`): back to the queue with a
 * new job (the old one cancelled, both in the revision's transaction), or, after {@link fitMaxAttempts}
 * attempts or a cancel request, to its final state, telling the launcher when they asked for e-mail.
 * `guard`: `{ staleSeconds }` from the sweeper, `{ attempt }` from a worker giving back its own attempt.
 */
export async function handBack(
  boss: PgBoss,
  revisionId: string,
  guard: { staleSeconds: number } | { attempt: number },
  context: { label: string; appUrl: string },
): Promise<void> {
  const done = await handBackRevision({
    revisionId,
    guard,
    maxAttempts: fitMaxAttempts,
    failureReason: abandonedReason,
    resend: async ({ previousJobId, inputs }, queue) => {
      if (previousJobId) await boss.cancel(fitQueue.name, previousJobId, { db: queue });
      const timeLimitMs = revisionSnapshotSchema.safeParse(inputs).data?.options.timeLimitMs ?? MAX_FIT_TIME_LIMIT_MS;
      return sendFitJob(boss, { revisionId, timeLimitMs, marginSeconds: env.FIT_JOB_EXPIRY_MARGIN_SECONDS, db: queue });
    },
  });
  if (!done) return;
  const why = "attempt" in guard ? `attempt ${guard.attempt} gave up` : "its runner is gone (stale heartbeat)";
  console.log(`${context.label}: revision ${revisionId}: ${why}; ${done.outcome} after ${done.attempts} attempt${done.attempts === 1 ? "" : "s"}`);
  if (done.outcome === "failed") await notifyRevisionEnded(revisionId, context.appUrl, { status: "failed", reason: done.failureReason! });
}
