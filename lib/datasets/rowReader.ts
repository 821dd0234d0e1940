import { toElectronvolts } from "@/lib/units";
import { type Delimiter, describeDelimiter } from "./delimiter";
import type { IssueCollector } from "./issues";
import { MAX_BAND_INDEX, groupDigits } from "./limits";
import type { DatasetMapping } from "./mapping";
import { describeNumberCell, parseDecimalCell } from "./numbers";
import type { PointTableBuilder } from "./pointTable";

interface MappedColumn {
  index: number;
  name: string;
}

/** Reads the data rows of one file against its header and mapping. */
export interface RowReader {
  /**
   * Appends the points of one data row to `out` (energies and σ in eV, k values as the file gives them);
   * problems go to the collector and the row adds nothing.
   * @param fields - the row's cells
   * @param row - its line number in the file
   */
  read(fields: readonly string[], row: number, out: PointTableBuilder): void;
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

  const energyFactor = toElectronvolts(1, mapping.energy.unit);
  const sigmaFactor = toElectronvolts(1, mapping.sigma?.unit ?? mapping.energy.unit);
  const kColumns = k.map((c) => c.index);
  const energyColumns = energies.map((c) => c.index);
  const energyValues = new Float64Array(energyColumns.length);

  return {
    read(fields, row, out) {
      if (fields.length !== names.length) {
        issues.addRow(row, `this row has ${fields.length} field${fields.length === 1 ? "" : "s"}, the header has ${names.length}`);
        return;
      }
      // Plain locals and one helper instead of per-row closures or objects: this runs once per row.
      let rowOk = true;
      const k0 = numberAt(fields, kColumns[0], k, 0, row);
      const k1 = kColumns.length > 1 ? numberAt(fields, kColumns[1], k, 1, row) : 0;
      const k2 = kColumns.length > 2 ? numberAt(fields, kColumns[2], k, 2, row) : 0;
      if (Number.isNaN(k0) || Number.isNaN(k1) || Number.isNaN(k2)) rowOk = false;

      let sigmaValue = NaN;
      if (sigma) {
        sigmaValue = numberAt(fields, sigma.index, [sigma], 0, row);
        if (Number.isNaN(sigmaValue)) rowOk = false;
        else if (sigmaValue <= 0) {
          rowOk = false;
          fail(sigma, row, `σ must be positive, got ${fields[sigma.index].trim()}`);
        }
      }
      let weightValue = NaN;
      if (weight) {
        weightValue = numberAt(fields, weight.index, [weight], 0, row);
        if (Number.isNaN(weightValue)) rowOk = false;
        else if (weightValue < 0) {
          rowOk = false;
          fail(weight, row, `a weight cannot be negative, got ${fields[weight.index].trim()}`);
        }
      }
      let bandFromColumn = 0;
      if (band) {
        const value = parseDecimalCell(fields[band.index]);
        if (Number.isInteger(value) && value >= 1 && value <= MAX_BAND_INDEX) bandFromColumn = value;
        else {
          rowOk = false;
          const cell = fields[band.index].trim();
          fail(
            band,
            row,
            Number.isInteger(value) && value > MAX_BAND_INDEX
              ? `band index “${cell}” is above the limit of ${groupDigits(MAX_BAND_INDEX)} (bands count from 1; is this the band column?)`
              : `band index “${cell}” is not a positive integer (bands count from 1)`,
          );
        }
      }
      for (let i = 0; i < energyColumns.length; i++) {
        energyValues[i] = numberAt(fields, energyColumns[i], energies, i, row);
        if (Number.isNaN(energyValues[i])) rowOk = false;
      }
      if (!rowOk) return;

      const labelId = label ? out.labelIdOf(fields[label.index].trim()) : -1;
      const sigmaEv = sigmaValue * sigmaFactor;
      for (let i = 0; i < energyColumns.length; i++) {
        out.push(row, k0, k1, k2, band ? bandFromColumn : i + 1, energyValues[i] * energyFactor, sigmaEv, weightValue, labelId);
      }
    },
  };

  function fail(c: MappedColumn, row: number, message: string): void {
    issues.add({ row, column: c.index + 1, columnName: c.name, message });
  }

  /** The cell as a number, or NaN after reporting why it is not one. */
  function numberAt(fields: readonly string[], index: number, columns: readonly MappedColumn[], which: number, row: number): number {
    const value = parseDecimalCell(fields[index]);
    if (Number.isNaN(value)) fail(columns[which], row, describeNumberCell(fields[index]));
    return value;
  }
}
