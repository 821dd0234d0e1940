import "server-only";
import { mailSinkMessageListSchema, messagesAddressedTo, type MailSinkMessage } from "@/lib/email/sink-message";
import { env } from "@/lib/env";

/** A caught message as the /dev/mail page shows it. */
export type SinkMessage = Omit<MailSinkMessage, "receivedAt"> & { receivedAt: Date };

const loopbackHosts = new Set(["127.0.0.1", "localhost", "[::1]"]);

/**
 * True when the development mail sink is configured AND the app is served on a loopback address. An
 * APP_URL with a public host name (a server behind a proxy) turns /dev/mail off even if MAIL_SINK_URL is
 * left set: a development tool is never part of a public site.
 */
export function isMailSinkEnabled(): boolean {
  return env.MAIL_SINK_URL !== undefined && loopbackHosts.has(new URL(env.APP_URL).hostname);
}

/**
 * The messages the development sink delivered to `email`, newest first; [] when the sink is not enabled.
 * The sink holds everyone's mail (password-reset links included), so only this filtered list ever leaves
 * the server.
 */
export async function listSinkMessagesFor(email: string): Promise<SinkMessage[]> {
  if (!isMailSinkEnabled() || !env.MAIL_SINK_URL) return [];
  const response = await fetch(new URL("/messages", env.MAIL_SINK_URL), {
    cache: "no-store",
    headers: { authorization: `Bearer ${env.MAIL_SINK_TOKEN}` },
  });
  if (!response.ok) throw new Error(`Mail sink answered ${response.status}`);
  const messages = mailSinkMessageListSchema.parse(await response.json());
  return messagesAddressedTo(messages, email).map((message) => ({ ...message, receivedAt: new Date(message.receivedAt) }));
}
