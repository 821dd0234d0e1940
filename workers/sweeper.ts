import type PgBoss from "pg-boss";
import { listStaleRevisions } from "@/db/queries/fit-attempts";
import { failureLog } from "./database-outage";
import { handBack } from "./hand-back";

/**
 * Every worker's sweeper: every `intervalMs` it hands back running revisions whose heartbeat is older
 * than `staleSeconds` (their runner is gone). Safe with any number of workers: each revision is handed
 * back under a row lock, in one transaction with its new job. After its own start and after any failed
 * sweep it waits `staleSeconds` first, so that live runners whose database connection was also away
 * have beaten again before their revisions are judged.
 */
export function startSweeper(params: { boss: PgBoss; intervalMs: number; staleSeconds: number; label: string; appUrl: string }): { stop(): void } {
  const { boss, staleSeconds, label } = params;
  const log = failureLog(`${label}: sweep`);
  let troubleAt = Date.now();
  let sweeping = false;
  const sweep = async () => {
    if (sweeping || Date.now() - troubleAt < staleSeconds * 1000) return;
    sweeping = true;
    try {
      for (const revisionId of await listStaleRevisions({ staleSeconds, limit: 20 }))
        await handBack(boss, revisionId, { staleSeconds }, { label, appUrl: params.appUrl });
      log.succeeded();
    } catch (error) {
      troubleAt = Date.now();
      log.failed(error);
    } finally {
      sweeping = false;
    }
  };
  const timer = setInterval(() => void sweep(), params.intervalMs);
  return { stop: () => clearInterval(timer) };
}
