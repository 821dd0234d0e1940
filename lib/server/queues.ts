import type PgBoss from "pg-boss";

/** PostgreSQL schema that holds pg-boss's tables. */
export const queueSchema = "pgboss";

/** The health queue: the app sends a job, a live worker completes it within seconds. */
export const healthQueue = {
  name: "system-health",
  // No retries and a short expiry: a health probe is only worth answering while someone waits for it.
  options: { name: "system-health", retryLimit: 0, expireInSeconds: 30, retentionSeconds: 300 },
} as const satisfies { name: string; options: PgBoss.Queue };

/** Output of a completed health job. */
export type HealthJobOutput = { worker: string; answeredAt: string };

/**
 * Where fit jobs go after their last retry (a worker died on every attempt, or the handler kept throwing):
 * the worker's dead-letter handler ends the revision `failed` with a readable reason.
 */
export const fitDeadLetterQueue = {
  name: "fit-revision-dead",
  options: { name: "fit-revision-dead", retryLimit: 3, retryDelay: 5, expireInSeconds: 60 },
} as const satisfies { name: string; options: PgBoss.Queue };

/**
 * One job per revision, sent in the same transaction as the revision (`sendFitJob`). Its retries cover a
 * handler that failed before it claimed the revision; after the last one the dead-letter queue ends a
 * revision still queued. A claimed revision is watched through its heartbeat instead (workers/sweeper.ts):
 * a dead runner's revision gets a new job, up to {@link fitMaxAttempts} attempts.
 */
export const fitQueue = {
  name: "fit-revision",
  options: { name: "fit-revision", retryLimit: 2, retryDelay: 1, retentionSeconds: 7 * 86_400, deadLetter: fitDeadLetterQueue.name },
} as const satisfies { name: string; options: PgBoss.Queue };

/** Data of a fit job. */
export type FitJobData = { revisionId: string };

/** Attempts (claims by a worker) a revision gets before a dead runner's revision ends `failed`. */
export const fitMaxAttempts = 3;

/**
 * The longest expiry pg-boss 10 accepts, seconds: its check is `expireIn / 3600 < 24` (attorney.js,
 * "expiration cannot exceed 24 hours"), so 24 h itself is refused.
 */
export const maxJobExpirySeconds = 86_399;

/**
 * A fit job's expiry, seconds: the fit's own wall-clock limit (the engine stops there), plus a quarter for
 * loading and writing, plus a fixed margin; never above {@link maxJobExpirySeconds}. The longest time
 * limit the launch accepts (19 h) keeps the quarter within it.
 * @param timeLimitMs - the fit's `timeLimitMs`, milliseconds
 * @param marginSeconds - fixed margin, seconds
 */
export function fitJobExpirySeconds(timeLimitMs: number, marginSeconds: number): number {
  return Math.min(maxJobExpirySeconds, Math.ceil((timeLimitMs / 1000) * 1.25 + marginSeconds));
}

/**
 * Sends a revision's fit job through `db` (pg-boss's way into the caller's transaction, so the job
 * commits with the revision) and returns its id.
 * @throws when the queue does not take the job
 */
export async function sendFitJob(
  boss: PgBoss,
  params: { revisionId: string; timeLimitMs: number; marginSeconds: number; db: PgBoss.Db },
): Promise<string> {
  const data: FitJobData = { revisionId: params.revisionId };
  const jobId = await boss.send(fitQueue.name, data, {
    expireInSeconds: fitJobExpirySeconds(params.timeLimitMs, params.marginSeconds),
    db: params.db,
  });
  if (!jobId) throw new Error(`the queue did not take the job of revision ${params.revisionId}`);
  return jobId;
}

/**
 * How often a running attempt's heartbeat is written, and a sweep for stale ones runs, milliseconds: a
 * quarter of the staleness limit (so three missed beats in a row are still no false alarm), between
 * 0.5 and 5 s.
 * @param staleSeconds - `FIT_HEARTBEAT_STALE_SECONDS`
 */
export function heartbeatIntervalMs(staleSeconds: number): number {
  return Math.min(5000, Math.max(500, (staleSeconds * 1000) / 4));
}

/** PostgreSQL's deadlock_detected: two processes creating the same queue's tables at once (seen at start-up). */
const deadlockDetected = "40P01";

async function createQueueRetrying(boss: PgBoss, queue: PgBoss.Queue): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      await boss.createQueue(queue.name, queue);
      return;
    } catch (error) {
      if (attempt >= 5 || (error as { code?: string }).code !== deadlockDetected) throw error;
      await new Promise((resolve) => setTimeout(resolve, 100 * attempt));
    }
  }
}

/**
 * Every queue the app uses; createQueue is idempotent, so the app and every worker call this on start
 * (concurrent calls can deadlock in PostgreSQL, so a deadlock is retried).
 */
export async function createQueues(boss: PgBoss): Promise<void> {
  await createQueueRetrying(boss, healthQueue.options);
  // The dead-letter queue first: the fit queue's row refers to it.
  await createQueueRetrying(boss, fitDeadLetterQueue.options);
  await createQueueRetrying(boss, fitQueue.options);
}
