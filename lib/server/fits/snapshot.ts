import { z } from "zod";
import { bandMappingSchema, energyWindowSchema, fitOptionsSchema } from "@/lib/fit/bands";
import { modelDocumentSchema } from "@/lib/tb";

/**
 * The immutable inputs of one revision, written at launch and read by the worker: the resolved model
 * DOCUMENT (never a template reference, so later template changes cannot alter a stored fit), the band
 * mapping, the energy window (eV), the fully defaulted options, and the dataset it ran on with the
 * SHA-256 of its file. Imported by the routes and the worker alike.
 */
export const revisionSnapshotSchema = z.object({
  model: modelDocumentSchema,
  mapping: bandMappingSchema,
  window: energyWindowSchema.nullable(),
  options: fitOptionsSchema,
  dataset: z.object({ id: z.string(), name: z.string(), sha256: z.string() }),
});
export type RevisionSnapshot = z.output<typeof revisionSnapshotSchema>;

/** Live progress of a running revision, as stored and served. */
export const revisionProgressSchema = z.object({
  start: z.int(),
  starts: z.int(),
  iteration: z.int(),
  chiSquared: z.number(),
  elapsedMs: z.number(),
  updatedAt: z.string(),
});
export type RevisionProgress = z.output<typeof revisionProgressSchema>;
