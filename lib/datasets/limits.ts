/**
 * Fixed limits of the file reader (not options): each is a refusal with row and column, never a silent
 * truncation or wrap-around. They are far above what a band file needs and keep a hostile file cheap.
 */

/**
 * Largest band index a long-format band column may hold. A dispersion has tens to a few thousand bands;
 * an index beyond this is a slip (a wrong column) and would not fit the int4 column it is stored in
 * (2 147 483 647) long before it made sense.
 */
export const MAX_BAND_INDEX = 100_000;

/** Most cells a header may have: a wide file holds at most this many columns (energies, k, labels). */
export const MAX_HEADER_CELLS = 10_000;

/**
 * Longest line (or quoted record spanning lines) in bytes of UTF-8: 1 MiB. A wide row of 10 000 energies
 * printed to 12 significant digits takes about 170 kB.
 */
export const MAX_LINE_BYTES = 1024 * 1024;

/** A count as messages print it: 100 000 (spaces between thousands). */
export const groupDigits = (n: number): string => n.toLocaleString("en-US").replace(/,/g, " ");
