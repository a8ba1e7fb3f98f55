// Writes comma-separated tables (RFC 4180 quoting). Text cells starting with = + - @ tab or CR are prefixed with a quote
// mark so spreadsheets do not run them as formulas (OWASP, "CSV Injection"); numbers are written as numbers.
// '#' head lines are rows of cells under the same guard: a line that would not survive it is written as one quoted cell.

export type CsvValue = string | number | boolean | undefined | null;

/** A '#' line at the head of a table: text (its comma-separated parts are its cells) or the cells themselves. */
export type CsvCommentLine = string | ReadonlyArray<CsvValue>;

/** True when the text is a plain decimal number (optional sign, point and exponent), as tables write them. */
export function isNumericText(text: string): boolean {
  return /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text);
}

/** True when a spreadsheet could run `text` as a formula (OWASP CSV Injection: leading = + - @ tab CR), numbers aside. */
export function needsFormulaGuard(text: string): boolean {
  if (/^[\t\r]/.test(text)) return true;
  const trimmed = text.trimStart();
  return /^[=+\-@]/.test(trimmed) && !isNumericText(text);
}

export function formatCsvCell(value: CsvValue): string {
  if (value === undefined || value === null) return '';
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new RangeError(`A table cell must be a finite number; got ${value}.`);
    return String(value);
  }
  let text = String(value);
  if (needsFormulaGuard(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

function oneLine(value: CsvValue): CsvValue {
  return typeof value === 'string' ? value.replace(/[\r\n]+/g, ' ') : value;
}

/** A text line is written as it is only when every comma-separated part of it would pass formatCsvCell() unchanged. */
function isPlainCommentText(text: string): boolean {
  return text.split(',').every((part, index) => {
    const cell = index === 0 ? part : part.trimStart();
    return !cell.startsWith('"') && !needsFormulaGuard(part) && !needsFormulaGuard(cell);
  });
}

/**
 * One '#' line: `# text` when its parts are safe cells, else `#,` and the text as one guarded, quoted cell; for cells,
 * `# first,second,...` when the first cell is plain text, else `#,` and every cell guarded.
 */
export function formatCsvCommentLine(line: CsvCommentLine): string {
  if (typeof line === 'string') {
    const text = oneLine(line) as string;
    return isPlainCommentText(text) ? `# ${text}` : `#,${formatCsvCell(text)}`;
  }
  const cells = line.map(oneLine);
  const first = cells[0];
  const rest = cells.slice(1).map(formatCsvCell);
  if (typeof first === 'string' && first !== '' && formatCsvCell(first) === first) return [`# ${first}`, ...rest].join(',');
  return ['#', ...cells.map(formatCsvCell)].join(',');
}

export function formatCsv(header: readonly string[], rows: ReadonlyArray<ReadonlyArray<CsvValue>>, commentLines: readonly CsvCommentLine[] = []): string {
  const lines = commentLines.map(formatCsvCommentLine);
  lines.push(header.map(formatCsvCell).join(','));
  for (const row of rows) lines.push(row.map(formatCsvCell).join(','));
  return lines.join('\n') + '\n';
}
