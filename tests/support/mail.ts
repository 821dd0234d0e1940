import { inject } from "vitest";
import { mailSinkMessageListSchema, messagesAddressedTo, type MailSinkMessage } from "@/lib/email/sink-message";

export type CapturedMail = MailSinkMessage;

/** The sink's `Authorization` header: it answers 401 to any request without this run's token. */
export function mailSinkAuthorization(): string {
  return `Bearer ${inject("mailSinkToken")}`;
}

/** Every message the test sink holds, newest first. */
export async function listMail(): Promise<CapturedMail[]> {
  const response = await fetch(`${inject("mailSinkUrl")}/messages`, { headers: { authorization: mailSinkAuthorization() } });
  if (!response.ok) throw new Error(`The mail sink answered ${response.status}`);
  return mailSinkMessageListSchema.parse(await response.json());
}

/** Waits for the newest message delivered to the address `to` (SMTP delivery is asynchronous). */
export async function waitForMail(to: string, timeoutMs = 10_000): Promise<CapturedMail> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const [found] = messagesAddressedTo(await listMail(), to);
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`No e-mail to ${to} arrived within ${timeoutMs} ms`);
}

/** The first link in a message's text that starts with `prefix`. */
export function linkIn(message: CapturedMail, prefix: string): string {
  const match = message.text.match(/https?:\/\/\S+/g)?.find((link) => link.startsWith(prefix));
  if (!match) throw new Error(`No link starting with ${prefix} in: ${message.text}`);
  return match;
}
