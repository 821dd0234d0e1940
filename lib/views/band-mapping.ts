import type { BandMappingInput } from "@/lib/fit/bands/schema";

/** One line of the band-mapping picture: a data band and the model band it is compared with. */
export interface BandPair {
  dataBand: number;
  /** the model band (1-based); null when the data band is left out or (nearest mapping) chosen per point */
  modelBand: number | null;
  /** true when the model has no such band: the fit would refuse this mapping */
  outOfRange: boolean;
}

/**
 * Which data band goes to which model band, for the mapping picture and the chart colours.
 * Offset mapping: data bands `dataBands[0]..dataBands[1]` (default all) → `firstModelBand`, +1, …;
 * nearest mapping: every data band pairs with "nearest" (null).
 * @param mapping - as the fit schema takes it
 * @param dataBands - the dataset's band numbers, ascending
 * @param modelBandCount - number of model bands
 */
export function bandPairs(mapping: BandMappingInput, dataBands: readonly number[], modelBandCount: number): BandPair[] {
  if (mapping.kind === "nearest") return dataBands.map((dataBand) => ({ dataBand, modelBand: null, outOfRange: false }));
  const first = mapping.dataBands?.[0] ?? dataBands[0] ?? 1;
  const last = mapping.dataBands?.[1] ?? dataBands[dataBands.length - 1] ?? first;
  const firstModel = mapping.firstModelBand ?? 1;
  return dataBands.map((dataBand) => {
    if (dataBand < first || dataBand > last) return { dataBand, modelBand: null, outOfRange: false };
    const modelBand = firstModel + (dataBand - first);
    return { dataBand, modelBand, outOfRange: modelBand > modelBandCount };
  });
}
