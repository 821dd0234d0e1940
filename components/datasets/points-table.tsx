"use client";

import { createColumnHelper, rowSortingFeature, tableFeatures, useTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useTransition } from "react";
import { formatQuantity } from "@/components/format";
import { Button, Select, TableView, type DataColumnMeta } from "@/components/ui";
import type { StoredPoint } from "@/db/queries/datasets";
import type { PointSortKey } from "@/lib/schemas/datasets";

// Sorting, the band filter and the page live in the URL; the server page reads them and queries one page,
// so half a million points never reach the browser.
const features = tableFeatures({ rowSortingFeature, columnMeta: {} as DataColumnMeta });
const column = createColumnHelper<typeof features, StoredPoint>();

const quantity = (value: number | null, unit: string, decimals = 4) => (value === null ? "—" : formatQuantity(value, { unit, decimals }));

// `any` is the library's own convention for a list of columns whose values differ in type.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const columns: ColumnDef<typeof features, StoredPoint, any>[] = [
  column.accessor("index", { id: "index", header: "#", cell: (c) => c.getValue() + 1, meta: { numeric: true } }),
  column.accessor("row", { id: "row", header: "File line", meta: { numeric: true } }),
  column.accessor("band", { id: "band", header: "Band", meta: { numeric: true } }),
  column.accessor("pathDistance", { id: "pathDistance", header: "Path distance", cell: (c) => quantity(c.getValue(), "1/Å"), meta: { numeric: true } }),
  column.display({
    id: "k",
    header: "k (1/Å)",
    cell: ({ row }) => [row.original.kx, row.original.ky, row.original.kz].map((x) => formatQuantity(x, { decimals: 4 })).join(", "),
    enableSorting: false,
    meta: { numeric: true },
  }),
  column.accessor("energy", { id: "energy", header: "Energy", cell: (c) => quantity(c.getValue(), "eV"), meta: { numeric: true } }),
  column.accessor("sigma", { id: "sigma", header: "σ", cell: (c) => quantity(c.getValue(), "eV"), meta: { numeric: true } }),
  column.accessor("label", { id: "label", header: "Label", cell: (c) => c.getValue() ?? "—", enableSorting: false }),
];

const sortable = new Set<string>(["index", "row", "band", "pathDistance", "energy", "sigma"]);

interface PointsTableProps {
  points: StoredPoint[];
  total: number;
  page: number;
  pageSize: number;
  sort: { column: PointSortKey; direction: "asc" | "desc" };
  band: number | undefined;
  bands: readonly number[];
}

export function PointsTable({ points, total, page, pageSize, sort, band, bands }: PointsTableProps) {
  const router = useRouter();
  const pathname = usePathname();
  const searchParams = useSearchParams();
  const [pending, startTransition] = useTransition();
  const pageCount = Math.max(1, Math.ceil(total / pageSize));

  const navigate = (changes: Record<string, string | undefined>) => {
    const next = new URLSearchParams(searchParams.toString());
    for (const [key, value] of Object.entries(changes)) {
      if (value === undefined) next.delete(key);
      else next.set(key, value);
    }
    startTransition(() => router.push(`${pathname}?${next.toString()}`, { scroll: false }));
  };

  const sorting: SortingState = [{ id: sort.column, desc: sort.direction === "desc" }];
  const table = useTable({
    features,
    columns,
    data: points,
    manualSorting: true,
    state: { sorting },
    enableSortingRemoval: false,
    onSortingChange: (updater) => {
      const [first] = typeof updater === "function" ? updater(sorting) : updater;
      if (!first || !sortable.has(first.id)) return;
      navigate({ sort: `${first.desc ? "-" : ""}${first.id}`, page: undefined });
    },
  });

  return (
    <div aria-busy={pending}>
      <div className="flex flex-wrap items-center gap-3 border-b border-line px-4 py-2 text-sm">
        <label htmlFor="band-filter" className="text-ink-muted">
          Band
        </label>
        <Select
          id="band-filter"
          density="compact"
          value={band === undefined ? "" : String(band)}
          onChange={(event) => navigate({ band: event.target.value || undefined, page: undefined })}
        >
          <option value="">All bands</option>
          {bands.map((b) => (
            <option key={b} value={b}>
              Band {b}
            </option>
          ))}
        </Select>
        <p className="ml-auto tabular-nums text-ink-muted">
          {total.toLocaleString("en-US")} points · page {page} of {pageCount}
        </p>
      </div>
      <TableView
        table={table}
        caption={`Points of this dataset, ${pageSize} per page, sorted on the server`}
        captionHidden
        empty="No points on this page."
        density="dense"
        className={pending ? "opacity-60" : undefined}
      />
      <nav aria-label="Pages of points" className="flex items-center justify-end gap-2 px-4 py-2">
        <Button variant="secondary" size="sm" disabled={page <= 1 || pending} onClick={() => navigate({ page: String(page - 1) })}>
          Previous page
        </Button>
        <Button variant="secondary" size="sm" disabled={page >= pageCount || pending} onClick={() => navigate({ page: String(page + 1) })}>
          Next page
        </Button>
      </nav>
    </div>
  );
}
