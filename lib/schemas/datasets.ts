import { z } from "zod";
import { positiveIntFromUrl } from "./url-integer";

/** Limits the dataset routes and the rename form share. */
export const datasetNameMaxLength = 200;
export const datasetDescriptionMaxLength = 5000;

/** Body of `PATCH /api/workspaces/{slug}/datasets/{id}`: a new name, a new description, or both. */
export const datasetChangesSchema = z
  .object({
    name: z.string().trim().min(1, "a dataset needs a name").max(datasetNameMaxLength, `at most ${datasetNameMaxLength} characters`).optional(),
    description: z.string().max(datasetDescriptionMaxLength, `at most ${datasetDescriptionMaxLength} characters`).optional(),
  })
  .strict()
  .refine((c) => c.name !== undefined || c.description !== undefined, "send a name, a description, or both");
export type DatasetChanges = z.infer<typeof datasetChangesSchema>;

/** Columns the points table sorts by (server-side). */
export const pointSortKeys = ["index", "row", "kIndex", "pathDistance", "band", "energy", "sigma"] as const;
export type PointSortKey = (typeof pointSortKeys)[number];

/** Largest page of points one request returns. */
export const maxPointsPageSize = 500;

/**
 * Query of `GET …/datasets/{id}/points`: `band` (1-based, optional filter), `page` (1-based, default 1),
 * `pageSize` (1–500, default 50), `sort` (a column, `-` in front for descending; default `index`, file order).
 */
export const pointsQuerySchema = z.object({
  band: positiveIntFromUrl("band").optional(),
  page: positiveIntFromUrl("page").default(1),
  pageSize: positiveIntFromUrl("pageSize", maxPointsPageSize).default(50),
  sort: z
    .string()
    .default("index")
    .transform((value, ctx) => {
      const descending = value.startsWith("-");
      const column = descending ? value.slice(1) : value;
      const key = pointSortKeys.find((k) => k === column);
      if (!key) {
        ctx.addIssue({ code: "custom", message: `sort by one of ${pointSortKeys.join(", ")} (prefix - for descending)` });
        return z.NEVER;
      }
      return { column: key, direction: descending ? ("desc" as const) : ("asc" as const) };
    }),
});
export type PointsQuery = z.output<typeof pointsQuerySchema>;
