import { beforeAll, describe, expect, it } from "vitest";
import { countResiduals } from "@/db/queries/fit-residuals";
import { env } from "@/lib/env";
import { type Team, createTeam } from "@/tests/support/workspace";
import { type RevisionBody, honeycombDataset, insertAbandonedRevision, isFinal, waitForRevision } from "./helpers";

// A revision whose runner is gone (its heartbeat stopped) is handed back by the sweeper of any live
// worker, or ended by Cancel at once, long before its queue job would expire (issue 11).

let team: Team;
let fitId: string;
let inputs: unknown;
const base = () => `/api/workspaces/${team.slug}`;
const revisionPath = (number: number) => `${base()}/fits/${fitId}/revisions/${number}`;
const stale = env.FIT_HEARTBEAT_STALE_SECONDS;

beforeAll(async () => {
  team = await createTeam("Halvorsen Quantum Materials Lab");
  const datasetId = await honeycombDataset(team.slug);
  const launched = await team.editor.post(`${base()}/fits`, { datasetId, name: "graphene pz", model: { template: "honeycomb-pz" } });
  expect(launched.status).toBe(201);
  fitId = (launched.body as { fitId: string }).fitId;
  await waitForRevision(team.viewer, revisionPath(1), isFinal);
  inputs = ((await team.viewer.get(revisionPath(1))).body as { inputs: unknown }).inputs;
});

describe("a running revision whose heartbeat is stale", () => {
  it("goes back to the queue and a live worker finishes it, one attempt later", async () => {
    const revisionId = await insertAbandonedRevision({ fitId, number: 2, inputs, attempts: 1, heartbeatAgeSeconds: stale + 5 });
    // the sweep runs every few seconds; the re-sent job then takes about a second
    const ended = await waitForRevision(team.viewer, revisionPath(2), isFinal, 15_000);
    expect(ended.status).toBe("succeeded");
    expect(ended.attempts).toBe(2);
    expect(ended.runner).not.toBe("vanished-worker:1");
    expect(await countResiduals({ revisionId })).toBe(ended.result!.pointsUsed);
  });

  it("after its last attempt ends failed, with a reason that says so", async () => {
    await insertAbandonedRevision({ fitId, number: 3, inputs, attempts: 3, heartbeatAgeSeconds: stale + 5 });
    const ended = await waitForRevision(team.viewer, revisionPath(3), isFinal, 15_000);
    expect(ended.status).toBe("failed");
    expect(ended.failureReason).toBe(
      "The fit did not finish: 3 attempts ended without a result (the worker running it stopped or met an error). Launch a new revision to try again.",
    );
    expect(ended.result).toBeNull();
  });

  it("that was asked to cancel ends cancelled without a result", async () => {
    await insertAbandonedRevision({ fitId, number: 4, inputs, attempts: 1, heartbeatAgeSeconds: stale + 5, cancelRequested: true });
    const ended = await waitForRevision(team.viewer, revisionPath(4), isFinal, 15_000);
    expect(ended.status).toBe("cancelled");
    expect(ended.attempts).toBe(1);
    expect(ended.result).toBeNull();
  });
});

describe("Cancel", () => {
  it("ends a revision whose runner is gone at once, without a result", async () => {
    await insertAbandonedRevision({ fitId, number: 5, inputs, attempts: 1, heartbeatAgeSeconds: stale + 60 });
    const cancel = await team.editor.post(`${revisionPath(5)}/cancel`);
    expect(cancel.status).toBe(200);
    expect(cancel.body).toMatchObject({ status: "cancelled" });
    const body = (await team.viewer.get(revisionPath(5))).body as RevisionBody;
    expect(body.status).toBe("cancelled");
    expect(body.result).toBeNull();
  });

  it("leaves a revision whose runner is alive to that runner (its heartbeat is fresh)", async () => {
    await insertAbandonedRevision({ fitId, number: 6, inputs, attempts: 1, heartbeatAgeSeconds: 0 });
    const cancel = await team.editor.post(`${revisionPath(6)}/cancel`);
    expect(cancel.body).toMatchObject({ status: "running" });
    // Nobody beats for it, so the sweeper ends it once the heartbeat is stale: cancelled, as asked.
    const ended = await waitForRevision(team.viewer, revisionPath(6), isFinal, (stale + 10) * 1000);
    expect(ended.status).toBe("cancelled");
  }, 60_000);
});
