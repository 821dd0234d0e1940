import {
  customType,
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
import type { DatasetMapping, DatasetSummary } from "@/lib/datasets";
import { organization, user } from "./auth";

/** PostgreSQL bytea as a Node Buffer: the uploaded file, kept byte for byte. */
const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

/**
 * An uploaded dispersion file of a workspace: the original bytes with their SHA-256, the mapping that
 * parsed them, and a summary of the parsed points (which live in `dataset_point`).
 */
export const dataset = pgTable(
  "dataset",
  {
    id: text("id").primaryKey(),
    workspaceId: text("workspace_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    source: text("source", { enum: ["calculation", "photoemission"] }).notNull(),
    energyReference: text("energy_reference"),
    mapping: jsonb("mapping").$type<DatasetMapping>().notNull(),
    summary: jsonb("summary").$type<DatasetSummary>().notNull(),
    fileName: text("file_name").notNull(),
    fileType: text("file_type").notNull(),
    fileSize: integer("file_size").notNull(),
    fileSha256: text("file_sha256").notNull(),
    fileBytes: bytea("file_bytes").notNull(),
    pointCount: integer("point_count").notNull(),
    bandCount: integer("band_count").notNull(),
    uploadedBy: text("uploaded_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("dataset_workspace_sha256_idx").on(t.workspaceId, t.fileSha256),
    index("dataset_workspace_created_idx").on(t.workspaceId, t.createdAt),
  ],
);
export type Dataset = typeof dataset.$inferSelect;
export type NewDataset = typeof dataset.$inferInsert;

/** One parsed dispersion point, energies in eV, k Cartesian in 1/Å (2π included). */
export const datasetPoint = pgTable(
  "dataset_point",
  {
    datasetId: text("dataset_id")
      .notNull()
      .references(() => dataset.id, { onDelete: "cascade" }),
    /** Position of the point in the parsed file, 0-based; the fit's residual rows refer to it. */
    index: integer("index").notNull(),
    /** 1-based file line the point came from. */
    row: integer("row").notNull(),
    kIndex: integer("k_index").notNull(),
    kx: doublePrecision("kx").notNull(),
    ky: doublePrecision("ky").notNull(),
    kz: doublePrecision("kz").notNull(),
    pathDistance: doublePrecision("path_distance").notNull(),
    band: integer("band").notNull(),
    energy: doublePrecision("energy").notNull(),
    sigma: doublePrecision("sigma"),
    weight: doublePrecision("weight"),
    label: text("label"),
  },
  (t) => [
    primaryKey({ columns: [t.datasetId, t.index] }),
    index("dataset_point_band_idx").on(t.datasetId, t.band, t.index),
  ],
);
export type DatasetPoint = typeof datasetPoint.$inferSelect;
export type NewDatasetPoint = typeof datasetPoint.$inferInsert;
