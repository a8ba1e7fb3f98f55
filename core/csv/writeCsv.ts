// Writes comma-separated tables (RFC 4180 quoting). Text cells starting with = + - @ (or tab/CR) are prefixed with a
// quote mark so spreadsheets do not run them as formulas (OWASP "CSV injection"); numbers are written as numbers.

export type CsvValue = string | number | boolean | undefined | null;

/** True when the text is a plain decimal number (optional sign, point and exponent), as tables write them. */
export function isNumericText(text: string): boolean {
  return /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text);
}

export function formatCsvCell(value: CsvValue): string {
  if (value === undefined || value === null) return '';
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new RangeError(`A table cell must be a finite number; got ${value}.`);
    return String(value);
  }
  let text = String(value);
  if (/^[=+\-@\t\r]/.test(text) && !isNumericText(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

export function formatCsv(header: readonly string[], rows: ReadonlyArray<ReadonlyArray<CsvValue>>, commentLines: readonly string[] = []): string {
  const lines = commentLines.map((line) => `# ${line.replace(/[\r\n]+/g, ' ')}`);
  lines.push(header.map(formatCsvCell).join(','));
  for (const row of rows) lines.push(row.map(formatCsvCell).join(','));
  return lines.join('\n') + '\n';
}
