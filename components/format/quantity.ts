/**
 * Formatting of physical values for display: `−2.781 ± 0.004 eV`.
 *
 * - The standard error is rounded to one or two significant digits by the Particle Data Group's rule
 *   (Review of Particle Physics, Introduction, "Rounding"): if the three leading digits of the error
 *   are 100–354 keep two digits, 355–949 keep one, 950–999 round up to 1000 and keep two.
 *   The value is then rounded to the same decimal place as the error.
 * - Negative values always carry a true minus sign (U+2212), even when they round to zero, so a small
 *   negative residual never reads as positive.
 */

/** Minus sign used for negative numbers (U+2212), wider than a hyphen and aligned with "+". */
export const MINUS_SIGN = "\u2212";

export interface QuantityFormatOptions {
  /** Standard error in the same unit as the value. Omitted or 0: the value is shown alone. */
  error?: number;
  /** Unit appended after a space (e.g. "eV", "Å", "1/Å"). Omitted: dimensionless. */
  unit?: string;
  /** Decimal places when no error is given. Default 3 (meV resolution for values in eV). */
  decimals?: number;
  /** Prefix positive values with "+" (offsets, residuals). Default false. */
  showPlus?: boolean;
}

interface NormalisedQuantityFormatOptions {
  error: number;
  unit: string;
  decimals: number;
  showPlus: boolean;
}

const defaultOptions: NormalisedQuantityFormatOptions = { error: 0, unit: "", decimals: 3, showPlus: false };

function normaliseOptions(options: QuantityFormatOptions): NormalisedQuantityFormatOptions {
  const merged = { ...defaultOptions, ...stripUndefined(options) };
  if (!Number.isFinite(merged.error) || merged.error < 0) {
    throw new RangeError(`error must be a finite, non-negative number, got ${merged.error}`);
  }
  if (!Number.isInteger(merged.decimals) || merged.decimals < 0 || merged.decimals > 20) {
    throw new RangeError(`decimals must be an integer from 0 to 20, got ${merged.decimals}`);
  }
  return merged;
}

function stripUndefined(options: QuantityFormatOptions): Partial<NormalisedQuantityFormatOptions> {
  return Object.fromEntries(Object.entries(options).filter(([, v]) => v !== undefined));
}

/** An error rounded for display and the power of ten of its last kept digit. */
export interface RoundedError {
  /** The rounded error, same unit as the input. */
  value: number;
  /** Power of ten of the last significant digit kept (−3 for 0.004, 1 for 60). */
  lastDigitPower: number;
}

/**
 * Rounds a standard error to one or two significant digits (Particle Data Group rule, see module note).
 * @param error - positive, finite; any unit
 */
export function roundError(error: number): RoundedError {
  if (!Number.isFinite(error) || error <= 0) {
    throw new RangeError(`error must be a finite, positive number, got ${error}`);
  }
  // toExponential gives the three leading digits already rounded in decimal, avoiding log10 drift.
  const [mantissa, exponentText] = error.toExponential(2).split("e");
  const leadingDigits = Number(mantissa.replace(".", ""));
  const exponent = Number(exponentText);
  if (leadingDigits <= 354) {
    return { value: roundToPower(error, exponent - 1), lastDigitPower: exponent - 1 };
  }
  if (leadingDigits <= 949) {
    return { value: roundToPower(error, exponent), lastDigitPower: exponent };
  }
  return { value: 10 ** (exponent + 1), lastDigitPower: exponent };
}

function roundToPower(x: number, power: number): number {
  return power >= 0 ? Math.round(x / 10 ** power) * 10 ** power : Math.round(x * 10 ** -power) / 10 ** -power;
}

function formatMagnitude(x: number, lastDigitPower: number): string {
  const decimals = Math.max(0, -lastDigitPower);
  const rounded = lastDigitPower > 0 ? roundToPower(x, lastDigitPower) : x;
  return rounded.toFixed(decimals);
}

function signFor(value: number, showPlus: boolean): string {
  if (value < 0) return MINUS_SIGN;
  if (value > 0 && showPlus) return "+";
  return "";
}

function formatNonFinite(value: number): string {
  if (Number.isNaN(value)) return "n/a";
  return value < 0 ? `${MINUS_SIGN}∞` : "∞";
}

/**
 * Formats a value with optional standard error and unit, e.g. `−2.781 ± 0.004 eV`.
 * @param value - the number to show, in `options.unit`
 * @param options - error, unit, decimals, showPlus; see {@link QuantityFormatOptions}
 * @returns display text; "n/a" for NaN, "∞"/"−∞" for infinities
 */
export function formatQuantity(value: number, options: QuantityFormatOptions = {}): string {
  const { error, unit, decimals, showPlus } = normaliseOptions(options);
  const unitSuffix = unit ? ` ${unit}` : "";
  if (!Number.isFinite(value)) return `${formatNonFinite(value)}${unitSuffix}`;

  const lastDigitPower = error > 0 ? roundError(error).lastDigitPower : -decimals;
  const valueText = `${signFor(value, showPlus)}${formatMagnitude(Math.abs(value), lastDigitPower)}`;
  if (error === 0) return `${valueText}${unitSuffix}`;

  const errorText = formatMagnitude(roundError(error).value, lastDigitPower);
  return `${valueText} ± ${errorText}${unitSuffix}`;
}
