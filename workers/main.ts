import { hostname } from "node:os";
import PgBoss from "pg-boss";
import { closeDatabase } from "@/db/client";
import { env } from "@/lib/env";
import {
  type FitJobData,
  type HealthJobOutput,
  createQueues,
  fitDeadLetterQueue,
  fitQueue,
  healthQueue,
  queueSchema,
} from "@/lib/server/queues";
import { failAbandonedRevision, runFitJob } from "./fit-job";

// The background worker: started with tsx (`tsx workers/main.ts`). It answers health probes, runs fit
// revisions (WORKER_FIT_CONCURRENCY at a time) and ends abandoned ones; several workers share the queues.

const workerName = env.WORKER_NAME ?? `${hostname()}:${process.pid}`;

async function main(): Promise<void> {
  const boss = new PgBoss({
    connectionString: env.DATABASE_URL,
    schema: queueSchema,
    // Expired jobs of a dead worker return to the queue at the next maintenance pass (pg-boss 10 has no
    // heartbeat), so passes run often (30 s by default; tests use 1–2 s).
    maintenanceIntervalSeconds: env.WORKER_MAINTENANCE_INTERVAL_SECONDS,
    max: env.WORKER_FIT_CONCURRENCY + 4,
  });
  boss.on("error", (error) => console.error("worker: pg-boss error:", error));
  await boss.start();
  await createQueues(boss);

  // Resolving completes every job of the batch with this output.
  await boss.work(healthQueue.name, { pollingIntervalSeconds: 0.5, batchSize: 5 }, async (): Promise<HealthJobOutput> => ({
    worker: workerName,
    answeredAt: new Date().toISOString(),
  }));

  // One poller per concurrent fit; each takes one job at a time, so a fit's failure retries only itself.
  const context = { runner: workerName, appUrl: env.APP_URL };
  for (let i = 0; i < env.WORKER_FIT_CONCURRENCY; i++) {
    await boss.work<FitJobData>(fitQueue.name, { pollingIntervalSeconds: 0.5, batchSize: 1 }, async ([job]) => {
      const outcome = await runFitJob(job.data.revisionId, context);
      console.log(`worker ${workerName}: revision ${outcome.revisionId} ${outcome.outcome} (attempt ${outcome.attempt ?? "-"})`);
      return outcome;
    });
  }
  await boss.work<FitJobData>(fitDeadLetterQueue.name, { pollingIntervalSeconds: 1, batchSize: 5 }, async (jobs) => {
    for (const job of jobs) await failAbandonedRevision(job.data.revisionId, env.APP_URL);
  });
  console.log(`worker ${workerName}: listening (${env.WORKER_FIT_CONCURRENCY} fit slots)`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`worker ${workerName}: ${signal}, finishing current jobs`);
    await boss.stop({ graceful: true, wait: true, timeout: 20_000 });
    await closeDatabase();
    process.exit(0);
  };
  process.on("SIGTERM", () => void stop("SIGTERM"));
  process.on("SIGINT", () => void stop("SIGINT"));
}

main().catch((error: unknown) => {
  console.error("worker: failed to start:", error);
  process.exit(1);
});
