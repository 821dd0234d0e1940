// Just enough MIME reading for the development mail sink: the messages nodemailer writes (single part or
// multipart/alternative, 7bit / quoted-printable / base64, UTF-8). RFC 2045–2047.

export type ParsedMail = { to: string; subject: string; text: string; html?: string };

type Part = { headers: Map<string, string>; body: string };

function splitHeaders(raw: string): Part {
  const normalised = raw.replace(/\r\n/g, "\n");
  const end = normalised.indexOf("\n\n");
  const head = end === -1 ? normalised : normalised.slice(0, end);
  const body = end === -1 ? "" : normalised.slice(end + 2);
  const headers = new Map<string, string>();
  // Folded header lines continue with whitespace (RFC 5322 §2.2.3).
  for (const line of head.replace(/\n[ \t]+/g, " ").split("\n")) {
    const colon = line.indexOf(":");
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  return { headers, body };
}

function headerParam(value: string, name: string): string | undefined {
  const match = new RegExp(`${name}="?([^";]+)"?`, "i").exec(value);
  return match?.[1];
}

function decodeQuotedPrintable(input: string): Buffer {
  const joined = input.replace(/=\n/g, "");
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i++) {
    const hex = joined.slice(i + 1, i + 3);
    if (joined[i] === "=" && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(joined[i], "utf8"));
    }
  }
  return Buffer.from(bytes);
}

function decodeBody(part: Part): string {
  const encoding = (part.headers.get("content-transfer-encoding") ?? "7bit").toLowerCase();
  if (encoding === "base64") return Buffer.from(part.body.replace(/\s+/g, ""), "base64").toString("utf8");
  if (encoding === "quoted-printable") return decodeQuotedPrintable(part.body).toString("utf8");
  return part.body;
}

/** Decodes RFC 2047 encoded words such as `=?UTF-8?Q?Caf=C3=A9?=` in a header value. */
export function decodeHeaderWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, "?==?")
    .replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_all, _charset: string, kind: string, text: string) =>
      kind.toUpperCase() === "B"
        ? Buffer.from(text, "base64").toString("utf8")
        : decodeQuotedPrintable(text.replace(/_/g, " ")).toString("utf8"),
    );
}

function leafParts(part: Part): Part[] {
  const type = part.headers.get("content-type") ?? "text/plain";
  if (!type.toLowerCase().startsWith("multipart/")) return [part];
  const boundary = headerParam(type, "boundary");
  if (!boundary) return [];
  const sections = part.body.split(`--${boundary}`).slice(1);
  return sections
    .filter((section) => !section.startsWith("--"))
    .flatMap((section) => leafParts(splitHeaders(section.replace(/^\n/, ""))));
}

/** Reads the recipient, subject, plain text and HTML out of a raw RFC 5322 message. */
export function parseMail(raw: string): ParsedMail {
  const message = splitHeaders(raw);
  let text = "";
  let html: string | undefined;
  for (const part of leafParts(message)) {
    const type = (part.headers.get("content-type") ?? "text/plain").toLowerCase();
    if (type.startsWith("text/html")) html ??= decodeBody(part).trimEnd();
    else if (type.startsWith("text/plain") && text === "") text = decodeBody(part).trimEnd();
  }
  return {
    to: decodeHeaderWords(message.headers.get("to") ?? ""),
    subject: decodeHeaderWords(message.headers.get("subject") ?? ""),
    text,
    ...(html !== undefined ? { html } : {}),
  };
}
