import { describe, expect, it } from 'vitest';
import { formatCsv, formatCsvCell, formatCsvCommentLine, readCsv } from '../../../core/csv';
import { spreadsheetCells } from '../../helpers/csvCells';

/** A cell a spreadsheet would run as a formula: a leading = + - @ tab or CR (OWASP CSV Injection), unless a plain number. */
function isFormulaCell(cell: string): boolean {
  const trimmed = cell.trimStart();
  return /^[\t\r]/.test(cell) || (/^[=+\-@]/.test(trimmed) && !/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(cell));
}

describe('formatCsvCell() formula guard', () => {
  // Expected: OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): cells starting with = + - @ tab (0x09)
  // or carriage return (0x0D) are prefixed with a single quote so a spreadsheet shows them as text.
  it.each([
    ['=1+1', "'=1+1"],
    ['+1+1', "'+1+1"],
    ['-1+1', "'-1+1"],
    ['-x', "'-x"],
    ['@SUM(A1:A2)', "'@SUM(A1:A2)"],
    ['\t=1+1', "'\t=1+1"],
    ['\tcmd', "'\tcmd"],
    ['\rcmd', `"'\rcmd"`],
    ['\r=1+1', `"'\r=1+1"`],
    [' =1+1', "' =1+1"],
  ])('formatCsvCell() guards the text %j as %j', (text, expected) => {
    expect(formatCsvCell(text)).toBe(expected);
  });

  it.each(['-3', '+4', '-2.5e3', '0.25', 'plain', 'a=b'])('formatCsvCell() leaves %j alone', (text) => {
    expect(formatCsvCell(text)).toBe(text);
  });
});

describe('formatCsv() head lines', () => {
  // Expected: this project's rule (issue 11): every cell of a '#' line passes the formula guard, as data cells do.
  it('formatCsvCommentLine() keeps safe text as it is and writes text with a formula part as one guarded cell', () => {
    expect(formatCsvCommentLine('origin (WGS84) lat,lon,alt_m: 51.9,-1.5,96.4')).toBe('# origin (WGS84) lat,lon,alt_m: 51.9,-1.5,96.4');
    expect(formatCsvCommentLine('microphone x,=1+1,y: channel 1')).toBe('#,"microphone x,=1+1,y: channel 1"');
    expect(formatCsvCommentLine('note: a,"=1+1"')).toBe('#,"note: a,""=1+1"""');
    expect(formatCsvCommentLine('note: a, @cmd')).toBe('#,"note: a, @cmd"');
    expect(formatCsvCommentLine('two\nlines')).toBe('# two lines');
    expect(formatCsvCommentLine(['microphone', 'x,=1+1,y', 'channel 1'])).toBe('# microphone,"x,=1+1,y",channel 1');
    expect(formatCsvCommentLine(['=evil', 'a'])).toBe("#,'=evil,a");
  });

  it('formatCsv() head lines with hostile labels give no formula cell, and a label with a comma or quote stays one cell', () => {
    const labels = ['x,=1+1,y', 'say "hi", @you', '-2+3', '\t=cmd', 'a\r\n=1'];
    const text = formatCsv(['event'], [['1']], [...labels.map((label) => `microphone ${label}: channel 1, x 0.000 m`), ...labels.map((label) => ['microphone', label, 'channel 1'])]);
    const headLines = text.split('\n').filter((line) => line.startsWith('#'));
    expect(headLines).toHaveLength(2 * labels.length);
    for (const line of headLines) {
      const cells = spreadsheetCells(line);
      expect(cells.filter(isFormulaCell), line).toEqual([]);
    }
    expect(spreadsheetCells(headLines[0]!)).toEqual(['#', 'microphone x,=1+1,y: channel 1, x 0.000 m']);
    expect(spreadsheetCells(headLines[labels.length + 1]!)).toEqual(['# microphone', 'say "hi", @you', 'channel 1']);
    // The reader still skips every head line.
    expect(readCsv(text, 'log.csv').rows.map((row) => row.cells)).toEqual([['1']]);
  });
});
