import { beforeAll, describe, expect, it } from "vitest";
import { TestClient, type TestResponse } from "@/tests/support/client";

// Security headers on every response (issue 11 §2): a nonce-based Content-Security-Policy on pages (Next
// stamps the nonce on its own scripts, which needs per-request rendering), a locked-down policy on API
// answers, frame-ancestors 'none', Referrer-Policy and X-Content-Type-Options everywhere.

/** The policy's directives by name, each with its source list. */
function directives(response: TestResponse): Map<string, string[]> {
  const header = response.headers.get("content-security-policy");
  expect(header, "Content-Security-Policy header").toBeTruthy();
  return new Map(
    header!
      .split(";")
      .map((part) => part.trim().split(/\s+/))
      .filter((words) => words[0] !== "")
      .map(([name, ...sources]) => [name.toLowerCase(), sources]),
  );
}

function expectCommonHeaders(response: TestResponse): Map<string, string[]> {
  expect(response.headers.get("x-content-type-options")).toBe("nosniff");
  expect(response.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
  const policy = directives(response);
  expect(policy.get("frame-ancestors")).toEqual(["'none'"]);
  return policy;
}

/** Checks a page's policy and that every script tag of its HTML carries the policy's nonce; returns the nonce. */
function expectPagePolicy(response: TestResponse): string {
  const policy = expectCommonHeaders(response);
  const scriptSources = policy.get("script-src") ?? [];
  const nonceSource = scriptSources.find((source) => source.startsWith("'nonce-"));
  expect(nonceSource, `script-src ${scriptSources.join(" ")}`).toBeDefined();
  const nonce = nonceSource!.slice("'nonce-".length, -1);
  // At least 128 random bits, base64 (CSP Level 3 §2.3.1 asks for 128 bits; W3C Recommendation).
  expect(nonce).toMatch(/^[A-Za-z0-9+/]{22,}={0,2}$/);
  expect(scriptSources).toContain("'strict-dynamic'");
  expect(scriptSources).not.toContain("'unsafe-inline'");
  expect(scriptSources).not.toContain("'unsafe-eval'");
  expect(policy.get("object-src")).toEqual(["'none'"]);
  expect(policy.get("base-uri")).toEqual(["'none'"]);
  expect(policy.get("form-action")).toEqual(["'self'"]);
  expect(policy.get("default-src")).toEqual(["'self'"]);
  if (typeof response.body === "string" && response.body.startsWith("<!DOCTYPE html>")) {
    const scripts = response.body.match(/<script\b[^>]*>/g) ?? [];
    expect(scripts.length).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
  }
  return nonce;
}

const signedOutPages = ["/", "/sign-in", "/sign-up", "/forgot-password", "/reset-password?token=not-a-token", "/invitations/no-such-invitation"];

let owner: TestClient;
let slug: string;

beforeAll(async () => {
  owner = new TestClient();
  await owner.newUser("headers");
  const created = await owner.post("/api/workspaces", { name: "Halvorsen header check" });
  expect(created.status).toBe(201);
  slug = (created.body as { slug: string }).slug;
});

describe("security headers", () => {
  it.each(signedOutPages)("signed-out page %s: 200 with a nonce on every script", async (path) => {
    const response = await new TestClient().get(path);
    expect(response.status).toBe(200);
    expectPagePolicy(response);
  });

  it("signed-in pages: 200 with a nonce on every script", async () => {
    const paths = ["/workspaces", `/w/${slug}`, `/w/${slug}/members`, `/w/${slug}/datasets`, `/w/${slug}/datasets/new`, `/w/${slug}/fits`, `/w/${slug}/fits/new`, "/dev/mail"];
    for (const path of paths) {
      const response = await owner.get(path);
      expect([path, response.status]).toEqual([path, 200]);
      expectPagePolicy(response);
    }
  });

  it("a 404 page, a 404 inside a workspace and a sign-in redirect carry the headers too", async () => {
    const missing = await new TestClient().get("/no-such-page");
    expect(missing.status).toBe(404);
    expectPagePolicy(missing);
    const foreign = await owner.get("/w/no-such-workspace-here");
    expect(foreign.status).toBe(404);
    expectPagePolicy(foreign);
    const redirect = await new TestClient().get(`/w/${slug}/fits`);
    expect(redirect.status).toBe(307);
    expectCommonHeaders(redirect);
  });

  it("API answers get a policy that allows nothing, and the common headers", async () => {
    const answers = [await new TestClient().get("/api/health"), await new TestClient().get("/api/workspaces"), await owner.get("/api/workspaces")];
    expect(answers.map((answer) => answer.status)).toEqual([200, 401, 200]);
    for (const answer of answers) {
      const policy = expectCommonHeaders(answer);
      expect(policy.get("default-src")).toEqual(["'none'"]);
    }
  });

  it("static files are sent with nosniff", async () => {
    const page = await new TestClient().get("/sign-in");
    const script = (page.body as string).match(/<script\b[^>]*\bsrc="(\/_next\/static\/[^"]+\.js)"/)?.[1];
    expect(script).toBeDefined();
    const response = await new TestClient().get(script!);
    expect(response.status).toBe(200);
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
  });

  it("draws a fresh nonce for every request", async () => {
    const nonces = new Set<string>();
    for (let i = 0; i < 3; i++) nonces.add(expectPagePolicy(await new TestClient().get("/sign-in")));
    nonces.add(expectPagePolicy(await new TestClient().get("/")));
    expect(nonces.size).toBe(4);
  });
});
