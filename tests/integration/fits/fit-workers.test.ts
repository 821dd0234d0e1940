import type { ChildProcess } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { countResiduals } from "@/db/queries/fit-residuals";
import { getRevision } from "@/db/queries/fits";
import { getWorkspaceBySlug } from "@/db/queries/workspaces";
import { env } from "@/lib/env";
import { type Team, createTeam } from "@/tests/support/workspace";
import { type RevisionBody, honeycombDataset, isFinal, longFit, siliconDataset, startWorker, stopWorker, waitForRevision, workerReady } from "./helpers";

// Several worker processes share the queue (the harness's own worker runs too): a worker SIGKILLed
// mid-fit loses nothing, and every fit runs exactly once (issue 5).

let team: Team;
const workers: ChildProcess[] = [];
const base = () => `/api/workspaces/${team.slug}`;

beforeAll(async () => {
  team = await createTeam("Halvorsen Quantum Materials Lab");
  for (const name of ["test-worker-a", "test-worker-b"]) {
    const child = startWorker(name);
    workers.push(child);
    await workerReady(child);
  }
});

afterAll(async () => {
  await Promise.all(workers.map((w) => stopWorker(w)));
});

async function revisionRowId(fitId: string, number: number): Promise<string> {
  const workspace = await getWorkspaceBySlug(team.slug);
  return (await getRevision({ workspaceId: workspace!.id, fitId, number }))!.revision.id;
}

describe("several workers", () => {
  it("ten fits are each run exactly once", async () => {
    const datasetId = await honeycombDataset(team.slug);
    const fitIds: string[] = [];
    for (let i = 0; i < 10; i++) {
      const launched = await team.editor.post(`${base()}/fits`, { datasetId, name: `pz ${i}`, model: { template: "honeycomb-pz" } });
      expect(launched.status).toBe(201);
      fitIds.push((launched.body as { fitId: string }).fitId);
    }
    const ended: RevisionBody[] = [];
    for (const id of fitIds) ended.push(await waitForRevision(team.viewer, `${base()}/fits/${id}/revisions/1`, isFinal));
    expect(ended.map((b) => [b.status, b.attempts])).toEqual(fitIds.map(() => ["succeeded", 1]));
    for (const id of fitIds) expect(await countResiduals({ revisionId: await revisionRowId(id, 1) })).toBe(120);
  });

  it("a worker SIGKILLed mid-fit: the job expires, is retried, and the revision ends final with one result", async () => {
    const datasetId = await siliconDataset(team.slug);
    // The harness's worker shares the queue with its WORKER_FIT_CONCURRENCY slots (it was started with this
    // process's environment): one long fit more than it can hold must run on a worker of ours.
    const paths: string[] = [];
    for (let i = 0; i <= env.WORKER_FIT_CONCURRENCY; i++) {
      const launched = await team.editor.post(`${base()}/fits`, { ...longFit(datasetId, 4000), name: `long ${i}` });
      expect(launched.status).toBe(201);
      paths.push(`${base()}/fits/${(launched.body as { fitId: string }).fitId}/revisions/1`);
    }
    let victim: { path: string; runner: string } | undefined;
    const deadline = Date.now() + 15_000;
    while (!victim && Date.now() < deadline) {
      for (const path of paths) {
        const body = (await team.viewer.get(path)).body as RevisionBody;
        if (body.status === "running" && body.runner?.startsWith("test-worker-")) victim = { path, runner: body.runner };
      }
      if (!victim) await new Promise((resolve) => setTimeout(resolve, 200));
    }
    expect(victim, "one fit should run on a test worker").toBeDefined();
    const killed = workers.find((w, i) => ["test-worker-a", "test-worker-b"][i] === victim!.runner)!;
    await stopWorker(killed, "SIGKILL");
    // The other fits only filled the slots: cancel them to keep the machine free.
    for (const path of paths.filter((p) => p !== victim!.path)) expect((await team.editor.post(`${path}/cancel`)).status).toBe(200);
    // A replacement, as an operator would start; expiry = 4 s × 1.25 + 15 s margin, maintenance every 1 s.
    const replacement = startWorker("test-worker-c");
    workers.push(replacement);
    await workerReady(replacement);

    const ended = await waitForRevision(team.viewer, victim!.path, isFinal, 50_000);
    expect(ended.status).toBe("succeeded");
    expect(ended.attempts).toBe(2);
    expect(ended.runner).not.toBe(victim!.runner);
    const fitId = victim!.path.split("/fits/")[1].split("/")[0];
    expect(await countResiduals({ revisionId: await revisionRowId(fitId, 1) })).toBe(ended.result!.pointsUsed);
    for (const path of paths) await waitForRevision(team.viewer, path, isFinal, 10_000);
  }, 90_000);
});
