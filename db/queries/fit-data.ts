import { and, asc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { dataset, datasetPoint } from "@/db/schema";
import type { DataPoint } from "@/lib/datasets";

// The dataset reads a fit needs (launch checks, the worker, the CSV exports), kept apart from the
// dataset pages' queries so that each side can change its own.

/** A dataset of the workspace with what a fit records about it, or null (also for another workspace's). */
export async function getDatasetForFit(params: { workspaceId: string; datasetId: string }) {
  const rows = await db
    .select({ id: dataset.id, name: dataset.name, sha256: dataset.fileSha256, summary: dataset.summary })
    .from(dataset)
    .where(and(eq(dataset.workspaceId, params.workspaceId), eq(dataset.id, params.datasetId)))
    .limit(1);
  return rows[0] ?? null;
}
export type FitDataset = NonNullable<Awaited<ReturnType<typeof getDatasetForFit>>>;

/** A stored point: lib/datasets' DataPoint plus its `index` in the dataset (residual rows refer to it). */
export type StoredFitPoint = DataPoint & { index: number };

/** Every point of a dataset in stored order (`index`). */
export async function loadDatasetPoints(datasetId: string): Promise<StoredFitPoint[]> {
  const rows = await db.select().from(datasetPoint).where(eq(datasetPoint.datasetId, datasetId)).orderBy(asc(datasetPoint.index));
  return rows.map((r) => ({
    k: [r.kx, r.ky, r.kz],
    pathDistance: r.pathDistance,
    band: r.band,
    energy: r.energy,
    ...(r.sigma === null ? {} : { sigma: r.sigma }),
    ...(r.weight === null ? {} : { weight: r.weight }),
    ...(r.label === null ? {} : { label: r.label }),
    kIndex: r.kIndex,
    row: r.row,
    index: r.index,
  }));
}
