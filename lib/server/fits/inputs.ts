import { z } from "zod";
import { bandMappingSchema, energyWindowSchema, fitOptionsSchema, modelSpecSchema } from "@/lib/fit/bands";
import { INT4_MAX } from "@/lib/schemas/url-integer";

/** Body of `POST /api/workspaces/{slug}/fits`: a fit on one dataset and its first revision. */
export const launchFitSchema = z
  .object({
    datasetId: z.string().min(1, "choose a dataset"),
    name: z.string().trim().min(1, "give the fit a name").max(200),
    notes: z.string().max(10_000).default(""),
    /** a model document, or a template request `{ template, latticeConstant?, lattice?, parameters? }` */
    model: modelSpecSchema,
    mapping: bandMappingSchema.optional(),
    /** eV; absent: every point */
    window: energyWindowSchema.optional(),
    options: fitOptionsSchema.optional(),
  })
  .strict();
export type LaunchFitInput = z.output<typeof launchFitSchema>;

const parameterChangeSchema = z
  .object({ value: z.number().finite().optional(), free: z.boolean().optional(), min: z.number().finite().optional(), max: z.number().finite().optional() })
  .strict();

/**
 * Body of `POST …/fits/{fitId}/revisions`: start from revision `from` (its inputs, with its fitted values as
 * start values) and apply the changes given. `model` replaces the model outright; `parameters` edits by
 * name the parameters of the model the revision starts from (`model` when given, else the copied one); `options` fields replace the copied options' fields; `window: null`
 * removes the window.
 */
export const newRevisionSchema = z
  .object({
    from: z.int().min(1, "revisions are numbered from 1").max(INT4_MAX, "no revision has so high a number"),
    model: modelSpecSchema.optional(),
    parameters: z.record(z.string(), parameterChangeSchema).optional(),
    mapping: bandMappingSchema.optional(),
    window: energyWindowSchema.nullable().optional(),
    options: z.record(z.string(), z.unknown()).optional(),
  })
  .strict();
export type NewRevisionInput = z.output<typeof newRevisionSchema>;

/** Query of `GET /api/workspaces/{slug}/fits`: `dataset` (a dataset id) keeps only that dataset's fits. */
export const fitListQuerySchema = z.object({
  dataset: z.uuid("dataset is a dataset id").optional(),
});
