import { z } from "zod";
import { workspaceRoleSchema } from "@/lib/schemas/workspaces";
import { workspaceRoute } from "@/lib/server/route";
import { changeMemberRole, removeMember } from "@/lib/server/workspaces";

/** Changes a member's role (owners only): `{ "role" }` → `{ memberId, role }`; 409 if no owner would remain. */
export const PATCH = workspaceRoute(
  { minimumRole: "owner", input: z.object({ role: workspaceRoleSchema }) },
  async ({ access, input, params }) => {
    await changeMemberRole(access, { memberId: params.memberId, role: input.role });
    return { memberId: params.memberId, role: input.role };
  },
);

/** Removes a member (owners only) → 204; 409 for the last owner, 404 for a member of another workspace. */
export const DELETE = workspaceRoute({ minimumRole: "owner" }, async ({ access, params }) => {
  await removeMember(access, { memberId: params.memberId });
  return new Response(null, { status: 204 });
});
