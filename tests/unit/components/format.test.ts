import { describe, expect, it } from "vitest";
import { formatDate, formatDateTime, formatQuantity, MINUS_SIGN, roundError } from "@/components/format";

// Rounding rule for uncertainties: Particle Data Group, Review of Particle Physics, Introduction,
// section "Rounding" (three leading digits 100–354 → two significant digits, 355–949 → one,
// 950–999 → round up to 1000 and keep two). Quoting the value to the error's last digit is
// common practice (ISO GUM, JCGM 100:2008, §7.2.6).

describe("roundError", () => {
  it.each([
    // [error, rounded, power of ten of the last kept digit] — PDG rule
    [0.004, 0.004, -3],
    [0.0123, 0.012, -3],
    [0.0354, 0.035, -3],
    [0.0355, 0.04, -2],
    [0.949, 0.9, -1],
    [0.0098, 0.01, -3],
    [0.009996, 0.01, -3],
    [56, 60, 1],
    [1.2, 1.2, -1],
  ])("rounds %f to %f (last digit 10^%i)", (error, rounded, power) => {
    const result = roundError(error);
    expect(result.value).toBeCloseTo(rounded, 12);
    expect(result.lastDigitPower).toBe(power);
  });

  it("refuses zero, negative and non-finite errors", () => {
    expect(() => roundError(0)).toThrow(/positive/);
    expect(() => roundError(-0.1)).toThrow(/positive/);
    expect(() => roundError(Number.NaN)).toThrow(/positive/);
  });
});

describe("formatQuantity", () => {
  it("writes value ± error with unit, using a true minus sign", () => {
    expect(formatQuantity(-2.78123, { error: 0.0041, unit: "eV" })).toBe(`${MINUS_SIGN}2.781 ± 0.004 eV`);
  });

  it("keeps two error digits when the leading digits are 100–354", () => {
    expect(formatQuantity(1.23456, { error: 0.0123, unit: "Å" })).toBe("1.235 ± 0.012 Å");
  });

  it("keeps the trailing zero when the error rounds up to 1000 in its leading digits", () => {
    expect(formatQuantity(0.5, { error: 0.0098, unit: "eV" })).toBe("0.500 ± 0.010 eV");
  });

  it("rounds to tens when the error is larger than 10", () => {
    expect(formatQuantity(-1234, { error: 56, unit: "meV" })).toBe(`${MINUS_SIGN}1230 ± 60 meV`);
  });

  it("never drops the sign of a negative value that rounds to zero", () => {
    expect(formatQuantity(-0.0004, { unit: "eV" })).toBe(`${MINUS_SIGN}0.000 eV`);
    expect(formatQuantity(-0.0004, { error: 0.004 })).toBe(`${MINUS_SIGN}0.000 ± 0.004`);
    // 0.002 has leading digits 200 → two significant digits under the PDG rule.
    expect(formatQuantity(-0.0004, { error: 0.002 })).toBe(`${MINUS_SIGN}0.0004 ± 0.0020`);
  });

  it("adds a plus sign only when asked, and never to zero", () => {
    expect(formatQuantity(0.25, { showPlus: true, unit: "eV" })).toBe("+0.250 eV");
    expect(formatQuantity(0.25, { unit: "eV" })).toBe("0.250 eV");
    expect(formatQuantity(0, { showPlus: true })).toBe("0.000");
  });

  it("uses fixed decimals when no error is given", () => {
    expect(formatQuantity(3.14159, { decimals: 2, unit: "1/Å" })).toBe("3.14 1/Å");
    expect(formatQuantity(-0.5, { decimals: 0 })).toBe(`${MINUS_SIGN}1`);
  });

  it("shows a value alone when the error is zero (a fixed parameter)", () => {
    expect(formatQuantity(-1.5, { error: 0, unit: "eV" })).toBe(`${MINUS_SIGN}1.500 eV`);
  });

  it("marks non-finite values instead of printing NaN", () => {
    expect(formatQuantity(Number.NaN, { unit: "eV" })).toBe("n/a eV");
    expect(formatQuantity(Number.NEGATIVE_INFINITY)).toBe(`${MINUS_SIGN}∞`);
  });

  it("refuses a negative error or impossible decimals", () => {
    expect(() => formatQuantity(1, { error: -0.1 })).toThrow(/non-negative/);
    expect(() => formatQuantity(1, { decimals: 1.5 })).toThrow(/integer/);
  });
});

describe("formatDateTime / formatDate", () => {
  it("formats in UTC with an explicit zone", () => {
    expect(formatDateTime("2025-03-03T14:07:59Z")).toBe("03 Mar 2025, 14:07 UTC");
    expect(formatDate(Date.UTC(2025, 0, 31, 23, 30))).toBe("31 Jan 2025");
  });

  it("refuses an invalid date", () => {
    expect(() => formatDateTime("not a date")).toThrow(/valid date/);
  });
});
