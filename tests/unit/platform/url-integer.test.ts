import { describe, expect, it } from "vitest";
import { INT4_MAX, positiveIntFromUrl } from "@/lib/schemas/url-integer";

// The one schema for whole numbers from a URL (issue 11, item 10). The int4 range is
// −2 147 483 648 … 2 147 483 647 (PostgreSQL 15 manual, §8.1.1 "Integer Types").

const page = positiveIntFromUrl("page");
const messageOf = (value: unknown) => {
  const parsed = page.safeParse(value);
  if (parsed.success) throw new Error(`accepted ${String(value)}`);
  return parsed.error.issues[0].message;
};

describe("positiveIntFromUrl", () => {
  it("reads 1 and 2³¹ − 1, as text and as numbers", () => {
    expect(page.parse("1")).toBe(1);
    expect(page.parse("2147483647")).toBe(INT4_MAX);
    expect(page.parse(50)).toBe(50);
    expect(page.parse("0000000000000000001")).toBe(1);
    expect(INT4_MAX).toBe(2 ** 31 - 1);
  });

  it.each(["2147483648", "99999999999", "4294967297", "9".repeat(400)])("refuses %s as above the int4 range", (value) => {
    expect(messageOf(value)).toBe("page must be at most 2 147 483 647");
  });

  it.each(["0", "000"])("refuses %s as below 1", (value) => {
    expect(messageOf(value)).toBe("page must be at least 1");
  });

  it.each(["1e20", "-1", "1.5", "+3", " 2", "0x10", "", "two"])("refuses %j as not digits", (value) => {
    expect(messageOf(value)).toBe("page must be a whole number written in digits (no sign, decimal point or exponent)");
  });

  it("takes a tighter bound and a default", () => {
    const pageSize = positiveIntFromUrl("pageSize", 500).default(50);
    expect(pageSize.parse(undefined)).toBe(50);
    expect(pageSize.parse("500")).toBe(500);
    for (const value of ["501", "99999999999"]) expect(pageSize.safeParse(value).error?.issues[0].message).toBe("pageSize must be at most 500");
  });
});
