import { z } from "zod";

/** Most points `GET …/datasets/{id}/chart-points` returns, and its default: what one chart draws smoothly. */
export const chartPointLimit = 20_000;

/** Query of `GET …/datasets/{id}/chart-points`: `max` (1–20 000, default 20 000), the most points wanted. */
export const chartPointsQuerySchema = z.object({
  max: z.coerce
    .number({ error: "max is a number of points" })
    .int("max is a whole number of points")
    .min(1, "max is at least 1")
    .max(chartPointLimit, `max is at most ${chartPointLimit}`)
    .default(chartPointLimit),
});
