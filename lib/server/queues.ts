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

/** Every queue the app uses; createQueue is idempotent, so both app and worker call this on start. */
export async function createQueues(boss: PgBoss): Promise<void> {
  await boss.createQueue(healthQueue.name, healthQueue.options);
}
