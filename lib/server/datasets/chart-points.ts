import { z } from "zod";
import { positiveIntFromUrl } from "@/lib/schemas/url-integer";

/** Most points `GET …/datasets/{id}/chart-points` returns, and its default: what one chart draws smoothly. */
export const chartPointLimit = 20_000;

/** Query of `GET …/datasets/{id}/chart-points`: `max` (1–20 000, default 20 000), the most points wanted. */
export const chartPointsQuerySchema = z.object({
  max: positiveIntFromUrl("max", chartPointLimit).default(chartPointLimit),
});
