import Papa from "papaparse";

/** Field separators of the files we read; "whitespace" means runs of spaces and tabs (no quoting). */
export type Delimiter = "," | "\t" | ";" | "whitespace";
export type DelimiterChoice = Delimiter | "auto";

/** Detection order: tab and semicolon before comma, since their files may hold commas inside fields. */
const CHARACTER_DELIMITERS = ["\t", ";", ","] as const;

/** Cells of several records, and per-record problems found while splitting them. */
export interface SplitRecords {
  fields: string[][];
  problems: { index: number; message: string }[];
}

const splitOnWhitespace = (text: string): string[] => text.trim().split(/[ \t]+/);

/**
 * Splits record texts into cells. Records without a `"` are split on the delimiter directly (the same cells
 * papaparse gives them, at a fraction of the cost); the quoted ones of a batch go through one papaparse call
 * (RFC 4180 quoting, `""` inside quotes). Whitespace splitting is plain (no quoting).
 * @param texts - complete records (no blank or comment lines)
 * @param delimiter - the field separator
 */
export function splitRecords(texts: readonly string[], delimiter: Delimiter): SplitRecords {
  if (delimiter === "whitespace") return { fields: texts.map(splitOnWhitespace), problems: [] };
  const fields: string[][] = new Array(texts.length);
  const quoted: number[] = [];
  for (let i = 0; i < texts.length; i++) {
    if (texts[i].includes('"')) quoted.push(i);
    else fields[i] = texts[i].split(delimiter);
  }
  const problems: SplitRecords["problems"] = [];
  if (quoted.length === 0) return { fields, problems };
  const parsed = Papa.parse<string[]>(quoted.map((i) => texts[i]).join("\n"), { delimiter, quoteChar: '"', skipEmptyLines: false });
  for (const e of parsed.errors)
    problems.push({
      index: quoted[e.row ?? 0] ?? quoted[0],
      message: e.type === "Quotes" ? `badly quoted field (${e.message})` : e.message,
    });
  if (parsed.data.length === quoted.length) quoted.forEach((i, j) => (fields[i] = parsed.data[j]));
  else
    quoted.forEach((i) => {
      fields[i] = [];
      problems.push({ index: i, message: "the quoting of this row could not be read" });
    });
  return { fields, problems };
}

const isSpaceOrTab = (c: number) => c === 32 || c === 9;

/**
 * The number of cells {@link splitRecords} gives a record, counted without splitting it (no string per
 * cell, so a header can be measured before it is split): delimiters outside quotes plus one (`""` inside
 * quotes toggles twice), or the runs of spaces and tabs inside the trimmed text plus one.
 * @param text - one complete record
 * @param delimiter - the field separator
 */
export function countCells(text: string, delimiter: Delimiter): number {
  let cells = 1;
  if (delimiter === "whitespace") {
    const trimmed = text.trim();
    for (let i = 1; i < trimmed.length; i++)
      if (isSpaceOrTab(trimmed.charCodeAt(i)) && !isSpaceOrTab(trimmed.charCodeAt(i - 1))) cells++;
    return cells;
  }
  const separator = delimiter.charCodeAt(0);
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 34 /* " */) quoted = !quoted;
    else if (c === separator && !quoted) cells++;
  }
  return cells;
}

/**
 * Picks the delimiter that splits a sample of records (header first) into the same number of cells, more
 * than one: tab, then semicolon, then comma, then whitespace. When none is consistent, the one giving the
 * header most cells wins, so that the parse then reports the ragged rows; a one-column file reads as comma.
 * Cells are counted, not split, so detection costs one pass per candidate however long the records are.
 * @param sample - the first records of the file, header first
 */
export function detectDelimiter(sample: readonly string[]): Delimiter {
  const candidates: Delimiter[] = [...CHARACTER_DELIMITERS, "whitespace"];
  const counts = candidates.map((d) => ({ d, cells: sample.map((text) => countCells(text, d)) }));
  const consistent = counts.find(({ cells }) => cells.length > 0 && cells[0] > 1 && cells.every((n) => n === cells[0]));
  if (consistent) return consistent.d;
  const widest = counts.reduce((best, c) => ((c.cells[0] ?? 0) > (best.cells[0] ?? 0) ? c : best));
  return (widest.cells[0] ?? 0) > 1 ? widest.d : ",";
}

/** How a delimiter is named in messages. */
export function describeDelimiter(delimiter: Delimiter): string {
  return { ",": "comma", "\t": "tab", ";": "semicolon", whitespace: "whitespace" }[delimiter];
}
