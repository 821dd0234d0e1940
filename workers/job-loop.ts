import type PgBoss from "pg-boss";
import { failureLog } from "./database-outage";

/**
 * Takes jobs of one queue in a loop (batches of `batchSize`, every `intervalMs` while it is empty), runs
 * `handler` and settles the batch: completed with the handler's output, or failed with its error (pg-boss
 * then retries it). Used instead of pg-boss's `work()`, which settles jobs without awaiting the call, so
 * that a settle during a database outage rejects unhandled and ends the process. Here a settle that
 * fails is tried again for a minute; one still unsettled then expires and is retried by pg-boss, which
 * the handlers tolerate (a revision is claimed at most once per job). pg-boss's `fetch` returns no jobs
 * while the database is away.
 */
export function startJobLoop<T extends object>(
  boss: PgBoss,
  options: { queue: string; batchSize: number; intervalMs: number; label: string },
  handler: (jobs: PgBoss.Job<T>[]) => Promise<object | void>,
): { stop(): Promise<void> } {
  const { queue, label } = options;
  let stopping = false;
  let wake: (() => void) | undefined;
  const pause = (ms: number) =>
    new Promise<void>((resolve) => {
      const timer = setTimeout(done, ms);
      function done() {
        clearTimeout(timer);
        wake = undefined;
        resolve();
      }
      wake = done;
    });

  const settleLog = failureLog(`${label}: settling jobs of ${queue}`);
  async function settle(ids: string[], run: () => Promise<unknown>): Promise<void> {
    const deadline = Date.now() + 60_000;
    for (let wait = 500; ; wait = Math.min(5000, wait * 2)) {
      try {
        await run();
        settleLog.succeeded();
        return;
      } catch (error) {
        settleLog.failed(error);
        if (stopping || Date.now() + wait > deadline) {
          console.error(`${label}: jobs ${ids.join(", ")} of ${queue} stay unsettled; they expire and are retried`);
          return;
        }
        await pause(wait);
      }
    }
  }

  const fetchLog = failureLog(`${label}: fetching jobs of ${queue}`);
  const loop = (async () => {
    while (!stopping) {
      let jobs: PgBoss.Job<T>[];
      try {
        jobs = await boss.fetch<T>(queue, { batchSize: options.batchSize });
        fetchLog.succeeded();
      } catch (error) {
        fetchLog.failed(error);
        jobs = [];
      }
      if (jobs.length === 0) {
        await pause(options.intervalMs);
        continue;
      }
      const ids = jobs.map((job) => job.id);
      try {
        const output = await handler(jobs);
        await settle(ids, () => (ids.length === 1 && output ? boss.complete(queue, ids[0], output) : boss.complete(queue, ids)));
      } catch (error) {
        console.error(`${label}: a job of ${queue} failed:`, error);
        const data = { message: error instanceof Error ? error.message : String(error) };
        await settle(ids, () => (ids.length === 1 ? boss.fail(queue, ids[0], data) : boss.fail(queue, ids)));
      }
    }
  })();

  return {
    async stop() {
      stopping = true;
      wake?.();
      await loop;
    },
  };
}
