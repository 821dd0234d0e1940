import { z } from "zod";
import { residualSortKeys } from "@/db/queries/fit-residuals";

const sortValues = [...residualSortKeys, ...residualSortKeys.map((k) => `-${k}` as const)] as const;

/** Query of `GET …/revisions/{n}/residuals`: `band` (data band), `page` (1-based), `pageSize` (≤ 1000), `sort` ("-absResidual"…). */
export const residualQuerySchema = z.object({
  band: z.coerce.number().int().min(1).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(1000).default(100),
  sort: z.enum(sortValues).default("pointIndex"),
});
