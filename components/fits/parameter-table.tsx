"use client";

import { Badge, DataTable, Notice, dataColumnHelper } from "@/components/ui";
import { formatQuantity } from "@/components/format";
import type { BandFitParameter, BandFitWarning } from "@/lib/fit/bands/schema";
import { ParameterName } from "./parameter-name";

const column = dataColumnHelper<BandFitParameter>();
const unitOf = (p: BandFitParameter) => (p.unit === "eV" ? "eV" : undefined);
const bound = (value: number | undefined, p: BandFitParameter) => (value === undefined ? "—" : formatQuantity(value, { unit: unitOf(p) }));

const columns = column.columns([
  column.accessor("name", { header: "Parameter", cell: (c) => <ParameterName name={c.getValue()} /> }),
  column.accessor("value", {
    header: "Fitted value",
    meta: { numeric: true },
    cell: (c) => formatQuantity(c.getValue(), { error: c.row.original.standardError ?? undefined, unit: unitOf(c.row.original) }),
  }),
  column.accessor("start", { header: "Start", meta: { numeric: true }, cell: (c) => formatQuantity(c.getValue(), { unit: unitOf(c.row.original) }) }),
  column.accessor("min", { header: "Min", meta: { numeric: true }, cell: (c) => bound(c.getValue(), c.row.original) }),
  column.accessor("max", { header: "Max", meta: { numeric: true }, cell: (c) => bound(c.getValue(), c.row.original) }),
  column.accessor("free", {
    header: "Status",
    cell: (c) => {
      const p = c.row.original;
      if (!p.free) return <Badge tone="neutral">fixed</Badge>;
      if (!p.determined) return <Badge tone="caution">{p.atBound ? `at ${p.atBound} bound` : "not determined"}</Badge>;
      return <Badge tone="success">free</Badge>;
    },
  }),
]);

/** Fitted parameters (value ± standard error, start, bounds, free/fixed) with the fit's warnings above them. */
export function ParameterTable({ parameters, warnings }: { parameters: BandFitParameter[]; warnings: BandFitWarning[] }) {
  return (
    <div className="flex flex-col gap-3">
      {warnings.length > 0 ? (
        <Notice tone="warning" title={`${warnings.length} warning${warnings.length === 1 ? "" : "s"} about this fit`} className="mx-4 mt-4">
          <ul className="list-disc pl-4">
            {warnings.map((w, i) => (
              <li key={i}>{w.message}</li>
            ))}
          </ul>
        </Notice>
      ) : null}
      <DataTable columns={columns} data={parameters} caption="Parameters: fitted value ± standard error; bounds in the parameter's unit." getRowId={(p) => p.name} />
    </div>
  );
}
