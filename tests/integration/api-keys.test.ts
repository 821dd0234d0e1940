import { execFile } from "node:child_process";
import { promisify } from "node:util";
import { beforeAll, describe, expect, it } from "vitest";
import { TestClient } from "@/tests/support/client";
import { createTeam, type Team } from "@/tests/support/workspace";

// API keys made in the browser (issue 18 item 1). The rules under test: a key's role is at most its
// creator's; a key acts with the lower of its role and its user's current role; only a browser session
// manages keys; a key reaches its own workspace only; the creator or an owner revokes.

type Member = "owner" | "editor" | "viewer";
type CreatedKey = { id: string; key: string; prefix: string; label: string; role: Member };

let team: Team;
const keysPath = () => `/api/workspaces/${team.slug}/api-keys`;

async function createKey(client: TestClient, role: Member, label = `${role} key`): Promise<CreatedKey> {
  const created = await client.post(keysPath(), { label, role });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  return created.body as CreatedKey;
}

/** The role a key acts with, as GET …/{slug} reports it. */
async function actingRole(key: string, slug = team.slug): Promise<unknown> {
  const answer = await TestClient.withApiKey(key).get(`/api/workspaces/${slug}`);
  return answer.status === 200 ? (answer.body as { role: string }).role : answer.status;
}

beforeAll(async () => {
  team = await createTeam("Halvorsen Scripting Lab");
});

describe("creating keys", () => {
  // Expected: a role up to the creator's own → 201; above it → 403; non-member → 404; signed out → 401.
  const matrix: Record<Member | "outsider" | "anonymous", Record<Member, number>> = {
    owner: { owner: 201, editor: 201, viewer: 201 },
    editor: { owner: 403, editor: 201, viewer: 201 },
    viewer: { owner: 403, editor: 403, viewer: 201 },
    outsider: { owner: 404, editor: 404, viewer: 404 },
    anonymous: { owner: 401, editor: 401, viewer: 401 },
  };
  for (const [caller, expected] of Object.entries(matrix) as [keyof typeof matrix, Record<Member, number>][]) {
    for (const [role, status] of Object.entries(expected) as [Member, number][]) {
      it(`${caller} asking for a ${role} key → ${status}`, async () => {
        const answer = await team[caller].post(keysPath(), { label: `${caller} wants ${role}`, role });
        expect(answer.status, JSON.stringify(answer.body)).toBe(status);
        if (status === 201) {
          const created = answer.body as CreatedKey;
          expect(created).toMatchObject({ role, label: `${caller} wants ${role}` });
          expect(created.key.startsWith(created.prefix)).toBe(true);
          expect(created.key).toMatch(/^bw_[A-Za-z0-9_-]{43}$/);
          expect(await actingRole(created.key)).toBe(role);
        }
      });
    }
  }

  it("refuses a missing name or an unknown role beside the field (422) and stores nothing", async () => {
    const before = ((await team.viewer.get(keysPath())).body as { apiKeys: unknown[] }).apiKeys.length;
    const blank = await team.viewer.post(keysPath(), { label: "  ", role: "viewer" });
    expect(blank.status).toBe(422);
    expect(blank.body).toMatchObject({ error: { issues: { label: [expect.stringContaining("Name the key")] } } });
    const unknownRole = await team.viewer.post(keysPath(), { label: "x", role: "admin" });
    expect(unknownRole.status).toBe(422);
    expect(unknownRole.body).toMatchObject({ error: { issues: { role: [expect.any(String)] } } });
    expect(((await team.viewer.get(keysPath())).body as { apiKeys: unknown[] }).apiKeys).toHaveLength(before);
  });
});

