import { describe, expect, it } from 'vitest';
import { CsvError } from '../../../core/csv';
import { nameTimePattern, parseDeploymentCsv, formatLocalInstant } from '../../../core/deployment';
import { expectWhenceError } from '../../helpers/expectWhenceError';

function csvError(text: string): string {
  try { parseDeploymentCsv(text, 'd.csv'); } catch (error) { expect(error).toBeInstanceOf(CsvError); return (error as Error).message; }
  throw new Error('no error');
}

describe('parseDeploymentCsv()', () => {
  it('reads one row per recorder file channel, with an optional start_time to the microsecond', () => {
    const table = parseDeploymentCsv('recorder,file,file_channel,microphone,start_time\nA,a1.wav,1,M1,2026-05-14T05:00:00.123456\nA,a1.wav,2,M2,\nB,sub/b1.wav,1,M3,\n', 'd.csv');
    expect(table.rows.map((r) => [r.recorder, r.file, r.fileChannel, r.microphone])).toEqual([['A', 'a1.wav', 1, 'M1'], ['A', 'a1.wav', 2, 'M2'], ['B', 'sub/b1.wav', 1, 'M3']]);
    expect(formatLocalInstant(table.rows[0]!.startTime!)).toBe('2026-05-14T05:00:00.123456'); // ISO 8601 round trip
    expect(table.rows[1]!.startTime).toBeUndefined();
  });

  it('refuses missing columns, bad channels, a file on two recorders, a microphone on two recorders and bad times, naming the line', () => {
    expect(csvError('recorder,file,microphone\nA,a.wav,M1\n')).toMatch(/file_channel/);
    expect(csvError('recorder,file,file_channel,microphone\nA,a.wav,0,M1\n')).toMatch(/line 2.*whole number from 1/s);
    expect(csvError('recorder,file,file_channel,microphone\nA,a.wav,1,M1\nB,a.wav,2,M2\n')).toMatch(/belongs to recorder 'A' on line 2/);
    expect(csvError('recorder,file,file_channel,microphone\nA,a.wav,1,M1\nB,b.wav,1,M1\n')).toMatch(/one recorder/);
    expect(csvError('recorder,file,file_channel,microphone\nA,a.wav,1,M1\nA,a.wav,1,M2\n')).toMatch(/already listed on line 2/);
    expect(csvError('recorder,file,file_channel,microphone,start_time\nA,a.wav,1,M1,14/05/2026 05:00\n')).toMatch(/not a local time.*YYYY-MM-DD/);
    expect(csvError('recorder,file,file_channel,microphone\n')).toMatch(/no rows/);
  });
});

describe('nameTimePattern()', () => {
  it('reads the start time from a file name with YYYY MM DD hh mm ss fff and * tokens', () => {
    const pattern = nameTimePattern('*_YYYYMMDD_hhmmss.fff*');
    expect(formatLocalInstant(pattern.read('SM4_20260514_053012.250.wav')!, 3)).toBe('2026-05-14T05:30:12.250');
    expect(pattern.read('SM4_20260230_053012.250.wav')).toBeUndefined(); // no 30 February (calendar)
    expect(pattern.read('notes.txt')).toBeUndefined();
  });

  it('refuses a pattern without a full date and time', () => {
    expectWhenceError(() => nameTimePattern('REC_YYYYMMDD'), 'usage', ['hh, mm, ss']);
  });
});
