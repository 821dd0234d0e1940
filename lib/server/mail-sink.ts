import "server-only";
import { mailSinkMessageListSchema, type MailSinkMessage } from "@/lib/email/sink-message";
import { env } from "@/lib/env";

/** A caught message as the /dev/mail page shows it. */
export type SinkMessage = Omit<MailSinkMessage, "receivedAt"> & { receivedAt: Date };

const loopbackHosts = new Set(["127.0.0.1", "localhost", "[::1]"]);

/**
 * True when the development mail sink is configured AND the app is served on a loopback address. The sink
 * holds every password-reset link, so its page must never be reachable from another machine: an APP_URL
 * with a public host name (a server behind a proxy) turns the page off even if MAIL_SINK_URL is left set.
 */
export function isMailSinkEnabled(): boolean {
  return env.MAIL_SINK_URL !== undefined && loopbackHosts.has(new URL(env.APP_URL).hostname);
}

/** Messages the development sink has received, newest first; [] when the sink is not enabled. */
export async function listSinkMessages(): Promise<SinkMessage[]> {
  if (!isMailSinkEnabled() || !env.MAIL_SINK_URL) return [];
  const response = await fetch(new URL("/messages", env.MAIL_SINK_URL), { cache: "no-store" });
  if (!response.ok) throw new Error(`Mail sink answered ${response.status}`);
  return mailSinkMessageListSchema
    .parse(await response.json())
    .map((message) => ({ ...message, receivedAt: new Date(message.receivedAt) }));
}
