import type { Vec3 } from "@/lib/tb/geometry/vec3";

/**
 * The points of a parsed file as columns (struct of arrays): one typed array per quantity, index i is the
 * i-th point in file order. Half a million points take about 40 MB here, where one object per point took
 * several times that; the upload stores these columns without building per-point objects.
 */
export interface PointTable {
  readonly length: number;
  /** Cartesian k components in 1/Å (2π included); components the file does not give are 0. */
  readonly kx: Float64Array;
  readonly ky: Float64Array;
  readonly kz: Float64Array;
  /** Position on the chart's k axis in 1/Å (see `assignPathCoordinates`). */
  readonly pathDistance: Float64Array;
  /** Data band index, 1-based. */
  readonly band: Int32Array;
  /** Energy in eV. */
  readonly energy: Float64Array;
  /** Uncertainty in eV; null when the mapping has no σ column. */
  readonly sigma: Float64Array | null;
  /** User weight (≥ 0); null when the mapping has no weight column. */
  readonly weight: Float64Array | null;
  /** Index into `labels`, −1 for an empty label cell; null when the mapping has no label column. */
  readonly labelId: Int32Array | null;
  /** The distinct labels in order of first appearance. */
  readonly labels: readonly string[];
  /** Index (0-based) of the distinct k vector: points with equal k share it. */
  readonly kIndex: Int32Array;
  /** Line of the file the point was read from (1-based). */
  readonly row: Int32Array;
}

/** One band energy of a dataset: one point of a {@link PointTable} as an object. */
export interface DataPoint {
  /** Cartesian wave vector in 1/Å (2π included); components the file does not give are 0. */
  k: Vec3;
  /** Position on the chart's k axis in 1/Å (see `assignPathCoordinates`). */
  pathDistance: number;
  /** Data band index, 1-based, as in the file (wide format: the energy column's position). */
  band: number;
  /** Energy in eV. */
  energy: number;
  /** Uncertainty of the energy in eV, when the file gives one. */
  sigma?: number;
  /** User weight (≥ 0), when the file gives one. */
  weight?: number;
  /** Branch or cut label, when the file gives one. */
  label?: string;
  /** Index (0-based) of the distinct k-point: points with equal k share it, whichever band or row. */
  kIndex: number;
  /** Line of the file the point was read from (1-based). */
  row: number;
}

/**
 * The points of a table as objects, for callers that want them one by one (fits, scripts, tests).
 * @param table - a parsed table
 */
export function tablePoints(table: PointTable): DataPoint[] {
  const points: DataPoint[] = new Array(table.length);
  for (let i = 0; i < table.length; i++) {
    const point: DataPoint = {
      k: [table.kx[i], table.ky[i], table.kz[i]],
      pathDistance: table.pathDistance[i],
      band: table.band[i],
      energy: table.energy[i],
      kIndex: table.kIndex[i],
      row: table.row[i],
    };
    if (table.sigma) point.sigma = table.sigma[i];
    if (table.weight) point.weight = table.weight[i];
    const labelId = table.labelId?.[i] ?? -1;
    if (labelId >= 0) point.label = table.labels[labelId];
    points[i] = point;
  }
  return points;
}

const INITIAL_CAPACITY = 4096;

function grown<T extends Float64Array | Int32Array>(array: T, capacity: number): T {
  const next = new (array.constructor as new (n: number) => T)(capacity);
  next.set(array);
  return next;
}

/**
 * Collects points row by row into growing typed arrays (capacity doubles). k columns hold the file's own
 * values (coordinates or a distance) until the k resolution turns them into Cartesian k in place.
 */
export class PointTableBuilder {
  length = 0;
  kx = new Float64Array(INITIAL_CAPACITY);
  ky = new Float64Array(INITIAL_CAPACITY);
  kz = new Float64Array(INITIAL_CAPACITY);
  band = new Int32Array(INITIAL_CAPACITY);
  energy = new Float64Array(INITIAL_CAPACITY);
  sigma: Float64Array | null;
  weight: Float64Array | null;
  labelId: Int32Array | null;
  row = new Int32Array(INITIAL_CAPACITY);
  private readonly labelIds = new Map<string, number>();
  readonly labels: string[] = [];

  constructor(has: { sigma: boolean; weight: boolean; label: boolean }) {
    this.sigma = has.sigma ? new Float64Array(INITIAL_CAPACITY) : null;
    this.weight = has.weight ? new Float64Array(INITIAL_CAPACITY) : null;
    this.labelId = has.label ? new Int32Array(INITIAL_CAPACITY) : null;
  }

  /** The id of a label text (−1 for an empty cell), adding it on first sight. */
  labelIdOf(text: string): number {
    if (text === "") return -1;
    let id = this.labelIds.get(text);
    if (id === undefined) {
      id = this.labels.push(text) - 1;
      this.labelIds.set(text, id);
    }
    return id;
  }

  /**
   * Appends one point; optional quantities are read only when their column exists.
   * @param k0 - first k value (a coordinate, or the path distance), then k1, k2 (0 when absent)
   * @param energy - eV; sigma - eV
   */
  push(row: number, k0: number, k1: number, k2: number, band: number, energy: number, sigma: number, weight: number, labelId: number): void {
    if (this.length === this.kx.length) this.grow();
    const i = this.length++;
    this.row[i] = row;
    this.kx[i] = k0;
    this.ky[i] = k1;
    this.kz[i] = k2;
    this.band[i] = band;
    this.energy[i] = energy;
    if (this.sigma) this.sigma[i] = sigma;
    if (this.weight) this.weight[i] = weight;
    if (this.labelId) this.labelId[i] = labelId;
  }

  private grow(): void {
    const capacity = this.kx.length * 2;
    this.kx = grown(this.kx, capacity);
    this.ky = grown(this.ky, capacity);
    this.kz = grown(this.kz, capacity);
    this.band = grown(this.band, capacity);
    this.energy = grown(this.energy, capacity);
    this.row = grown(this.row, capacity);
    if (this.sigma) this.sigma = grown(this.sigma, capacity);
    if (this.weight) this.weight = grown(this.weight, capacity);
    if (this.labelId) this.labelId = grown(this.labelId, capacity);
  }

  /**
   * The finished table: views of exactly `length` entries, with the k index and path coordinate columns.
   * @param kIndex - per point; pathDistance - per point, 1/Å
   */
  finish(kIndex: Int32Array, pathDistance: Float64Array): PointTable {
    const n = this.length;
    return {
      length: n,
      kx: this.kx.subarray(0, n),
      ky: this.ky.subarray(0, n),
      kz: this.kz.subarray(0, n),
      pathDistance: pathDistance.subarray(0, n),
      band: this.band.subarray(0, n),
      energy: this.energy.subarray(0, n),
      sigma: this.sigma?.subarray(0, n) ?? null,
      weight: this.weight?.subarray(0, n) ?? null,
      labelId: this.labelId?.subarray(0, n) ?? null,
      labels: this.labels,
      kIndex: kIndex.subarray(0, n),
      row: this.row.subarray(0, n),
    };
  }
}
