import { z } from "zod";
import { bandFitResultSchema } from "@/lib/fit/bands/schema";
import { revisionProgressSchema, revisionSnapshotSchema } from "@/lib/server/fits/snapshot";
import { modelParameterSchema } from "@/lib/tb";

/**
 * What the pages read from the fit and dataset routes (issue 5; the datasets routes). Objects are loose so
 * that fields a route adds later do not break a page; the fields listed are the ones the pages use.
 */

const revisionStatusSchema = z.enum(["queued", "running", "succeeded", "failed", "cancelled"]);
export type RevisionStatusName = z.infer<typeof revisionStatusSchema>;

/** A revision's status is final once it can no longer change. */
export function isFinalStatus(status: RevisionStatusName): boolean {
  return status === "succeeded" || status === "failed" || status === "cancelled";
}

const timestamp = z.string();

export const fitSummarySchema = z.looseObject({
  id: z.string(),
  name: z.string(),
  datasetId: z.string(),
  datasetName: z.string().nullish(),
  createdAt: timestamp,
  createdByName: z.string().nullish(),
  latestRevision: z.int().nullable(),
  latestStatus: revisionStatusSchema.nullable(),
  /** eV */
  latestRms: z.number().nullish(),
  latestFinishedAt: timestamp.nullish(),
});
export type FitSummary = z.infer<typeof fitSummarySchema>;
export const fitListSchema = z.looseObject({ fits: z.array(fitSummarySchema) });

export const revisionSummarySchema = z.looseObject({
  number: z.int(),
  parentNumber: z.int().nullable(),
  status: revisionStatusSchema,
  launchedBy: z.string().nullable(),
  createdAt: timestamp,
  startedAt: timestamp.nullable(),
  finishedAt: timestamp.nullable(),
  rms: z.number().nullable(),
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;

export const fitDetailsSchema = z.looseObject({
  fit: z.looseObject({
    id: z.string(),
    name: z.string(),
    notes: z.string(),
    datasetId: z.string(),
    createdAt: timestamp,
    revisions: z.array(revisionSummarySchema),
  }),
});
export type FitDetails = z.infer<typeof fitDetailsSchema>["fit"];

/** A finished revision's result without the per-point rows (those page through the residuals route). */
export const revisionResultSchema = bandFitResultSchema.partial({ residuals: true, starts: true });
export type RevisionResult = z.infer<typeof revisionResultSchema>;

export const revisionDetailsSchema = z.looseObject({
  number: z.int(),
  parentNumber: z.int().nullable(),
  status: revisionStatusSchema,
  progress: revisionProgressSchema.nullable(),
  result: revisionResultSchema.nullable(),
  inputs: revisionSnapshotSchema,
  fitName: z.string(),
  failureReason: z.string().nullable(),
  /** the checks before queueing (the frame check) */
  launchWarnings: z.array(z.looseObject({ kind: z.string(), message: z.string() })),
  /** the launcher's name; null when the account is gone */
  launchedBy: z.string().nullable(),
  createdAt: timestamp,
  startedAt: timestamp.nullable(),
  finishedAt: timestamp.nullable(),
});
export type RevisionDetails = z.infer<typeof revisionDetailsSchema>;

export const residualRowSchema = z.looseObject({
  pointIndex: z.int(),
  dataBand: z.int(),
  modelBand: z.int(),
  pathDistance: z.number(),
  energy: z.number(),
  modelEnergy: z.number(),
  residual: z.number(),
  weightedResidual: z.number(),
});
export type ResidualRow = z.infer<typeof residualRowSchema>;
export const residualPageSchema = z.looseObject({ rows: z.array(residualRowSchema), total: z.int() });
export type ResidualPage = z.infer<typeof residualPageSchema>;

export const templateSummarySchema = z.looseObject({
  id: z.string(),
  title: z.string(),
  /** number of orbitals (model bands) */
  orbitals: z.int(),
  parameters: z.array(modelParameterSchema),
  latticeConstant: z.looseObject({ value: z.number(), meaning: z.string() }),
});
export const templateListSchema = z.looseObject({ templates: z.array(templateSummarySchema) });

export const datasetSummaryRowSchema = z.looseObject({
  id: z.string(),
  name: z.string(),
  pointCount: z.int(),
  bandCount: z.int(),
});
export type DatasetOption = z.infer<typeof datasetSummaryRowSchema>;
export const datasetListSchema = z.looseObject({ datasets: z.array(datasetSummaryRowSchema) });

export const datasetDetailsSchema = z.looseObject({
  dataset: z.looseObject({
    id: z.string(),
    name: z.string(),
    summary: z.looseObject({
      bands: z.array(z.int()),
      ticks: z.array(z.object({ label: z.string(), pathDistance: z.number() })),
      energyRange: z.object({ min: z.number(), max: z.number() }),
      pointCount: z.int(),
    }),
  }),
});
export type DatasetDetails = z.infer<typeof datasetDetailsSchema>["dataset"];

/** A dataset point as charts read it (the chart-points route): k and path distance in 1/Å, energy in eV. */
export const datasetPointSchema = z.looseObject({
  index: z.int(),
  kIndex: z.int(),
  kx: z.number(),
  ky: z.number(),
  kz: z.number(),
  pathDistance: z.number(),
  band: z.int(),
  energy: z.number(),
  /** eV; null where the dataset gives no uncertainty */
  sigma: z.number().nullish(),
});
export type DatasetPointRow = z.infer<typeof datasetPointSchema>;
/** `GET …/datasets/{id}/chart-points`: every point, or every `stride`-th point of each band, of `total`. */
export const chartPointsSchema = z.looseObject({ points: z.array(datasetPointSchema), total: z.int(), stride: z.int().min(1) });
export type ChartPoints = z.infer<typeof chartPointsSchema>;
