import { beforeAll, describe, expect, it } from "vitest";
import { createTeam, type Team } from "@/tests/support/workspace";
import { getWorkspaceBySlug, listPendingInvitations } from "@/db/queries/workspaces";
import { testEmail } from "@/tests/support/client";

// The role matrix of issue 2: owner, editor, viewer, non-member and signed-out against every workspace
// route. Expected statuses follow the product rule (DESIGN.md "Workspaces"; issue 2 §6): non-member → 404
// (existence not leaked), below the role → 403, signed out → 401.

type Caller = "owner" | "editor" | "viewer" | "outsider" | "anonymous";
const callers: Caller[] = ["owner", "editor", "viewer", "outsider", "anonymous"];

let team: Team;
beforeAll(async () => {
  team = await createTeam();
});

const matrix: Array<{ route: string; method: "GET" | "POST"; body?: () => unknown; expected: Record<Caller, number> }> = [
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
];

describe("role matrix", () => {
  for (const row of matrix) {
    for (const caller of callers) {
      it(`${row.method} ${row.route} as ${caller} → ${row.expected[caller]}`, async () => {
        const path = row.route.replace("{slug}", team.slug);
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

  it("refuses better-auth's stock role names on its own invite endpoint, storing nothing", async () => {
    const workspace = await getWorkspaceBySlug(team.slug);
    const email = testEmail("admin");
    const response = await team.owner.post("/api/auth/organization/invite-member", {
      email,
      role: "admin",
      organizationId: workspace?.id,
    });
    expect(response.status).toBe(400);
    expect(JSON.stringify(response.body)).toContain("Unknown role: admin");
    const pending = await listPendingInvitations(workspace?.id ?? "");
    expect(pending.map((invitation) => invitation.email)).not.toContain(email);
  });
});
