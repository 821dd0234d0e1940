/** A cell read as a number, or why it is not one. */
export type NumberCell = { ok: true; value: number } | { ok: false; message: string };

// Decimal numbers with an optional exponent; Fortran's D exponent (1.0D+00) is common practice in DFT output.
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eEdD][+-]?\d+)?$/;
const NOT_FINITE = /^[+-]?(?:nan|inf|infinity)$/i;

/**
 * Reads one cell as a finite number. Only plain decimal notation is accepted: no thousands separators, no
 * decimal commas, no hexadecimal, no NaN or Infinity.
 * @param cell - the cell's text (surrounding spaces are ignored)
 */
export function readNumberCell(cell: string): NumberCell {
  const text = cell.trim();
  if (text === "") return { ok: false, message: "empty value where a number is expected" };
  if (NOT_FINITE.test(text)) return { ok: false, message: `“${text}” is not a finite number` };
  if (!DECIMAL.test(text)) return { ok: false, message: `“${text}” is not a number` };
  const value = Number(text.replace(/[dD]/, "e"));
  if (!Number.isFinite(value)) return { ok: false, message: `“${text}” is too large` };
  return { ok: true, value };
}
