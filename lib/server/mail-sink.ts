import "server-only";
import { z } from "zod";
import { env } from "@/lib/env";

const sinkMessageSchema = z.object({
  id: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string().optional(),
  receivedAt: z.coerce.date(),
});
export type SinkMessage = z.infer<typeof sinkMessageSchema>;

/** True when the development mail sink is configured (never in production). */
export function isMailSinkEnabled(): boolean {
  return env.MAIL_SINK_URL !== undefined;
}

/** Messages the development sink has received, newest first; [] when the sink is not configured. */
export async function listSinkMessages(): Promise<SinkMessage[]> {
  if (!env.MAIL_SINK_URL) return [];
  const response = await fetch(new URL("/messages", env.MAIL_SINK_URL), { cache: "no-store" });
  if (!response.ok) throw new Error(`Mail sink answered ${response.status}`);
  return z.array(sinkMessageSchema).parse(await response.json());
}
