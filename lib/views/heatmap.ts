/** One cell of the correlation heatmap. */
export interface CorrelationCell {
  row: number;
  column: number;
  rowName: string;
  columnName: string;
  /** correlation coefficient in [−1, 1]; null when not determined */
  value: number | null;
  /** CSS colour of the cell */
  fill: string;
  /** |value| > 0.99: the pair is not separately determined (the fit's own warning threshold) */
  strong: boolean;
}

/** The band fit's threshold for a "strong-correlation" warning (DESIGN.md, What a fit reports). */
export const STRONG_CORRELATION = 0.99;

const NEGATIVE: [number, number, number] = [0, 114, 178]; // Okabe–Ito blue
const POSITIVE: [number, number, number] = [213, 94, 0]; // Okabe–Ito vermillion
const NEUTRAL: [number, number, number] = [247, 247, 247];
const UNDETERMINED_FILL = "#d9dce0";

/**
 * Diverging colour for a correlation: blue for −1 through near-white at 0 to vermillion for +1
 * (linear in each channel; a blue–white–orange diverging scale stays readable with colour-vision deficiency,
 * Okabe & Ito 2008).
 * @param value - correlation coefficient, clamped to [−1, 1]; null gives the "not determined" grey
 */
export function correlationFill(value: number | null): string {
  if (value === null || !Number.isFinite(value)) return UNDETERMINED_FILL;
  const t = Math.min(1, Math.abs(value));
  const end = value < 0 ? NEGATIVE : POSITIVE;
  const [r, g, b] = NEUTRAL.map((c, i) => Math.round(c + (end[i] - c) * t));
  return `rgb(${r}, ${g}, ${b})`;
}

/**
 * Cells of a correlation heatmap, row by row.
 * @param names - parameter names, the matrix's order
 * @param matrix - square, entries in [−1, 1] or null
 */
export function correlationCells(names: readonly string[], matrix: readonly (readonly (number | null)[])[]): CorrelationCell[] {
  if (matrix.length !== names.length || matrix.some((row) => row.length !== names.length))
    throw new RangeError(`a correlation matrix for ${names.length} parameters must be ${names.length} × ${names.length}`);
  return matrix.flatMap((values, row) =>
    values.map((value, column) => ({
      row,
      column,
      rowName: names[row],
      columnName: names[column],
      value,
      fill: correlationFill(value),
      strong: row !== column && value !== null && Math.abs(value) > STRONG_CORRELATION,
    })),
  );
}

/**
 * Stops of the heatmap's colour scale from −1 to +1, evenly spaced, for its legend bar.
 * @param count - number of stops, ≥ 2 (default 9: every 0.25)
 */
export function correlationScaleStops(count = 9): { value: number; fill: string }[] {
  if (!Number.isInteger(count) || count < 2) throw new RangeError(`a colour scale needs at least 2 stops, got ${count}`);
  return Array.from({ length: count }, (_, i) => {
    const value = -1 + (2 * i) / (count - 1);
    return { value, fill: correlationFill(value) };
  });
}
