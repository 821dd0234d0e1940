"use client";

import { type TooltipEntry, tooltipSummary } from "@/lib/views/chart-tooltip";

const signed = (v: number, decimals: number) => v.toFixed(decimals).replace("-", "\u2212");

/**
 * Tooltip of the band charts: the path position once, then one value per series (recharts' default
 * repeats x for every scatter series).
 */
export function BandTooltip({
  active,
  payload,
  labels,
  valueTitle = "E",
  unit = "eV",
  xKey = "x",
}: {
  active?: boolean;
  payload?: readonly unknown[];
  /** series id (the Scatter's or Line's `id`) → label */
  labels: ReadonlyMap<string, string>;
  valueTitle?: string;
  unit?: string;
  /** the data key of the path-distance axis */
  xKey?: string;
}) {
  if (!active || !payload?.length) return null;
  const summary = tooltipSummary(payload as readonly TooltipEntry[], labels, xKey);
  if (summary.rows.length === 0) return null;
  return (
    <div className="rounded-md border border-line bg-surface px-2.5 py-1.5 text-xs tabular-nums shadow-sm">
      {summary.x !== null ? <p className="font-medium text-ink">k along the path: {summary.x.toFixed(4)} 1/Å</p> : null}
      <ul className="mt-0.5">
        {summary.rows.map((row) => (
          <li key={row.id} className="flex items-center gap-1.5 text-ink">
            <span aria-hidden="true" className="inline-block size-2 rounded-full" style={{ backgroundColor: row.colour }} />
            {row.label}: {valueTitle} = {signed(row.value, 4)} {unit}
          </li>
        ))}
      </ul>
    </div>
  );
}
