"use client";

import { useMemo, useState } from "react";
import { CartesianGrid, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis, ZAxis } from "recharts";
import { BandTooltip } from "@/components/charts/band-tooltip";
import { MarkerIcon } from "@/components/charts/marker-icon";
import { Button, Input, Notice } from "@/components/ui";
import { dataBandStyles, modelBandStyles } from "@/lib/views/band-colours";
import { bandPairs } from "@/lib/views/band-mapping";
import {
  type ModelBandLine,
  chartResiduals,
  dataSeriesByBand,
  distinctKPoints,
  energyDomain,
  modelBandLines,
  modelEnergiesByKIndex,
} from "@/lib/views/band-series";
import { readNumber } from "@/lib/views/number-field";
import type { ChartPoints, DatasetDetails } from "@/lib/views/responses";
import { pathTicks } from "@/lib/views/ticks";
import type { EnergyAlignment } from "@/lib/fit/bands/energy-alignment";
import type { BandMapping, EnergyWindow } from "@/lib/fit/bands/schema";
import type { ModelDocument } from "@/lib/tb";
import type { ChartFigureSource } from "@/lib/views/figure";
import { BandChart, type LineSeries } from "./band-chart";
import { FigureDownloads } from "./figure-downloads";

/** One model drawn over the data (the compare page draws two). */
export interface OverlayModel {
  key: string;
  label: string;
  model: ModelDocument;
  /** δ, Z and E_ref the model's energies are drawn with */
  alignment: EnergyAlignment;
  dashed?: boolean;
}

const AXIS_FONT = { fontSize: 12, fill: "#4b5563" };

/**
 * Data points and model bands along the path, with per-band toggles and an energy zoom, and (for a single
 * model) the residual chart below.
 */
