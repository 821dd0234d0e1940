import { and, asc, count, desc, eq, sql, type SQL } from "drizzle-orm";
import { db } from "@/db/client";
import type { PointSortKey } from "@/lib/schemas/datasets";
import { dataset, datasetPoint, user, type DatasetPoint, type NewDataset } from "@/db/schema";
import type { PointTable } from "@/lib/datasets";

/**
 * Points per INSERT … SELECT FROM unnest(arrays): each column travels as one array parameter, so a batch
 * costs 12 parameters whatever its size; 50 000 rows keep a statement's arrays at a few MB.
 */
const INSERT_BATCH_ROWS = 50_000;

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
 * Stores a dataset and all its points in one transaction: either both are stored or neither is. Points go
 * in batches as column arrays (`unnest`), straight from the parsed table's typed arrays, in file order
 * (`index` 0…n−1, the index fits' residuals refer to). A unique-index violation (same file hash in the
 * workspace) propagates to the caller.
 * @param row - the dataset row
 * @param points - the parsed points (k and path distance in 1/Å, energies and σ in eV)
 */
export async function insertDatasetWithPoints(row: NewDataset, points: PointTable) {
  await db.transaction(async (tx) => {
    await tx.insert(dataset).values(row);
    for (let start = 0; start < points.length; start += INSERT_BATCH_ROWS) {
      const end = Math.min(start + INSERT_BATCH_ROWS, points.length);
      await tx.execute(pointBatchInsert(row.id, points, start, end));
    }
  });
}

/** One batch of points as INSERT … SELECT FROM unnest(column arrays); absent optional columns are NULL. */
function pointBatchInsert(datasetId: string, points: PointTable, start: number, end: number): SQL {
  const column = (values: Float64Array | Int32Array) => sql.param(Array.from(values.subarray(start, end)));
  const index = Array.from({ length: end - start }, (_, i) => start + i);
  const labels = points.labelId
    ? Array.from(points.labelId.subarray(start, end), (id) => (id >= 0 ? points.labels[id] : null))
    : null;
  return sql`
    insert into ${datasetPoint} (dataset_id, index, row, k_index, kx, ky, kz, path_distance, band, energy, sigma, weight, label)
    select ${datasetId}, p.* from unnest(
      ${sql.param(index)}::int4[], ${column(points.row)}::int4[], ${column(points.kIndex)}::int4[],
      ${column(points.kx)}::float8[], ${column(points.ky)}::float8[], ${column(points.kz)}::float8[],
      ${column(points.pathDistance)}::float8[], ${column(points.band)}::int4[], ${column(points.energy)}::float8[],
      ${points.sigma ? sql`${column(points.sigma)}::float8[]` : sql`null::float8[]`},
      ${points.weight ? sql`${column(points.weight)}::float8[]` : sql`null::float8[]`},
      ${labels ? sql`${sql.param(labels)}::text[]` : sql`null::text[]`}
    ) as p`;
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

/**
 * A point as charts draw it: file-order `index`, k-point index and Cartesian k (1/Å, for model bands at the
 * data's own k-points), path distance (1/Å), band and energy (eV).
 */
export type ChartPoint = Pick<StoredPoint, "index" | "kIndex" | "kx" | "ky" | "kz" | "pathDistance" | "band" | "energy" | "sigma">;

/**
 * The stride that keeps at most `maxPoints` points when every `stride`-th point of each band is kept
 * (ranks 0, stride, 2·stride… in file order): band b keeps ⌈n_b/stride⌉ ≤ n_b/stride + 1 points, so a
 * stride of ⌈N/(maxPoints − B)⌉ keeps at most maxPoints in all. With maxPoints ≤ B every band still keeps
 * its first point.
 * @param pointCount - N, the dataset's points
 * @param bandCount - B, its bands
 * @param maxPoints - the most points wanted
 */
export function chartStride(pointCount: number, bandCount: number, maxPoints: number): number {
  if (pointCount <= maxPoints) return 1;
  return Math.max(1, Math.ceil(pointCount / Math.max(1, maxPoints - bandCount)));
}

/**
 * At most `maxPoints` points for a chart (see {@link chartStride}): every n-th point of each band in file
 * order, n the same for all bands, so every band and its shape survive the thinning. Ordered by band,
 * then file order.
 */
export async function sampleDatasetPoints(params: {
  datasetId: string;
  pointCount: number;
  bandCount: number;
  maxPoints: number;
}): Promise<{ points: ChartPoint[]; stride: number }> {
  const stride = chartStride(params.pointCount, params.bandCount, params.maxPoints);
  const ranked = db
    .select({
      index: datasetPoint.index,
      kIndex: datasetPoint.kIndex,
      kx: datasetPoint.kx,
      ky: datasetPoint.ky,
      kz: datasetPoint.kz,
      pathDistance: datasetPoint.pathDistance,
      band: datasetPoint.band,
      energy: datasetPoint.energy,
      sigma: datasetPoint.sigma,
      rank: sql<number>`row_number() over (partition by ${datasetPoint.band} order by ${datasetPoint.index}) - 1`.as("rank"),
    })
    .from(datasetPoint)
    .where(eq(datasetPoint.datasetId, params.datasetId))
    .as("ranked");
  const points = await db
    .select({
      index: ranked.index,
      kIndex: ranked.kIndex,
      kx: ranked.kx,
      ky: ranked.ky,
      kz: ranked.kz,
      pathDistance: ranked.pathDistance,
      band: ranked.band,
      energy: ranked.energy,
      sigma: ranked.sigma,
    })
    .from(ranked)
    .where(stride === 1 ? undefined : sql`${ranked.rank} % ${stride} = 0`)
    .orderBy(asc(ranked.band), asc(ranked.index));
  return { points, stride };
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
