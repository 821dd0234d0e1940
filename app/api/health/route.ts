import { NextResponse } from "next/server";
import { pingDatabase } from "@/db/queries/health";
import { checkWorkerHealth } from "@/lib/server/job-queue";

export const dynamic = "force-dynamic";

type Status = "up" | "down";

async function probe(check: () => Promise<unknown>): Promise<Status> {
  try {
    const result = await check();
    return result === false ? "down" : "up";
  } catch (error) {
    console.error("health:", error);
    return "down";
  }
}

/** Public liveness: the database answers a query and a worker answers a health job. */
export async function GET() {
  const database = await probe(pingDatabase);
  const queue = database === "up" ? await probe(() => checkWorkerHealth()) : "down";
  const ok = database === "up" && queue === "up";
  return NextResponse.json({ ok, database, queue }, { status: ok ? 200 : 503 });
}
