import { and, asc, count, desc, eq, sql, type SQL } from "drizzle-orm";
import { db } from "@/db/client";
import type { PointSortKey } from "@/lib/schemas/datasets";
import { dataset, datasetPoint, user, type DatasetPoint, type NewDataset, type NewDatasetPoint } from "@/db/schema";

/** Rows per INSERT: 13 columns × 4000 rows stays under PostgreSQL's 65 535 bind parameters per statement. */
const INSERT_BATCH_ROWS = 4000;

/** A dataset as pages and routes show it: everything but the file's bytes. */
const datasetFields = {
  id: dataset.id,
  name: dataset.name,
  description: dataset.description,
  source: dataset.source,
  energyReference: dataset.energyReference,
  mapping: dataset.mapping,
  summary: dataset.summary,
  fileName: dataset.fileName,
  fileType: dataset.fileType,
  fileSize: dataset.fileSize,
  fileSha256: dataset.fileSha256,
  pointCount: dataset.pointCount,
  bandCount: dataset.bandCount,
  uploadedBy: dataset.uploadedBy,
  uploaderName: user.name,
  createdAt: dataset.createdAt,
  updatedAt: dataset.updatedAt,
};

/** A dataset with its uploader's name, as {@link getDataset} returns it. */
export type DatasetDetails = NonNullable<Awaited<ReturnType<typeof getDataset>>>;

/** The id and name of the workspace's dataset with this file hash, or null. */
export async function findDatasetBySha256(params: { workspaceId: string; sha256: string }) {
  const rows = await db
    .select({ id: dataset.id, name: dataset.name })
    .from(dataset)
    .where(and(eq(dataset.workspaceId, params.workspaceId), eq(dataset.fileSha256, params.sha256)))
    .limit(1);
  return rows[0] ?? null;
}

/**
 * Stores a dataset and all its points in one transaction (batched inserts): either both are stored or
 * neither is. A unique-index violation (same file hash in the workspace) propagates to the caller.
 */
export async function insertDatasetWithPoints(row: NewDataset, points: readonly Omit<NewDatasetPoint, "datasetId">[]) {
  await db.transaction(async (tx) => {
    await tx.insert(dataset).values(row);
    for (let start = 0; start < points.length; start += INSERT_BATCH_ROWS) {
      const batch = points.slice(start, start + INSERT_BATCH_ROWS).map((p) => ({ ...p, datasetId: row.id }));
      await tx.insert(datasetPoint).values(batch);
    }
  });
}

/** The workspace's datasets, newest first, without mapping, summary or bytes. */
export async function listDatasets(workspaceId: string) {
  return db
    .select({
      id: dataset.id,
      name: dataset.name,
      source: dataset.source,
      fileName: dataset.fileName,
      pointCount: dataset.pointCount,
      bandCount: dataset.bandCount,
      uploaderName: user.name,
      createdAt: dataset.createdAt,
    })
    .from(dataset)
    .leftJoin(user, eq(dataset.uploadedBy, user.id))
    .where(eq(dataset.workspaceId, workspaceId))
    .orderBy(desc(dataset.createdAt));
}

/** One dataset of the workspace (null when the id is unknown or belongs to another workspace). */
export async function getDataset(params: { workspaceId: string; id: string }) {
  const rows = await db
    .select(datasetFields)
    .from(dataset)
    .leftJoin(user, eq(dataset.uploadedBy, user.id))
    .where(and(eq(dataset.workspaceId, params.workspaceId), eq(dataset.id, params.id)))
    .limit(1);
  return rows[0] ?? null;
}

/** The original bytes of a dataset's file with its name and type, or null. */
export async function getDatasetFile(params: { workspaceId: string; id: string }) {
  const rows = await db
    .select({ fileName: dataset.fileName, fileType: dataset.fileType, fileBytes: dataset.fileBytes })
    .from(dataset)
    .where(and(eq(dataset.workspaceId, params.workspaceId), eq(dataset.id, params.id)))
    .limit(1);
  return rows[0] ?? null;
}

