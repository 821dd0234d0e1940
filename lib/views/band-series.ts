import { type EnergyAlignment, NEUTRAL_ALIGNMENT, alignEnergy } from "@/lib/fit/bands/energy-alignment";
import { type ModelDocument, type Vec3, compileModel, computeBands } from "@/lib/tb";

/** A data point on a band chart: path distance (1/Å), energy (eV) and, where the data give it, σ (eV). */
export interface ChartPoint {
  x: number;
  y: number;
  sigma?: number;
}

/** Data points of one data band, sorted along the path. */
export interface DataBandSeries {
  band: number;
  points: ChartPoint[];
}

/** The fields of a dataset point a band chart needs. */
export interface ChartDataPoint {
  /** 1/Å */
  pathDistance: number;
  band: number;
  /** eV */
  energy: number;
  /** uncertainty of the energy, eV (photoemission peaks); null or absent when the data give none */
  sigma?: number | null;
}

/**
 * Data points grouped by band (ascending), each band sorted by path distance; a point keeps its σ (for
 * error bars) when it has one.
 * @param points - dataset points, any order
 */
export function dataSeriesByBand(points: readonly ChartDataPoint[]): DataBandSeries[] {
  const byBand = new Map<number, ChartPoint[]>();
  for (const p of points) {
    const list = byBand.get(p.band) ?? [];
    list.push(p.sigma === undefined || p.sigma === null ? { x: p.pathDistance, y: p.energy } : { x: p.pathDistance, y: p.energy, sigma: p.sigma });
    byBand.set(p.band, list);
  }
  return [...byBand.entries()]
    .sort(([a], [b]) => a - b)
    .map(([band, list]) => ({ band, points: list.sort((a, b) => a.x - b.x) }));
}

/** A distinct k-point of the data with its place on the path. */
export interface PathKPoint {
  /** Cartesian, 1/Å */
  k: Vec3;
  /** 1/Å */
  pathDistance: number;
}

/** A model band as a line: y is null where the path jumps, so the line breaks there. */
export interface ModelBandLine {
  /** 1-based model band */
  band: number;
  points: { x: number; y: number | null }[];
}

/**
 * Model bands along the data's own k-points, for drawing over the data: the k-points are sorted by path
 * distance, the bands computed with lib/tb, and the fit's offset and renormalisation applied.
 * Two k-points at the same path distance mark a jump in the path: the lines break there.
 * @param model - the model document (its parameter values are used)
 * @param kPoints - distinct k-points of the data (Cartesian 1/Å, in the model's frame)
 * @throws ModelError when the document does not compile
 */
export function modelBandLines(model: ModelDocument, kPoints: readonly PathKPoint[], alignment: EnergyAlignment = NEUTRAL_ALIGNMENT): ModelBandLine[] {
  const sorted = [...kPoints].sort((a, b) => a.pathDistance - b.pathDistance);
  const compiled = compileModel(model);
  const n = compiled.orbitalCount;
  const { energies } = computeBands(compiled, undefined, sorted.map((p) => p.k));
  return Array.from({ length: n }, (_, band) => {
    const points: { x: number; y: number | null }[] = [];
    sorted.forEach((p, i) => {
      if (i > 0 && p.pathDistance === sorted[i - 1].pathDistance) points.push({ x: p.pathDistance, y: null });
      points.push({ x: p.pathDistance, y: alignEnergy(energies[i * n + band], alignment) });
    });
    return { band: band + 1, points };
  });
}

/**
 * Distinct k-points of dataset points, by their k-point index.
 * @param points - dataset points with `kIndex`, Cartesian `k` (1/Å) and `pathDistance` (1/Å)
 */
export function distinctKPoints(points: readonly (PathKPoint & { kIndex: number })[]): PathKPoint[] {
  const byIndex = new Map<number, PathKPoint>();
  for (const p of points) if (!byIndex.has(p.kIndex)) byIndex.set(p.kIndex, { k: p.k, pathDistance: p.pathDistance });
  return [...byIndex.values()];
}

/** A round tick step (1, 2 or 5 × 10ⁿ) close to `rough`: the usual choice for readable axes (common practice). */
export function niceStep(rough: number): number {
  const power = 10 ** Math.floor(Math.log10(rough));
  const scaled = rough / power;
  return (scaled <= 1 ? 1 : scaled <= 2 ? 2 : scaled <= 5 ? 5 : 10) * power;
}

