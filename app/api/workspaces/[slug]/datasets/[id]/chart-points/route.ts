import { sampleDatasetPoints } from "@/db/queries/datasets";
import { chartPointsQuerySchema } from "@/lib/server/datasets/chart-points";
import { requireDataset } from "@/lib/server/datasets/dataset-access";
import { parseInput } from "@/lib/server/parse-input";
import { workspaceRoute } from "@/lib/server/route";

/**
 * The dataset's points for a chart in one request: `?max=` (1–20 000, default 20 000) →
 * `{ points: [{ index, kIndex, kx, ky, kz, pathDistance, band, energy, sigma }], total, stride }`. Every point
 * when the dataset has at most `max`; else every `stride`-th point of each band in file order (the same
 * stride for all bands, each band's first point kept), at most `max` in all (one per band when `max` is
 * below the band count). Ordered by band, then file order. k and path distance in 1/Å, energies and σ in eV (σ null where the file gives none).
 */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access, params, request }) => {
  const found = await requireDataset(access.workspace.id, params.id);
  const query = parseInput(chartPointsQuerySchema, Object.fromEntries(new URL(request.url).searchParams));
  const { points, stride } = await sampleDatasetPoints({
    datasetId: found.id,
    pointCount: found.pointCount,
    bandCount: found.bandCount,
    maxPoints: query.max,
  });
  return { points, total: found.pointCount, stride };
});
