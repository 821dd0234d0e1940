import { loadDatasetPoints } from "@/db/queries/fit-data";
import { bandsCsv } from "@/lib/export";
import { revisionAlignment } from "@/lib/fit/bands";
import { requireResult, requireRevision, snapshotOf } from "@/lib/server/fits/views";
import { workspaceRoute } from "@/lib/server/route";

/** The fitted model's bands as CSV: at the dataset's k-points, then on a dense path of the model's k-path. */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access, params }) => {
  const details = await requireRevision(access.workspace.id, params);
  const result = requireResult(details);
  const snapshot = snapshotOf(details);
  const seen = new Set<number>();
  const dataK = (await loadDatasetPoints(snapshot.dataset.id)).filter((p) => !seen.has(p.kIndex) && seen.add(p.kIndex));
  const csv = bandsCsv(result.fittedModel, dataK, revisionAlignment(result.parameters, snapshot.options));
  return new Response(csv, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="bands-r${details.revision.number}.csv"`,
    },
  });
});
