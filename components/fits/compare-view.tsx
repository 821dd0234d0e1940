"use client";

import { formatQuantity } from "@/components/format";
import { Badge, Notice, Panel } from "@/components/ui";
import { revisionAlignment } from "@/lib/fit/bands/energy-alignment";
import { compareBands, compareParameters } from "@/lib/views/compare";
import { useDatasetPoints, useRevision } from "./hooks";
import { OverlayPanel } from "./overlay-panel";
import { ParameterName } from "./parameter-name";

const ev = (v: number | null | undefined, unit: string, error?: number | null) =>
  v === null || v === undefined ? "—" : formatQuantity(v, { unit: unit === "eV" ? "eV" : undefined, error: error ?? undefined, decimals: 4 });

/** Two revisions of one fit side by side. */
export function CompareView({ slug, fitId, a, b }: { slug: string; fitId: string; a: number; b: number }) {
  const ra = useRevision(slug, fitId, a);
  const rb = useRevision(slug, fitId, b);
  const data = useDatasetPoints(slug, ra.data?.inputs.dataset.id);
  const error = ra.error ?? rb.error;
  if (error) return <Notice tone="error">{error.message}</Notice>;
  if (!ra.data || !rb.data) return <p className="text-sm text-ink-muted">Loading both revisions…</p>;
  const resA = ra.data.result;
  const resB = rb.data.result;
  if (!resA || !resB) return <Notice tone="warning">Both revisions need a result to be compared; one of them has none yet.</Notice>;
  const parameters = compareParameters(resA.parameters, resB.parameters);
  const bands = compareBands(resA.bands, resB.bands);
  return (
    <div className="flex flex-col gap-6">
      <Panel
        title="Parameters"
        description="Δ = B − A. “Beyond errors” means |Δ| exceeds the combined standard error √(σA² + σB²); both revisions use the same data, so treat it as a guide."
        flush
      >
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-sm">
            <caption className="sr-only">Parameters of revision {a} (A) and revision {b} (B)</caption>
            <thead className="bg-surface-sunken text-xs uppercase tracking-wide text-ink-muted">
              <tr>
                <th scope="col" className="border-y border-line px-4 py-2 text-left">Parameter</th>
                <th scope="col" className="border-y border-line px-4 py-2 text-right">A: revision {a}</th>
                <th scope="col" className="border-y border-line px-4 py-2 text-right">B: revision {b}</th>
                <th scope="col" className="border-y border-line px-4 py-2 text-right">Δ</th>
                <th scope="col" className="border-y border-line px-4 py-2 text-right">Combined σ</th>
                <th scope="col" className="border-y border-line px-4 py-2 text-left">Verdict</th>
              </tr>
            </thead>
            <tbody>
              {parameters.map((row) => (
                <tr key={row.name} className="border-b border-line last:border-b-0">
                  <th scope="row" className="px-4 py-2 text-left font-medium">
                    <ParameterName name={row.name} />
                    {row.a && row.b && row.a.free !== row.b.free ? <span className="ml-2 text-xs text-ink-muted">({row.b.free ? "freed in B" : "fixed in B"})</span> : null}
                  </th>
                  <td className="px-4 py-2 text-right tabular-nums whitespace-nowrap">{row.a ? ev(row.a.value, row.unit, row.a.standardError) : "absent"}</td>
                  <td className="px-4 py-2 text-right tabular-nums whitespace-nowrap">{row.b ? ev(row.b.value, row.unit, row.b.standardError) : "absent"}</td>
                  <td className="px-4 py-2 text-right tabular-nums whitespace-nowrap">{row.difference === null ? "—" : formatQuantity(row.difference, { unit: row.unit === "eV" ? "eV" : undefined, decimals: 4, showPlus: true })}</td>
                  <td className="px-4 py-2 text-right tabular-nums whitespace-nowrap">{ev(row.combinedError, row.unit)}</td>
                  <td className="px-4 py-2">
                    {row.differsBeyondErrors === null ? (
                      <span className="text-ink-muted">no errors to compare</span>
                    ) : row.differsBeyondErrors ? (
                      <Badge tone="caution">beyond errors</Badge>
                    ) : (
                      <Badge tone="neutral">within errors</Badge>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Panel>
      <Panel title="RMS per band" flush>
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">RMS per data band of both revisions</caption>
          <thead className="bg-surface-sunken text-xs uppercase tracking-wide text-ink-muted">
            <tr>
              <th scope="col" className="border-y border-line px-4 py-2 text-right">Data band</th>
              <th scope="col" className="border-y border-line px-4 py-2 text-right">A: RMS</th>
              <th scope="col" className="border-y border-line px-4 py-2 text-right">B: RMS</th>
              <th scope="col" className="border-y border-line px-4 py-2 text-right">Change</th>
            </tr>
          </thead>
          <tbody>
            {bands.map((row) => (
              <tr key={row.dataBand} className="border-b border-line last:border-b-0 tabular-nums">
                <td className="px-4 py-2 text-right">{row.dataBand}</td>
                <td className="px-4 py-2 text-right">{ev(row.rmsA, "eV")}</td>
                <td className="px-4 py-2 text-right">{ev(row.rmsB, "eV")}</td>
                <td className="px-4 py-2 text-right">{row.change === null ? "—" : formatQuantity(row.change, { unit: "eV", decimals: 4, showPlus: true })}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Panel>
      <Panel title="Both models over the data" description={`Solid lines: revision ${a}; dashed: revision ${b}.`}>
        {data.dataset && data.points ? (
          <OverlayPanel
            dataset={data.dataset}
            points={data.points}
            models={[
              { key: "a", label: `revision ${a}`, model: resA.fittedModel, alignment: revisionAlignment(resA.parameters, ra.data.inputs.options) },
              { key: "b", label: `revision ${b}`, model: resB.fittedModel, alignment: revisionAlignment(resB.parameters, rb.data.inputs.options), dashed: true },
            ]}
            mapping={ra.data.inputs.mapping}
            window={ra.data.inputs.window}
            showResiduals={false}
          />
        ) : (
          <p className="text-sm text-ink-muted">Loading the data…</p>
        )}
      </Panel>
    </div>
  );
}
