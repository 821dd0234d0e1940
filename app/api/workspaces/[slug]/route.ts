import { workspaceRoute } from "@/lib/server/route";

/** One workspace and the caller's role in it: `{ slug, name, role }`. */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access }) => ({
  slug: access.workspace.slug,
  name: access.workspace.name,
  role: access.role,
}));
