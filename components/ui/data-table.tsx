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
import { TableView, type DataColumnMeta } from "./table-view";

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

  return <TableView table={table} caption={caption} captionHidden={captionHidden} empty={empty ?? "Nothing to show."} />;
}
