import {
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
} from "drizzle-orm/pg-core";
import { organization, user } from "./auth";
import { dataset } from "./datasets";

/** A fit: one dataset, a name and notes; its launches are the revisions. */
export const fit = pgTable(
  "fit",
  {
    id: text("id").primaryKey(),
    workspaceId: text("workspace_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    datasetId: text("dataset_id")
      .notNull()
      .references(() => dataset.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    notes: text("notes").notNull().default(""),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("fit_workspace_created_idx").on(t.workspaceId, t.createdAt), index("fit_dataset_idx").on(t.datasetId)],
);
export type Fit = typeof fit.$inferSelect;
export type NewFit = typeof fit.$inferInsert;

export const revisionStatuses = ["queued", "running", "succeeded", "failed", "cancelled"] as const;
export type RevisionStatus = (typeof revisionStatuses)[number];

/**
 * One launch of a fit. `inputs` is the immutable snapshot (resolved model document, mapping, window,
 * options) written at launch; `progress` is overwritten while it runs; `result` is written once, in the
 * same transaction as the residual rows, and only while the status is still `running`.
 */
export const fitRevision = pgTable(
  "fit_revision",
  {
    id: text("id").primaryKey(),
    fitId: text("fit_id")
      .notNull()
      .references(() => fit.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    parentNumber: integer("parent_number"),
    status: text("status", { enum: revisionStatuses }).notNull().default("queued"),
    inputs: jsonb("inputs").notNull(),
    progress: jsonb("progress"),
    result: jsonb("result"),
    failureReason: text("failure_reason"),
    cancelRequested: timestamp("cancel_requested", { withTimezone: true }),
    jobId: text("job_id"),
    /** runs started so far; the result write is guarded by it, so a superseded attempt cannot commit */
    attempts: integer("attempts").notNull().default(0),
    /** name of the worker process that holds the current attempt (host:pid or WORKER_NAME) */
    runner: text("runner"),
    /**
     * database time of the running attempt's last sign of life, written every few seconds by its worker
     * (workers/heartbeat.ts); a stale one means the runner is gone (the sweeper hands the revision back)
     */
    heartbeatAt: timestamp("heartbeat_at", { withTimezone: true }),
    /** checks at launch that did not refuse the fit (e.g. a k-frame mismatch), `{ kind, message }[]` */
    launchWarnings: jsonb("launch_warnings").$type<{ kind: string; message: string }[]>().notNull().default([]),
    launchedBy: text("launched_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp("started_at", { withTimezone: true }),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("fit_revision_number_idx").on(t.fitId, t.number), index("fit_revision_status_idx").on(t.status)],
);
export type FitRevision = typeof fitRevision.$inferSelect;
export type NewFitRevision = typeof fitRevision.$inferInsert;

/** Per-point residual of a finished revision (rows, so tables page and sort in the database). */
export const fitResidual = pgTable(
  "fit_residual",
  {
    revisionId: text("revision_id")
      .notNull()
      .references(() => fitRevision.id, { onDelete: "cascade" }),
    /** Index of the dataset point (`dataset_point.index`). */
    pointIndex: integer("point_index").notNull(),
    dataBand: integer("data_band").notNull(),
    modelBand: integer("model_band").notNull(),
    pathDistance: doublePrecision("path_distance").notNull(),
    energy: doublePrecision("energy").notNull(),
    modelEnergy: doublePrecision("model_energy").notNull(),
    /** model − data, eV. */
    residual: doublePrecision("residual").notNull(),
    absResidual: doublePrecision("abs_residual").notNull(),
    weightedResidual: doublePrecision("weighted_residual").notNull(),
  },
  (t) => [
    primaryKey({ columns: [t.revisionId, t.pointIndex] }),
    index("fit_residual_band_idx").on(t.revisionId, t.dataBand),
    index("fit_residual_abs_idx").on(t.revisionId, t.absResidual),
  ],
);
export type FitResidual = typeof fitResidual.$inferSelect;
export type NewFitResidual = typeof fitResidual.$inferInsert;
