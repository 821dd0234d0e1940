/**
 * Figure sizes for journals. Widths: one column 8.6 cm and two columns 17.8 cm, as the American Physical
 * Society's author guidelines give for Physical Review figures (APS, "Information for Authors", figure
 * size); 300 dpi for raster images (common practice of journals for line art with halftones).
 */
export const figureWidthsCm = { single: 8.6, double: 17.8 } as const;
export type FigureWidth = keyof typeof figureWidthsCm;

/** Which chart a figure shows. */
export type FigureKind = "overlay" | "residual";

/** Heights, cm: the band overlay about 3:4 in one column, flatter across two; the residual strip lower. */
const figureHeightsCm: Record<FigureKind, Record<FigureWidth, number>> = {
  overlay: { single: 6.5, double: 9 },
  residual: { single: 4, double: 5 },
};

/** Raster resolution of PNG figures, dots per inch. */
export const FIGURE_DPI = 300;

const CM_PER_INCH = 2.54;
const POINTS_PER_INCH = 72;

/** A figure's size: in cm (the SVG's width/height), in points (its viewBox) and in pixels at {@link FIGURE_DPI}. */
export interface FigureSize {
  widthCm: number;
  heightCm: number;
  /** viewBox size: 1 user unit = 1 pt = 1/72 in */
  widthPt: number;
  heightPt: number;
  /** PNG size at 300 dpi: width_cm / 2.54 × 300, rounded */
  widthPx: number;
  heightPx: number;
}

/**
 * The size of one figure.
 * @param kind - overlay or residual chart
 * @param width - single (8.6 cm) or double (17.8 cm) column
 */
export function figureSize(kind: FigureKind, width: FigureWidth): FigureSize {
  const widthCm = figureWidthsCm[width];
  const heightCm = figureHeightsCm[kind][width];
  const toPt = (cm: number) => (cm / CM_PER_INCH) * POINTS_PER_INCH;
  const toPx = (cm: number) => Math.round((cm / CM_PER_INCH) * FIGURE_DPI);
  return { widthCm, heightCm, widthPt: toPt(widthCm), heightPt: toPt(heightCm), widthPx: toPx(widthCm), heightPx: toPx(heightCm) };
}
