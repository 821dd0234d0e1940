import { requestCancel } from "@/db/queries/fits";
import { requireRevision } from "@/lib/server/fits/views";
import { workspaceRoute } from "@/lib/server/route";

/**
 * Cancels a revision (editor or owner): a queued one ends at once; a running one stops within a second
 * and keeps its best point. A final one is left as it is. → `{ status }` (the status after the request).
 */
export const POST = workspaceRoute({ minimumRole: "editor" }, async ({ access, params }) => {
  const details = await requireRevision(access.workspace.id, params);
  return { status: await requestCancel(details.revision.id) };
});