describe("what a key may do", () => {
  it("is limited to the key's own role, below its user's", async () => {
    const viewerKeyOfOwner = TestClient.withApiKey((await createKey(team.owner, "viewer")).key);
    const editorKeyOfOwner = TestClient.withApiKey((await createKey(team.owner, "editor")).key);
    // Reading datasets needs a viewer: both keys may.
    expect((await viewerKeyOfOwner.get(`/api/workspaces/${team.slug}/datasets`)).status).toBe(200);
    // Launching a fit needs an editor: the viewer key is refused before its body is read (403); the editor
    // key passes the role check and meets the body's validation (422 for an empty body).
    expect((await viewerKeyOfOwner.post(`/api/workspaces/${team.slug}/fits`, {})).status).toBe(403);
    expect((await editorKeyOfOwner.post(`/api/workspaces/${team.slug}/fits`, {})).status).toBe(422);
    // Inviting needs an owner: an owner's editor key may not.
    expect((await editorKeyOfOwner.post(`/api/workspaces/${team.slug}/invitations`, { email: "someone@halvorsen-lab.example", role: "viewer" })).status).toBe(403);
    const listed = (await viewerKeyOfOwner.get("/api/workspaces")).body as { workspaces: { slug: string; role: string }[] };
    expect(listed.workspaces).toEqual([expect.objectContaining({ slug: team.slug, role: "viewer" })]);
  });

  it("is demoted with its user: the lower of the key's role and the user's current role", async () => {
    const spare = await createTeam("Halvorsen Demotion Lab");
    const key = (await spare.editor.post(`/api/workspaces/${spare.slug}/api-keys`, { label: "editor notebook", role: "editor" })).body as CreatedKey;
    expect(await actingRole(key.key, spare.slug)).toBe("editor");
    const members = (await spare.owner.get(`/api/workspaces/${spare.slug}/members`)).body as { members: { memberId: string; role: string }[] };
    const editorId = members.members.find((m) => m.role === "editor")!.memberId;
    expect((await spare.owner.request("PATCH", `/api/workspaces/${spare.slug}/members/${editorId}`, { role: "viewer" })).status).toBe(200);
    expect(await actingRole(key.key, spare.slug)).toBe("viewer");
    expect((await TestClient.withApiKey(key.key).post(`/api/workspaces/${spare.slug}/fits`, {})).status).toBe(403);
    // Removed from the workspace, the key reaches nothing there (404, as for any non-member).
    expect((await spare.owner.request("DELETE", `/api/workspaces/${spare.slug}/members/${editorId}`)).status).toBe(204);
    expect(await actingRole(key.key, spare.slug)).toBe(404);
  });

  it("cannot list, create or revoke keys (403), not even its own", async () => {
    const created = await createKey(team.owner, "owner", "owner script");
    const script = TestClient.withApiKey(created.key);
    expect((await script.get(keysPath())).status).toBe(403);
    expect((await script.post(keysPath(), { label: "minted by a key", role: "viewer" })).status).toBe(403);
    expect((await script.request("DELETE", `${keysPath()}/${created.id}`)).status).toBe(403);
    expect(await actingRole(created.key)).toBe("owner");
  });

  it("of another workspace answers 404 here, for keys and data alike", async () => {
    const other = await createTeam("Halvorsen Other Lab");
    const foreign = (await other.owner.post(`/api/workspaces/${other.slug}/api-keys`, { label: "other lab", role: "owner" })).body as CreatedKey;
    const script = TestClient.withApiKey(foreign.key);
    expect((await script.get(`/api/workspaces/${team.slug}/datasets`)).status).toBe(404);
    expect((await script.get(keysPath())).status).toBe(404);
    expect((await script.post(keysPath(), { label: "x", role: "viewer" })).status).toBe(404);
    // …and a session of this workspace cannot revoke the other workspace's key through this one (404).
    expect((await team.owner.request("DELETE", `${keysPath()}/${foreign.id}`)).status).toBe(404);
    expect(await actingRole(foreign.key, other.slug)).toBe("owner");
  });
});

