import { describeDatabaseError, isConnectionError } from "@/db/connection-errors";

// How the worker lives through a database outage: repeated tasks (polls, heartbeats, sweeps) log the
// first failure and the recovery instead of one line per try, and a fit's final write waits for the
// database to come back instead of throwing its result away.

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Tracks one repeated task: its first failure and its recovery are logged, the tries between are counted. */
export function failureLog(label: string): { failed(error: unknown): void; succeeded(): void } {
  let failures = 0;
  let since = 0;
  return {
    failed(error) {
      if (failures++ === 0) {
        since = Date.now();
        console.error(`${label} failed (further failures are counted, not logged):`, describeDatabaseError(error));
      }
    },
    succeeded() {
      if (failures === 0) return;
      console.log(`${label} works again after ${failures} failed ${failures === 1 ? "try" : "tries"} over ${((Date.now() - since) / 1000).toFixed(1)} s`);
      failures = 0;
    },
  };
}

/**
 * Runs `task`, and again while it fails because the database cannot be reached (0.5 s, doubling to
 * 5 s between tries), for at most `giveUpAfterMs`.
 * @throws the task's own error when it is not a connection error, or the last one after the deadline
 */
export async function retryWhileUnreachable<T>(label: string, task: () => Promise<T>, giveUpAfterMs = 600_000): Promise<T> {
  const log = failureLog(label);
  const deadline = Date.now() + giveUpAfterMs;
  for (let pause = 500; ; pause = Math.min(5000, pause * 2)) {
    try {
      const result = await task();
      log.succeeded();
      return result;
    } catch (error) {
      if (!isConnectionError(error) || Date.now() + pause > deadline) throw error;
      log.failed(error);
      await sleep(pause);
    }
  }
}
