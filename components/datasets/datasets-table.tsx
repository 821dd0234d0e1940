"use client";

import Link from "next/link";
import { formatDateTime } from "@/components/format";
import { Badge, DataTable, dataColumnHelper, type DataColumn } from "@/components/ui";

export interface DatasetListRow {
  id: string;
  href: string;
  name: string;
  source: "calculation" | "photoemission";
  fileName: string;
  pointCount: number;
  bandCount: number;
  uploaderName: string | null;
  createdAt: Date;
}

const column = dataColumnHelper<DatasetListRow>();
const columns: DataColumn<DatasetListRow>[] = [
  column.accessor("name", {
    header: "Name",
    cell: (c) => (
      <Link href={c.row.original.href} className="font-medium text-accent-700 hover:underline">
        {c.getValue()}
      </Link>
    ),
  }),
  column.accessor("source", { header: "Source", cell: (c) => <Badge tone="neutral">{c.getValue() === "calculation" ? "Calculation" : "Photoemission"}</Badge> }),
  column.accessor("pointCount", { header: "Points", cell: (c) => c.getValue().toLocaleString("en-US"), meta: { numeric: true } }),
  column.accessor("bandCount", { header: "Bands", meta: { numeric: true } }),
  column.accessor("fileName", { header: "File", cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
  column.accessor("uploaderName", { header: "Uploaded by", cell: (c) => c.getValue() ?? "—" }),
  column.accessor("createdAt", { header: "Uploaded", cell: (c) => formatDateTime(c.getValue()), meta: { figures: true }, sortFn: "datetime" }),
];

export function DatasetsTable({ rows }: { rows: DatasetListRow[] }) {
  return <DataTable columns={columns} data={rows} caption="Datasets of this workspace" captionHidden getRowId={(r) => r.id} initialSorting={[{ id: "createdAt", desc: true }]} />;
}
