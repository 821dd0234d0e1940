/**
 * One problem found in a file. `row` is the line number an editor shows (1-based, header and comment lines
 * included); `column` is the 1-based field index with its header name. Either is null when the problem is
 * not tied to one (an empty file, a size limit).
 */
export interface FileIssue {
  row: number | null;
  column: number | null;
  columnName: string | null;
  message: string;
}

/** How many issues a refused file lists; the rest are only counted. */
export const LISTED_ISSUE_LIMIT = 50;

/** Keeps the first issues of a file and counts all of them. */
export class IssueCollector {
  readonly listed: FileIssue[] = [];
  count = 0;

  add(issue: FileIssue): void {
    this.count++;
    if (this.listed.length < LISTED_ISSUE_LIMIT) this.listed.push(issue);
  }

  /** A problem of the whole file or of a whole row. */
  addRow(row: number | null, message: string): void {
    this.add({ row, column: null, columnName: null, message });
  }
}

/**
 * Thrown inside the parser for a problem that stops reading (binary data, a limit): reported as the
 * file's last issue, never escaping the public entry point.
 */
export class StopParsing extends Error {
  constructor(readonly issue: FileIssue) {
    super(issue.message);
  }
}

/**
 * A one-line human reading of an issue, e.g. `Row 12, column 9 (energy_eV): "abc" is not a number`.
 * @param issue - an issue from a refused parse
 */
export function describeFileIssue(issue: FileIssue): string {
  const where: string[] = [];
  if (issue.row !== null) where.push(`Row ${issue.row}`);
  if (issue.column !== null) where.push(`column ${issue.column}${issue.columnName ? ` (${issue.columnName})` : ""}`);
  return where.length ? `${where.join(", ")}: ${issue.message}` : issue.message;
}
