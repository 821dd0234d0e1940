import nodemailer from "nodemailer";
import { describe, expect, it } from "vitest";
import { decodeHeaderWords, parseMail } from "@/scripts/lib/mime";

// The sink's MIME reader against messages built by nodemailer itself (its stream transport writes the
// exact bytes it would send over SMTP), so the test follows whatever encoding nodemailer picks.
async function rawMessage(message: { to: string; subject: string; text: string; html?: string }): Promise<string> {
  const transport = nodemailer.createTransport({ streamTransport: true, buffer: true, newline: "unix" });
  const info = await transport.sendMail({ from: "Sender <sender@tests.example>", ...message });
  return (info.message as Buffer).toString("utf8");
}

describe("parseMail", () => {
  it("reads a multipart/alternative message with non-ASCII text and long lines", async () => {
    const text = `Tørrisdal invited you to “Halvorsen” — open https://127.0.0.1:3000/invitations/${"a".repeat(90)}`;
    const raw = await rawMessage({ to: "lea@tests.example", subject: "Invitation to Kvantelab ÆØÅ", text, html: `<p>${text}</p>` });
    const parsed = parseMail(raw);
    expect(parsed).toEqual({ to: "lea@tests.example", subject: "Invitation to Kvantelab ÆØÅ", text, html: `<p>${text}</p>` });
  });

  it("reads a plain-text-only message", async () => {
    const parsed = parseMail(await rawMessage({ to: "a@tests.example", subject: "Plain", text: "line one\nline two" }));
    expect(parsed).toEqual({ to: "a@tests.example", subject: "Plain", text: "line one\nline two" });
  });
});

describe("decodeHeaderWords", () => {
  it("decodes B and Q encoded words (RFC 2047 §4 examples' forms)", () => {
    expect(decodeHeaderWords("=?UTF-8?B?w4ZyZQ==?=")).toBe("Ære");
    expect(decodeHeaderWords("=?UTF-8?Q?Caf=C3=A9_au_lait?=")).toBe("Café au lait");
    expect(decodeHeaderWords("=?UTF-8?Q?a?= =?UTF-8?Q?b?=")).toBe("ab");
  });
});
