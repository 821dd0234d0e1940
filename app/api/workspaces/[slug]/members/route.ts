import { listMembers } from "@/db/queries/workspaces";
import { workspaceRoute } from "@/lib/server/route";

/** Members of the workspace: `{ members: [{ memberId, userId, name, email, role, joinedAt }] }`. */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access }) => ({
  members: await listMembers(access.workspace.id),
}));
