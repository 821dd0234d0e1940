/** What a numeric text field holds after reading: nothing, a number, or the message to show beside it. */
export type NumberReading = { kind: "empty" } | { kind: "number"; value: number } | { kind: "invalid"; message: string };

const NUMBER_PATTERN = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/**
 * Reads a number typed by a user. Accepts the true minus sign (U+2212) that our own tables print, so a
 * value copied from a table pastes back; refuses anything that is not a plain decimal number.
 * @param text - the field's text
 */
export function readNumber(text: string): NumberReading {
  const trimmed = text.trim().replace(/\u2212/g, "-");
  if (trimmed === "") return { kind: "empty" };
  if (!NUMBER_PATTERN.test(trimmed)) return { kind: "invalid", message: "enter a number, e.g. −2.5 or 1e-3" };
  const value = Number(trimmed);
  return Number.isFinite(value) ? { kind: "number", value } : { kind: "invalid", message: "the number is too large" };
}

/** Collects field errors by field key while a form is read. */
export class FieldErrors {
  readonly byField: Record<string, string[]> = {};
  add(field: string, message: string): void {
    const messages = (this.byField[field] ??= []);
    if (!messages.includes(message)) messages.push(message);
  }
  get empty(): boolean {
    return Object.keys(this.byField).length === 0;
  }
  /**
   * A number from a field: required fields report "required", invalid text its message.
   * @returns undefined when empty or invalid (the error is recorded)
   */
  number(field: string, text: string, required: boolean): number | undefined {
    const reading = readNumber(text);
    if (reading.kind === "number") return reading.value;
    if (reading.kind === "invalid") this.add(field, reading.message);
    else if (required) this.add(field, "required");
    return undefined;
  }
  /** An integer from a field (same rules as {@link number}, plus "a whole number"). */
  integer(field: string, text: string, required: boolean): number | undefined {
    const value = this.number(field, text, required);
    if (value !== undefined && !Number.isInteger(value)) {
      this.add(field, "enter a whole number");
      return undefined;
    }
    return value;
  }
}
