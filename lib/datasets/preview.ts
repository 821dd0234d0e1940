import { type ColumnRoleGuess, guessColumnRoles } from "./columnRoles";
import { type Delimiter, type DelimiterChoice, detectDelimiter, splitRecords } from "./delimiter";
import { type FileIssue, StopParsing } from "./issues";
import { readTextRecords } from "./textRecords";

export interface PreviewOptions {
  /** Data rows to show. Default 20. */
  maxRows?: number;
  /** Delimiter to use; default "auto" (detected as the full parse detects it). */
  delimiter?: DelimiterChoice;
  /** The bytes are the start of a longer file: the last, possibly cut, line is dropped. Default false. */
  truncated?: boolean;
}

export type FilePreview =
  | {
      ok: true;
      delimiter: Delimiter;
      headerRow: number;
      header: string[];
      rows: { row: number; fields: string[] }[];
      guess: ColumnRoleGuess;
    }
  | { ok: false; issue: FileIssue };

const NEWLINE = 0x0a;

/**
 * Reads the first rows of a file for the upload form (in the browser, from `file.slice(0, 64 KiB)`), with the
 * same record, comment and delimiter rules as the full parse, and guesses the column roles.
 * @param bytes - the start of the file (or all of it)
 * @param options - rows to show, delimiter, whether the bytes are cut
 */
export async function previewDelimitedText(bytes: Uint8Array, options: PreviewOptions = {}): Promise<FilePreview> {
  const maxRows = options.maxRows ?? 20;
  // Cut after the last complete line, so that a multi-byte character split by the slice is never decoded.
  const end = options.truncated ? bytes.lastIndexOf(NEWLINE) + 1 : bytes.length;
  const records: { line: number; text: string }[] = [];
  try {
    for await (const record of readTextRecords(bytes.subarray(0, end), end)) {
      records.push(record);
      if (records.length > maxRows) break;
    }
  } catch (error) {
    if (error instanceof StopParsing) return { ok: false, issue: error.issue };
    throw error;
  }
  if (records.length === 0)
    return { ok: false, issue: { row: null, column: null, columnName: null, message: "the file is empty: it has no header row" } };
  const texts = records.map((r) => r.text);
  const delimiter = !options.delimiter || options.delimiter === "auto" ? detectDelimiter(texts) : options.delimiter;
  const [header, ...rows] = splitRecords(texts, delimiter).fields;
  const headerNames = header.map((h) => h.trim());
  return {
    ok: true,
    delimiter,
    headerRow: records[0].line,
    header: headerNames,
    rows: rows.map((fields, i) => ({ row: records[i + 1].line, fields })),
    guess: guessColumnRoles(headerNames),
  };
}
