"use client";

import { z } from "zod";
import { chartPointLimit } from "@/lib/server/datasets/chart-points";
import {
  chartPointsSchema,
  datasetDetailsSchema,
  datasetListSchema,
  fitDetailsSchema,
  fitListSchema,
  residualPageSchema,
  revisionDetailsSchema,
  templateListSchema,
} from "@/lib/views/responses";
import { type ResidualQuery, residualSearchParams } from "@/lib/views/residual-query";

/** An error answer of a route: its safe message and, for refused input, the messages per field. */
export class RouteError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly issues: Record<string, string[]> = {},
  ) {
    super(message);
  }
}

const errorBodySchema = z.object({
  error: z.object({ message: z.string(), issues: z.record(z.string(), z.array(z.string())).optional() }),
});

async function request<T>(url: string, schema: z.ZodType<T>, init?: RequestInit): Promise<T> {
  const response = await fetch(url, { ...init, headers: { accept: "application/json", ...(init?.body ? { "content-type": "application/json" } : {}) } });
  const body: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    const parsed = errorBodySchema.safeParse(body);
    throw new RouteError(parsed.success ? parsed.data.error.message : `The server answered ${response.status}.`, response.status, parsed.data?.error.issues);
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw new RouteError("The server's answer was not understood; reload the page.", response.status);
  return parsed.data;
}

/** The routes of one workspace, as URLs (downloads are plain links). */
export function fitRoutes(slug: string) {
  const workspace = `/api/workspaces/${encodeURIComponent(slug)}`;
  const fit = (fitId: string) => `${workspace}/fits/${encodeURIComponent(fitId)}`;
  const revision = (fitId: string, n: number) => `${fit(fitId)}/revisions/${n}`;
  return {
    fits: `${workspace}/fits`,
    fitsOfDataset: (datasetId: string | undefined) => `${workspace}/fits${datasetId ? `?dataset=${encodeURIComponent(datasetId)}` : ""}`,
    fit,
    revisions: (fitId: string) => `${fit(fitId)}/revisions`,
    revision,
    residuals: (fitId: string, n: number, query: ResidualQuery) => `${revision(fitId, n)}/residuals?${residualSearchParams(query)}`,
    cancel: (fitId: string, n: number) => `${revision(fitId, n)}/cancel`,
    exportJson: (fitId: string, n: number) => `${revision(fitId, n)}/export`,
    residualsCsv: (fitId: string, n: number) => `${revision(fitId, n)}/residuals.csv`,
    bandsCsv: (fitId: string, n: number) => `${revision(fitId, n)}/bands.csv`,
    datasets: `${workspace}/datasets`,
    dataset: (id: string) => `${workspace}/datasets/${encodeURIComponent(id)}`,
    chartPoints: (id: string, max: number) => `${workspace}/datasets/${encodeURIComponent(id)}/chart-points?max=${max}`,
  };
}

export const fitApi = {
  /** The workspace's fits, or one dataset's when `datasetId` is given. */
  listFits: (slug: string, datasetId?: string) => request(fitRoutes(slug).fitsOfDataset(datasetId), fitListSchema),
  getFit: (slug: string, fitId: string) => request(fitRoutes(slug).fit(fitId), fitDetailsSchema),
  getRevision: (slug: string, fitId: string, n: number) => request(fitRoutes(slug).revision(fitId, n), revisionDetailsSchema),
  listResiduals: (slug: string, fitId: string, n: number, query: ResidualQuery) => request(fitRoutes(slug).residuals(fitId, n, query), residualPageSchema),
  cancel: (slug: string, fitId: string, n: number) => request(fitRoutes(slug).cancel(fitId, n), z.unknown(), { method: "POST", body: "{}" }),
  launch: (slug: string, body: unknown) =>
    request(fitRoutes(slug).fits, z.object({ fitId: z.string(), revision: z.int() }), { method: "POST", body: JSON.stringify(body) }),
  newRevision: (slug: string, fitId: string, body: unknown) =>
    request(fitRoutes(slug).revisions(fitId), z.looseObject({ revision: z.int() }), { method: "POST", body: JSON.stringify(body) }),
  listTemplates: () => request("/api/templates", templateListSchema),
  listDatasets: (slug: string) => request(fitRoutes(slug).datasets, datasetListSchema),
  getDataset: (slug: string, id: string) => request(fitRoutes(slug).dataset(id), datasetDetailsSchema),
  /**
   * The dataset's points for charts in one request: all of them up to {@link chartPointLimit}, else every
   * `stride`-th point of each band (the chart-points route).
   */
  chartPoints: (slug: string, id: string) => request(fitRoutes(slug).chartPoints(id, chartPointLimit), chartPointsSchema),
};
