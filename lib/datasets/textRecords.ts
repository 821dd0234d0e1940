import { type ByteSource, byteChunks } from "./byteSource";
import { StopParsing } from "./issues";
import { describeByteLimit } from "./options";

/** One logical record of a delimited file: its text and the line it starts on (1-based, as an editor shows). */
export interface TextRecord {
  line: number;
  text: string;
}

const fileIssue = (row: number | null, message: string) =>
  new StopParsing({ row, column: null, columnName: null, message });

const UTF16_MESSAGE = "the file is UTF-16 text; save it as UTF-8 (CSV UTF-8) and upload again";

const quoteCount = (text: string): number => {
  let n = 0;
  for (let i = text.indexOf('"'); i !== -1; i = text.indexOf('"', i + 1)) n++;
  return n;
};

/**
 * Streams the records of a UTF-8 delimited file: strips a byte-order mark, accepts LF and CRLF, skips blank
 * lines and `#` comment lines, and joins the lines of a quoted field that spans several lines (an odd number
 * of `"` so far means a quote is still open, RFC 4180 §2.6–2.7). Stops with an issue on a NUL byte or
 * invalid UTF-8 (binary data, UTF-16), on an unclosed quote, or once more than `maxBytes` have arrived.
 * @param source - the file's bytes
 * @param maxBytes - largest accepted size in bytes
 */
export async function* readTextRecords(source: ByteSource, maxBytes: number): AsyncGenerator<TextRecord> {
  const decoder = new TextDecoder("utf-8", { fatal: true });
  let bytesSeen = 0;
  const head: number[] = [];
  let lineNumber = 0;
  let partialLine = "";
  // The record still waiting for its closing quote; held in an object so that closures update it.
  const pending: { open: { line: number; text: string; quotes: number } | null } = { open: null };

  // A UTF-16 byte-order mark: the file is text, only in an encoding we do not read.
  const isUtf16 = () => (head[0] === 0xff && head[1] === 0xfe) || (head[0] === 0xfe && head[1] === 0xff);

  function* takeLine(raw: string): Generator<TextRecord> {
    lineNumber++;
    const line = raw.endsWith("\r") ? raw.slice(0, -1) : raw;
    if (line.includes("\0"))
      throw fileIssue(
        lineNumber,
        isUtf16()
          ? UTF16_MESSAGE
          : "the file contains a NUL byte: this looks like a binary file, not delimited text",
      );
    let open = pending.open;
    if (open) {
      open.text += "\n" + line;
      open.quotes += quoteCount(line);
    } else {
      const trimmed = line.trimStart();
      if (trimmed === "" || trimmed.startsWith("#")) return;
      open = pending.open = { line: lineNumber, text: line, quotes: quoteCount(line) };
    }
    if (open.quotes % 2 === 0) {
      yield { line: open.line, text: open.text };
      pending.open = null;
    }
  }

  function decode(bytes: Uint8Array | undefined): string {
    try {
      return bytes ? decoder.decode(bytes, { stream: true }) : decoder.decode();
    } catch {
      throw fileIssue(
        lineNumber + 1,
        isUtf16() ? UTF16_MESSAGE : "the file is not valid UTF-8 text (binary data, or another text encoding)",
      );
    }
  }

  for await (const chunk of byteChunks(source)) {
    bytesSeen += chunk.byteLength;
    if (bytesSeen > maxBytes) throw fileIssue(null, `the file is larger than the limit of ${describeByteLimit(maxBytes)}`);
    for (let i = 0; head.length < 2 && i < chunk.length; i++) head.push(chunk[i]);
    const pieces = (partialLine + decode(chunk)).split("\n");
    partialLine = pieces.pop() ?? "";
    for (const piece of pieces) yield* takeLine(piece);
  }
  const rest = partialLine + decode(undefined);
  if (rest !== "") yield* takeLine(rest);
  if (pending.open) throw fileIssue(pending.open.line, "a quoted field opened on this row is never closed");
}
