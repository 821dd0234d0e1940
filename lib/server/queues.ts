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
 * One job per revision. Retries cover a worker that died mid-fit: its job expires (pg-boss 10 has no
 * heartbeat), the next maintenance pass returns it, and the retried attempt restarts the revision. Each
 * job's own expiry is derived from the fit's time limit when it is sent ({@link fitJobExpirySeconds}).
 */
export const fitQueue = {
  name: "fit-revision",
  options: { name: "fit-revision", retryLimit: 2, retryDelay: 1, retentionSeconds: 7 * 86_400, deadLetter: fitDeadLetterQueue.name },
} as const satisfies { name: string; options: PgBoss.Queue };

/** Data of a fit job. */
export type FitJobData = { revisionId: string };

/**
 * A fit job's expiry, seconds: the fit's own wall-clock limit (the engine stops there), plus a quarter for
 * loading and writing, plus a fixed margin; capped at pg-boss's 24 hours.
 * @param timeLimitMs - the fit's `timeLimitMs`, milliseconds
 * @param marginSeconds - fixed margin, seconds
 */
export function fitJobExpirySeconds(timeLimitMs: number, marginSeconds: number): number {
  return Math.min(86_400, Math.ceil((timeLimitMs / 1000) * 1.25 + marginSeconds));
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