export function OverlayPanel({
  dataset,
  points,
  models,
  mapping,
  window,
  showResiduals,
  figure,
}: {
  dataset: DatasetDetails;
  /** the chart-points route's answer: every point, or every `stride`-th point of each band */
  points: ChartPoints;
  models: OverlayModel[];
  mapping: BandMapping;
  window: EnergyWindow | null;
  showResiduals: boolean;
  /** set on the revision page: offers the charts as figures for a paper */
  figure?: { fitName: string; revision: number };
}) {
  const bands = dataset.summary.bands;
  const [hidden, setHidden] = useState<Set<number>>(new Set());
  const [zoomText, setZoomText] = useState({ min: "", max: "" });
  const zoomMin = readNumber(zoomText.min);
  const zoomMax = readNumber(zoomText.max);
  const zoom = zoomMin.kind === "number" && zoomMax.kind === "number" && zoomMin.value < zoomMax.value ? { min: zoomMin.value, max: zoomMax.value } : undefined;
  const zoomError = zoomMin.kind === "invalid" || zoomMax.kind === "invalid" ? "enter numbers in eV" : zoomMin.kind === "number" && zoomMax.kind === "number" && !zoom ? "the lower end must be below the upper" : null;

  const styles = useMemo(() => dataBandStyles(bands), [bands]);
  const chartPoints = useMemo(
    () =>
      points.points.map((p) => ({ band: p.band, energy: p.energy, sigma: p.sigma, pathDistance: p.pathDistance, kIndex: p.kIndex, k: [p.kx, p.ky, p.kz] as [number, number, number] })),
    [points],
  );
  const kPoints = useMemo(() => distinctKPoints(chartPoints), [chartPoints]);
  const computed = useMemo(
    () =>
      models.map((m) => {
        try {
          return { ...m, lines: modelBandLines(m.model, kPoints, m.alignment), error: null };
        } catch (error) {
          return { ...m, lines: [] as ModelBandLine[], error: (error as Error).message };
        }
      }),
    [models, kPoints],
  );
  const modelBandCount = computed[0]?.lines.length ?? 0;
  const pairs = useMemo(() => bandPairs(mapping, bands, modelBandCount), [mapping, bands, modelBandCount]);
  const lineStyles = modelBandStyles(modelBandCount, pairs, styles);
  const shownModelBands = new Set(pairs.filter((p) => !hidden.has(p.dataBand) && p.modelBand !== null).map((p) => p.modelBand!));

  const dataSeries = dataSeriesByBand(chartPoints.filter((p) => !hidden.has(p.band))).map((s) => ({
    key: `data-${s.band}`,
    label: `data band ${s.band}`,
    colour: styles.get(s.band)!.colour,
    marker: styles.get(s.band)!.marker,
    points: s.points,
  }));
  const lines: LineSeries[] = computed.flatMap((m) =>
    m.lines
      // A model band disappears with the data band mapped to it; unmapped model bands stay, drawn faint.
      .filter((l) => mapping.kind === "nearest" || !pairs.some((p) => p.modelBand === l.band && hidden.has(p.dataBand)))
      .map((l) => ({
        key: `${m.key}-${l.band}`,
        label: `${m.label} band ${l.band}`,
        colour: mapping.kind === "nearest" ? "#1c5264" : lineStyles[l.band - 1].colour,
        faint: mapping.kind !== "nearest" && !shownModelBands.has(l.band),
        // the compare page's second model is dashed throughout; otherwise the band's own dash
        dash: m.dashed ? "6 4" : mapping.kind === "nearest" ? undefined : lineStyles[l.band - 1].dash,
        points: l.points,
      })),
  );
  const ticks = pathTicks(dataset.summary.ticks.map((t) => ({ label: t.label, position: t.pathDistance })));
  const domain = energyDomain(chartPoints, zoom);

  const residuals = useMemo(() => {
    if (!showResiduals || !computed[0] || computed[0].error) return [];
    const energies = modelEnergiesByKIndex(computed[0].model, chartPoints, computed[0].alignment);
    const modelBandOf = (b: number) => (mapping.kind === "nearest" ? ("nearest" as const) : (pairs.find((p) => p.dataBand === b)?.modelBand ?? null));
    return chartResiduals(chartPoints, energies, modelBandOf, window);
  }, [showResiduals, computed, mapping, pairs, chartPoints, window]);

  const residualLabels = new Map(bands.map((b) => [`residual-${b}`, `band ${b}`]));

  const figureSource: ChartFigureSource | null = figure
    ? {
        datasetName: dataset.name,
        ticks,
        xDomain: ticks.length >= 2 ? [ticks[0].position, ticks[ticks.length - 1].position] : [Math.min(...chartPoints.map((p) => p.pathDistance), 0), Math.max(...chartPoints.map((p) => p.pathDistance), 1)],
        energyDomain: domain,
        bands: dataSeries.map((s, i) => {
          const band = Number(s.key.slice("data-".length));
          return { band, index: bands.indexOf(band) >= 0 ? bands.indexOf(band) : i, colour: s.colour, points: s.points };
        }),
        lines: lines.map((l) => ({ colour: l.colour, dash: l.dash, points: l.points })),
        models: models.map((m) => ({ label: m.label, dash: m.dashed ? "6 4" : undefined })),
        residuals,
      }
    : null;

  const toggle = (band: number) => setHidden((h) => { const next = new Set(h); if (next.has(band)) next.delete(band); else next.add(band); return next; });

  return (
    <div className="flex flex-col gap-4">
      {computed.map((m) => (m.error ? <Notice key={m.key} tone="error">{`${m.label}: ${m.error}`}</Notice> : null))}
      {points.stride > 1 ? (
        <Notice tone="info">
          {`The charts draw one in ${points.stride} points of each band (${points.points.length.toLocaleString("en-US")} of ${points.total.toLocaleString("en-US")}); the tables use every point.`}
        </Notice>
      ) : null}
      <div className="flex flex-wrap items-end gap-x-6 gap-y-3">
        <fieldset className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <legend className="mb-1 text-sm font-medium">Bands shown</legend>
          {bands.map((b) => (
            <label key={b} className="inline-flex items-center gap-1.5 text-sm">
              <input type="checkbox" checked={!hidden.has(b)} onChange={() => toggle(b)} className="accent-accent-700" />
              <MarkerIcon marker={styles.get(b)!.marker} colour={styles.get(b)!.colour} />
              band {b}
            </label>
          ))}
        </fieldset>
        <div className="flex items-end gap-2">
          <label className="flex flex-col text-sm" htmlFor="zoom-min">
            Zoom from (eV)
            <Input id="zoom-min" density="compact" className="w-24" inputMode="decimal" value={zoomText.min} onChange={(e) => setZoomText({ ...zoomText, min: e.target.value })} aria-describedby="zoom-hint" />
          </label>
          <label className="flex flex-col text-sm" htmlFor="zoom-max">
            to (eV)
            <Input id="zoom-max" density="compact" className="w-24" inputMode="decimal" value={zoomText.max} onChange={(e) => setZoomText({ ...zoomText, max: e.target.value })} aria-describedby="zoom-hint" />
          </label>
          {window ? (
            <Button size="sm" variant="secondary" onClick={() => setZoomText({ min: String(window.min), max: String(window.max) })}>
              Zoom to the fit window
            </Button>
          ) : null}
          {zoom ? (
            <Button size="sm" variant="ghost" onClick={() => setZoomText({ min: "", max: "" })}>
              Show all
            </Button>
          ) : null}
        </div>
        <p id="zoom-hint" className={zoomError ? "text-xs text-danger-700" : "text-xs text-ink-muted"}>
          {zoomError ?? "Leave both empty to show every energy."}
        </p>
      </div>
      <BandChart
        points={dataSeries}
        lines={lines}
        ticks={ticks}
        energyDomain={domain}
        window={window ?? undefined}
        description={`Band energies of ${dataset.name} along the path ${ticks.map((t) => t.label).join("–")}: ${dataSeries.length} data bands as dots, ${models.map((m) => m.label).join(" and ")} as lines.`}
      />
      {showResiduals ? (
        <div>
          <h3 className="text-sm font-semibold">Residuals along the path</h3>
          <figure role="img" aria-label={`Residual (model − data) of ${residuals.length} points against path distance, coloured by band`}>
            <ResponsiveContainer width="100%" height={200}>
              <ScatterChart margin={{ top: 8, right: 16, bottom: 24, left: 8 }}>
                <CartesianGrid stroke="#e5e7eb" vertical={false} />
                <XAxis type="number" dataKey="x" domain={ticks.length >= 2 ? [ticks[0].position, ticks[ticks.length - 1].position] : ["auto", "auto"]} ticks={ticks.map((t) => t.position)} tickFormatter={(v: number) => ticks.find((t) => t.position === v)?.label ?? ""} tick={AXIS_FONT} label={{ value: "k along the path (1/Å)", position: "insideBottom", offset: -14, ...AXIS_FONT }} />
                <YAxis type="number" dataKey="y" tick={AXIS_FONT} width={56} tickFormatter={(v: number) => v.toFixed(2).replace("-", "\u2212")} label={{ value: "model − data (eV)", angle: -90, position: "insideLeft", ...AXIS_FONT }} />
                <ReferenceLine y={0} stroke="#6b7280" />
                <ZAxis range={[18, 18]} />
                <Tooltip isAnimationActive={false} content={(props) => <BandTooltip active={props.active} payload={props.payload} labels={residualLabels} valueTitle="model − data" />} />
                {bands
                  .filter((b) => !hidden.has(b))
                  .map((b) => (
                    <Scatter
                      key={b}
                      id={`residual-${b}`}
                      name={`band ${b}`}
                      data={residuals.filter((r) => r.band === b)}
                      fill={styles.get(b)!.colour}
                      shape={styles.get(b)!.marker}
                      isAnimationActive={false}
                    />
                  ))}
              </ScatterChart>
            </ResponsiveContainer>
          </figure>
        </div>
      ) : null}
      {figure && figureSource ? <FigureDownloads source={figureSource} fitName={figure.fitName} revision={figure.revision} /> : null}
    </div>
  );
}