describe("listing and revoking", () => {
  it("lists an owner every key, anyone else their own, without hashes; last use is recorded", async () => {
    const editorKey = await createKey(team.editor, "editor", "editor listing key");
    const viewerKey = await createKey(team.viewer, "viewer", "viewer listing key");
    await TestClient.withApiKey(viewerKey.key).get(`/api/workspaces/${team.slug}`);
    type Listed = { id: string; label: string; prefix: string; role: string; creatorName: string; createdByYou: boolean; lastUsedAt: string | null };
    const byOwner = ((await team.owner.get(keysPath())).body as { apiKeys: Listed[] }).apiKeys;
    const byEditor = ((await team.editor.get(keysPath())).body as { apiKeys: Listed[] }).apiKeys;
    expect(byOwner.map((k) => k.id)).toEqual(expect.arrayContaining([editorKey.id, viewerKey.id]));
    expect(byEditor.map((k) => k.id)).toContain(editorKey.id);
    expect(byEditor.map((k) => k.id)).not.toContain(viewerKey.id);
    expect(byEditor.every((k) => k.createdByYou)).toBe(true);
    const listedViewerKey = byOwner.find((k) => k.id === viewerKey.id)!;
    expect(listedViewerKey).toMatchObject({ label: "viewer listing key", prefix: viewerKey.prefix, role: "viewer", createdByYou: false, creatorName: "Test viewer" });
    expect(listedViewerKey.lastUsedAt).not.toBeNull();
    expect(byOwner.find((k) => k.id === editorKey.id)!.lastUsedAt).toBeNull();
    const text = JSON.stringify(byOwner);
    expect(text).not.toContain(viewerKey.key);
    expect(text).not.toMatch(/hash/i);
  });

  it("lets the creator revoke, an owner revoke anyone's, and no one else; a revoked key gets 401", async () => {
    const editorKey = await createKey(team.editor, "viewer", "to be revoked by its creator");
    const viewerKey = await createKey(team.viewer, "viewer", "to be revoked by an owner");
    // A colleague who is not an owner does not see the key, so for them it does not exist (404).
    expect((await team.viewer.request("DELETE", `${keysPath()}/${editorKey.id}`)).status).toBe(404);
    expect((await team.outsider.request("DELETE", `${keysPath()}/${editorKey.id}`)).status).toBe(404);
    expect((await team.anonymous.request("DELETE", `${keysPath()}/${editorKey.id}`)).status).toBe(401);
    expect(await actingRole(editorKey.key)).toBe("viewer");

    expect((await team.editor.request("DELETE", `${keysPath()}/${editorKey.id}`)).status).toBe(204);
    expect((await team.owner.request("DELETE", `${keysPath()}/${viewerKey.id}`)).status).toBe(204);
    for (const revoked of [editorKey, viewerKey]) {
      const answer = await TestClient.withApiKey(revoked.key).get(`/api/workspaces/${team.slug}/datasets`);
      expect(answer.status).toBe(401);
      expect(answer.body).toMatchObject({ error: { code: "unauthenticated" } });
    }
    expect((await team.editor.request("DELETE", `${keysPath()}/${editorKey.id}`)).status).toBe(404);
  });
});

describe("npm run api-key (operators)", () => {
  const run = promisify(execFile);
  const cli = (...args: string[]) => run("node_modules/.bin/tsx", ["scripts/create-api-key.ts", ...args], { env: process.env });

  it("takes an optional role, and refuses one above the member's", async () => {
    const members = (await team.owner.get(`/api/workspaces/${team.slug}/members`)).body as { members: { email: string; role: string }[] };
    const editorEmail = members.members.find((m) => m.role === "editor")!.email;
    const printed = await cli(editorEmail, team.slug, "operator key", "viewer");
    const key = printed.stdout.trim();
    expect(await actingRole(key)).toBe("viewer");
    const defaulted = await cli(editorEmail, team.slug);
    expect(await actingRole(defaulted.stdout.trim())).toBe("editor");
    await expect(cli(editorEmail, team.slug, "too much", "owner")).rejects.toMatchObject({ code: 1, stderr: expect.stringContaining("cannot be above your own") });
    await expect(cli(editorEmail, team.slug, "bad role", "admin")).rejects.toMatchObject({ code: 2 });
  });
});
