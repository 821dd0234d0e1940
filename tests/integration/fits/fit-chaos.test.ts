import type { ChildProcess } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { countResiduals } from "@/db/queries/fit-residuals";
import { getRevision } from "@/db/queries/fits";
import { getWorkspaceBySlug } from "@/db/queries/workspaces";
import { env } from "@/lib/env";
import { TestClient } from "@/tests/support/client";
import { testPostgres } from "@/tests/support/test-postgres";
import { type Team, createTeam } from "@/tests/support/workspace";
import { type RevisionBody, isFinal, longFit, siliconDataset, startWorker, stopWorker, waitForRevision, workerReady } from "./helpers";

// Faults together (issue 11): fits run on the harness's worker and on one of ours; ours is SIGKILLed and
// PostgreSQL is stopped for 30 s at the same moment. The harness's worker must survive the outage, the
// site must keep answering, and after the restart every fit ends exactly once within 30 s.

const postgres = testPostgres();
const outageMs = 30_000;
const recoveryMs = 30_000;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

let team: Team;
let victimWorker: ChildProcess;
const base = () => `/api/workspaces/${team.slug}`;

async function timedGet(path: string): Promise<{ status: number; body: unknown; ms: number }> {
  const began = Date.now();
  const response = await fetch(new URL(path, new TestClient().baseUrl), { signal: AbortSignal.timeout(10_000) });
  const body = response.headers.get("content-type")?.includes("json") ? await response.json() : await response.text();
  return { status: response.status, body, ms: Date.now() - began };
}

describe.skipIf(!postgres)("a worker killed during a 30 s PostgreSQL outage", () => {
  beforeAll(async () => {
    team = await createTeam("Halvorsen Quantum Materials Lab");
    victimWorker = startWorker("chaos-victim");
    await workerReady(victimWorker);
  });

  afterAll(async () => {
    await stopWorker(victimWorker);
    // Never leave the shared server down for the files after this one.
    await postgres!.start();
  });

  it("every fit ends once, the site stays up, and it recovers within 30 s", async () => {
    const datasetId = await siliconDataset(team.slug);
    // The harness's worker has WORKER_FIT_CONCURRENCY slots, ours one: one fit more than the harness holds.
    const paths: string[] = [];
    for (let i = 0; i <= env.WORKER_FIT_CONCURRENCY; i++) {
      const launched = await team.editor.post(`${base()}/fits`, { ...longFit(datasetId, 6000), name: `chaos ${i}` });
      expect(launched.status).toBe(201);
      paths.push(`${base()}/fits/${(launched.body as { fitId: string }).fitId}/revisions/1`);
    }
    const running = async () => Promise.all(paths.map(async (path) => (await team.viewer.get(path)).body as RevisionBody));
    let states = await running();
    for (const deadline = Date.now() + 15_000; Date.now() < deadline; states = await running()) {
      if (states.every((s) => s.status === "running")) break;
      await sleep(200);
    }
    expect(states.map((s) => s.status)).toEqual(paths.map(() => "running"));
    const victimIndex = states.findIndex((s) => s.runner === "chaos-victim");
    expect(victimIndex, "one fit runs on the worker that is killed").toBeGreaterThanOrEqual(0);

    await stopWorker(victimWorker, "SIGKILL");
    await postgres!.stop();
    const outageEnds = Date.now() + outageMs;
    // The site answers throughout: public pages render, health says the database is down and no worker answers.
    while (Date.now() < outageEnds - 3000) {
      const health = await timedGet("/api/health");
      expect(health.status).toBe(503);
      expect(health.body).toEqual({ ok: false, database: "down", worker: "away" });
      expect(health.ms).toBeLessThan(8000);
      expect((await timedGet("/sign-in")).status).toBe(200);
      await sleep(3000);
    }
    await sleep(Math.max(0, outageEnds - Date.now()));
    await postgres!.start();
    const faultEnded = Date.now();

    // The harness's worker survived: with ours dead, it is the only one that can answer the health job.
    let health = await timedGet("/api/health");
    while (health.status !== 200 && Date.now() - faultEnded < recoveryMs) {
      await sleep(500);
      health = await timedGet("/api/health");
    }
    expect(health.body).toEqual({ ok: true, database: "ok", worker: "ok" });

    const ended: RevisionBody[] = [];
    for (const path of paths) ended.push(await waitForRevision(team.viewer, path, isFinal, Math.max(1000, recoveryMs - (Date.now() - faultEnded))));
    expect(Date.now() - faultEnded).toBeLessThan(recoveryMs);
    expect(ended.map((b) => b.status)).toEqual(paths.map(() => "succeeded"));
    // The killed worker's fit ran again on a live worker; the others were never restarted.
    expect(ended.map((b) => b.attempts)).toEqual(paths.map((_, i) => (i === victimIndex ? 2 : 1)));
    expect(ended[victimIndex].runner).not.toBe("chaos-victim");
    // Exactly one attempt wrote each revision's residual rows.
    const workspace = await getWorkspaceBySlug(team.slug);
    for (const [i, path] of paths.entries()) {
      const fitId = path.split("/fits/")[1].split("/")[0];
      const revision = (await getRevision({ workspaceId: workspace!.id, fitId, number: 1 }))!.revision;
      expect(await countResiduals({ revisionId: revision.id })).toBe(ended[i].result!.pointsUsed);
    }
  }, 110_000);
});
