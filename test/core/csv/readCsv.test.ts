import { describe, expect, it } from 'vitest';
import { cellNumber, CsvError, formatCsv, formatCsvCell, readCsv, requireColumns } from '../../../core/csv';

describe('readCsv()', () => {
  it('reads quoted cells with commas, doubled quotes and line breaks (RFC 4180)', () => {
    const table = readCsv('channel,label\r\n1,"north, by the ""old"" oak"\r\n2,"two\nlines"\r\n3,plain\r\n', 'a.csv');
    expect(table.header).toEqual(['channel', 'label']);
    expect(table.rows.map((row) => row.cells[1])).toEqual(['north, by the "old" oak', 'two\nlines', 'plain']);
    // The record after a quoted line break starts on line 5 of the file.
    expect(table.rows.map((row) => row.lineNumber)).toEqual([2, 3, 5]);
  });

  it('skips blank and # comment lines, strips a byte-order mark and lower-cases the header', () => {
    const table = readCsv('\ufeff# surveyed 2026-04-02\nChannel;X_m;Y_m\n\n1;0;0\n# moved\n2;5;0\n', 'b.csv');
    expect(table.header).toEqual(['channel', 'x_m', 'y_m']);
    expect(table.rows.map((row) => row.lineNumber)).toEqual([4, 6]);
  });

  it('refuses an unclosed quote and an empty file with the place named', () => {
    expect(() => readCsv('a,b\n1,"open\n', 'c.csv')).toThrow(/c\.csv, line 2: a quoted cell is never closed/);
    expect(() => readCsv('\n\n', 'd.csv')).toThrow(/d\.csv: the file is empty/);
  });

  it('cellNumber() names file, line and column for text and for decimal commas', () => {
    const table = readCsv('x_m,y_m\n1.5,abc\n"2,5",1\n', 'e.csv');
    expect(cellNumber(table, table.rows[0]!, 'x_m', 'metres')).toBe(1.5);
    expect(() => cellNumber(table, table.rows[0]!, 'y_m', 'metres')).toThrow("e.csv, line 2, column 'y_m': 'abc' is not a number; expected metres.");
    expect(() => cellNumber(table, table.rows[1]!, 'x_m', 'metres')).toThrow(/use a point as the decimal mark/);
    expect(() => cellNumber(table, table.rows[1]!, 'x_m', 'metres')).toThrow(CsvError);
  });

  it('requireColumns() lists what is missing and what is there', () => {
    const table = readCsv('channel,x\n1,2\n', 'f.csv');
    expect(() => requireColumns(table, ['channel', 'x_m', 'y_m'], 'positions')).toThrow("f.csv, line 1: missing columns 'x_m', 'y_m' (positions). The header has: channel, x.");
  });
});

describe('formatCsv()', () => {
  it('escapes text that a spreadsheet would run as a formula (OWASP CSV injection, common practice)', () => {
    expect(formatCsvCell('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(formatCsvCell('+1 call')).toBe("'+1 call");
    expect(formatCsvCell('@here')).toBe("'@here");
    expect(formatCsvCell('-3')).toBe('-3');
    expect(formatCsvCell(-3.5)).toBe('-3.5');
  });

  it('refuses non-finite numbers and round-trips through readCsv()', () => {
    expect(() => formatCsvCell(Number.NaN)).toThrow(RangeError);
    const text = formatCsv(['event', 'note'], [['1', 'a, "quoted" note'], ['2', undefined]]);
    const table = readCsv(text, 'g.csv');
    expect(table.rows.map((row) => row.cells)).toEqual([['1', 'a, "quoted" note'], ['2', '']]);
  });
});