/**
 * Ticks at round values (1, 2 or 5 × 10ⁿ apart, about six intervals) inside a domain.
 * @param domain - [low, high], low < high
 */
export function linearTicks([low, high]: [number, number]): number[] {
  const step = niceStep((high - low) / 6);
  const ticks: number[] = [];
  for (let v = Math.ceil(low / step) * step; v <= high + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  return ticks;
}

/**
 * A symmetric range (eV) around zero for the residual chart: the largest |residual| with 10 % room,
 * rounded up to a round step; [−0.1, 0.1] when there are none.
 * @param residuals - model − data, eV
 */
export function residualDomain(residuals: readonly { y: number }[]): [number, number] {
  let largest = 0;
  for (const r of residuals) largest = Math.max(largest, Math.abs(r.y));
  if (!(largest > 0)) return [-0.1, 0.1];
  const step = niceStep((largest * 1.1) / 3);
  const edge = Math.ceil((largest * 1.1) / step) * step;
  return [-edge, edge];
}

/**
 * Energy range (eV) to show: the given zoom window if any, else the data's range with 5 % padding,
 * widened to whole multiples of a round step (about six intervals) so the axis ticks read well.
 * @param zoom - the user's energy window, eV
 */
export function energyDomain(points: readonly ChartDataPoint[], zoom?: { min: number; max: number }): [number, number] {
  if (zoom && zoom.min < zoom.max) return [zoom.min, zoom.max];
  if (points.length === 0) return [-1, 1];
  let low = Infinity;
  let high = -Infinity;
  for (const p of points) {
    low = Math.min(low, p.energy);
    high = Math.max(high, p.energy);
  }
  const pad = (high - low || 1) * 0.05;
  const step = niceStep((high - low + 2 * pad) / 6);
  return [Math.floor((low - pad) / step) * step, Math.ceil((high + pad) / step) * step];
}

/** A residual (model − data, eV) at a path distance, for the residual chart. */
export interface ChartResidual {
  band: number;
  x: number;
  y: number;
}

/**
 * Residuals for the chart, model − data in eV, from model energies at each point's own k-point: offset
 * mapping compares with the mapped band, nearest mapping with the closest model band. Points outside the
 * window or unmapped are left out, as in the fit.
 * @param points - dataset points with their k-point index
 * @param modelEnergies - k index → model band energies (ascending, eV, offset and renormalisation applied)
 * @param modelBandOf - data band → model band (1-based), or "nearest"
 */
export function chartResiduals(
  points: readonly (ChartDataPoint & { kIndex: number })[],
  modelEnergies: ReadonlyMap<number, readonly number[]>,
  modelBandOf: (dataBand: number) => number | null | "nearest",
  window?: { min: number; max: number } | null,
): ChartResidual[] {
  const result: ChartResidual[] = [];
  for (const p of points) {
    if (window && (p.energy < window.min || p.energy > window.max)) continue;
    const energies = modelEnergies.get(p.kIndex);
    const target = modelBandOf(p.band);
    if (!energies || target === null) continue;
    const model =
      target === "nearest"
        ? energies.reduce((best, e) => (Math.abs(e - p.energy) < Math.abs(best - p.energy) ? e : best), energies[0])
        : energies[target - 1];
    if (model !== undefined) result.push({ band: p.band, x: p.pathDistance, y: model - p.energy });
  }
  return result;
}

/**
 * Model band energies (eV, ascending, offset and renormalisation applied) at each distinct k-point of the
 * data, by k-point index — what {@link chartResiduals} compares with.
 * @param points - dataset points with `kIndex` and Cartesian `k` (1/Å)
 */
export function modelEnergiesByKIndex(model: ModelDocument, points: readonly { kIndex: number; k: Vec3 }[], alignment: EnergyAlignment = NEUTRAL_ALIGNMENT): Map<number, number[]> {
  const byIndex = new Map<number, Vec3>();
  for (const p of points) if (!byIndex.has(p.kIndex)) byIndex.set(p.kIndex, p.k);
  const indices = [...byIndex.keys()];
  const compiled = compileModel(model);
  const n = compiled.orbitalCount;
  const { energies } = computeBands(compiled, undefined, indices.map((i) => byIndex.get(i)!));
  return new Map(indices.map((index, i) => [index, Array.from(energies.subarray(i * n, (i + 1) * n), (e) => alignEnergy(e, alignment))]));
}
