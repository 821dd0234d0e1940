"use client";

import { useState } from "react";
import { correlationCells, correlationScaleStops } from "@/lib/views/heatmap";
import { parameterLabel } from "@/lib/views/parameter-label";

const scaleStops = correlationScaleStops();

/** The colour scale of the heatmap: −1 to +1 with labelled ends and middle (decorative; the text says it). */
function CorrelationScale() {
  return (
    <div className="flex flex-col gap-1 text-xs text-ink-muted">
      <p>Colour scale: correlation coefficient</p>
      <div
        aria-hidden="true"
        className="h-3 w-64 max-w-full rounded-sm border border-line"
        style={{ background: `linear-gradient(to right, ${scaleStops.map((s) => s.fill).join(", ")})` }}
      />
      <div className="flex w-64 max-w-full justify-between tabular-nums">
        <span>−1 anti-correlated</span>
        <span>0</span>
        <span>+1 correlated</span>
      </div>
    </div>
  );
}

const format = (v: number | null) => (v === null ? "not determined" : v.toFixed(3).replace("-", "\u2212"));

/**
 * Correlation of the free parameters as coloured cells (blue −1, white 0, vermillion +1); the value shows
 * on hover or focus, and the same numbers are in the table below for screen readers and copying.
 */
export function CorrelationHeatmap({ names: storedNames, matrix }: { names: string[]; matrix: (number | null)[][] }) {
  const [active, setActive] = useState<string | null>(null);
  const names = storedNames.map(parameterLabel);
  if (names.length === 0) return <p className="text-sm text-ink-muted">No free parameters, so there is nothing to correlate.</p>;
  const cells = correlationCells(names, matrix);
  const activeCell = cells.find((c) => `${c.row}-${c.column}` === active);
  return (
    <div className="flex flex-col gap-3">
      <p className="h-5 text-sm tabular-nums" aria-live="polite">
        {activeCell ? `${activeCell.rowName} × ${activeCell.columnName}: ${format(activeCell.value)}` : "Point at a cell to read its correlation."}
      </p>
      <div className="relative overflow-x-auto" aria-hidden="true">
        <div className="inline-grid gap-px bg-line p-px" style={{ gridTemplateColumns: `auto repeat(${names.length}, 2.25rem)` }}>
          <div className="bg-surface" />
          {names.map((n) => (
            <div key={`h-${n}`} className="flex items-end justify-center bg-surface px-0.5 py-1 text-xs">
              <span className="[writing-mode:vertical-rl] rotate-180 whitespace-nowrap">{n}</span>
            </div>
          ))}
          {names.map((rowName, row) => (
            <div key={`r-${rowName}`} className="contents">
              <div className="flex items-center justify-end bg-surface px-2 text-xs whitespace-nowrap">{rowName}</div>
              {cells
                .filter((c) => c.row === row)
                .map((c) => (
                  <div
                    key={`${c.row}-${c.column}`}
                    tabIndex={-1}
                    onMouseEnter={() => setActive(`${c.row}-${c.column}`)}
                    onMouseLeave={() => setActive(null)}
                    title={`${c.rowName} × ${c.columnName}: ${format(c.value)}`}
                    className={c.strong ? "size-9 outline-2 -outline-offset-2 outline-ink" : "size-9"}
                    style={{ backgroundColor: c.fill }}
                  />
                ))}
            </div>
          ))}
        </div>
      </div>
      <CorrelationScale />
      <details className="text-sm">
        <summary className="cursor-pointer text-accent-700">Correlations as a table</summary>
        <div className="relative mt-2 overflow-x-auto">
          <table className="border-collapse text-xs tabular-nums">
            <caption className="sr-only">Correlation matrix of the free parameters</caption>
            <thead>
              <tr>
                <th scope="col" className="px-2 py-1" />
                {names.map((n) => (
                  <th key={n} scope="col" className="px-2 py-1 text-right font-medium">
                    {n}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {matrix.map((values, row) => (
                <tr key={names[row]} className="border-t border-line">
                  <th scope="row" className="px-2 py-1 text-left font-medium">
                    {names[row]}
                  </th>
                  {values.map((v, col) => (
                    <td key={col} className="px-2 py-1 text-right">
                      {format(v)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </div>
  );
}
