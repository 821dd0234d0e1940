"use client";

import type { ReactTable, RowData, rowSortingFeature, SortDirection, TableFeatures } from "@tanstack/react-table";
// The static forms keep the sorting API typed for any feature set; a generic `TFeatures` hides the methods.
import { column_getCanSort, column_getIsSorted, column_getToggleSortingHandler } from "@tanstack/react-table/static-functions";
import type { ReactNode } from "react";
import { cx } from "./class-names";

/** Per-column presentation hints read by {@link TableView}. */
export interface DataColumnMeta {
  /** Right-align with tabular figures (numbers with units). */
  numeric?: boolean;
  /** Tabular figures without right alignment (dates, times, indices). */
  figures?: boolean;
  /** Right-align without number styling (row actions). */
  alignEnd?: boolean;
  /** Screen-reader-only header text for columns whose visible header is empty (row actions). */
  srHeader?: string;
}

/** Any feature set with sorting and {@link DataColumnMeta} column hints. */
export type TableViewFeatures = TableFeatures & { rowSortingFeature: typeof rowSortingFeature; columnMeta: DataColumnMeta };

/**
 * Cell padding: `regular` for short lists, `dense` for long pages of numbers,
 * `compact` for wide numeric tables that must fit a panel.
 */
export type TableDensity = "regular" | "dense" | "compact";

const headerPadding: Record<TableDensity, string> = { regular: "px-4 py-2", dense: "px-4 py-2", compact: "px-3 py-2" };
const cellPadding: Record<TableDensity, string> = { regular: "px-4 py-2", dense: "px-4 py-1.5", compact: "px-3 py-1.5" };

interface TableViewProps<TFeatures extends TableViewFeatures, Row extends RowData> {
  table: ReactTable<TFeatures, Row>;
  /** Caption naming the table; set `captionHidden` to keep it for screen readers only. */
  caption: string;
  captionHidden?: boolean;
  /** Shown inside the table body when there are no rows. */
  empty: ReactNode;
  density?: TableDensity;
  /** Sets `aria-busy` on the table while its rows are being replaced. */
  busy?: boolean;
  /** Extra classes on the `<table>` (e.g. dimming while a new page loads). */
  className?: string;
}

function sortLabel(direction: false | SortDirection): "ascending" | "descending" | "none" {
  if (direction === "asc") return "ascending";
  if (direction === "desc") return "descending";
  return "none";
}

/**
 * Renders a table instance: sortable headers are buttons with ▲/▼ and `aria-sort`; numeric cells are
 * right-aligned in tabular figures. Sorting itself (client or server) stays with the caller's table.
 */
export function TableView<TFeatures extends TableViewFeatures, Row extends RowData>({
  table,
  caption,
  captionHidden,
  empty,
  density = "regular",
  busy,
  className,
}: TableViewProps<TFeatures, Row>) {
  const rows = table.getRowModel().rows;
  return (
    // relative: screen-reader-only text inside cells is absolutely positioned; without a positioned
    // ancestor here it escapes the scroll box and widens the page on phones
    <div className="relative overflow-x-auto">
      <table className={cx("w-full border-collapse text-sm", className)} aria-busy={busy}>
        <caption className={cx("px-4 py-2 text-left text-sm text-ink-muted", captionHidden && "sr-only")}>{caption}</caption>
        <thead className="bg-surface-sunken">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const meta: DataColumnMeta | undefined = header.column.columnDef.meta;
                const direction = column_getIsSorted(header.column);
                const canSort = column_getCanSort(header.column);
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={canSort ? sortLabel(direction) : undefined}
                    className={cx(
                      "border-y border-line text-xs font-semibold uppercase tracking-wide text-ink-muted",
                      headerPadding[density],
                      meta?.numeric || meta?.alignEnd ? "text-right" : "text-left",
                    )}
                  >
                    {header.isPlaceholder ? null : canSort ? (
                      <button
                        type="button"
                        onClick={column_getToggleSortingHandler(header.column)}
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
              <td colSpan={table.getAllLeafColumns().length} className="px-4 py-6 text-center text-ink-muted">
                {empty}
              </td>
            </tr>
          ) : (
            rows.map((row) => (
              <tr key={row.id} className="border-b border-line last:border-b-0 hover:bg-surface-raised">
                {row.getAllCells().map((cell) => {
                  const meta: DataColumnMeta | undefined = cell.column.columnDef.meta;
                  return (
                    <td
                      key={cell.id}
                      className={cx(
                        "align-middle",
                        cellPadding[density],
                        meta?.numeric && "whitespace-nowrap text-right tabular-nums",
                        meta?.figures && "whitespace-nowrap tabular-nums",
                        meta?.alignEnd && "whitespace-nowrap text-right",
                      )}
                    >
                      <table.FlexRender cell={cell} />
                    </td>
                  );
                })}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}
