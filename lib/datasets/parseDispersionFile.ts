import type { ByteSource } from "./byteSource";
import { type Delimiter, countCells, describeDelimiter, detectDelimiter, splitRecords } from "./delimiter";
import { type FileIssue, IssueCollector, StopParsing } from "./issues";
import { MAX_HEADER_CELLS, groupDigits } from "./limits";
import type { DatasetMapping } from "./mapping";
import { type ParseOptions, resolveParseOptions } from "./options";
import { type DataPoint, type PointTable, PointTableBuilder, tablePoints } from "./pointTable";
import { resolvePoints } from "./points";
import { type RowReader, createRowReader } from "./rowReader";
import { type DatasetSummary, summariseTable } from "./summary";
import { type TextRecord, readTextRecordBatches } from "./textRecords";

type Refusal = { ok: false; issues: FileIssue[]; issueCount: number };

export type DispersionTableResult = { ok: true; table: PointTable; summary: DatasetSummary; warnings: string[] } | Refusal;
export type DispersionParseResult = { ok: true; points: DataPoint[]; summary: DatasetSummary; warnings: string[] } | Refusal;

/** Records read before the delimiter is chosen: the header and this many data rows. */
const DETECTION_SAMPLE_ROWS = 20;

/**
 * Reads a CSV/TSV band file against its mapping into columns, streaming: the file is never held as one
 * string, and points live in typed arrays (no object per row or point).
 * All-or-nothing: any bad row refuses the whole file with every problem listed by row and column (the first
 * 50, and the count). Stops early on binary data, invalid UTF-8, the size and point limits and the fixed
 * limits of `limits.ts` (line length, header cells: checked before the header is split).
 * @param source - the file's bytes (Web ReadableStream, Node Readable or other async iterable, or in memory)
 * @param mapping - a mapping validated by `datasetMappingSchema`
 * @param options - limits (bytes, points) and the pause between chunks; defaults in `options.ts`
 * @returns the points as a {@link PointTable} (k in 1/Å, energies and σ in eV), a summary and warnings; or the issues
 */
export async function parseDispersionTable(
  source: ByteSource,
  mapping: DatasetMapping,
  options?: ParseOptions,
): Promise<DispersionTableResult> {
  const { maxBytes, maxPoints, pause } = resolveParseOptions(options);
  const issues = new IssueCollector();
  const rows = new PointTableBuilder({ sigma: !!mapping.sigma, weight: !!mapping.weight, label: !!mapping.label });
  let delimiter: Delimiter = ",";
  let headerRow = 0;
  let dataRows = 0;
  let reader: RowReader | null = null;

  const readBatch = (batch: TextRecord[]) => {
    if (batch.length === 0) return;
    const split = splitRecords(
      batch.map((r) => r.text),
      delimiter,
    );
    const bad = new Set<number>();
    for (const p of split.problems) {
      bad.add(p.index);
      issues.addRow(batch[p.index]?.line ?? null, p.message);
    }
    for (let i = 0; i < split.fields.length; i++) if (!bad.has(i)) reader?.read(split.fields[i], batch[i].line, rows);
    dataRows += batch.length;
    if (rows.length > maxPoints)
      throw new StopParsing({
        row: batch.at(-1)?.line ?? null,
        column: null,
        columnName: null,
        message: `the file holds more than ${maxPoints.toLocaleString("en-US")} points, the limit`,
      });
  };

  const start = (sample: TextRecord[]): boolean => {
    delimiter = mapping.delimiter === "auto" ? detectDelimiter(sample.map((r) => r.text)) : mapping.delimiter;
    headerRow = sample[0].line;
    const cells = countCells(sample[0].text, delimiter);
    if (cells > MAX_HEADER_CELLS) {
      issues.addRow(
        headerRow,
        `the header has ${groupDigits(cells)} cells when split on ${describeDelimiter(delimiter)}, ` +
          `more than the limit of ${groupDigits(MAX_HEADER_CELLS)}`,
      );
      return false;
    }
    const header = splitRecords([sample[0].text], delimiter);
    if (header.problems.length > 0) {
      header.problems.forEach((p) => issues.addRow(headerRow, `header: ${p.message}`));
      return false;
    }
    reader = createRowReader(header.fields[0], headerRow, mapping, delimiter, issues);
    if (!reader) return false;
    readBatch(sample.slice(1));
    return true;
  };

  try {
    let sample: TextRecord[] | null = [];
    for await (const batch of readTextRecordBatches(source, maxBytes)) {
      await pause();
      if (!sample) {
        readBatch(batch);
        continue;
      }
      const room = DETECTION_SAMPLE_ROWS + 1 - sample.length;
      sample.push(...batch.slice(0, room));
      if (sample.length > DETECTION_SAMPLE_ROWS) {
        if (!start(sample)) return refused(issues);
        sample = null;
        readBatch(batch.slice(room));
      }
    }
    if (sample) {
      if (sample.length === 0) {
        issues.addRow(null, "the file is empty: it has no header row (blank lines and # comments do not count)");
        return refused(issues);
      }
      if (!start(sample)) return refused(issues);
    }
  } catch (error) {
    if (!(error instanceof StopParsing)) throw error;
    issues.add(error.issue);
    return refused(issues);
  }

  if (dataRows === 0) issues.addRow(headerRow, "the file has a header but no data rows");
  if (issues.count > 0) return refused(issues);
  const resolved = await resolvePoints(rows, mapping, issues, pause);
  if (!resolved) return refused(issues);
  await pause();
  const summary = summariseTable(resolved.table, resolved.ticks, delimiter, resolved.warnings);
  return { ok: true, table: resolved.table, summary, warnings: summary.warnings ?? [] };
}

/**
 * {@link parseDispersionTable}, with the points as one object each (for fits, scripts and tests; the upload
 * stores the columns directly).
 * @param source - the file's bytes
 * @param mapping - a mapping validated by `datasetMappingSchema`
 * @param options - limits (bytes, points) and the pause between chunks
 */
export async function parseDispersionFile(
  source: ByteSource,
  mapping: DatasetMapping,
  options?: ParseOptions,
): Promise<DispersionParseResult> {
  const result = await parseDispersionTable(source, mapping, options);
  if (!result.ok) return result;
  return { ok: true, points: tablePoints(result.table), summary: result.summary, warnings: result.warnings };
}

const refused = (issues: IssueCollector): Refusal => ({
  ok: false,
  issues: issues.listed,
  issueCount: issues.count,
});
