import { beforeAll, describe, expect, it } from "vitest";
import { acceptInvitationFromMail, createTeam, type Team } from "@/tests/support/workspace";
import { testEmail, TestClient } from "@/tests/support/client";

// The role matrix of issue 2: owner, editor, viewer, non-member and signed-out against every workspace
// route. Expected statuses follow the product rule (DESIGN.md "Workspaces"; issue 2 §6): non-member → 404
// (existence not leaked), below the role → 403, signed out → 401.

type Caller = "owner" | "editor" | "viewer" | "outsider" | "anonymous";
const callers: Caller[] = ["owner", "editor", "viewer", "outsider", "anonymous"];

let team: Team;
/** Targets of the per-member and per-invitation routes: the viewer, a spare member and a pending invitation. */
const targets = { viewerMemberId: "", spareMemberId: "", invitationId: "" };

async function memberIdOf(email: string): Promise<string> {
  const listed = await team.owner.get(`/api/workspaces/${team.slug}/members`);
  const found = (listed.body as { members: Array<{ memberId: string; email: string }> }).members.find((m) => m.email === email);
  if (!found) throw new Error(`${email} is not a member`);
  return found.memberId;
}

beforeAll(async () => {
  team = await createTeam();
  const viewerSession = await team.viewer.get("/api/auth/get-session");
  targets.viewerMemberId = await memberIdOf((viewerSession.body as { user: { email: string } }).user.email);
  const spare = new TestClient();
  const spareEmail = await spare.newUser("spare");
  await team.owner.post(`/api/workspaces/${team.slug}/invitations`, { email: spareEmail, role: "viewer" });
  await acceptInvitationFromMail(spare, spareEmail);
  targets.spareMemberId = await memberIdOf(spareEmail);
  const pending = await team.owner.post(`/api/workspaces/${team.slug}/invitations`, { email: testEmail("pending"), role: "editor" });
  targets.invitationId = (pending.body as { id: string }).id;
});

// The owner's row runs first (callers are in that order): the others are refused on their role before the
// target is even looked up, so a target the owner already removed does not change their answer.
const matrix: Array<{ route: string; method: "GET" | "POST" | "PATCH" | "DELETE"; body?: () => unknown; expected: Record<Caller, number> }> = [
  {
    route: "/api/workspaces",
    method: "GET",
    expected: { owner: 200, editor: 200, viewer: 200, outsider: 200, anonymous: 401 },
  },
  {
    route: "/api/workspaces",
    method: "POST",
    body: () => ({ name: "Another lab" }),
    expected: { owner: 201, editor: 201, viewer: 201, outsider: 201, anonymous: 401 },
  },
  {
    route: "/api/workspaces/{slug}",
    method: "GET",
    expected: { owner: 200, editor: 200, viewer: 200, outsider: 404, anonymous: 401 },
  },
  {
    route: "/api/workspaces/{slug}/members",
    method: "GET",
    expected: { owner: 200, editor: 200, viewer: 200, outsider: 404, anonymous: 401 },
  },
  {
    route: "/api/workspaces/{slug}/invitations",
    method: "POST",
    body: () => ({ email: testEmail("invitee"), role: "viewer" }),
    expected: { owner: 201, editor: 403, viewer: 403, outsider: 404, anonymous: 401 },
  },
  {
    route: "/api/workspaces/{slug}/members/{viewerMemberId}",
    method: "PATCH",
    body: () => ({ role: "viewer" }),
    expected: { owner: 200, editor: 403, viewer: 403, outsider: 404, anonymous: 401 },
  },
  {
    route: "/api/workspaces/{slug}/members/{spareMemberId}",
    method: "DELETE",
    expected: { owner: 204, editor: 403, viewer: 403, outsider: 404, anonymous: 401 },
  },
  {
    route: "/api/workspaces/{slug}/invitations/{invitationId}",
    method: "DELETE",
    expected: { owner: 204, editor: 403, viewer: 403, outsider: 404, anonymous: 401 },
  },
];

const pathOf = (route: string) =>
  route
    .replace("{slug}", team.slug)
    .replace("{viewerMemberId}", targets.viewerMemberId)
    .replace("{spareMemberId}", targets.spareMemberId)
    .replace("{invitationId}", targets.invitationId);

