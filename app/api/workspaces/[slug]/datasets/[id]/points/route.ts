import { listDatasetPoints } from "@/db/queries/datasets";
import { pointsQuerySchema } from "@/lib/schemas/datasets";
import { requireDataset } from "@/lib/server/datasets/dataset-access";
import { parseInput } from "@/lib/server/parse-input";
import { workspaceRoute } from "@/lib/server/route";

/**
 * One page of points, paged and sorted on the server: `?band=&page=&pageSize=&sort=` (sort by index, row,
 * kIndex, pathDistance, band, energy or sigma; `-energy` descending) → `{ points, total, page, pageSize }`.
 * k in 1/Å, path distance in 1/Å, energies and σ in eV.
 */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access, params, request }) => {
  const found = await requireDataset(access.workspace.id, params.id);
  const query = parseInput(pointsQuerySchema, Object.fromEntries(new URL(request.url).searchParams));
  const { points, total } = await listDatasetPoints({
    datasetId: found.id,
    band: query.band,
    page: query.page,
    pageSize: query.pageSize,
    sort: query.sort.column,
    direction: query.sort.direction,
  });
  return { points, total, page: query.page, pageSize: query.pageSize };
});
