import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";
import type { MailMessage } from "./messages";

let transporter: Transporter | undefined;

// The local sink speaks plain SMTP without TLS; a hosted provider's smtps:// URL or STARTTLS works as usual.
function getTransporter(): Transporter {
  transporter ??= nodemailer.createTransport(env.SMTP_URL);
  return transporter;
}

/** Sends one message through SMTP_URL. Throws when the server refuses it. */
export async function sendMail(message: MailMessage): Promise<void> {
  await getTransporter().sendMail({ from: env.MAIL_FROM, ...message });
}
