import { z } from "zod";
import { residualSortKeys } from "@/db/queries/fit-residuals";
import { positiveIntFromUrl } from "@/lib/schemas/url-integer";

const sortValues = [...residualSortKeys, ...residualSortKeys.map((k) => `-${k}` as const)] as const;

/** Query of `GET …/revisions/{n}/residuals`: `band` (data band), `page` (1-based), `pageSize` (≤ 1000), `sort` ("-absResidual"…). */
export const residualQuerySchema = z.object({
  band: positiveIntFromUrl("band").optional(),
  page: positiveIntFromUrl("page").default(1),
  pageSize: positiveIntFromUrl("pageSize", 1000).default(100),
  sort: z.enum(sortValues).default("pointIndex"),
});
