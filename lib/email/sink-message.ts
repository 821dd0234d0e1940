import { z } from "zod";

/**
 * One message as the development mail sink lists it over HTTP (GET /messages, newest first). Shared by the
 * sink, the /dev/mail page and the tests, so the three never disagree about the JSON.
 */
export const mailSinkMessageSchema = z.object({
  id: z.string(),
  /** The To header as written (display names included); for reading, not for deciding who may see it. */
  to: z.string(),
  /** The SMTP envelope's recipients (RCPT TO), lower-case: the addresses the message was delivered to. */
  recipients: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().optional(),
  /** ISO 8601 time the sink received the message. */
  receivedAt: z.iso.datetime(),
});
export type MailSinkMessage = z.infer<typeof mailSinkMessageSchema>;

export const mailSinkMessageListSchema = z.array(mailSinkMessageSchema);

/**
 * The messages delivered to `email`: whole-address comparison with the envelope recipients, ignoring case
 * (better-auth stores addresses lower-cased, and the app sends to the stored address). Never a substring
 * match, which would show `long.ann@x.example`'s mail to `ann@x.example`.
 */
export function messagesAddressedTo<M extends Pick<MailSinkMessage, "recipients">>(messages: M[], email: string): M[] {
  const address = email.trim().toLowerCase();
  return messages.filter((message) => message.recipients.includes(address));
}
