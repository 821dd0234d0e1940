import { NextResponse } from "next/server";
import { describeDatabaseError } from "@/db/connection-errors";
import { pingDatabase } from "@/db/queries/health";
import { checkWorkerHealth } from "@/lib/server/job-queue";

export const dynamic = "force-dynamic";

/** How long the database may take to answer `select 1`, ms: a server that hangs is down too. */
const databaseTimeoutMs = 3000;

async function databaseAnswers(): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${databaseTimeoutMs} ms`)), databaseTimeoutMs);
  });
  try {
    await Promise.race([pingDatabase(), timeout]);
    return true;
  } catch (error) {
    console.error("health: database:", describeDatabaseError(error));
    return false;
  } finally {
    clearTimeout(timer);
  }
}

async function workerAnswers(): Promise<boolean> {
  try {
    return await checkWorkerHealth();
  } catch (error) {
    console.error("health: worker probe:", error);
    return false;
  }
}

/**
 * Public liveness: `database` is "ok" when it answers a query, `worker` "ok" when a worker completes a
 * health job and "away" otherwise — also while the database is down, since jobs travel through it. The
 * pages keep being served either way; the status is 503 unless both are ok.
 */
export async function GET() {
  const database = (await databaseAnswers()) ? "ok" : "down";
  const worker = database === "ok" && (await workerAnswers()) ? "ok" : "away";
  const ok = database === "ok" && worker === "ok";
  return NextResponse.json({ ok, database, worker }, { status: ok ? 200 : 503 });
}