/** Renames a dataset or changes its description; returns false when it does not exist in the workspace. */
export async function updateDataset(params: { workspaceId: string; id: string; name?: string; description?: string }) {
  const changes: Partial<NewDataset> = { updatedAt: new Date() };
  if (params.name !== undefined) changes.name = params.name;
  if (params.description !== undefined) changes.description = params.description;
  const rows = await db
    .update(dataset)
    .set(changes)
    .where(and(eq(dataset.workspaceId, params.workspaceId), eq(dataset.id, params.id)))
    .returning({ id: dataset.id });
  return rows.length > 0;
}

/** Deletes a dataset with its points (cascade); returns false when it does not exist in the workspace. */
export async function deleteDataset(params: { workspaceId: string; id: string }) {
  const rows = await db
    .delete(dataset)
    .where(and(eq(dataset.workspaceId, params.workspaceId), eq(dataset.id, params.id)))
    .returning({ id: dataset.id });
  return rows.length > 0;
}


const pointColumns = {
  index: datasetPoint.index,
  row: datasetPoint.row,
  kIndex: datasetPoint.kIndex,
  kx: datasetPoint.kx,
  ky: datasetPoint.ky,
  kz: datasetPoint.kz,
  pathDistance: datasetPoint.pathDistance,
  band: datasetPoint.band,
  energy: datasetPoint.energy,
  sigma: datasetPoint.sigma,
  weight: datasetPoint.weight,
  label: datasetPoint.label,
};

/** One stored point as routes and the points table show it (k in 1/Å, energies in eV). */
export type StoredPoint = Omit<DatasetPoint, "datasetId">;

/**
 * One page of a dataset's points, sorted on the server (ties broken by file order), and the number of
 * points that match the band filter.
 */
export async function listDatasetPoints(params: {
  datasetId: string;
  band?: number;
  page: number;
  pageSize: number;
  sort: PointSortKey;
  direction: "asc" | "desc";
}): Promise<{ points: StoredPoint[]; total: number }> {
  const where = and(
    eq(datasetPoint.datasetId, params.datasetId),
    params.band === undefined ? undefined : eq(datasetPoint.band, params.band),
  );
  const order = params.direction === "asc" ? asc : desc;
  const [points, totals] = await Promise.all([
    db
      .select(pointColumns)
      .from(datasetPoint)
      .where(where)
      .orderBy(order(datasetPoint[params.sort]), asc(datasetPoint.index))
      .limit(params.pageSize)
      .offset((params.page - 1) * params.pageSize),
    db.select({ total: count() }).from(datasetPoint).where(where),
  ]);
  return { points, total: totals[0]?.total ?? 0 };
}

/** A chart point: path distance (1/Å), energy (eV), band. */
export type ChartPoint = { pathDistance: number; energy: number; band: number };

/**
 * At most about `maxPoints` points for the chart: every n-th point of each band in file order (n the same
 * for all bands), so a band's shape and every band survive the thinning.
 */
export async function sampleDatasetPoints(params: { datasetId: string; pointCount: number; maxPoints: number }): Promise<ChartPoint[]> {
  const stride = Math.max(1, Math.ceil(params.pointCount / params.maxPoints));
  const ranked = db
    .select({
      pathDistance: datasetPoint.pathDistance,
      energy: datasetPoint.energy,
      band: datasetPoint.band,
      index: datasetPoint.index,
      rank: sql<number>`row_number() over (partition by ${datasetPoint.band} order by ${datasetPoint.index}) - 1`.as("rank"),
    })
    .from(datasetPoint)
    .where(eq(datasetPoint.datasetId, params.datasetId))
    .as("ranked");
  const keep: SQL = sql`${ranked.rank} % ${stride} = 0`;
  return db
    .select({ pathDistance: ranked.pathDistance, energy: ranked.energy, band: ranked.band })
    .from(ranked)
    .where(keep)
    .orderBy(asc(ranked.band), asc(ranked.index));
}

/** How many datasets and points a workspace holds (tests check that a refused upload stored nothing). */
export async function countWorkspaceDatasetRows(workspaceId: string) {
  const [datasets] = await db.select({ n: count() }).from(dataset).where(eq(dataset.workspaceId, workspaceId));
  const [points] = await db
    .select({ n: count() })
    .from(datasetPoint)
    .innerJoin(dataset, eq(datasetPoint.datasetId, dataset.id))
    .where(eq(dataset.workspaceId, workspaceId));
  return { datasets: datasets?.n ?? 0, points: points?.n ?? 0 };
}
