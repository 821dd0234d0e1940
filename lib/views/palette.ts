/**
 * Band colours and markers. Colours: the colour-blind-safe qualitative palette of Okabe & Ito, "Color
 * Universal Design (CUD): How to make figures and presentations that are friendly to colorblind people"
 * (2008), in their published order with black last. Up to eight bands stay distinguishable by colour;
 * beyond that the colours repeat and the marker (dots) or dash (lines) changes as a second cue.
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
 * The colours drawn on white: Okabe–Ito with its yellow (#F0E442, contrast 1.3:1 on white) replaced by a
 * darker yellow of the same hue family, #9E8C00 (3.4:1, above the 3:1 that WCAG 2.2 SC 1.4.11 asks of
 * graphical objects). Our own choice; the other seven are Okabe & Ito's.
 */
export const bandPalette = okabeItoPalette.map((c) => (c.name === "yellow" ? { name: "dark yellow", hex: "#9E8C00" } : c));

/** Marker shapes, in the order they come in: recharts' own symbol names, drawn the same way in figures. */
export const bandMarkers = ["circle", "square", "triangle", "diamond", "cross"] as const;
export type BandMarker = (typeof bandMarkers)[number];

/** SVG stroke-dasharray of model lines per round of eight colours (solid first). */
export const bandDashes = [undefined, "5 3", "1.5 2.5", "8 3 2 3"] as const;

function checkIndex(bandIndex: number): void {
  if (!Number.isInteger(bandIndex) || bandIndex < 0) {
    throw new RangeError(`bandIndex must be a non-negative integer, got ${bandIndex}`);
  }
}

/**
 * Colour for a band by its zero-based index, cycling after eight.
 * @param bandIndex - zero-based band index (non-negative integer)
 * @returns a hex colour string
 */
export function bandColour(bandIndex: number): string {
  checkIndex(bandIndex);
  return bandPalette[bandIndex % bandPalette.length].hex;
}

/**
 * Marker of a band's dots: circles for the first eight bands, then the next shape for each further
 * round of eight colours, so no two of the first 40 bands look the same.
 * @param bandIndex - zero-based band index (non-negative integer)
 */
export function bandMarker(bandIndex: number): BandMarker {
  checkIndex(bandIndex);
  return bandMarkers[Math.floor(bandIndex / bandPalette.length) % bandMarkers.length];
}

/**
 * Dash pattern of a band's model line (undefined: solid), changing with each round of eight colours.
 * @param bandIndex - zero-based band index (non-negative integer)
 */
export function bandDash(bandIndex: number): string | undefined {
  checkIndex(bandIndex);
  return bandDashes[Math.floor(bandIndex / bandPalette.length) % bandDashes.length];
}

/**
 * Marker of a band's points in exported figures: a new shape for every band (cycling through five), so
 * that bands stay apart in a greyscale print, where colours of similar lightness merge. With eight colours
 * and five shapes no two of the first 40 bands look alike.
 * @param bandIndex - zero-based band index (non-negative integer)
 */
export function figureBandMarker(bandIndex: number): BandMarker {
  checkIndex(bandIndex);
  return bandMarkers[bandIndex % bandMarkers.length];
}
