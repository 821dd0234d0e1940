import { z } from "zod";

/** Largest value of a PostgreSQL `integer` (int4) column: 2³¹ − 1 (PostgreSQL 15 manual, §8.1.1). */
export const INT4_MAX = 2_147_483_647;

/**
 * The schema of a positive whole number that comes from a URL (a query parameter or a path segment) and
 * reaches SQL as an int4 value or a page: digits only (no sign, fraction, exponent or blanks), 1 to
 * 2 147 483 647. The one definition for every such number, so that `band=99999999999` or `page=1e20` is a
 * 4xx, never a database error. A number (not text) is read as its decimal digits, for callers that pass
 * defaults as numbers.
 * @param name - the parameter's name, for the messages ("page must be …")
 * @param max - a tighter upper bound (a page size); at most {@link INT4_MAX}
 */
export function positiveIntFromUrl(name: string, max = INT4_MAX) {
  return z.coerce
    .string()
    .regex(/^\d+$/, `${name} must be a whole number written in digits (no sign, decimal point or exponent)`)
    // Past 15 significant digits the value is far above the limit; Number() would round it (or give
    // Infinity past 308 digits, which z.number() refuses with a message about the type).
    .transform((digits) => {
      const significant = digits.replace(/^0+(?=\d)/, "");
      return significant.length > 15 ? Number.MAX_SAFE_INTEGER : Number(significant);
    })
    .pipe(
      z
        .number()
        .min(1, `${name} must be at least 1`)
        .max(Math.min(max, INT4_MAX), `${name} must be at most ${Math.min(max, INT4_MAX).toLocaleString("en-US").replace(/,/g, " ")}`),
    );
}
