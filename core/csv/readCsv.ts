// Reads comma-separated tables (RFC 4180: quoted cells, doubled quotes, CRLF or LF) into rows with their line numbers.
// Also accepts semicolon- or tab-separated files when the header line uses that separator; '#' lines are comments.
import { CsvError } from './csvError';

export interface CsvRow { lineNumber: number; cells: string[] }
export interface CsvTable { fileName: string; header: string[]; rows: CsvRow[] }

function detectSeparator(firstLine: string): string {
  const counts = [',', ';', '\t'].map((separator) => [separator, firstLine.split(separator).length] as const);
  counts.sort((a, b) => b[1] - a[1]);
  return counts[0]![1] > 1 ? counts[0]![0] : ',';
}

/** Splits text into records; a record's line number is the line it starts on (1-based). */
function splitRecords(text: string, separator: string, fileName: string): CsvRow[] {
  const rows: CsvRow[] = [];
  let cells: string[] = [];
  let cell = '';
  let quoted = false;
  let lineNumber = 1;
  let recordLine = 1;
  let cellStarted = false;
  for (let i = 0; i < text.length; i++) {
    const char = text[i]!;
    if (quoted) {
      if (char === '"') {
        if (text[i + 1] === '"') { cell += '"'; i++; } else { quoted = false; }
      } else {
        if (char === '\n') lineNumber++;
        cell += char;
      }
      continue;
    }
    if (char === '"' && !cellStarted) { quoted = true; cellStarted = true; continue; }
    if (char === separator) { cells.push(cell); cell = ''; cellStarted = false; continue; }
    if (char === '\r' && text[i + 1] === '\n') continue;
    if (char === '\n' || char === '\r') {
      cells.push(cell);
      rows.push({ lineNumber: recordLine, cells });
      cells = []; cell = ''; cellStarted = false;
      lineNumber++;
      recordLine = lineNumber;
      continue;
    }
    cell += char;
    if (char.trim() !== '') cellStarted = true;
  }
  if (quoted) throw new CsvError({ fileName, lineNumber: recordLine }, 'a quoted cell is never closed (a " is missing). Close the quote or remove it.');
  if (cell !== '' || cells.length > 0) { cells.push(cell); rows.push({ lineNumber: recordLine, cells }); }
  return rows;
}

export function readCsv(text: string, fileName: string): CsvTable {
  const withoutBom = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const meaningful = (row: CsvRow) => !(row.cells.length === 1 && row.cells[0]!.trim() === '') && !row.cells[0]!.trimStart().startsWith('#');
  const firstLine = withoutBom.split(/\r?\n/).find((line) => line.trim() !== '' && !line.trimStart().startsWith('#')) ?? '';
  const separator = detectSeparator(firstLine);
  const records = splitRecords(withoutBom, separator, fileName).filter(meaningful);
  const headerRow = records[0];
  if (headerRow === undefined) throw new CsvError({ fileName }, 'the file is empty. It needs a header row naming the columns, then one row per entry.');
  const header = headerRow.cells.map((name) => name.trim().toLowerCase());
  const rows = records.slice(1).map((row) => ({ lineNumber: row.lineNumber, cells: row.cells.map((cell) => cell.trim()) }));
  for (const row of rows) refuseExtraCells(row, header.length, separator, fileName);
  return { fileName, header, rows };
}

/** Numbers written with a decimal comma in a comma-separated file: a whole number followed by a cell of digits. */
function looksLikeDecimalCommas(cells: readonly string[]): boolean {
  for (let i = 0; i + 1 < cells.length; i++) {
    if (/^[+-]?\d+$/.test(cells[i]!) && /^\d+([eE][+-]?\d+)?$/.test(cells[i + 1]!)) return true;
  }
  return false;
}

/** A row with more (non-empty) cells than the header would be read with its cells under the wrong columns: refused. */
function refuseExtraCells(row: CsvRow, headerLength: number, separator: string, fileName: string): void {
  if (row.cells.length <= headerLength || row.cells.slice(headerLength).every((cell) => cell === '')) return;
  const counts = `it has ${row.cells.length} cells but the header names ${headerLength} column${headerLength === 1 ? '' : 's'}`;
  const separatorName = separator === ',' ? 'commas' : separator === ';' ? 'semicolons' : 'tabs';
  if (separator === ',' && looksLikeDecimalCommas(row.cells)) {
    throw new CsvError({ fileName, lineNumber: row.lineNumber }, `${counts}; the numbers seem to use a comma as the decimal mark (e.g. '12,5'), which splits them across columns. Use a point as the decimal mark (12.5), or separate the columns with semicolons.`);
  }
  throw new CsvError({ fileName, lineNumber: row.lineNumber }, `${counts} (separated by ${separatorName}). Remove the extra cells, or put a cell that contains ${separatorName === 'tabs' ? 'a tab' : `a ${separator}`} in double quotes.`);
}
