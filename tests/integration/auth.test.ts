import { describe, expect, it } from "vitest";
import { TestClient, testEmail, testPassword } from "@/tests/support/client";
import { linkIn, waitForMail } from "@/tests/support/mail";

// Sign-up, sign-in, sign-out and password reset through better-auth's own endpoints under /api/auth,
// as the browser forms call them (issue 2 §5).

async function sessionEmail(client: TestClient): Promise<string | null> {
  const response = await client.get("/api/auth/get-session");
  const body = response.body as { user?: { email: string } } | null;
  return body?.user?.email ?? null;
}

describe("e-mail and password accounts", () => {
  it("signs up, signs out and signs in again", async () => {
    const client = new TestClient();
    const email = testEmail("account");
    const signedUp = await client.signUp({ name: "Account Holder", email });
    expect(signedUp.status).toBe(200);
    expect(await sessionEmail(client)).toBe(email);

    expect((await client.signOut()).status).toBe(200);
    expect(await sessionEmail(client)).toBeNull();
    expect((await client.get("/api/workspaces")).status).toBe(401);

    expect((await client.signIn(email)).status).toBe(200);
    expect(await sessionEmail(client)).toBe(email);
    expect((await client.get("/api/workspaces")).status).toBe(200);
  });

  it("refuses a wrong password and a duplicate sign-up", async () => {
    const client = new TestClient();
    const email = await client.newUser("duplicate");
    const stranger = new TestClient();
    expect((await stranger.signIn(email, "not-the-password")).status).toBe(401);
    expect(await sessionEmail(stranger)).toBeNull();
    const again = await new TestClient().signUp({ name: "Again", email });
    expect(again.status).toBeGreaterThanOrEqual(400);
    expect(again.status).toBeLessThan(500);
  });

  it("rate-limits repeated failed sign-ins from one address", async () => {
    const client = new TestClient();
    const email = await client.newUser("target");
    const attacker = new TestClient();
    const statuses: number[] = [];
    // The default limit is AUTH_RATE_LIMIT_MAX = 10 attempts per 60 s (lib/env.ts).
    for (let attempt = 0; attempt < 12; attempt++) statuses.push((await attacker.signIn(email, `wrong-${attempt}`)).status);
    expect(statuses.slice(0, 10)).toEqual(Array(10).fill(401));
    expect(statuses.slice(10)).toEqual([429, 429]);
    // Even the right password is refused until the window passes …
    expect((await attacker.signIn(email, testPassword)).status).toBe(429);
    // … while another address is unaffected.
    expect((await new TestClient().signIn(email, testPassword)).status).toBe(200);
  });

  it("limits failed sign-ins per account, whichever addresses they come from", async () => {
    const email = await new TestClient().newUser("guessed");
    // AUTH_ACCOUNT_RATE_LIMIT_MAX = 20 failures per 15 minutes (lib/env.ts); every attempt from a new address.
    for (let attempt = 0; attempt < 20; attempt++) {
      expect((await new TestClient().signIn(email, `guess-${attempt}`)).status).toBe(401);
    }
    const blocked = await new TestClient().signIn(email, testPassword);
    expect(blocked.status).toBe(429);
    expect(blocked.body).toMatchObject({ error: { code: "rate_limited", message: expect.stringMatching(/this account/) } });
    // Another account is not affected.
    const other = new TestClient();
    const otherEmail = await other.newUser("unguessed");
    expect((await new TestClient().signIn(otherEmail)).status).toBe(200);
  });

  it("resets a password through the e-mailed link", async () => {
    const client = new TestClient();
    const email = await client.newUser("forgetful");
    const requested = await client.post("/api/auth/request-password-reset", { email, redirectTo: "/reset-password" });
    expect(requested.status).toBe(200);
    const mail = await waitForMail(email);
    const link = new URL(linkIn(mail, `${client.baseUrl}/reset-password`));
    const token = link.searchParams.get("token");
    expect(token).toBeTruthy();

    const reset = await client.post("/api/auth/reset-password", { token, newPassword: "a-brand-new-passphrase" });
    expect(reset.status).toBe(200);
    expect((await new TestClient().signIn(email, testPassword)).status).toBe(401);
    expect((await new TestClient().signIn(email, "a-brand-new-passphrase")).status).toBe(200);
  });
});
