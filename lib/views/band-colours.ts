import { bandColour } from "@/components/charts/palette";

/** Colour of model bands that no data band maps to: drawn thin and grey so the mapped ones stand out. */
export const UNMAPPED_BAND_COLOUR = "#9AA3AD";

/**
 * Colours for a band chart: data band number → colour, in the order of the dataset's bands
 * (Okabe & Ito 2008 palette, cycling after eight).
 * @param dataBands - the dataset's band numbers (1-based), any order; duplicates are ignored
 */
export function dataBandColours(dataBands: readonly number[]): Map<number, string> {
  const sorted = [...new Set(dataBands)].sort((a, b) => a - b);
  return new Map(sorted.map((band, i) => [band, bandColour(i)]));
}

/**
 * Colour of each model band: the colour of the data band mapped to it, grey when none is.
 * @param modelBandCount - number of model bands (orbitals)
 * @param pairs - data band → model band (1-based both)
 * @param colours - from {@link dataBandColours}
 */
export function modelBandColours(
  modelBandCount: number,
  pairs: readonly { dataBand: number; modelBand: number | null }[],
  colours: ReadonlyMap<number, string>,
): string[] {
  const result = Array.from({ length: modelBandCount }, () => UNMAPPED_BAND_COLOUR);
  for (const { dataBand, modelBand } of pairs) {
    if (modelBand !== null && modelBand >= 1 && modelBand <= modelBandCount) result[modelBand - 1] = colours.get(dataBand) ?? UNMAPPED_BAND_COLOUR;
  }
  return result;
}