describe("role matrix", () => {
  for (const row of matrix) {
    for (const caller of callers) {
      it(`${row.method} ${row.route} as ${caller} → ${row.expected[caller]}`, async () => {
        const path = pathOf(row.route);
        const response = await team[caller].request(row.method, path, row.body?.());
        expect(response.status).toBe(row.expected[caller]);
        if (response.status >= 400) {
          expect(response.body).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
        }
      });
    }
  }

  it("reports each member's own role and lists all three members", async () => {
    for (const role of ["owner", "editor", "viewer"] as const) {
      const response = await team[role].get(`/api/workspaces/${team.slug}`);
      expect(response.body).toMatchObject({ slug: team.slug, role });
    }
    const members = await team.viewer.get(`/api/workspaces/${team.slug}/members`);
    const roles = (members.body as { members: Array<{ role: string }> }).members.map((m) => m.role).sort();
    expect(roles).toEqual(["editor", "owner", "viewer"]);
  });

  it("gives a non-member the same 404 for an existing and a missing workspace", async () => {
    const existing = await team.outsider.get(`/api/workspaces/${team.slug}`);
    const missing = await team.outsider.get("/api/workspaces/no-such-workspace-0000");
    expect(existing.status).toBe(404);
    expect(missing.body).toEqual(existing.body);
  });

  it("leaves the team's workspace out of an outsider's list", async () => {
    const listed = await team.outsider.get("/api/workspaces");
    const slugs = (listed.body as { workspaces: Array<{ slug: string }> }).workspaces.map((w) => w.slug);
    expect(slugs).not.toContain(team.slug);
    const own = await team.viewer.get("/api/workspaces");
    expect((own.body as { workspaces: Array<{ slug: string }> }).workspaces.map((w) => w.slug)).toContain(team.slug);
  });

  it("answers 404 on better-auth's organization endpoints, which would reveal a workspace or skip our rules", async () => {
    const probes = [
      team.outsider.post("/api/auth/organization/check-slug", { slug: team.slug }),
      team.outsider.get(`/api/auth/organization/get-full-organization?organizationSlug=${team.slug}`),
      team.owner.post("/api/auth/organization/create", { name: "x".repeat(500), slug: "too-long-name-lab" }),
      team.owner.post("/api/auth/organization/invite-member", { email: testEmail("admin"), role: "admin" }),
      team.owner.post("/api/auth/organization/update-member-role", { memberId: targets.viewerMemberId, role: "owner" }),
    ];
    for (const response of await Promise.all(probes)) expect(response.status).toBe(404);
  });
});

// Pages use the same rule: statuses are real HTTP statuses (no loading.tsx streams a 200 first).
describe("page guards", () => {
  const pages: Array<{ path: string; expected: Record<Caller, number> }> = [
    { path: "/w/{slug}", expected: { owner: 200, editor: 200, viewer: 200, outsider: 404, anonymous: 307 } },
    { path: "/w/{slug}/members", expected: { owner: 200, editor: 200, viewer: 200, outsider: 404, anonymous: 307 } },
    { path: "/w/{slug}/datasets/new", expected: { owner: 200, editor: 200, viewer: 403, outsider: 404, anonymous: 307 } },
  ];
  for (const page of pages) {
    for (const caller of callers) {
      it(`GET ${page.path} as ${caller} → ${page.expected[caller]}`, async () => {
        const response = await team[caller].get(page.path.replace("{slug}", team.slug));
        expect(response.status).toBe(page.expected[caller]);
      });
    }
  }

  it("sends a signed-out visitor to sign in and back to the page they asked for", async () => {
    const response = await team.anonymous.get(`/w/${team.slug}/members`);
    expect(response.headers.get("location")).toBe(`/sign-in?next=${encodeURIComponent(`/w/${team.slug}/members`)}`);
  });

  it("tells a viewer on an editor's page which roles it needs", async () => {
    const response = await team.viewer.get(`/w/${team.slug}/datasets/new`);
    expect(String(response.body)).toContain("Your role does not allow this page");
  });
});
