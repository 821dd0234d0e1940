"use client";

import { formatDateTime, formatQuantity } from "@/components/format";
import { ButtonLink, EmptyState, Notice, Panel, buttonClasses } from "@/components/ui";
import { revisionAlignment } from "@/lib/fit/bands/energy-alignment";
import type { RevisionDetails } from "@/lib/views/responses";
import { fitRoutes } from "./api";
import { BandTable } from "./band-table";
import { ConvergenceChart } from "./convergence-chart";
import { CorrelationHeatmap } from "./correlation-heatmap";
import { useDatasetPoints, useRevision } from "./hooks";
import { OverlayPanel } from "./overlay-panel";
import { ParameterTable } from "./parameter-table";
import { ProgressPanel } from "./progress-panel";
import { ResidualTable } from "./residual-table";

const statusText: Record<RevisionDetails["status"], string> = {
  queued: "queued",
  running: "running",
  succeeded: "finished",
  failed: "failed",
  cancelled: "cancelled",
};

/** eV → meV without rounding noise (3e-4 eV is 0.3 meV, not 0.30000000000000004). */
const inMeV = (ev: number) => Number((ev * 1000).toPrecision(12));

function InputsSummary({ revision }: { revision: RevisionDetails }) {
  const { inputs } = revision;
  const free = inputs.model.parameters.filter((p) => p.free).length;
  const mapping =
    inputs.mapping.kind === "nearest"
      ? "each point to the nearest model band"
      : `data bands ${inputs.mapping.dataBands ? inputs.mapping.dataBands.join("–") : "(all)"} → model bands from ${inputs.mapping.firstModelBand}`;
  const rows: [string, string][] = [
    ["Launched by", revision.launchedBy ?? "a former member"],
    ["Launched", formatDateTime(new Date(revision.createdAt))],
    ["Finished", revision.finishedAt ? formatDateTime(new Date(revision.finishedAt)) : "—"],
    ["Dataset", `${inputs.dataset.name} (SHA-256 ${inputs.dataset.sha256.slice(0, 12)}…)`],
    ["Model", `${inputs.model.name}${inputs.model.template ? ` (template ${inputs.model.template})` : ""}: ${inputs.model.parameters.length} parameters, ${free} free`],
    ["Band mapping", mapping],
    ["Energy window", inputs.window ? `${formatQuantity(inputs.window.min, { unit: "eV", decimals: 2 })} to ${formatQuantity(inputs.window.max, { unit: "eV", decimals: 2 })}` : "every point"],
    ["σ", inputs.options.sigma === "uniform" ? `${inputs.options.uniformSigma} eV for every point` : `from the data, ${inputs.options.uniformSigma} eV where missing`],
    ["Limits", `${inputs.options.maxIterations} iterations, ${inputs.options.timeLimitMs / 1000} s, ${inputs.options.starts} start${inputs.options.starts === 1 ? "" : "s"} (seed ${inputs.options.seed})`],
    ["Energy offset", `${inputs.options.energyOffset.free ? "fitted from" : "fixed at"} ${formatQuantity(inputs.options.energyOffset.value, { unit: "eV" })}`],
    ["Renormalisation", `${inputs.options.renormalisation.free ? "fitted from" : "fixed at"} ${inputs.options.renormalisation.value}`],
  ];
  // a result says what its fit used; one stored before crossings were treated has no tolerance
  const crossingTolerance = revision.result ? (revision.result.crossings?.tolerance ?? null) : inputs.options.crossingTolerance;
  rows.push([
    "Band crossings",
    crossingTolerance === null
      ? "not treated (fitted before band crossings were)"
      : crossingTolerance > 0
        ? `bands within ${inMeV(crossingTolerance)} meV of another take the degenerate-subspace derivative`
        : "not treated",
  ]);
  if (revision.parentNumber) rows.splice(2, 0, ["Started from", `revision ${revision.parentNumber}`]);
  return (
    <dl className="grid grid-cols-1 gap-x-6 gap-y-1.5 text-sm sm:grid-cols-[max-content_1fr]">
      {rows.map(([term, value]) => (
        <div key={term} className="contents">
          <dt className="text-ink-muted">{term}</dt>
          <dd className="tabular-nums">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

/** The revision page's body: progress while it runs, then charts, tables and downloads. */
export function RevisionView({ slug, fitId, number, canEdit }: { slug: string; fitId: string; number: number; canEdit: boolean }) {
  const revision = useRevision(slug, fitId, number);
  const data = useDatasetPoints(slug, revision.data?.inputs.dataset.id);
  if (revision.isPending) return <p className="text-sm text-ink-muted">Loading the revision…</p>;
  if (revision.error) return <Notice tone="error">{revision.error.message}</Notice>;
  const r = revision.data;
  const routes = fitRoutes(slug);
  const result = r.result;
  const running = r.status === "queued" || r.status === "running";

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center gap-3">
        <p className="text-sm">
          <span className="font-medium">{r.fitName}</span> ·{" "}
          Status: <strong data-testid="revision-status">{statusText[r.status]}</strong>
          {result ? (
            <span className="tabular-nums">
              {" "}
              · RMS {formatQuantity(result.rms, { unit: "eV", decimals: 4 })} over {result.pointsUsed} points · reduced χ² {result.reducedChiSquared.toPrecision(4)} · {result.iterations} iterations ({result.stopReason.replace(/-/g, " ")})
              {result.crossings ? (
                <span data-testid="crossing-count">
                  {" "}
                  · {result.crossings.points} point{result.crossings.points === 1 ? "" : "s"} at band crossings (within {inMeV(result.crossings.tolerance)} meV)
                </span>
              ) : null}
            </span>
          ) : null}
        </p>
        <div className="ml-auto flex flex-wrap gap-2">
          {canEdit && !running ? (
            <ButtonLink href={`/w/${slug}/fits/${fitId}/revisions/new?from=${number}`} variant="primary" size="sm">
              New revision from this one
            </ButtonLink>
          ) : null}
          <ButtonLink href={`/w/${slug}/fits/${fitId}`} variant="secondary" size="sm">
            All revisions
          </ButtonLink>
        </div>
      </div>
      {running ? <ProgressPanel slug={slug} fitId={fitId} revision={r} canCancel={canEdit} /> : null}
      {r.status === "failed" ? <Notice tone="error" title="The fit failed">{r.failureReason ?? "No reason was recorded."}</Notice> : null}
      {r.status === "cancelled" ? (
        <Notice tone="warning" title="Cancelled">
          {result ? "The fit was stopped; the results below are its best point so far." : "The fit was cancelled before it stored a result."}
        </Notice>
      ) : null}
      {r.launchWarnings.length ? (
        <Notice tone="warning" title="Checks before the fit">
          <ul className="list-disc pl-4">
            {r.launchWarnings.map((w, i) => (
              <li key={i}>{w.message}</li>
            ))}
          </ul>
        </Notice>
      ) : null}

      {result ? (
        <>
          <Panel title="Bands over the data" description="Dots are data points, lines the fitted model on the data's own k-points; colours pair each data band with its model band.">
            {data.error ? <Notice tone="error">{data.error.message}</Notice> : null}
            {data.dataset && data.points ? (
              <>
                <OverlayPanel
                  dataset={data.dataset}
                  points={data.points}
                  models={[{ key: "fit", label: `revision ${number}`, model: result.fittedModel, alignment: revisionAlignment(result.parameters, r.inputs.options) }]}
                  mapping={r.inputs.mapping}
                  window={r.inputs.window}
                  showResiduals
                  figure={{ fitName: r.fitName, revision: number }}
                />
              </>
            ) : (
              <p className="text-sm text-ink-muted">Loading the data…</p>
            )}
          </Panel>
          <Panel title="Parameters" flush>
            <ParameterTable parameters={result.parameters} warnings={result.warnings} />
          </Panel>
          <div className="grid grid-cols-[minmax(0,1fr)] gap-6 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
            <Panel title="Residuals per band" flush>
              <BandTable bands={result.bands} />
            </Panel>
            <Panel title="Convergence" description="χ² of the best start, per iteration.">
              <ConvergenceChart trace={result.trace} />
            </Panel>
          </div>
          <Panel title="Residuals per point" description="Sorted and paged on the server; choose a column header to sort." flush>
            <ResidualTable slug={slug} fitId={fitId} revision={number} bands={result.bands.map((b) => b.dataBand)} />
          </Panel>
          <Panel title="Parameter correlations" description="Blue: anti-correlated, orange: correlated; outlined cells exceed |0.99|, where the data cannot tell the pair apart.">
            <CorrelationHeatmap names={result.correlation.names} matrix={result.correlation.matrix} />
          </Panel>
          <Panel title="Downloads">
            <div className="flex flex-wrap gap-2">
              <a className={buttonClasses("secondary", "sm")} href={routes.exportJson(fitId, number)} download>
                Parameter set (JSON)
              </a>
              <a className={buttonClasses("secondary", "sm")} href={routes.residualsCsv(fitId, number)} download>
                Residuals (CSV)
              </a>
              <a className={buttonClasses("secondary", "sm")} href={routes.bandsCsv(fitId, number)} download>
                Model bands (CSV)
              </a>
            </div>
          </Panel>
        </>
      ) : !running && r.status !== "failed" ? (
        <EmptyState title="No result" description="This revision ended without a result." />
      ) : null}
      <Panel title="Inputs of this revision">
        <InputsSummary revision={r} />
      </Panel>
    </div>
  );
}
