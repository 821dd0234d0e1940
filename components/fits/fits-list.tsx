"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { formatDateTime, formatQuantity } from "@/components/format";
import { ButtonLink, DataTable, EmptyState, Notice, dataColumnHelper } from "@/components/ui";
import type { FitSummary } from "@/lib/views/responses";
import { fitApi } from "./api";
import { StatusBadge } from "./status-badge";

type Row = FitSummary & { slug: string };
const column = dataColumnHelper<Row>();
const columns = column.columns([
  column.accessor("name", {
    header: "Fit",
    cell: (c) => (
      <Link className="font-medium text-accent-700 hover:underline" href={`/w/${c.row.original.slug}/fits/${c.row.original.id}`}>
        {c.getValue()}
      </Link>
    ),
  }),
  column.accessor((r) => r.datasetName ?? r.datasetId, {
    id: "dataset",
    header: "Dataset",
    cell: (c) => (
      <Link className="text-accent-700 hover:underline" href={`/w/${c.row.original.slug}/datasets/${c.row.original.datasetId}`}>
        {c.getValue()}
      </Link>
    ),
  }),
  column.accessor("latestRevision", { header: "Latest revision", meta: { numeric: true }, cell: (c) => c.getValue() ?? "—" }),
  column.accessor("latestStatus", { header: "Status", cell: (c) => <StatusBadge status={c.getValue()} /> }),
  column.accessor((r) => r.latestRms ?? null, { id: "rms", header: "RMS", meta: { numeric: true }, cell: (c) => (c.getValue() === null ? "—" : formatQuantity(c.getValue()!, { unit: "eV", decimals: 4 })) }),
  column.accessor((r) => r.createdByName ?? "", { id: "who", header: "Created by" }),
  column.accessor("createdAt", { header: "Created", meta: { figures: true }, cell: (c) => formatDateTime(new Date(c.getValue())) }),
  column.accessor((r) => r.latestFinishedAt ?? null, {
    id: "finished",
    header: "Latest finished",
    meta: { figures: true },
    cell: (c) => (c.getValue() === null ? "—" : formatDateTime(new Date(c.getValue()!))),
  }),
]);

/** The workspace's fits (optionally of one dataset), newest first. */
export function FitsList({ slug, datasetId, canLaunch }: { slug: string; datasetId?: string; canLaunch: boolean }) {
  const fits = useQuery({ queryKey: ["fits", slug, datasetId ?? null], queryFn: () => fitApi.listFits(slug, datasetId) });
  if (fits.isPending) return <p className="text-sm text-ink-muted">Loading fits…</p>;
  if (fits.error) return <Notice tone="error">{fits.error.message}</Notice>;
  const rows = fits.data.fits.map((f) => ({ ...f, slug }));
  if (rows.length === 0)
    return (
      <EmptyState
        title={datasetId ? "No fits on this dataset yet" : "No fits yet"}
        description={canLaunch ? "Pick a dataset and a template, check the preview over the data, and launch a fit." : "Editors launch fits; you will see them here."}
        action={canLaunch ? <ButtonLink href={`/w/${slug}/fits/new${datasetId ? `?dataset=${datasetId}` : ""}`}>New fit</ButtonLink> : undefined}
      />
    );
  return <DataTable columns={columns} data={rows} caption="Fits" captionHidden getRowId={(r) => r.id} initialSorting={[{ id: "createdAt", desc: true }]} />;
}
