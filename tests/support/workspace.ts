import { TestClient } from "./client";
import { linkIn, waitForMail } from "./mail";

export type Team = {
  slug: string;
  owner: TestClient;
  editor: TestClient;
  viewer: TestClient;
  outsider: TestClient;
  anonymous: TestClient;
};

/** Accepts an invitation the way the invitation page's action does (better-auth's endpoint). */
export async function acceptInvitationFromMail(client: TestClient, email: string): Promise<void> {
  const mail = await waitForMail(email);
  const link = linkIn(mail, `${client.baseUrl}/invitations/`);
  const invitationId = decodeURIComponent(link.split("/invitations/")[1]);
  const accepted = await client.post("/api/auth/organization/accept-invitation", { invitationId });
  if (accepted.status !== 200) throw new Error(`accept failed: ${accepted.status} ${JSON.stringify(accepted.body)}`);
}

/** A workspace with one member per role (joined through real invitations), a non-member and a signed-out client. */
export async function createTeam(name = "Matrix Lab"): Promise<Team> {
  const owner = new TestClient();
  await owner.newUser("owner");
  const created = await owner.post("/api/workspaces", { name });
  if (created.status !== 201) throw new Error(`create failed: ${created.status} ${JSON.stringify(created.body)}`);
  const slug = (created.body as { slug: string }).slug;

  const members: Record<"editor" | "viewer", TestClient> = { editor: new TestClient(), viewer: new TestClient() };
  for (const role of ["editor", "viewer"] as const) {
    const email = await members[role].newUser(role);
    const invited = await owner.post(`/api/workspaces/${slug}/invitations`, { email, role });
    if (invited.status !== 201) throw new Error(`invite failed: ${invited.status} ${JSON.stringify(invited.body)}`);
    await acceptInvitationFromMail(members[role], email);
  }

  const outsider = new TestClient();
  await outsider.newUser("outsider");
  return { slug, owner, editor: members.editor, viewer: members.viewer, outsider, anonymous: new TestClient() };
}
