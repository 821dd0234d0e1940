import { describe, expect, inject, it } from "vitest";
import { messagesAddressedTo } from "@/lib/email/sink-message";
import { TestClient, testEmail, testPassword } from "@/tests/support/client";
import { linkIn, listMail, mailSinkAuthorization, waitForMail } from "@/tests/support/mail";

// The account takeover of issue 11 §1: a signed-out visitor asks for a victim's password reset and reads
// the link on /dev/mail, or straight from the mail sink's HTTP side. /dev/mail shows a signed-in user only
// the mail addressed to them; the sink answers only requests with its bearer token.

const attackerPassword = "chosen-by-the-attacker-2024";

/** The token of the newest reset e-mail to `email`, read from the sink with the tests' own token. */
async function resetTokenSentTo(email: string, baseUrl: string): Promise<string> {
  const token = new URL(linkIn(await waitForMail(email), `${baseUrl}/reset-password`)).searchParams.get("token");
  if (!token) throw new Error(`The reset e-mail to ${email} has no token`);
  return token;
}

/**
 * The attack, step by step, as a signed-out visitor: request a reset for the victim, read the link on
 * /dev/mail, choose a new password with it, sign in as the victim. Returns how far it got.
 */
async function attemptTakeover(victimEmail: string) {
  const attacker = new TestClient();
  const requested = await attacker.post("/api/auth/request-password-reset", { email: victimEmail, redirectTo: "/reset-password" });
  expect(requested.status).toBe(200);
  // The message is in the sink before the attacker looks, so an empty page is not a timing accident.
  const token = await resetTokenSentTo(victimEmail, attacker.baseUrl);
  const page = await attacker.get("/dev/mail");
  const html = typeof page.body === "string" ? page.body : "";
  const outcome = {
    devMailStatus: page.status,
    devMailRedirect: page.headers.get("location"),
    linkRead: html.includes(token),
    passwordChanged: false,
    signedInAsVictim: false,
  };
  if (!outcome.linkRead) return outcome;
  const reset = await attacker.post("/api/auth/reset-password", { token, newPassword: attackerPassword });
  outcome.passwordChanged = reset.status === 200;
  outcome.signedInAsVictim = (await attacker.signIn(victimEmail, attackerPassword)).status === 200;
  return outcome;
}

describe("/dev/mail", () => {
  it("refuses the account takeover: a signed-out visitor is sent to sign in and never sees the reset link", async () => {
    const victimEmail = await new TestClient().newUser("victim");
    const outcome = await attemptTakeover(victimEmail);
    expect(outcome).toEqual({
      devMailStatus: 307,
      devMailRedirect: "/sign-in?next=%2Fdev%2Fmail",
      linkRead: false,
      passwordChanged: false,
      signedInAsVictim: false,
    });
    // The victim's own password still works; the attacker's does not.
    expect((await new TestClient().signIn(victimEmail, testPassword)).status).toBe(200);
    expect((await new TestClient().signIn(victimEmail, attackerPassword)).status).toBe(401);
  });

  it("shows a signed-in user their own mail and nobody else's, even at an address that contains theirs", async () => {
    const near = new TestClient();
    const nearEmail = await near.newUser("near");
    // Another user's address that ends with the first one's: a substring match would hand it over.
    const farEmail = `long.${nearEmail}`;
    expect((await new TestClient().signUp({ name: "Far Away", email: farEmail })).status).toBe(200);
    const anyone = new TestClient();
    for (const email of [nearEmail, farEmail]) {
      expect((await anyone.post("/api/auth/request-password-reset", { email, redirectTo: "/reset-password" })).status).toBe(200);
    }
    const nearToken = await resetTokenSentTo(nearEmail, near.baseUrl);
    const farToken = await resetTokenSentTo(farEmail, near.baseUrl);

    const page = await near.get("/dev/mail");
    expect(page.status).toBe(200);
    const html = page.body as string;
    expect(html).toContain(nearToken);
    expect(html).not.toContain(farToken);
    expect(html).not.toContain(farEmail);

    // A user with no mail sees none of the others'.
    const stranger = new TestClient();
    await stranger.newUser("stranger");
    const strangerPage = (await stranger.get("/dev/mail")).body as string;
    for (const secret of [nearToken, farToken, nearEmail]) expect(strangerPage).not.toContain(secret);
  });
});

describe("the mail sink's HTTP side", () => {
  const messagesUrl = () => `${inject("mailSinkUrl")}/messages`;

  it("answers 401 and no messages without the right bearer token", async () => {
    const email = testEmail("sink");
    await new TestClient().signUp({ name: "Sink Reader", email });
    expect((await new TestClient().post("/api/auth/request-password-reset", { email, redirectTo: "/reset-password" })).status).toBe(200);
    await waitForMail(email);

    const right = mailSinkAuthorization();
    const attempts: Record<string, Record<string, string>> = {
      "no token": {},
      "a wrong token": { authorization: `Bearer ${"0".repeat(64)}` },
      "a prefix of the token": { authorization: right.slice(0, -1) },
      "the token with another scheme": { authorization: right.replace("Bearer", "Basic") },
      "the token in another header": { "x-token": right.slice("Bearer ".length) },
    };
    for (const [label, headers] of Object.entries(attempts)) {
      const response = await fetch(messagesUrl(), { headers });
      const text = await response.text();
      expect([label, response.status]).toEqual([label, 401]);
      expect(text).not.toContain(email);
    }
    const deleted = await fetch(messagesUrl(), { method: "DELETE" });
    expect(deleted.status).toBe(401);
    // Nothing was deleted: the message is still there for the token holder.
    expect(messagesAddressedTo(await listMail(), email)).not.toEqual([]);
  });
});

describe("what a signed-out visitor sees elsewhere", () => {
  it("/api/health says only whether the database and a worker are there", async () => {
    const response = await new TestClient().get("/api/health");
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ ok: true, database: "ok", worker: "ok" });
  });
});
