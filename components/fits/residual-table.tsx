"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import {
  createColumnHelper,
  rowPaginationFeature,
  rowSortingFeature,
  tableFeatures,
  useTable,
  type PaginationState,
  type SortingState,
} from "@tanstack/react-table";
import { useState } from "react";
import { formatQuantity } from "@/components/format";
import { Button, Notice, Select, TableView, type DataColumnMeta } from "@/components/ui";
import { pageCount, residualQuerySchema, sortFromTable } from "@/lib/views/residual-query";
import type { ResidualRow } from "@/lib/views/responses";
import { fitApi } from "./api";

// Sorting and paging happen in the database (issue 5's residuals route); the table only holds one page.
const features = tableFeatures({ rowSortingFeature, rowPaginationFeature, columnMeta: {} as DataColumnMeta });
const column = createColumnHelper<typeof features, ResidualRow>();
const ev = (value: number) => formatQuantity(value, { unit: "eV", decimals: 4 });
const numeric: DataColumnMeta = { numeric: true };
const figures: DataColumnMeta = { figures: true };

const columns = column.columns([
  column.accessor("pointIndex", { header: "Point", cell: (c) => c.getValue() + 1, meta: figures }),
  column.accessor("dataBand", { header: "Data band", meta: figures }),
  column.accessor("modelBand", { header: "Model band", enableSorting: false, meta: figures }),
  column.accessor("pathDistance", { header: "Path (1/Å)", cell: (c) => c.getValue().toFixed(4), meta: numeric }),
  column.accessor("energy", { header: "Data E", cell: (c) => ev(c.getValue()), meta: numeric }),
  column.accessor("modelEnergy", { header: "Model E", cell: (c) => ev(c.getValue()), meta: numeric }),
  column.accessor("residual", { header: "Residual", cell: (c) => ev(c.getValue()), meta: numeric }),
  column.accessor((row) => Math.abs(row.residual), { id: "absResidual", header: "|Residual|", sortDescFirst: true, cell: (c) => ev(c.getValue()), meta: numeric }),
  column.accessor("weightedResidual", { header: "Residual/σ", enableSorting: false, cell: (c) => c.getValue().toFixed(3).replace("-", "\u2212"), meta: numeric }),
]);
const emptyRows: ResidualRow[] = [];
const PAGE_SIZE = 25;

/** Every point's residual, one page at a time, sorted and filtered by band on the server. */
export function ResidualTable({ slug, fitId, revision, bands }: { slug: string; fitId: string; revision: number; bands: number[] }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: PAGE_SIZE });
  const [band, setBand] = useState<number | undefined>(undefined);
  const query = residualQuerySchema.parse({ band, page: pagination.pageIndex + 1, pageSize: pagination.pageSize, ...sortFromTable(sorting) });
  const result = useQuery({
    queryKey: ["residuals", slug, fitId, revision, query],
    queryFn: () => fitApi.listResiduals(slug, fitId, revision, query),
    placeholderData: keepPreviousData,
  });
  const table = useTable({
    features,
    columns,
    data: result.data?.rows ?? emptyRows,
    rowCount: result.data?.total,
    state: { sorting, pagination },
    onSortingChange: (updater) => {
      setSorting(updater);
      setPagination((p) => ({ ...p, pageIndex: 0 }));
    },
    onPaginationChange: setPagination,
    manualSorting: true,
    manualPagination: true,
    getRowId: (row) => String(row.pointIndex),
  });
  const total = result.data?.total ?? 0;
  const pages = pageCount(total, pagination.pageSize);
  return (
    <div>
      <div className="flex flex-wrap items-center gap-3 px-4 py-3">
        <label className="flex items-center gap-2 text-sm" htmlFor="residual-band">
          Band
          <Select
            id="residual-band"
            density="compact"
            value={band ?? ""}
            onChange={(e) => {
              setBand(e.target.value === "" ? undefined : Number(e.target.value));
              setPagination((p) => ({ ...p, pageIndex: 0 }));
            }}
          >
            <option value="">all bands</option>
            {bands.map((b) => (
              <option key={b} value={b}>
                data band {b}
              </option>
            ))}
          </Select>
        </label>
        <p className="text-sm text-ink-muted tabular-nums" aria-live="polite">
          {result.isFetching ? "Loading…" : `${total} points · page ${pagination.pageIndex + 1} of ${pages}`}
        </p>
      </div>
      {result.error ? <Notice tone="error" className="mx-4 mb-3">{result.error.message}</Notice> : null}
      <TableView
        table={table}
        caption="Per-point residuals (model − data, eV); sort by a column header"
        captionHidden
        empty={result.isPending ? "Loading residuals…" : "No points in this selection."}
        density="compact"
        busy={result.isFetching}
      />
      <div className="flex items-center justify-end gap-2 px-4 py-3">
        <Button variant="secondary" size="sm" onClick={() => table.previousPage()} disabled={pagination.pageIndex === 0}>
          Previous page
        </Button>
        <Button variant="secondary" size="sm" onClick={() => table.nextPage()} disabled={pagination.pageIndex + 1 >= pages}>
          Next page
        </Button>
      </div>
    </div>
  );
}
