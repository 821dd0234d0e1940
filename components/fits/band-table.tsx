"use client";

import { formatQuantity } from "@/components/format";
import { DataTable, dataColumnHelper } from "@/components/ui";
import type { RevisionResult } from "@/lib/views/responses";

type BandRow = RevisionResult["bands"][number];
const column = dataColumnHelper<BandRow>();
const ev = (v: number) => formatQuantity(v, { unit: "eV", decimals: 4 });
const columns = column.columns([
  column.accessor("dataBand", { header: "Data band", meta: { numeric: true } }),
  column.accessor("modelBand", { header: "Model band", meta: { numeric: true }, cell: (c) => c.getValue() ?? "nearest" }),
  column.accessor("points", { header: "Points", meta: { numeric: true } }),
  column.accessor("rms", { header: "RMS", meta: { numeric: true }, cell: (c) => ev(c.getValue()) }),
  column.accessor("maxAbs", { header: "Max |residual|", meta: { numeric: true }, cell: (c) => ev(c.getValue()) }),
  column.accessor("mean", { header: "Mean residual", meta: { numeric: true }, cell: (c) => ev(c.getValue()) }),
]);

/** RMS, maximum |residual| and mean residual (model − data) per data band. */
export function BandTable({ bands }: { bands: BandRow[] }) {
  return <DataTable columns={columns} data={bands} caption="Residuals per band (model − data)" getRowId={(b) => String(b.dataBand)} />;
}
