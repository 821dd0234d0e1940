"use client";

import { useQuery } from "@tanstack/react-query";
import { isFinalStatus } from "@/lib/views/responses";
import { fitApi } from "./api";

/** How often a running revision is read again, ms. */
export const PROGRESS_POLL_MS = 1000;

/** A revision, read again every second until its status is final. */
export function useRevision(slug: string, fitId: string, n: number) {
  return useQuery({
    queryKey: ["revision", slug, fitId, n],
    queryFn: () => fitApi.getRevision(slug, fitId, n),
    refetchInterval: (query) => (query.state.data && isFinalStatus(query.state.data.status) ? false : PROGRESS_POLL_MS),
  });
}

/** A dataset with its chart points (all of them, or every n-th point of each band on large datasets). */
export function useDatasetPoints(slug: string, datasetId: string | undefined) {
  const details = useQuery({
    queryKey: ["dataset", slug, datasetId],
    queryFn: () => fitApi.getDataset(slug, datasetId!),
    enabled: Boolean(datasetId),
    staleTime: Infinity,
  });
  const dataset = details.data?.dataset;
  const points = useQuery({
    queryKey: ["dataset-chart-points", slug, datasetId],
    queryFn: () => fitApi.chartPoints(slug, datasetId!),
    enabled: Boolean(datasetId),
    staleTime: Infinity,
  });
  return { dataset, points: points.data, error: details.error ?? points.error, loading: details.isPending || points.isPending };
}
