import { listDatasets } from "@/db/queries/datasets";
import { uploadDataset } from "@/lib/server/datasets/upload-dataset";
import { workspaceRoute } from "@/lib/server/route";

/** The workspace's datasets, newest first: `{ datasets: [{ id, name, source, fileName, pointCount, bandCount, uploaderName, createdAt }] }`. */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access }) => ({
  datasets: await listDatasets(access.workspace.id),
}));

/**
 * Upload (editor+): multipart `file` and `mapping` (JSON, see README) → 201 `{ id, pointCount, bandCount,
 * warnings }`; 422 with the file's issues by row and column; 409 when the same bytes are already here.
 */
export const POST = workspaceRoute({ minimumRole: "editor" }, async ({ access, request }) => uploadDataset(request, access));
