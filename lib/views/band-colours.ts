import { type BandMarker, bandColour, bandDash, bandMarker } from "./palette";

/** Colour of model bands that no data band maps to: drawn thin and grey so the mapped ones stand out. */
export const UNMAPPED_BAND_COLOUR = "#9AA3AD";

/** How one data band is drawn: its colour, the marker of its dots and the dash of its model line. */
export interface BandStyle {
  colour: string;
  marker: BandMarker;
  /** SVG stroke-dasharray; undefined for a solid line */
  dash: string | undefined;
}

/**
 * Styles for a band chart: data band number → style, in ascending band order (Okabe & Ito 2008 colours,
 * cycling after eight, with a new marker and dash for each further round of eight).
 * @param dataBands - the dataset's band numbers (1-based), any order; duplicates are ignored
 */
export function dataBandStyles(dataBands: readonly number[]): Map<number, BandStyle> {
  const sorted = [...new Set(dataBands)].sort((a, b) => a - b);
  return new Map(sorted.map((band, i) => [band, { colour: bandColour(i), marker: bandMarker(i), dash: bandDash(i) }]));
}

/**
 * Style of each model band: the style of the data band mapped to it, grey and solid when none is.
 * @param modelBandCount - number of model bands (orbitals)
 * @param pairs - data band → model band (1-based both)
 * @param styles - from {@link dataBandStyles}
 */
export function modelBandStyles(
  modelBandCount: number,
  pairs: readonly { dataBand: number; modelBand: number | null }[],
  styles: ReadonlyMap<number, BandStyle>,
): BandStyle[] {
  const unmapped: BandStyle = { colour: UNMAPPED_BAND_COLOUR, marker: "circle", dash: undefined };
  const result = Array.from({ length: modelBandCount }, () => unmapped);
  for (const { dataBand, modelBand } of pairs) {
    if (modelBand !== null && modelBand >= 1 && modelBand <= modelBandCount) result[modelBand - 1] = styles.get(dataBand) ?? unmapped;
  }
  return result;
}
