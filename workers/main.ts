import { hostname } from "node:os";
import PgBoss from "pg-boss";
import { env } from "@/lib/env";
import { createQueues, healthQueue, queueSchema, type HealthJobOutput } from "@/lib/server/queues";

// The background worker: started with tsx (`tsx workers/main.ts`). It owns pg-boss's maintenance; fits
// will be added as further queues here.

const workerName = `${hostname()}:${process.pid}`;

async function main(): Promise<void> {
  const boss = new PgBoss({
    connectionString: env.DATABASE_URL,
    schema: queueSchema,
    // Expired jobs of a dead worker return to the queue at the next maintenance pass (pg-boss 10 has no
    // heartbeat), so passes run every 30 s rather than the default 120 s.
    maintenanceIntervalSeconds: 30,
  });
  boss.on("error", (error) => console.error("worker: pg-boss error:", error));
  await boss.start();
  await createQueues(boss);

  // Resolving completes every job of the batch with this output.
  await boss.work(healthQueue.name, { pollingIntervalSeconds: 0.5, batchSize: 5 }, async (): Promise<HealthJobOutput> => ({
    worker: workerName,
    answeredAt: new Date().toISOString(),
  }));
  console.log(`worker ${workerName}: listening on queue ${healthQueue.name}`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`worker ${workerName}: ${signal}, finishing current jobs`);
    await boss.stop({ graceful: true, wait: true, timeout: 20_000 });
    process.exit(0);
  };
  process.on("SIGTERM", () => void stop("SIGTERM"));
  process.on("SIGINT", () => void stop("SIGINT"));
}

main().catch((error: unknown) => {
  console.error("worker: failed to start:", error);
  process.exit(1);
});
