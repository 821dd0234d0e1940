import { parentPort, workerData } from "node:worker_threads";
import { closeDatabase } from "@/db/client";
import { type HeldAttempt, beatHeldAttempts } from "@/db/queries/fit-attempts";
import { failureLog } from "./database-outage";

// The heartbeat thread (started by heartbeat.ts): stamps the held attempts every interval, on its own
// database connection. Messages: `{ held }` replaces the list, `{ stop: true }` ends the thread.

const { intervalMs, label } = workerData as { intervalMs: number; label: string };
const log = failureLog(`${label}: heartbeat`);
let held: HeldAttempt[] = [];
let beating = false;

async function beat(): Promise<void> {
  if (beating) return;
  beating = true;
  try {
    await beatHeldAttempts(held);
    log.succeeded();
  } catch (error) {
    log.failed(error);
  } finally {
    beating = false;
  }
}

const timer = setInterval(() => void beat(), intervalMs);

parentPort!.on("message", (message: { held?: HeldAttempt[]; stop?: boolean }) => {
  if (message.held) held = message.held;
  if (message.stop) {
    clearInterval(timer);
    parentPort!.close();
    void closeDatabase();
  }
});
