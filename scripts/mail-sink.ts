import { randomUUID } from "node:crypto";
import { createServer } from "node:http";
import { SMTPServer } from "smtp-server";
import type { MailSinkMessage } from "@/lib/email/sink-message";
import { parseMailSinkEnv } from "@/lib/env";
import { parseMail } from "./lib/mime";

// Development and test mail sink: accepts every message over plain SMTP on 127.0.0.1, keeps it in memory,
// and lists the messages as JSON over HTTP (GET /messages, DELETE /messages). Never relays anything.

const ports = parseMailSinkEnv();

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
      const envelopeTo = session.envelope.rcptTo.map((rcpt) => rcpt.address).join(", ");
      messages.unshift({ id: randomUUID(), ...parsed, to: parsed.to || envelopeTo, receivedAt: new Date().toISOString() });
      messages.length = Math.min(messages.length, maxMessages);
      callback();
    });
  },
});

const http = createServer((request, response) => {
  const url = new URL(request.url ?? "/", "http://127.0.0.1");
  if (url.pathname !== "/messages") {
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

smtp.listen(ports.MAIL_SINK_SMTP_PORT, "127.0.0.1", () => {
  http.listen(ports.MAIL_SINK_HTTP_PORT, "127.0.0.1", () => {
    console.log(`mail sink: smtp://127.0.0.1:${ports.MAIL_SINK_SMTP_PORT}, messages at http://127.0.0.1:${ports.MAIL_SINK_HTTP_PORT}/messages`);
  });
});

function stop() {
  http.close();
  smtp.close(() => process.exit(0));
}
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
