import { describe, expect, it } from "vitest";
import { getWorkspaceBySlug, listMembers, listPendingInvitations } from "@/db/queries/workspaces";
import { TestClient } from "@/tests/support/client";
import { linkIn, waitForMail } from "@/tests/support/mail";

// Invitation round trip through the SMTP sink (issue 2 §6 and "What must be tested").

describe("invitations", () => {
  it("mails a link that the invitee follows to join with the invited role", async () => {
    const owner = new TestClient();
    await owner.newUser("inviter");
    const slug = ((await owner.post("/api/workspaces", { name: "Round Trip Lab" })).body as { slug: string }).slug;

    const invitee = new TestClient();
    const email = await invitee.newUser("invitee");
    const invited = await owner.post(`/api/workspaces/${slug}/invitations`, { email: email.toUpperCase(), role: "editor" });
    expect(invited.status).toBe(201);
    expect(invited.body).toMatchObject({ email, role: "editor" });

    const mail = await waitForMail(email);
    expect(mail.subject).toContain("Round Trip Lab");
    const link = linkIn(mail, `${owner.baseUrl}/invitations/`);
    const invitationId = decodeURIComponent(link.split("/invitations/")[1]);
    expect(invitationId).toBe((invited.body as { id: string }).id);

    expect((await invitee.get(`/api/workspaces/${slug}`)).status).toBe(404);
    const accepted = await invitee.post("/api/auth/organization/accept-invitation", { invitationId });
    expect(accepted.status).toBe(200);
    const seen = await invitee.get(`/api/workspaces/${slug}`);
    expect(seen.body).toMatchObject({ slug, name: "Round Trip Lab", role: "editor" });

    const workspace = await getWorkspaceBySlug(slug);
    expect(await listPendingInvitations(workspace?.id ?? "")).toEqual([]);
    const members = await listMembers(workspace?.id ?? "");
    expect(members.map((m) => [m.email, m.role])).toContainEqual([email, "editor"]);
  });

  it("does not let someone else accept an invitation meant for another address", async () => {
    const owner = new TestClient();
    await owner.newUser("inviter");
    const slug = ((await owner.post("/api/workspaces", { name: "Guarded Lab" })).body as { slug: string }).slug;
    const intended = await new TestClient().newUser("intended");
    const invited = await owner.post(`/api/workspaces/${slug}/invitations`, { email: intended, role: "viewer" });
    const interloper = new TestClient();
    await interloper.newUser("interloper");
    const accepted = await interloper.post("/api/auth/organization/accept-invitation", {
      invitationId: (invited.body as { id: string }).id,
    });
    expect(accepted.status).toBe(403);
    expect((await interloper.get(`/api/workspaces/${slug}`)).status).toBe(404);
  });

  it("refuses a second invitation to a pending address and to an existing member", async () => {
    const owner = new TestClient();
    const ownerEmail = await owner.newUser("inviter");
    const slug = ((await owner.post("/api/workspaces", { name: "Twice Lab" })).body as { slug: string }).slug;
    const email = await new TestClient().newUser("twice");
    expect((await owner.post(`/api/workspaces/${slug}/invitations`, { email, role: "viewer" })).status).toBe(201);
    const again = await owner.post(`/api/workspaces/${slug}/invitations`, { email, role: "editor" });
    expect(again.status).toBe(409);
    const self = await owner.post(`/api/workspaces/${slug}/invitations`, { email: ownerEmail, role: "viewer" });
    expect(self.status).toBe(409);
    expect(self.body).toMatchObject({ error: { code: "conflict", message: expect.stringContaining("already a member") } });
  });
});
