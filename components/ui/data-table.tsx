"use client";

import {
  createColumnHelper,
  createSortedRowModel,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
  type ColumnDef,
  type RowData,
  type SortingState,
} from "@tanstack/react-table";
import { useState, type ReactNode } from "react";
import { cx } from "./class-names";

/** Per-column presentation hints. */
export interface DataColumnMeta {
  /** Right-align with tabular figures (numbers with units). */
  numeric?: boolean;
  /** Tabular figures without right alignment (dates, times). */
  figures?: boolean;
  /** Right-align without number styling (row actions). */
  alignEnd?: boolean;
  /** Screen-reader-only header text for columns whose visible header is empty (row actions). */
  srHeader?: string;
}

/** The feature set every Bandwright table uses: client-side sorting on a small, loaded page of rows. */
export const dataTableFeatures = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic, datetime: sortFn_datetime, text: sortFn_text },
  columnMeta: {} as DataColumnMeta,
});

export type DataTableFeatures = typeof dataTableFeatures;

// `any` is the library's own convention for a list of columns whose values differ in type.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type DataColumn<Row extends RowData> = ColumnDef<DataTableFeatures, Row, any>;

/** Column helper bound to {@link dataTableFeatures}; define columns at module scope with it. */
export function dataColumnHelper<Row extends RowData>() {
  return createColumnHelper<DataTableFeatures, Row>();
}

interface DataTableProps<Row extends RowData> {
  /** Stable (module-scope or memoised) column definitions. */
  columns: DataColumn<Row>[];
  data: Row[];
  /** Visible caption naming the table for screen readers; set `captionHidden` to keep it for them only. */
  caption: string;
  captionHidden?: boolean;
  /** Shown inside the table body when `data` is empty. */
  empty?: ReactNode;
  /** Stable row id (defaults to the index). */
  getRowId?: (row: Row) => string;
  initialSorting?: SortingState;
}

function sortLabel(direction: false | "asc" | "desc"): "ascending" | "descending" | "none" {
  if (direction === "asc") return "ascending";
  if (direction === "desc") return "descending";
  return "none";
}

/** A dense, sortable table. Sortable headers are buttons; `aria-sort` reports the order. */
export function DataTable<Row extends RowData>({
  columns,
  data,
  caption,
  captionHidden,
  empty,
  getRowId,
  initialSorting = [],
}: DataTableProps<Row>) {
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const table = useTable({
    features: dataTableFeatures,
    columns,
    data,
    getRowId: getRowId ? (row) => getRowId(row) : undefined,
    state: { sorting },
    onSortingChange: setSorting,
  });
  const rows = table.getRowModel().rows;

  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm">
        <caption className={cx("px-4 py-2 text-left text-sm text-ink-muted", captionHidden && "sr-only")}>{caption}</caption>
        <thead className="bg-surface-sunken">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const meta = header.column.columnDef.meta;
                const direction = header.column.getIsSorted();
                const canSort = header.column.getCanSort();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={canSort ? sortLabel(direction) : undefined}
                    className={cx(
                      "border-y border-line px-4 py-2 text-xs font-semibold uppercase tracking-wide text-ink-muted",
                      meta?.numeric || meta?.alignEnd ? "text-right" : "text-left",
                    )}
                  >
                    {header.isPlaceholder ? null : canSort ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className={cx("inline-flex items-center gap-1 uppercase hover:text-ink", meta?.numeric && "flex-row-reverse")}
                      >
                        <table.FlexRender header={header} />
                        <span aria-hidden="true" className="w-3 text-accent-700">
                          {direction === "asc" ? "▲" : direction === "desc" ? "▼" : ""}
                        </span>
                      </button>
                    ) : meta?.srHeader ? (
                      <span className="sr-only">{meta.srHeader}</span>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={columns.length} className="px-4 py-6 text-center text-ink-muted">
                {empty ?? "Nothing to show."}
              </td>
            </tr>
          ) : (
            rows.map((row) => (
              <tr key={row.id} className="border-b border-line last:border-b-0 hover:bg-surface-raised">
                {row.getAllCells().map((cell) => (
                  <td
                    key={cell.id}
                    className={cx(
                      "px-4 py-2 align-middle",
                      cell.column.columnDef.meta?.numeric && "whitespace-nowrap text-right tabular-nums",
                      cell.column.columnDef.meta?.figures && "whitespace-nowrap tabular-nums",
                      cell.column.columnDef.meta?.alignEnd && "whitespace-nowrap text-right",
                    )}
                  >
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}
