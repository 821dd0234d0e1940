import { requireFit } from "@/lib/server/fits/views";
import { workspaceRoute } from "@/lib/server/route";

/** One fit with its revisions (summaries, oldest first). */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access, params }) => ({
  fit: await requireFit(access.workspace.id, params.fitId),
}));
