import { requestCancel } from "@/db/queries/fits";
import { env } from "@/lib/env";
import { requireRevision } from "@/lib/server/fits/views";
import { workspaceRoute } from "@/lib/server/route";

/**
 * Cancels a revision (editor or owner): a queued one ends at once; a running one stops within a second
 * and keeps its best point, or, when its runner is gone (stale heartbeat), ends at once without a result.
 * A final one is left as it is. → `{ status }` (the status after the request).
 */
export const POST = workspaceRoute({ minimumRole: "editor" }, async ({ access, params }) => {
  const details = await requireRevision(access.workspace.id, params);
  return { status: await requestCancel({ revisionId: details.revision.id, staleSeconds: env.FIT_HEARTBEAT_STALE_SECONDS }) };
});
