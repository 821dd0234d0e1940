import { describe, expect, it } from "vitest";
import { apiContentSecurityPolicy, newNonce, pageContentSecurityPolicy } from "@/lib/server/security-headers";

// The page policy of proxy.ts in each mode; the integration test checks the headers on real responses.

const directives = (policy: string) => new Map(policy.split("; ").map((part) => [part.split(" ")[0], part.split(" ").slice(1)]));

describe("pageContentSecurityPolicy", () => {
  it("in production allows scripts and style elements only with the nonce, and no eval", () => {
    const policy = directives(pageContentSecurityPolicy({ nonce: "abc", development: false, https: false }));
    expect(policy.get("script-src")).toEqual(["'self'", "'nonce-abc'", "'strict-dynamic'"]);
    expect(policy.get("style-src")).toEqual(["'self'", "'nonce-abc'"]);
    expect(policy.get("style-src-attr")).toEqual(["'unsafe-inline'"]);
    expect(policy.get("frame-ancestors")).toEqual(["'none'"]);
    expect(policy.get("object-src")).toEqual(["'none'"]);
    expect(policy.has("upgrade-insecure-requests")).toBe(false);
  });

  it("in development adds eval for scripts and inline styles, as next dev needs", () => {
    const policy = directives(pageContentSecurityPolicy({ nonce: "abc", development: true, https: false }));
    expect(policy.get("script-src")).toEqual(["'self'", "'nonce-abc'", "'strict-dynamic'", "'unsafe-eval'"]);
    expect(policy.get("style-src")).toEqual(["'self'", "'unsafe-inline'"]);
  });

  it("upgrades insecure requests only when the app is served over https", () => {
    expect(directives(pageContentSecurityPolicy({ nonce: "abc", development: false, https: true })).has("upgrade-insecure-requests")).toBe(true);
  });

  it("gives API answers a policy that allows nothing", () => {
    expect(directives(apiContentSecurityPolicy)).toEqual(new Map([["default-src", ["'none'"]], ["frame-ancestors", ["'none'"]]]));
  });
});

describe("newNonce", () => {
  it("draws 128 bits, base64, different every time", () => {
    const nonces = Array.from({ length: 100 }, newNonce);
    for (const nonce of nonces) expect(Buffer.from(nonce, "base64")).toHaveLength(16);
    expect(new Set(nonces).size).toBe(100);
  });
});
