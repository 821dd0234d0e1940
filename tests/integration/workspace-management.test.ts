import { describe, expect, it } from "vitest";
import { getWorkspaceBySlug, listMembers, listPendingInvitations } from "@/db/queries/workspaces";
import { TestClient, testEmail } from "@/tests/support/client";
import { acceptInvitationFromMail, createTeam } from "@/tests/support/workspace";
import { createUploadTeam, fixtureBytes, fixtureMappings, upload } from "./datasets/helpers";

// Owners manage members and invitations (issue 2 §6): changing roles and removing members keep at least
// one owner even when two owners act at the same moment; a pending invitation can be withdrawn; the same
// address is never invited twice at once.

type Members = { members: Array<{ memberId: string; email: string; role: string }> };

async function membersOf(client: TestClient, slug: string) {
  return ((await client.get(`/api/workspaces/${slug}/members`)).body as Members).members;
}

async function emailOf(client: TestClient): Promise<string> {
  return ((await client.get("/api/auth/get-session")).body as { user: { email: string } }).user.email;
}

describe("members", () => {
  it("never demotes or removes the last owner", async () => {
    const team = await createTeam("Lone Owner Lab");
    const own = (await membersOf(team.owner, team.slug)).find((m) => m.role === "owner");
    const demoted = await team.owner.request("PATCH", `/api/workspaces/${team.slug}/members/${own?.memberId}`, { role: "viewer" });
    expect(demoted.status).toBe(409);
    expect(demoted.body).toMatchObject({ error: { code: "conflict", message: expect.stringMatching(/at least one owner/) } });
    const removed = await team.owner.request("DELETE", `/api/workspaces/${team.slug}/members/${own?.memberId}`);
    expect(removed.status).toBe(409);
    expect((await membersOf(team.owner, team.slug)).filter((m) => m.role === "owner")).toHaveLength(1);
  });

  it("keeps one owner when two owners demote each other at the same moment", async () => {
    const team = await createTeam("Two Owners Lab");
    const editorEmail = await emailOf(team.editor);
    const before = await membersOf(team.owner, team.slug);
    const first = before.find((m) => m.role === "owner");
    const second = before.find((m) => m.email === editorEmail);
    expect((await team.owner.request("PATCH", `/api/workspaces/${team.slug}/members/${second?.memberId}`, { role: "owner" })).status).toBe(200);

    const [a, b] = await Promise.all([
      team.owner.request("PATCH", `/api/workspaces/${team.slug}/members/${second?.memberId}`, { role: "viewer" }),
      team.editor.request("PATCH", `/api/workspaces/${team.slug}/members/${first?.memberId}`, { role: "viewer" }),
    ]);
    // One wins; the other is refused, either by the owner rule (409) or, if it came second, because its
    // caller is no longer an owner (403).
    expect([a.status, b.status].filter((status) => status === 200)).toHaveLength(1);
    expect([a.status, b.status].find((status) => status !== 200)).toBeOneOf([403, 409]);
    const workspace = await getWorkspaceBySlug(team.slug);
    const owners = (await listMembers(workspace?.id ?? "")).filter((m) => m.role === "owner");
    expect(owners).toHaveLength(1);
  });

  it("refuses a member id from another workspace with 404", async () => {
    const [one, other] = await Promise.all([createTeam("One Lab"), createTeam("Other Lab")]);
    const foreign = (await membersOf(other.owner, other.slug)).find((m) => m.role === "viewer");
    const response = await one.owner.request("DELETE", `/api/workspaces/${one.slug}/members/${foreign?.memberId}`);
    expect(response.status).toBe(404);
    expect(await membersOf(other.owner, other.slug)).toHaveLength(3);
  });
});

describe("invitations", () => {
  it("withdraws a pending invitation: its link stops working and the address can be invited again", async () => {
    const owner = new TestClient();
    await owner.newUser("withdrawer");
    const slug = ((await owner.post("/api/workspaces", { name: "Withdraw Lab" })).body as { slug: string }).slug;
    const invitee = new TestClient();
    const email = await invitee.newUser("mistyped");
    const invited = await owner.post(`/api/workspaces/${slug}/invitations`, { email, role: "editor" });
    const id = (invited.body as { id: string }).id;
    expect((await owner.post(`/api/workspaces/${slug}/invitations`, { email, role: "viewer" })).status).toBe(409);

    expect((await owner.request("DELETE", `/api/workspaces/${slug}/invitations/${id}`)).status).toBe(204);
    expect((await owner.request("DELETE", `/api/workspaces/${slug}/invitations/${id}`)).status).toBe(404);
    const accepted = await invitee.post("/api/auth/organization/accept-invitation", { invitationId: id });
    expect(accepted.status).toBeGreaterThanOrEqual(400);
    expect((await invitee.get(`/api/workspaces/${slug}`)).status).toBe(404);

    expect((await owner.post(`/api/workspaces/${slug}/invitations`, { email, role: "viewer" })).status).toBe(201);
    await acceptInvitationFromMail(invitee, email);
    expect((await invitee.get(`/api/workspaces/${slug}`)).body).toMatchObject({ role: "viewer" });
  });

  it("stores one invitation when the same address is invited twice at once", async () => {
    const owner = new TestClient();
    await owner.newUser("double");
    const slug = ((await owner.post("/api/workspaces", { name: "Double Invite Lab" })).body as { slug: string }).slug;
    const email = testEmail("twice");
    const responses = await Promise.all([
      owner.post(`/api/workspaces/${slug}/invitations`, { email, role: "viewer" }),
      owner.post(`/api/workspaces/${slug}/invitations`, { email, role: "editor" }),
    ]);
    expect(responses.map((r) => r.status).sort()).toEqual([201, 409]);
    const workspace = await getWorkspaceBySlug(slug);
    expect((await listPendingInvitations(workspace?.id ?? "")).filter((i) => i.email === email)).toHaveLength(1);
  });
});

describe("workspace home", () => {
  it("shows empty states in a new workspace and the newest datasets once there are some", async () => {
    const team = await createUploadTeam("Overview Lab");
    const empty = String((await team.viewer.get(`/w/${team.slug}`)).body);
    expect(empty).toContain("No datasets yet");
    expect(empty).toContain("No fits yet");

    const name = "hq12-photoemission-cuts.csv";
    const uploaded = await upload(team, { name, bytes: fixtureBytes(name) }, fixtureMappings[name]);
    expect(uploaded.status).toBe(201);
    const dataset = uploaded.body as { id: string; name: string };
    const home = String((await team.viewer.get(`/w/${team.slug}`)).body);
    expect(home).not.toContain("No datasets yet");
    expect(home).toContain("1 dataset, newest first.");
    expect(home).toContain(`/w/${team.slug}/datasets/${dataset.id}`);
    expect(home).toContain("No fits yet");
  });
});
