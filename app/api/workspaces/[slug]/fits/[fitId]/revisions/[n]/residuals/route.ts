import { listResiduals } from "@/db/queries/fit-residuals";
import { residualQuerySchema } from "@/lib/server/fits/residual-query";
import { requireRevision } from "@/lib/server/fits/views";
import { parseInput } from "@/lib/server/parse-input";
import { workspaceRoute } from "@/lib/server/route";

/**
 * Per-point residuals, sorted and paged in the database:
 * `?band=&page=&pageSize=&sort=` → `{ rows: [{ pointIndex, dataBand, modelBand, pathDistance, energy, modelEnergy, residual, weightedResidual }], total, page, pageSize }`.
 */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access, params, request }) => {
  const query = parseInput(residualQuerySchema, Object.fromEntries(new URL(request.url).searchParams));
  const details = await requireRevision(access.workspace.id, params);
  const { rows, total } = await listResiduals({ revisionId: details.revision.id, dataBand: query.band, page: query.page, pageSize: query.pageSize, sort: query.sort });
  return { rows, total, page: query.page, pageSize: query.pageSize };
});
