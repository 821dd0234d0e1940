import { count, desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { dataset, fit, fitRevision } from "@/db/schema";

/**
 * What the workspace home shows: how many datasets and fits there are, and the newest few of each (fits
 * with the number and status of their latest revision).
 * @param limit - how many of the newest datasets and fits to return
 */
export async function getWorkspaceOverview(workspaceId: string, limit = 5) {
  const [datasetTotal, fitTotal, latestDatasets, latestFits] = await Promise.all([
    db.select({ n: count() }).from(dataset).where(eq(dataset.workspaceId, workspaceId)),
    db.select({ n: count() }).from(fit).where(eq(fit.workspaceId, workspaceId)),
    db
      .select({
        id: dataset.id,
        name: dataset.name,
        source: dataset.source,
        pointCount: dataset.pointCount,
        bandCount: dataset.bandCount,
        createdAt: dataset.createdAt,
      })
      .from(dataset)
      .where(eq(dataset.workspaceId, workspaceId))
      .orderBy(desc(dataset.createdAt))
      .limit(limit),
    db
      .select({ id: fit.id, name: fit.name, createdAt: fit.createdAt })
      .from(fit)
      .where(eq(fit.workspaceId, workspaceId))
      .orderBy(desc(fit.createdAt))
      .limit(limit),
  ]);
  const latestRevisions =
    latestFits.length === 0
      ? []
      : await db
          .selectDistinctOn([fitRevision.fitId], { fitId: fitRevision.fitId, number: fitRevision.number, status: fitRevision.status })
          .from(fitRevision)
          .where(inArray(fitRevision.fitId, latestFits.map((f) => f.id)))
          .orderBy(fitRevision.fitId, desc(fitRevision.number));
  const revisionOf = new Map(latestRevisions.map((revision) => [revision.fitId, revision]));
  return {
    datasetCount: datasetTotal[0]?.n ?? 0,
    fitCount: fitTotal[0]?.n ?? 0,
    latestDatasets,
    latestFits: latestFits.map((f) => ({
      ...f,
      latestRevision: revisionOf.get(f.id)?.number ?? null,
      latestStatus: revisionOf.get(f.id)?.status ?? null,
    })),
  };
}

export type WorkspaceOverview = Awaited<ReturnType<typeof getWorkspaceOverview>>;
