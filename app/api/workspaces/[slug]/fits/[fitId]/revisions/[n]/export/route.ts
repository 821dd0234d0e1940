import { NextResponse } from "next/server";
import { exportRevision } from "@/lib/server/fits/export";
import { requireRevision } from "@/lib/server/fits/views";
import { workspaceRoute } from "@/lib/server/route";

/** The revision's parameter set (format "bandwright-parameter-set", version 2; JSON Schema in lib/export). */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access, params }) => {
  const details = await requireRevision(access.workspace.id, params);
  return NextResponse.json(exportRevision(details), {
    headers: { "content-disposition": `attachment; filename="parameter-set-r${details.revision.number}.json"` },
  });
});
