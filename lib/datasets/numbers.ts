const NOT_FINITE = /^[+-]?(?:nan|inf|infinity)$/i;

const isDigit = (c: number) => c >= 48 && c <= 57;
// Spaces, tabs, CR/LF, no-break space and a stray byte-order mark: what `String.prototype.trim` removes in files.
const isBlank = (c: number) => c <= 32 || c === 0xa0 || c === 0xfeff;

/**
 * Reads one cell as a finite number, or NaN when it is not one. Only plain decimal notation is accepted:
 * `[+-]digits[.digits][e|E|d|D[+-]digits]` (Fortran's D exponent, 1.0D+00, is common practice in DFT output),
 * with surrounding blanks ignored; no thousands separators, decimal commas, hexadecimal, NaN or Infinity.
 * Allocation-free on the accepted path: it runs once per cell of files with millions of cells.
 * @param cell - the cell's text
 * @returns the value, or NaN (then {@link describeNumberCell} says why)
 */
export function parseDecimalCell(cell: string): number {
  let start = 0;
  let end = cell.length;
  while (start < end && isBlank(cell.charCodeAt(start))) start++;
  while (end > start && isBlank(cell.charCodeAt(end - 1))) end--;
  let i = start;
  let c = cell.charCodeAt(i);
  if (c === 43 || c === 45) i++;
  let digits = 0;
  for (; i < end && isDigit(cell.charCodeAt(i)); i++) digits++;
  if (i < end && cell.charCodeAt(i) === 46) {
    i++;
    for (; i < end && isDigit(cell.charCodeAt(i)); i++) digits++;
  }
  if (digits === 0) return NaN;
  let fortran = false;
  if (i < end) {
    c = cell.charCodeAt(i);
    if (c !== 101 && c !== 69 && c !== 100 && c !== 68) return NaN;
    fortran = c === 100 || c === 68;
    i++;
    c = cell.charCodeAt(i);
    if (c === 43 || c === 45) i++;
    let exponentDigits = 0;
    for (; i < end && isDigit(cell.charCodeAt(i)); i++) exponentDigits++;
    if (exponentDigits === 0 || i !== end) return NaN;
  }
  const text = start === 0 && end === cell.length ? cell : cell.slice(start, end);
  const value = Number(fortran ? text.replace(/[dD]/, "e") : text);
  return Number.isFinite(value) ? value : NaN;
}

/**
 * Why a cell that {@link parseDecimalCell} refused is not a number, for the issue list.
 * @param cell - the refused cell's text
 */
export function describeNumberCell(cell: string): string {
  const text = cell.trim();
  if (text === "") return "empty value where a number is expected";
  if (NOT_FINITE.test(text)) return `“${text}” is not a finite number`;
  if (/^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eEdD][+-]?\d+)?$/.test(text)) return `“${text}” is too large`;
  return `“${text}” is not a number`;
}
