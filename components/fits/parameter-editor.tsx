"use client";

import { Input } from "@/components/ui";
import type { ParameterDraft } from "@/lib/views/launch-draft";
import { parameterLabel } from "@/lib/views/parameter-label";
import { ParameterName } from "./parameter-name";

type ErrorsFor = (field: string) => string[] | undefined;

function Cell({ id, label, value, onChange, errors }: { id: string; label: string; value: string; onChange: (v: string) => void; errors?: string[] }) {
  return (
    <div className="flex flex-col">
      <Input
        id={id}
        density="compact"
        inputMode="decimal"
        className="w-28 text-right tabular-nums"
        aria-label={label}
        aria-invalid={errors ? true : undefined}
        aria-describedby={errors ? `${id}-error` : undefined}
        value={value}
        onChange={(e) => onChange(e.target.value)}
      />
      {errors ? (
        <span id={`${id}-error`} className="mt-0.5 max-w-28 text-xs font-medium text-danger-700">
          {errors.join(" ")}
        </span>
      ) : null}
    </div>
  );
}

/** The parameter table of the launch form: value, free/fixed and bounds per parameter, with units. */
export function ParameterEditor({ rows, onChange, errorsFor }: { rows: ParameterDraft[]; onChange: (rows: ParameterDraft[]) => void; errorsFor: ErrorsFor }) {
  const update = (i: number, change: Partial<ParameterDraft>) => onChange(rows.map((r, j) => (j === i ? { ...r, ...change } : r)));
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Model parameters: start value, whether it is fitted, and bounds</caption>
        <thead className="bg-surface-sunken text-xs uppercase tracking-wide text-ink-muted">
          <tr>
            <th scope="col" className="border-y border-line px-3 py-2 text-left">Parameter</th>
            <th scope="col" className="border-y border-line px-3 py-2 text-left">Start value</th>
            <th scope="col" className="border-y border-line px-3 py-2 text-left">Unit</th>
            <th scope="col" className="border-y border-line px-3 py-2 text-left">Fit it</th>
            <th scope="col" className="border-y border-line px-3 py-2 text-left">Min</th>
            <th scope="col" className="border-y border-line px-3 py-2 text-left">Max</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row, i) => {
            const key = `parameters.${row.name}`;
            const safeId = `param-${i}`;
            const label = parameterLabel(row.name);
            return (
              <tr key={row.name} className="border-b border-line align-top last:border-b-0">
                <th scope="row" className="px-3 py-1.5 text-left font-medium">
                  <ParameterName name={row.name} />
                  {row.description ? <span className="block text-xs font-normal text-ink-muted">{row.description}</span> : null}
                </th>
                <td className="px-3 py-1.5">
                  <Cell id={`${safeId}-value`} label={`${label} start value`} value={row.value} onChange={(value) => update(i, { value })} errors={errorsFor(`${key}.value`)} />
                </td>
                <td className="px-3 py-1.5 text-ink-muted">{row.unit === "eV" ? "eV" : "1"}</td>
                <td className="px-3 py-1.5">
                  <label className="inline-flex items-center gap-1.5">
                    <input type="checkbox" className="accent-accent-700" checked={row.free} onChange={(e) => update(i, { free: e.target.checked })} aria-label={`fit ${label}`} />
                    {row.free ? "free" : "fixed"}
                  </label>
                </td>
                <td className="px-3 py-1.5">
                  <Cell id={`${safeId}-min`} label={`${label} lower bound`} value={row.min} onChange={(min) => update(i, { min })} errors={errorsFor(`${key}.min`)} />
                </td>
                <td className="px-3 py-1.5">
                  <Cell id={`${safeId}-max`} label={`${label} upper bound`} value={row.max} onChange={(max) => update(i, { max })} errors={errorsFor(`${key}.max`)} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
