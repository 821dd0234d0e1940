import { createHash, randomUUID, timingSafeEqual } from "node:crypto";
import { createServer, type IncomingMessage } from "node:http";
import { SMTPServer } from "smtp-server";
import type { MailSinkMessage } from "@/lib/email/sink-message";
import { parseMailSinkEnv } from "@/lib/env";
import { parseMail } from "./lib/mime";

// Development and test mail sink: accepts every message over plain SMTP on 127.0.0.1, keeps it in memory,
// and lists the messages as JSON over HTTP (GET /messages, DELETE /messages) to requests that carry
// `Authorization: Bearer $MAIL_SINK_TOKEN` (anything else: 401) — the messages hold password-reset links,
// which any process on this machine could otherwise read from 127.0.0.1. Never relays anything.

const config = parseMailSinkEnv();
const tokenDigest = sha256(`Bearer ${config.MAIL_SINK_TOKEN}`);

function sha256(text: string): Buffer {
  return createHash("sha256").update(text).digest();
}

/** Compares digests, so neither the length nor a prefix of the token leaks through timing. */
function authorised(request: IncomingMessage): boolean {
  const header = request.headers.authorization;
  return header !== undefined && timingSafeEqual(sha256(header), tokenDigest);
}

/** Oldest messages are dropped beyond this many (the sink runs for days during development). */
const maxMessages = 500;
const messages: MailSinkMessage[] = [];

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS", "AUTH"],
  logger: false,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on("data", (chunk: Buffer) => chunks.push(chunk));
    stream.on("end", () => {
      const parsed = parseMail(Buffer.concat(chunks).toString("utf8"));
      const recipients = session.envelope.rcptTo.map((rcpt) => rcpt.address.toLowerCase());
      messages.unshift({ id: randomUUID(), ...parsed, to: parsed.to || recipients.join(", "), recipients, receivedAt: new Date().toISOString() });
      messages.length = Math.min(messages.length, maxMessages);
      callback();
    });
  },
});

const http = createServer((request, response) => {
  const url = new URL(request.url ?? "/", "http://127.0.0.1");
  if (!authorised(request)) {
    response.writeHead(401, { "content-type": "application/json", "www-authenticate": "Bearer" }).end('{"error":"unauthenticated"}');
  } else if (url.pathname !== "/messages") {
    response.writeHead(404, { "content-type": "application/json" }).end('{"error":"not found"}');
  } else if (request.method === "GET") {
    response.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(messages));
  } else if (request.method === "DELETE") {
    messages.length = 0;
    response.writeHead(204).end();
  } else {
    response.writeHead(405).end();
  }
});

smtp.listen(config.MAIL_SINK_SMTP_PORT, "127.0.0.1", () => {
  http.listen(config.MAIL_SINK_HTTP_PORT, "127.0.0.1", () => {
    console.log(`mail sink: smtp://127.0.0.1:${config.MAIL_SINK_SMTP_PORT}, messages at http://127.0.0.1:${config.MAIL_SINK_HTTP_PORT}/messages`);
  });
});

function stop() {
  http.close();
  smtp.close(() => process.exit(0));
}
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
