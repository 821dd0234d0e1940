import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { getFit, listFits } from "@/db/queries/fits";
import { getWorkspaceBySlug } from "@/db/queries/workspaces";
import { type Team, createTeam } from "@/tests/support/workspace";
import { type RevisionBody, honeycombDataset, isFinal, waitForRevision } from "./helpers";

// A revision and its queue job are created together or not at all, and the time limit the launch accepts
// is one the queue accepts too (issue 11).

let team: Team;
let datasetId: string;
let workspaceId: string;
const base = () => `/api/workspaces/${team.slug}`;
const launch = (extra: Record<string, unknown>) => ({ datasetId, name: "graphene pz", model: { template: "honeycomb-pz" }, ...extra });

// pg-boss keeps jobs in pgboss.job; this trigger makes it refuse the jobs of fits whose notes carry the
// marker, as a queue that fails mid-send would (the error reaches the app from inside pg-boss's send).
const marker = "queue-refuses-this-fit";

beforeAll(async () => {
  team = await createTeam("Halvorsen Quantum Materials Lab");
  datasetId = await honeycombDataset(team.slug);
  workspaceId = (await getWorkspaceBySlug(team.slug))!.id;
  await db.execute(sql`
    create or replace function test_refuse_marked_fit_job() returns trigger language plpgsql as $$
    begin
      if new.name = 'fit-revision' and exists (
        select 1 from fit_revision r join fit f on f.id = r.fit_id where r.id = new.data->>'revisionId' and f.notes = ${sql.raw(`'${marker}'`)}
      ) then
        raise exception 'simulated queue failure';
      end if;
      return new;
    end $$`);
  await db.execute(sql`create trigger test_refuse_marked_fit_job before insert on pgboss.job for each row execute function test_refuse_marked_fit_job()`);
});

afterAll(async () => {
  await db.execute(sql`drop trigger if exists test_refuse_marked_fit_job on pgboss.job`);
  await db.execute(sql`drop function if exists test_refuse_marked_fit_job()`);
});

describe("the time limit", () => {
  it.each([68_400_001, 69_107_201, 86_400_000])("%d ms is refused with 422 naming the maximum", async (timeLimitMs) => {
    const before = (await listFits({ workspaceId })).length;
    const response = await team.editor.post(`${base()}/fits`, launch({ options: { timeLimitMs } }));
    expect(response.status).toBe(422);
    expect((response.body as { error: { message: string } }).error.message).toBe("at most 68 400 000 ms (19 h)");
    expect((await listFits({ workspaceId })).length).toBe(before);
  });

  it("the maximum, 68 400 000 ms, is accepted and its job queued", async () => {
    const response = await team.editor.post(`${base()}/fits`, launch({ name: "nineteen hours", options: { timeLimitMs: 68_400_000 } }));
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    const path = `${base()}/fits/${(response.body as { fitId: string }).fitId}/revisions/1`;
    // the honeycomb fit converges long before its limit
    expect((await waitForRevision(team.viewer, path, isFinal)).status).toBe("succeeded");
  });
});

describe("a queue that fails while the job is sent", () => {
  it("leaves no fit and no revision behind a launch (503)", async () => {
    const before = (await listFits({ workspaceId })).length;
    const response = await team.editor.post(`${base()}/fits`, launch({ name: "refused launch", notes: marker }));
    expect(response.status).toBe(503);
    expect((response.body as { error: { message: string } }).error.message).toBe("The job queue did not accept the fit; try again.");
    expect((await listFits({ workspaceId })).length).toBe(before);
  });

  it("leaves no revision behind a new revision (503)", async () => {
    const first = await team.editor.post(`${base()}/fits`, launch({ name: "base fit" }));
    expect(first.status).toBe(201);
    const fitId = (first.body as { fitId: string }).fitId;
    const ended = await waitForRevision(team.viewer, `${base()}/fits/${fitId}/revisions/1`, isFinal);
    expect(ended.status).toBe("succeeded");
    await db.execute(sql`update fit set notes = ${marker} where id = ${fitId}`);

    const response = await team.editor.post(`${base()}/fits/${fitId}/revisions`, { from: 1 });
    expect(response.status).toBe(503);
    const fit = await getFit({ workspaceId, fitId });
    expect(fit!.revisions.map((r) => [r.number, r.status])).toEqual([[1, "succeeded"]]);
    expect((await team.viewer.get(`${base()}/fits/${fitId}/revisions/2`)).status).toBe(404);
    const revision1 = (await team.viewer.get(`${base()}/fits/${fitId}/revisions/1`)).body as RevisionBody;
    expect(revision1.status).toBe("succeeded");
  });
});
