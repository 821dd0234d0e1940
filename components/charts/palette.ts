/**
 * Band colours: the colour-blind-safe qualitative palette of Okabe & Ito, "Color Universal Design
 * (CUD): How to make figures and presentations that are friendly to colorblind people" (2008),
 * in their published order with black last. Up to eight bands stay distinguishable; beyond that the
 * colours repeat and charts must tell bands apart by marker or dash as well.
 */
export const okabeItoPalette = [
  { name: "orange", hex: "#E69F00" },
  { name: "sky blue", hex: "#56B4E9" },
  { name: "bluish green", hex: "#009E73" },
  { name: "yellow", hex: "#F0E442" },
  { name: "blue", hex: "#0072B2" },
  { name: "vermillion", hex: "#D55E00" },
  { name: "reddish purple", hex: "#CC79A7" },
  { name: "black", hex: "#000000" },
] as const;

/**
 * Colour for a band by its zero-based index, cycling after eight.
 * @param bandIndex - zero-based band index (non-negative integer)
 * @returns a hex colour string
 */
export function bandColour(bandIndex: number): string {
  if (!Number.isInteger(bandIndex) || bandIndex < 0) {
    throw new RangeError(`bandIndex must be a non-negative integer, got ${bandIndex}`);
  }
  return okabeItoPalette[bandIndex % okabeItoPalette.length].hex;
}
