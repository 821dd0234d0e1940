import type { ByteSource } from "./byteSource";
import { type Delimiter, detectDelimiter, splitRecords } from "./delimiter";
import { type FileIssue, IssueCollector, StopParsing } from "./issues";
import type { DatasetMapping } from "./mapping";
import { type ParseOptions, resolveParseOptions } from "./options";
import { type DataPoint, resolvePoints } from "./points";
import { type RawPoint, type RowReader, createRowReader } from "./rowReader";
import { type DatasetSummary, summarisePoints } from "./summary";
import { type TextRecord, readTextRecords } from "./textRecords";

export type DispersionParseResult =
  | { ok: true; points: DataPoint[]; summary: DatasetSummary; warnings: string[] }
  | { ok: false; issues: FileIssue[]; issueCount: number };

/** Records read before the delimiter is chosen: the header and this many data rows. */
const DETECTION_SAMPLE_ROWS = 20;
/** Records split per papaparse call. */
const BATCH_RECORDS = 2000;

/**
 * Reads a CSV/TSV band file against its mapping, streaming: the file is never held as one string.
 * All-or-nothing: any bad row refuses the whole file with every problem listed by row and column (the first
 * 50, and the count). Stops early on binary data, invalid UTF-8 and the size and point limits.
 * @param source - the file's bytes (Web ReadableStream, Node Readable or other async iterable, or in memory)
 * @param mapping - a mapping validated by `datasetMappingSchema`
 * @param options - limits (bytes, points); defaults in `options.ts`
 * @returns points (k in 1/Å, energies and σ in eV), a summary and warnings; or the issues
 */
export async function parseDispersionFile(
  source: ByteSource,
  mapping: DatasetMapping,
  options?: ParseOptions,
): Promise<DispersionParseResult> {
  const { maxBytes, maxPoints } = resolveParseOptions(options);
  const issues = new IssueCollector();
  const raw: RawPoint[] = [];
  let delimiter: Delimiter = ",";
  let headerRow = 0;
  let dataRows = 0;
  let reader: RowReader | null = null;

  const readBatch = (batch: TextRecord[]) => {
    const split = splitRecords(
      batch.map((r) => r.text),
      delimiter,
    );
    const bad = new Set<number>();
    for (const p of split.problems) {
      bad.add(p.index);
      issues.addRow(batch[p.index]?.line ?? null, p.message);
    }
    split.fields.forEach((fields, i) => {
      if (!bad.has(i)) reader?.read(fields, batch[i].line, raw);
    });
    dataRows += batch.length;
    if (raw.length > maxPoints)
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
    let batch: TextRecord[] = [];
    for await (const record of readTextRecords(source, maxBytes)) {
      if (sample) {
        sample.push(record);
        if (sample.length > DETECTION_SAMPLE_ROWS) {
          if (!start(sample)) return refused(issues);
          sample = null;
        }
        continue;
      }
      batch.push(record);
      if (batch.length === BATCH_RECORDS) {
        readBatch(batch);
        batch = [];
      }
    }
    if (sample) {
      if (sample.length === 0) {
        issues.addRow(null, "the file is empty: it has no header row (blank lines and # comments do not count)");
        return refused(issues);
      }
      if (!start(sample)) return refused(issues);
    }
    readBatch(batch);
  } catch (error) {
    if (!(error instanceof StopParsing)) throw error;
    issues.add(error.issue);
    return refused(issues);
  }

  if (dataRows === 0) issues.addRow(headerRow, "the file has a header but no data rows");
  if (issues.count > 0) return refused(issues);
  const resolved = resolvePoints(raw, mapping, issues);
  if (!resolved) return refused(issues);
  return {
    ok: true,
    points: resolved.points,
    summary: summarisePoints(resolved.points, resolved.ticks, delimiter),
    warnings: resolved.warnings,
  };
}

const refused = (issues: IssueCollector): DispersionParseResult => ({
  ok: false,
  issues: issues.listed,
  issueCount: issues.count,
});
