import { describe, expect, it } from 'vitest';
import { readCsv } from '../../../core/csv';
import { surveyLogCsv, type SurveyLogContext } from '../../../core/export';
import { spreadsheetCells } from '../../helpers/csvCells';

// Expected: this project's rule (issue 11): the survey log's '#' head lines carry file names, labels, settings and notes
// through the formula guard of OWASP "CSV Injection" (no cell may start with = + - @ tab or CR unless it is a number).
describe('surveyLogCsv() head lines', () => {
  it('surveyLogCsv() writes hostile labels, recording names and notes without a formula cell, each label kept in one cell', () => {
    const context: SurveyLogContext = {
      recordingName: '=HYPERLINK("http://example.invalid","open"),x.wav',
      recordingStartTime: undefined,
      sampleRateHz: 48_000,
      geometry: {
        microphones: [
          { channel: 1, label: 'x,=1+1,y', eastMeters: 0, northMeters: 0, upMeters: 1, surveySigmaMeters: 0.01 },
          { channel: 2, label: 'say "hi", @you', eastMeters: 30, northMeters: 0, upMeters: 1, surveySigmaMeters: 0.01 },
          { channel: 3, label: '-2+3', eastMeters: 0, northMeters: 30, upMeters: 1, surveySigmaMeters: 0.01 },
        ],
        origin: undefined,
        warnings: [],
      },
      medium: { description: 'air: temperatureCelsius 12', speedMetersPerSecond: 338.5, speedSigmaMetersPerSecond: 0.6, reference: 'Cramer 1993' },
      softwareVersion: '0.1.0',
      settings: { band_hz: '=cmd|x', dims: 2 },
      dimensions: 2,
    };
    const text = surveyLogCsv([], context, ['a,+SUM(A1)', '\t@x']);
    const head = text.split('\n').filter((line) => line.startsWith('#'));
    for (const line of head) {
      const cells = spreadsheetCells(line);
      for (const cell of cells) expect(/^[\t\r]/.test(cell) || /^\s*[=+\-@]/.test(cell), `${line} -> ${cell}`).toBe(false);
    }
    for (const label of ['x,=1+1,y', 'say "hi", @you']) {
      expect(head.some((line) => spreadsheetCells(line).some((cell) => cell.includes(`microphone ${label}:`)))).toBe(true);
    }
    expect(readCsv(text, 'log.csv').rows).toEqual([]);
  });
});
