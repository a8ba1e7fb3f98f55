// Typed access to the cells of a table by column name, with messages that name the file, line and column.
import { CsvError } from './csvError';
import type { CsvRow, CsvTable } from './readCsv';
import { isNumericText } from './writeCsv';
import { printableText } from '../text';

export function requireColumns(table: CsvTable, names: readonly string[], purpose: string): void {
  const missing = names.filter((name) => !table.header.includes(name));
  if (missing.length > 0) {
    throw new CsvError({ fileName: table.fileName, lineNumber: 1 }, `missing column${missing.length > 1 ? 's' : ''} ${missing.map((n) => `'${n}'`).join(', ')} (${purpose}). The header has: ${printableText(table.header.join(', '), 200)}.`);
  }
}

export function hasColumn(table: CsvTable, name: string): boolean {
  return table.header.includes(name);
}

export function cellText(table: CsvTable, row: CsvRow, name: string): string {
  const index = table.header.indexOf(name);
  return index < 0 ? '' : (row.cells[index] ?? '');
}

/** The number in a cell; text, blanks (unless optional) and non-finite values are refused with the place named. */
export function cellNumber(table: CsvTable, row: CsvRow, name: string, unitText: string): number;
export function cellNumber(table: CsvTable, row: CsvRow, name: string, unitText: string, optional: true): number | undefined;
export function cellNumber(table: CsvTable, row: CsvRow, name: string, unitText: string, optional = false): number | undefined {
  const text = cellText(table, row, name);
  const location = { fileName: table.fileName, lineNumber: row.lineNumber, columnName: name };
  if (text === '') {
    if (optional) return undefined;
    throw new CsvError(location, `the cell is empty; it needs a number (${unitText}).`);
  }
  const value = Number(text);
  if (!Number.isFinite(value) || !isNumericText(text)) {
    throw new CsvError(location, `'${printableText(text, 40)}' is not a number; expected ${unitText}${text.includes(',') ? ' (use a point as the decimal mark)' : ''}.`);
  }
  return value;
}
