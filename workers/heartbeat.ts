import { Worker } from "node:worker_threads";
import type { HeldAttempt } from "@/db/queries/fit-attempts";

/** The heartbeat of the attempts this process runs. */
export type Heartbeat = {
  /** Beat for this attempt from now on (its claim wrote the first beat). */
  hold(attempt: HeldAttempt): void;
  /** Stop beating for it (it ended, or was given back). */
  release(attempt: HeldAttempt): void;
  /** Ends the thread. */
  stop(): Promise<void>;
};

const key = (a: HeldAttempt) => `${a.revisionId}#${a.attempt}`;

/**
 * Starts the heartbeat thread: every `intervalMs` it stamps `heartbeat_at` of the attempts held. A thread
 * of its own, because a fit's first evaluation (and the final statistics) block the main thread for
 * seconds on a large dataset (measured: 2.4 s for 100 000 points of sp3s* silicon, without a single
 * yield), and a heartbeat must not depend on them; it dies with the process, which is what it reports.
 * If the thread itself fails, the process exits (a supervisor starts a fresh worker): without a heartbeat
 * every fit it ran would be handed back anyway.
 */
export function startHeartbeat(intervalMs: number, label: string): Heartbeat {
  const thread = new Worker(threadBootstrap(new URL("./heartbeat-thread.ts", import.meta.url)), {
    eval: true,
    workerData: { intervalMs, label },
  });
  let stopping = false;
  thread.on("error", (error) => {
    console.error(`${label}: the heartbeat thread failed; exiting:`, error);
    process.exit(1);
  });
  thread.on("exit", (code) => {
    if (stopping) return;
    console.error(`${label}: the heartbeat thread exited (${code}); exiting`);
    process.exit(1);
  });
  const held = new Map<string, HeldAttempt>();
  const publish = () => thread.postMessage({ held: [...held.values()] });
  return {
    hold(attempt) {
      held.set(key(attempt), attempt);
      publish();
    },
    release(attempt) {
      held.delete(key(attempt));
      publish();
    },
    async stop() {
      stopping = true;
      const exited = new Promise((resolve) => thread.once("exit", resolve));
      thread.postMessage({ stop: true });
      await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 5000))]);
      await thread.terminate();
    },
  };
}

/**
 * Code that starts a TypeScript module in a worker thread: Node 20 gives threads neither tsx's loader
 * hooks nor `--import tsx`, so the thread registers tsx itself first (its API, resolved from here).
 */
function threadBootstrap(module: URL): string {
  const tsx = import.meta.resolve("tsx/esm/api");
  return `import(${JSON.stringify(tsx)}).then(({ register }) => { register(); return import(${JSON.stringify(module.href)}); });`;
}
