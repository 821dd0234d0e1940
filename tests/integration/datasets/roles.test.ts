import { beforeAll, describe, expect, it } from "vitest";
import { createUploadTeam, fixtureBytes, fixtureMappings, storedRows, upload, type UploadTeam } from "./helpers";

// Role rule of DESIGN.md "Workspaces" and issue 7 §3: viewers read everything and change nothing (403);
// non-members get 404 (existence not leaked); signed out 401.

const fixture = "hq07-honeycomb-monolayer-dft.csv";
let team: UploadTeam;
let id: string;
beforeAll(async () => {
  team = await createUploadTeam("Roles Datasets Lab");
  const response = await upload(team, { name: fixture, bytes: fixtureBytes(fixture) }, fixtureMappings[fixture]);
  id = (response.body as { id: string }).id;
});

type Caller = "owner" | "editor" | "viewer" | "outsider" | "anonymous";
const callers: Caller[] = ["owner", "editor", "viewer", "outsider", "anonymous"];

const reads = ["", "/{id}", "/{id}/points", "/{id}/file"];

describe("dataset routes by role", () => {
  for (const suffix of reads)
    it(`GET datasets${suffix}: members 200, non-member 404, signed out 401`, async () => {
      const expected: Record<Caller, number> = { owner: 200, editor: 200, viewer: 200, outsider: 404, anonymous: 401 };
      for (const caller of callers) {
        const response = await team[caller].get(`/api/workspaces/${team.slug}/datasets${suffix.replace("{id}", id)}`);
        expect([caller, response.status]).toEqual([caller, expected[caller]]);
      }
    });

  it("refuses uploads, renames and deletes by a viewer (403), a non-member (404) and the signed out (401)", async () => {
    const before = await storedRows(team);
    for (const [caller, status] of [["viewer", 403], ["outsider", 404], ["anonymous", 401]] as const) {
      const client = team[caller];
      expect((await client.post(`/api/workspaces/${team.slug}/datasets`, {})).status).toBe(status);
      expect((await client.request("PATCH", `/api/workspaces/${team.slug}/datasets/${id}`, { name: "mine now" })).status).toBe(status);
      expect((await client.request("DELETE", `/api/workspaces/${team.slug}/datasets/${id}`)).status).toBe(status);
    }
    expect(await storedRows(team)).toEqual(before);
    const dataset = await team.owner.get(`/api/workspaces/${team.slug}/datasets/${id}`);
    expect(dataset.body).toMatchObject({ dataset: { name: fixtureMappings[fixture].name } });
  });

  it("answers 404 for another workspace's dataset id and for a malformed id", async () => {
    const other = await createUploadTeam("Other Datasets Lab");
    expect((await other.owner.get(`/api/workspaces/${other.slug}/datasets/${id}`)).status).toBe(404);
    expect((await other.owner.get(`/api/workspaces/${other.slug}/datasets/not-an-id`)).status).toBe(404);
    expect((await other.editor.request("DELETE", `/api/workspaces/${other.slug}/datasets/${id}`)).status).toBe(404);
  });

  it("lets the owner delete too", async () => {
    expect((await team.owner.request("DELETE", `/api/workspaces/${team.slug}/datasets/${id}`)).status).toBe(204);
  });
});
