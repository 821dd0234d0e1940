import { listAllResiduals } from "@/db/queries/fit-residuals";
import { residualsCsv } from "@/lib/export";
import { requireResult, requireRevision } from "@/lib/server/fits/views";
import { workspaceRoute } from "@/lib/server/route";

/** Per-point residuals as CSV (model − data, eV). */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access, params }) => {
  const details = await requireRevision(access.workspace.id, params);
  requireResult(details);
  const csv = residualsCsv(await listAllResiduals(details.revision.id));
  return new Response(csv, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="residuals-r${details.revision.number}.csv"`,
    },
  });
});
