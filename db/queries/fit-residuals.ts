import { type SQL, and, asc, count, desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { fitResidual } from "@/db/schema";

/** Orders a residual table can be sorted by; a leading "-" sorts descending. */
export const residualSortKeys = ["pointIndex", "dataBand", "pathDistance", "energy", "modelEnergy", "residual", "absResidual"] as const;
export type ResidualSortKey = (typeof residualSortKeys)[number];
export type ResidualSort = ResidualSortKey | `-${ResidualSortKey}`;

const sortColumns = {
  pointIndex: fitResidual.pointIndex,
  dataBand: fitResidual.dataBand,
  pathDistance: fitResidual.pathDistance,
  energy: fitResidual.energy,
  modelEnergy: fitResidual.modelEnergy,
  residual: fitResidual.residual,
  absResidual: fitResidual.absResidual,
} as const;

const residualColumns = {
  pointIndex: fitResidual.pointIndex,
  dataBand: fitResidual.dataBand,
  modelBand: fitResidual.modelBand,
  pathDistance: fitResidual.pathDistance,
  energy: fitResidual.energy,
  modelEnergy: fitResidual.modelEnergy,
  residual: fitResidual.residual,
  weightedResidual: fitResidual.weightedResidual,
};

function filter(revisionId: string, dataBand?: number): SQL | undefined {
  return dataBand === undefined
    ? eq(fitResidual.revisionId, revisionId)
    : and(eq(fitResidual.revisionId, revisionId), eq(fitResidual.dataBand, dataBand));
}

/**
 * One page of a revision's residual rows, sorted and paged in the database (ties broken by point index).
 * @param page - 1-based
 */
export async function listResiduals(params: { revisionId: string; dataBand?: number; page: number; pageSize: number; sort: ResidualSort }) {
  const descending = params.sort.startsWith("-");
  const column = sortColumns[(descending ? params.sort.slice(1) : params.sort) as ResidualSortKey];
  const where = filter(params.revisionId, params.dataBand);
  const [rows, [{ total }]] = await Promise.all([
    db
      .select(residualColumns)
      .from(fitResidual)
      .where(where)
      .orderBy(descending ? desc(column) : asc(column), asc(fitResidual.pointIndex))
      .limit(params.pageSize)
      .offset((params.page - 1) * params.pageSize),
    db.select({ total: count() }).from(fitResidual).where(where),
  ]);
  return { rows, total };
}

/** Every residual row of a revision in point order (the CSV download). */
export async function listAllResiduals(revisionId: string) {
  return db.select(residualColumns).from(fitResidual).where(eq(fitResidual.revisionId, revisionId)).orderBy(asc(fitResidual.pointIndex));
}

/** Number of residual rows of a revision, optionally of one data band. */
export async function countResiduals(params: { revisionId: string; dataBand?: number }): Promise<number> {
  const [row] = await db.select({ n: count() }).from(fitResidual).where(filter(params.revisionId, params.dataBand));
  return row.n;
}
