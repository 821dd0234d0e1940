import { z } from "zod";

/**
 * One message as the development mail sink lists it over HTTP (GET /messages, newest first). Shared by the
 * sink, the /dev/mail page and the tests, so the three never disagree about the JSON.
 */
export const mailSinkMessageSchema = z.object({
  id: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string().optional(),
  /** ISO 8601 time the sink received the message. */
  receivedAt: z.iso.datetime(),
});
export type MailSinkMessage = z.infer<typeof mailSinkMessageSchema>;

export const mailSinkMessageListSchema = z.array(mailSinkMessageSchema);
