import { randomUUID } from "node:crypto";
import { inject } from "vitest";

/** A response as the tests look at it. */
export type TestResponse = { status: number; body: unknown; headers: Headers };

let clientsMade = 0;

/**
 * A fresh address in the IPv6 documentation range 2001:db8::/32 (RFC 3849), so each simulated client has
 * its own rate-limit bucket. better-auth groups IPv6 clients by /64, so the process id (test files run in
 * separate processes) and a counter go into the /64 prefix itself: no two clients of one run share it.
 */
export function testClientIp(): string {
  clientsMade += 1;
  return `2001:db8:${(process.pid & 0xffff).toString(16)}:${clientsMade.toString(16)}::1`;
}

/** A unique address on the reserved .example domain (RFC 2606). */
export function testEmail(label: string): string {
  return `${label}-${randomUUID().slice(0, 8)}@tests.example`;
}

export const testPassword = "correct-horse-battery";

/**
 * One simulated browser: keeps its cookies, sends the Origin better-auth expects and its own
 * X-Forwarded-For address (believed because the test app trusts 127.0.0.1 as a proxy; global-setup.ts). Requests go to inject("baseUrl") (provided by tests/support/global-setup.ts).
 */
export class TestClient {
  private readonly cookies = new Map<string, string>();
  readonly baseUrl: string;

  constructor(
    readonly ip: string = testClientIp(),
    private readonly bearer?: string,
  ) {
    // Not process.env.BASE_URL: inside test files vitest sets that to Vite's base path ("/").
    this.baseUrl = inject("baseUrl");
  }

  /** Same cookies and address, but authenticating with an API key instead. */
  static withApiKey(key: string): TestClient {
    return new TestClient(testClientIp(), key);
  }

  /**
   * `body` as a string is sent verbatim (for malformed JSON); anything else is JSON-encoded. `extraHeaders`
   * replace the defaults (e.g. another Origin or Content-Type).
   */
  async request(method: string, path: string, body?: unknown, extraHeaders: Record<string, string> = {}): Promise<TestResponse> {
    const headers: Record<string, string> = { origin: this.baseUrl, "x-forwarded-for": this.ip };
    if (this.cookies.size > 0) headers.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
    if (this.bearer) headers.authorization = `Bearer ${this.bearer}`;
    if (body !== undefined) headers["content-type"] = "application/json";
    Object.assign(headers, extraHeaders);
    const response = await fetch(new URL(path, this.baseUrl), {
      method,
      headers,
      body: body === undefined ? undefined : typeof body === "string" ? body : JSON.stringify(body),
      redirect: "manual",
    });
    for (const cookie of response.headers.getSetCookie()) {
      const [pair] = cookie.split(";");
      const eq = pair.indexOf("=");
      const name = pair.slice(0, eq);
      const value = pair.slice(eq + 1);
      if (value === "" || /max-age=0/i.test(cookie)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    const text = await response.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      // Not JSON (e.g. an HTML error page); tests see the raw text.
    }
    return { status: response.status, body: parsed, headers: response.headers };
  }

  get(path: string) {
    return this.request("GET", path);
  }

  post(path: string, body?: unknown) {
    return this.request("POST", path, body ?? {});
  }

  signUp(user: { name: string; email: string; password?: string }) {
    return this.post("/api/auth/sign-up/email", { ...user, password: user.password ?? testPassword });
  }

  signIn(email: string, password: string = testPassword) {
    return this.post("/api/auth/sign-in/email", { email, password });
  }

  signOut() {
    return this.post("/api/auth/sign-out");
  }

  /** Signs up a new user with a unique address and returns it. */
  async newUser(label: string): Promise<string> {
    const email = testEmail(label);
    const response = await this.signUp({ name: `Test ${label}`, email });
    if (response.status !== 200) throw new Error(`sign-up failed: ${response.status} ${JSON.stringify(response.body)}`);
    return email;
  }
}
