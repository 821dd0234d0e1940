import { toElectronvolts } from "@/lib/units";
import { type Delimiter, describeDelimiter } from "./delimiter";
import type { IssueCollector } from "./issues";
import type { DatasetMapping } from "./mapping";
import { readNumberCell } from "./numbers";

/** One energy read from a row, before k is resolved: k values are the file's own (coordinates or a distance). */
export interface RawPoint {
  row: number;
  kValues: readonly number[];
  band: number;
  energy: number;
  sigma?: number;
  weight?: number;
  label?: string;
}

interface MappedColumn {
  index: number;
  name: string;
}

/** Reads the data rows of one file against its header and mapping. */
export interface RowReader {
  /**
   * Appends the points of one data row to `out`; problems go to the collector and the row adds nothing.
   * @param fields - the row's cells
   * @param row - its line number in the file
   */
  read(fields: readonly string[], row: number, out: RawPoint[]): void;
}

const mappedColumnNames = (m: DatasetMapping): string[] =>
  [
    ...(m.k.columns ?? []),
    m.k.column,
    m.band?.column,
    m.energy.column,
    ...(m.energy.columns ?? []),
    m.sigma?.column,
    m.weight?.column,
    m.label?.column,
  ].filter((c): c is string => c !== undefined);

const listNames = (names: readonly string[]): string =>
  names.length > 12 ? `${names.slice(0, 12).join(", ")}, …` : names.join(", ");

/**
 * Matches the mapping's columns to the header; reports a header that reads as one column (wrong delimiter),
 * mapped columns that are missing, and mapped names that occur twice.
 * @param header - the header's cells (trimmed here)
 * @param headerRow - the header's line number
 * @returns a reader for the data rows, or null when the header does not fit the mapping
 */
export function createRowReader(
  header: readonly string[],
  headerRow: number,
  mapping: DatasetMapping,
  delimiter: Delimiter,
  issues: IssueCollector,
): RowReader | null {
  const names = header.map((h) => h.trim());
  const wanted = mappedColumnNames(mapping);
  if (names.length === 1 && new Set(wanted).size > 1) {
    issues.addRow(
      headerRow,
      `the header reads as a single column (“${names[0]}”) when split on ${describeDelimiter(delimiter)}; ` +
        `the mapping needs ${new Set(wanted).size} columns — is the delimiter right?`,
    );
    return null;
  }
  const before = issues.count;
  const resolve = (name: string): MappedColumn => {
    const index = names.indexOf(name);
    if (index === -1)
      issues.add({
        row: headerRow,
        column: null,
        columnName: name,
        message: `mapped column “${name}” is not in the header (columns: ${listNames(names)})`,
      });
    else if (names.indexOf(name, index + 1) !== -1)
      issues.add({ row: headerRow, column: index + 1, columnName: name, message: `column “${name}” appears more than once in the header` });
    return { index, name };
  };
  const k = (mapping.k.kind === "path" ? [mapping.k.column as string] : (mapping.k.columns as string[])).map(resolve);
  const band = mapping.band ? resolve(mapping.band.column) : null;
  const energies = (mapping.energy.columns ?? [mapping.energy.column as string]).map(resolve);
  const sigma = mapping.sigma ? resolve(mapping.sigma.column) : null;
  const weight = mapping.weight ? resolve(mapping.weight.column) : null;
  const label = mapping.label ? resolve(mapping.label.column) : null;
  if (issues.count > before) return null;

  const energyUnit = mapping.energy.unit;
  const sigmaUnit = mapping.sigma?.unit ?? energyUnit;

  return {
    read(fields, row, out) {
      if (fields.length !== names.length) {
        issues.addRow(row, `this row has ${fields.length} field${fields.length === 1 ? "" : "s"}, the header has ${names.length}`);
        return;
      }
      let rowOk = true;
      const fail = (c: MappedColumn, message: string) => {
        rowOk = false;
        issues.add({ row, column: c.index + 1, columnName: c.name, message });
      };
      const numberAt = (c: MappedColumn): number => {
        const cell = readNumberCell(fields[c.index]);
        if (cell.ok) return cell.value;
        fail(c, cell.message);
        return NaN;
      };

      const kValues = k.map(numberAt);
      const sigmaValue = sigma ? numberAt(sigma) : undefined;
      if (sigma && sigmaValue !== undefined && Number.isFinite(sigmaValue) && sigmaValue <= 0)
        fail(sigma, `σ must be positive, got ${fields[sigma.index].trim()}`);
      const weightValue = weight ? numberAt(weight) : undefined;
      if (weight && weightValue !== undefined && weightValue < 0)
        fail(weight, `a weight cannot be negative, got ${fields[weight.index].trim()}`);
      const labelText = label ? fields[label.index].trim() || undefined : undefined;

      let bandFromColumn = 0;
      if (band) {
        const text = fields[band.index].trim();
        const cell = readNumberCell(text);
        if (cell.ok && Number.isInteger(cell.value) && cell.value >= 1) bandFromColumn = cell.value;
        else fail(band, `band index “${text}” is not a positive integer (bands count from 1)`);
      }
      const energyValues = energies.map(numberAt);
      if (!rowOk) return;

      const sigmaEv = sigmaValue === undefined ? undefined : toElectronvolts(sigmaValue, sigmaUnit);
      energyValues.forEach((value, i) => {
        const point: RawPoint = { row, kValues, band: band ? bandFromColumn : i + 1, energy: toElectronvolts(value, energyUnit) };
        if (sigmaEv !== undefined) point.sigma = sigmaEv;
        if (weightValue !== undefined) point.weight = weightValue;
        if (labelText !== undefined) point.label = labelText;
        out.push(point);
      });
    },
  };
}
