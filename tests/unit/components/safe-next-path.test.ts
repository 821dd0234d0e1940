import { describe, expect, it } from "vitest";
import { authPageHref, defaultAfterSignIn, safeNextPath } from "@/components/auth/safe-next-path";

// Open-redirect cases follow the OWASP Unvalidated Redirects and Forwards Cheat Sheet (common practice).
describe("safeNextPath", () => {
  it("keeps a path on this site with its query", () => {
    expect(safeNextPath("/invitations/abc?x=1")).toBe("/invitations/abc?x=1");
  });

  it.each([
    ["missing", undefined],
    ["empty", ""],
    ["absolute URL", "https://evil.example/"],
    ["protocol-relative", "//evil.example/"],
    ["backslash trick", "/\\evil.example"],
    ["tab inside", "/\t/evil.example"],
    ["javascript scheme", "javascript:alert(1)"],
  ])("falls back to the default for %s", (_label, value) => {
    expect(safeNextPath(value)).toBe(defaultAfterSignIn);
  });

  it("takes the first of repeated values", () => {
    expect(safeNextPath(["/w/lab", "//evil"])).toBe("/w/lab");
  });
});

describe("authPageHref", () => {
  it("adds next only when it is not the default", () => {
    expect(authPageHref("/sign-up", "/invitations/a b")).toBe("/sign-up?next=%2Finvitations%2Fa%20b");
    expect(authPageHref("/sign-in", defaultAfterSignIn)).toBe("/sign-in");
  });
});
