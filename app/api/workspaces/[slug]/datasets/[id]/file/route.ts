import { getDatasetFile } from "@/db/queries/datasets";
import { requireDataset } from "@/lib/server/datasets/dataset-access";
import { workspaceRoute } from "@/lib/server/route";

// The stored type came from the browser: only plain-text types are echoed, anything else is served as bytes.
const textTypes = new Set(["text/csv", "text/tab-separated-values", "text/plain"]);

/** The original bytes as uploaded, with the original file name. */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access, params }) => {
  const found = await requireDataset(access.workspace.id, params.id);
  const file = await getDatasetFile({ workspaceId: access.workspace.id, id: found.id });
  if (!file) return new Response(null, { status: 404 });
  return new Response(new Uint8Array(file.fileBytes), {
    headers: {
      "content-type": textTypes.has(file.fileType) ? file.fileType : "application/octet-stream",
      "content-length": String(file.fileBytes.byteLength),
      "content-disposition": `attachment; filename*=UTF-8''${encodeURIComponent(file.fileName)}`,
      "x-content-type-options": "nosniff",
    },
  });
});
