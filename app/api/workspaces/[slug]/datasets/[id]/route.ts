import { NextResponse } from "next/server";
import { deleteDataset, updateDataset } from "@/db/queries/datasets";
import { datasetChangesSchema } from "@/lib/schemas/datasets";
import { requireDataset } from "@/lib/server/datasets/dataset-access";
import { workspaceRoute } from "@/lib/server/route";

/** One dataset: name, description, source, mapping, summary, file name/size/SHA-256, uploader, times. */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access, params }) => ({
  dataset: await requireDataset(access.workspace.id, params.id),
}));

/** Rename or re-describe (editor+): `{ name?, description? }`. */
export const PATCH = workspaceRoute({ minimumRole: "editor", input: datasetChangesSchema }, async ({ access, params, input }) => {
  const found = await requireDataset(access.workspace.id, params.id);
  await updateDataset({ workspaceId: access.workspace.id, id: found.id, ...input });
  return { dataset: await requireDataset(access.workspace.id, found.id) };
});

/** Delete with all points (editor+) → 204. */
export const DELETE = workspaceRoute({ minimumRole: "editor" }, async ({ access, params }) => {
  const found = await requireDataset(access.workspace.id, params.id);
  await deleteDataset({ workspaceId: access.workspace.id, id: found.id });
  return new NextResponse(null, { status: 204 });
});
