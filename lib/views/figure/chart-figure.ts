import { type ChartPoint, type ChartResidual, residualDomain } from "../band-series";
import { figureBandMarker } from "../palette";
import type { PathTick } from "../ticks";
import type { FigureKind, FigureWidth } from "./figure-size";
import type { FigureInput, FigureLine } from "./svg-figure";

/** What the revision page's charts show, for turning into a figure. */
export interface ChartFigureSource {
  datasetName: string;
  ticks: readonly PathTick[];
  /** path distance, 1/Å */
  xDomain: [number, number];
  /** eV, the zoom as shown */
  energyDomain: [number, number];
  /** the data bands shown, each with its place among all the dataset's bands (for its marker) */
  bands: readonly { band: number; index: number; colour: string; points: readonly ChartPoint[] }[];
  lines: readonly FigureLine[];
  /** one per model drawn, e.g. { label: "revision 2" } */
  models: readonly { label: string; dash?: string }[];
  residuals: readonly ChartResidual[];
}

/**
 * The figure of one chart: the band overlay (data markers, model lines, the shown zoom) or the residual
 * strip (model − data around a zero line), with markers that change from band to band.
 */
export function chartFigure(source: ChartFigureSource, kind: FigureKind, width: FigureWidth): Omit<FigureInput, "fonts"> {
  const shown = new Set(source.bands.map((b) => b.band));
  const common = { kind, width, ticks: source.ticks, xDomain: source.xDomain, xTitle: "k along the path (1/Å)" };
  const modelNames = source.models.map((m) => m.label).join(" and ") || "the model";
  const dots = (pointsOf: (band: (typeof source.bands)[number]) => readonly ChartPoint[]) =>
    source.bands.map((b) => ({ label: `band ${b.band}`, colour: b.colour, marker: figureBandMarker(b.index), points: pointsOf(b) }));
  if (kind === "residual") {
    const residuals = source.residuals.filter((r) => shown.has(r.band));
    return {
      ...common,
      title: `${source.datasetName}: residuals (model − data) of ${modelNames} along the path`,
      yDomain: residualDomain(residuals),
      yTitle: "model − data (eV)",
      dots: dots((b) => residuals.filter((r) => r.band === b.band)),
      lines: [],
      lineLegend: [],
      zeroLine: true,
    };
  }
  return {
    ...common,
    title: `${source.datasetName}: bands of ${modelNames} over the data`,
    yDomain: source.energyDomain,
    yTitle: "E (eV)",
    dots: dots((b) => b.points),
    lines: source.lines,
    lineLegend: source.models.map((m) => ({ label: `model (${m.label})`, dash: m.dash })),
  };
}
