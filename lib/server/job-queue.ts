import "server-only";
import PgBoss from "pg-boss";
import { describeDatabaseError } from "@/db/connection-errors";
import { env } from "@/lib/env";
import { createQueues, healthQueue, queueSchema } from "./queues";

// The web app only sends jobs and reads their state; maintenance and scheduling are the worker's job.
const globalForQueue = globalThis as typeof globalThis & { bandwrightQueue?: Promise<PgBoss> };

async function startQueue(): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: env.DATABASE_URL,
    schema: queueSchema,
    max: 3,
    supervise: false,
    schedule: false,
  });
  boss.on("error", (error) => console.error("pg-boss:", describeDatabaseError(error)));
  await boss.start();
  await createQueues(boss);
  return boss;
}

/** The process's pg-boss client, started once. A failed start is forgotten so the next call retries. */
export function getQueue(): Promise<PgBoss> {
  globalForQueue.bandwrightQueue ??= startQueue().catch((error: unknown) => {
    globalForQueue.bandwrightQueue = undefined;
    throw error;
  });
  return globalForQueue.bandwrightQueue;
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Sends a health job and waits for a worker to complete it.
 * @param timeoutMs - how long to wait for an answer, milliseconds (the worker polls every 0.5 s)
 * @returns true when a worker answered in time
 */
async function probeWorker(timeoutMs: number): Promise<boolean> {
  const boss = await getQueue();
  const jobId = await boss.send(healthQueue.name, { askedAt: new Date().toISOString() });
  if (!jobId) return false;
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const job = await boss.getJobById(healthQueue.name, jobId);
    if (job?.state === "completed") return true;
    if (job?.state === "failed") return false;
    await sleep(150);
  }
  return false;
}

/** How long one worker answer is reused, milliseconds: health checks cannot flood the queue's small pool. */
const healthCacheMs = 5000;
let lastProbe: { at: number; answer: Promise<boolean> } | undefined;

/**
 * Whether a worker answers a health job. Concurrent callers share one probe, and its answer is reused for
 * 5 s, so a burst of anonymous /api/health requests costs one job, not one each.
 * @param timeoutMs - how long a probe waits for the worker, milliseconds
 */
export function checkWorkerHealth(timeoutMs = 5000): Promise<boolean> {
  if (!lastProbe || Date.now() - lastProbe.at > healthCacheMs) {
    const answer = probeWorker(timeoutMs).catch((error: unknown) => {
      lastProbe = undefined; // an error is not cached: the next caller tries again
      throw error;
    });
    lastProbe = { at: Date.now(), answer };
  }
  return lastProbe.answer;
}
