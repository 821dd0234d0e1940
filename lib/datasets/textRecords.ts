import { type ByteSource, byteChunks } from "./byteSource";
import { StopParsing } from "./issues";
import { MAX_LINE_BYTES } from "./limits";
import { describeByteLimit } from "./options";

/** One logical record of a delimited file: its text and the line it starts on (1-based, as an editor shows). */
export interface TextRecord {
  line: number;
  text: string;
}

const fileIssue = (row: number | null, message: string) =>
  new StopParsing({ row, column: null, columnName: null, message });

const UTF16_MESSAGE = "the file is UTF-16 text; save it as UTF-8 (CSV UTF-8) and upload again";
const LINE_TOO_LONG = `this line is longer than the limit of ${describeByteLimit(MAX_LINE_BYTES)} for one line`;
const RECORD_TOO_LONG =
  `the quoted field opened on this row runs past the limit of ${describeByteLimit(MAX_LINE_BYTES)} for one record: ` +
  'is a closing quote (") missing?';

/** Bytes of `text` in UTF-8: 1 to 3 per UTF-16 unit below U+D800 and above U+DFFF, 2 per surrogate (4 per pair). */
function utf8Length(text: string): number {
  let bytes = text.length;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0x80) bytes += c >= 0x800 && (c < 0xd800 || c > 0xdfff) ? 2 : 1;
  }
  return bytes;
}

/** Whether a line is over the limit; its UTF-8 length is counted only when its length alone cannot tell. */
const overLineLimit = (text: string) => text.length > MAX_LINE_BYTES || (text.length * 3 > MAX_LINE_BYTES && utf8Length(text) > MAX_LINE_BYTES);

const quoteCount = (text: string): number => {
  let n = 0;
  for (let i = text.indexOf('"'); i !== -1; i = text.indexOf('"', i + 1)) n++;
  return n;
};

/**
 * Streams the records of a UTF-8 delimited file, one batch per chunk read: strips a byte-order mark, accepts
 * LF and CRLF, skips blank lines and `#` comment lines, and joins the lines of a quoted field that spans
 * several lines (an odd number of `"` so far means a quote is still open, RFC 4180 §2.6–2.7). Stops with an
 * issue on a NUL byte or invalid UTF-8 (binary data, UTF-16), on an unclosed quote, on a line or quoted
 * record longer than {@link MAX_LINE_BYTES} (checked as the bytes arrive, so a huge line is never built up),
 * or once more than `maxBytes` have arrived.
 * @param source - the file's bytes
 * @param maxBytes - largest accepted size in bytes
 * @returns batches of records in file order (a batch may be empty)
 */
export async function* readTextRecordBatches(source: ByteSource, maxBytes: number): AsyncGenerator<TextRecord[]> {
  const decoder = new TextDecoder("utf-8", { fatal: true });
  let bytesSeen = 0;
  const head: number[] = [];
  let lineNumber = 0;
  let partialLine = "";
  // The record still waiting for its closing quote.
  let open: { line: number; text: string; quotes: number; bytes: number } | null = null;

  // A UTF-16 byte-order mark: the file is text, only in an encoding we do not read.
  const isUtf16 = () => (head[0] === 0xff && head[1] === 0xfe) || (head[0] === 0xfe && head[1] === 0xff);

  // A NUL byte says "binary" (or UTF-16): a clearer reason than the length of a line without newlines.
  function refuseNul(text: string, row: number): void {
    if (text.includes("\0"))
      throw fileIssue(row, isUtf16() ? UTF16_MESSAGE : "the file contains a NUL byte: this looks like a binary file, not delimited text");
  }

  function takeLine(raw: string, out: TextRecord[]): void {
    lineNumber++;
    const line = raw.endsWith("\r") ? raw.slice(0, -1) : raw;
    refuseNul(line, lineNumber);
    if (overLineLimit(line)) throw fileIssue(lineNumber, LINE_TOO_LONG);
    const quotes = line.includes('"') ? quoteCount(line) : 0;
    if (open) {
      open.bytes += 1 + utf8Length(line);
      if (open.bytes > MAX_LINE_BYTES) throw fileIssue(open.line, RECORD_TOO_LONG);
      open.text += "\n" + line;
      open.quotes += quotes;
    } else {
      const first = line.charCodeAt(0);
      // Only lines starting with a blank need trimming to tell whether they are blank or a comment.
      const trimmed = first <= 32 || first === 0xa0 || first === 0xfeff ? line.trimStart() : line;
      if (trimmed === "" || trimmed.charCodeAt(0) === 35 /* # */) return;
      if (quotes % 2 === 0) {
        out.push({ line: lineNumber, text: line });
        return;
      }
      open = { line: lineNumber, text: line, quotes, bytes: utf8Length(line) };
    }
    if (open.quotes % 2 === 0) {
      out.push({ line: open.line, text: open.text });
      open = null;
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
    const text = partialLine + decode(chunk);
    const batch: TextRecord[] = [];
    let from = 0;
    for (let end = text.indexOf("\n"); end !== -1; end = text.indexOf("\n", from)) {
      takeLine(text.slice(from, end), batch);
      from = end + 1;
    }
    partialLine = text.slice(from);
    // More UTF-16 units than the limit has bytes: over it whatever the characters (each takes ≥ 1 byte).
    if (partialLine.length > MAX_LINE_BYTES) {
      refuseNul(partialLine, lineNumber + 1);
      throw fileIssue(lineNumber + 1, LINE_TOO_LONG);
    }
    yield batch;
  }
  const rest = partialLine + decode(undefined);
  const last: TextRecord[] = [];
  if (rest !== "") takeLine(rest, last);
  if (open) throw fileIssue((open as { line: number }).line, "a quoted field opened on this row is never closed");
  yield last;
}

/**
 * The records of {@link readTextRecordBatches} one by one (the preview reads only the first few).
 * @param source - the file's bytes
 * @param maxBytes - largest accepted size in bytes
 */
export async function* readTextRecords(source: ByteSource, maxBytes: number): AsyncGenerator<TextRecord> {
  for await (const batch of readTextRecordBatches(source, maxBytes)) yield* batch;
}
