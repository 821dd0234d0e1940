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
  heartbeatIntervalMs,
  queueSchema,
} from "@/lib/server/queues";
import { failureLog } from "./database-outage";
import { failUnstartedRevision, runFitJob } from "./fit-job";
import { handBack } from "./hand-back";
import { startHeartbeat } from "./heartbeat";
import { startJobLoop } from "./job-loop";
import { startSweeper } from "./sweeper";

// The background worker: started with tsx (`tsx workers/main.ts`). It answers health probes, runs fit
// revisions (WORKER_FIT_CONCURRENCY at a time) with a heartbeat, hands back the revisions of runners that
// are gone, and ends revisions whose jobs never started; several workers share the queues. It keeps
// running through a database outage and carries on when the database is back.

const workerName = env.WORKER_NAME ?? `${hostname()}:${process.pid}`;
const label = `worker ${workerName}`;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

// The known rejections are handled where they arise; anything a library still leaves unhandled is logged
// and the worker carries on (every state it changes is guarded in the database).
process.on("unhandledRejection", (reason) => console.error(`${label}: unhandled rejection (the worker carries on):`, reason));

async function main(): Promise<void> {
  const boss = new PgBoss({
    connectionString: env.DATABASE_URL,
    schema: queueSchema,
    // Maintenance expires jobs left active by a dead worker (pg-boss bookkeeping; their revisions are the
    // sweeper's). No cron schedules are used.
    maintenanceIntervalSeconds: env.WORKER_MAINTENANCE_INTERVAL_SECONDS,
    schedule: false,
    max: env.WORKER_FIT_CONCURRENCY + 4,
  });
  const queueLog = failureLog(`${label}: pg-boss`);
  boss.on("error", (error) => queueLog.failed(error));
  boss.on("maintenance", () => queueLog.succeeded());
  await boss.start();
  await createQueues(boss);

  const staleSeconds = env.FIT_HEARTBEAT_STALE_SECONDS;
  const beatMs = heartbeatIntervalMs(staleSeconds);
  const heartbeat = startHeartbeat(beatMs, label);
  const context = {
    runner: workerName,
    appUrl: env.APP_URL,
    heartbeat,
    handBack: (revisionId: string, attempt: number) => handBack(boss, revisionId, { attempt }, { label, appUrl: env.APP_URL }),
  };

  const loops = [
    startJobLoop(boss, { queue: healthQueue.name, batchSize: 5, intervalMs: 500, label }, async (): Promise<HealthJobOutput> => ({
      worker: workerName,
      answeredAt: new Date().toISOString(),
    })),
    // One loop per concurrent fit; each takes one job at a time, so a fit's failure retries only itself.
    ...Array.from({ length: env.WORKER_FIT_CONCURRENCY }, () =>
      startJobLoop<FitJobData>(boss, { queue: fitQueue.name, batchSize: 1, intervalMs: 500, label }, async ([job]) => {
        const outcome = await runFitJob(job.data.revisionId, context);
        console.log(`${label}: revision ${outcome.revisionId} ${outcome.outcome} (attempt ${outcome.attempt ?? "-"})`);
        return outcome;
      }),
    ),
    startJobLoop<FitJobData>(boss, { queue: fitDeadLetterQueue.name, batchSize: 5, intervalMs: 1000, label }, async (jobs) => {
      for (const job of jobs) await failUnstartedRevision(job.data.revisionId, env.APP_URL);
    }),
  ];
  const sweeper = startSweeper({ boss, intervalMs: beatMs, staleSeconds, label, appUrl: env.APP_URL });
  console.log(`${label}: listening (${env.WORKER_FIT_CONCURRENCY} fit slots)`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${label}: ${signal}, finishing current jobs (at most 20 s)`);
    sweeper.stop();
    // A fit still running after that is handed back by another worker's sweeper once its heartbeat is stale.
    await Promise.race([Promise.all(loops.map((loop) => loop.stop())), sleep(20_000)]);
    await heartbeat.stop();
    await boss.stop({ graceful: false, wait: true }).catch((error: unknown) => console.error(`${label}: pg-boss stop:`, error));
    await closeDatabase();
    process.exit(0);
  };
  process.on("SIGTERM", () => void stop("SIGTERM"));
  process.on("SIGINT", () => void stop("SIGINT"));
}

main().catch((error: unknown) => {
  console.error(`${label}: failed to start:`, error);
  process.exit(1);
});
