import { z } from "zod";

/** Columns of the per-point residual table the server can sort by. */
export const residualSortColumns = ["pointIndex", "dataBand", "pathDistance", "energy", "modelEnergy", "residual", "absResidual"] as const;
export type ResidualSortColumn = (typeof residualSortColumns)[number];

/** What the residual table asks the server for. */
export const residualQuerySchema = z.object({
  band: z.int().min(1).optional(),
  page: z.int().min(1).default(1),
  pageSize: z.int().min(1).max(1000).default(25),
  sort: z.enum(residualSortColumns).default("pointIndex"),
  descending: z.boolean().default(false),
});
export type ResidualQuery = z.output<typeof residualQuerySchema>;

/**
 * The query string of `GET …/revisions/{n}/residuals`: `band`, `page` (1-based), `pageSize`, and
 * `sort` as the column name with a leading "-" for descending (e.g. `sort=-absResidual`).
 */
export function residualSearchParams(query: ResidualQuery): URLSearchParams {
  const params = new URLSearchParams();
  if (query.band !== undefined) params.set("band", String(query.band));
  params.set("page", String(query.page));
  params.set("pageSize", String(query.pageSize));
  params.set("sort", `${query.descending ? "-" : ""}${query.sort}`);
  return params;
}

/**
 * The server sort for a table's sorting state (TanStack Table's `[{ id, desc }]`, first entry wins);
 * unknown columns fall back to the point order.
 */
export function sortFromTable(sorting: readonly { id: string; desc: boolean }[]): Pick<ResidualQuery, "sort" | "descending"> {
  const first = sorting[0];
  const column = residualSortColumns.find((c) => c === first?.id);
  return column ? { sort: column, descending: first.desc } : { sort: "pointIndex", descending: false };
}

/** Number of pages for a total row count (at least 1, so an empty table still shows "page 1 of 1"). */
export function pageCount(total: number, pageSize: number): number {
  return Math.max(1, Math.ceil(total / pageSize));
}
