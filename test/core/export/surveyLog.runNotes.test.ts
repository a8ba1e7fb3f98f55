import { describe, expect, it } from 'vitest';
import { surveyLogColumns, surveyLogRunNotes } from '../../../core/export';

// Expected values: the survey log's layout this project specifies (DEVELOPERS.md glossary, "survey log"; issue 10 defect 6).
describe('surveyLogRunNotes()', () => {
  it('surveyLogRunNotes() writes the run\'s warnings, its timing model and the span scanned, as whence locate and the app both do', () => {
    expect(surveyLogRunNotes({ warnings: ['No events were found.'], timingNote: 'timing noise pooled over 3 event(s)', scannedFromSeconds: 0, scannedToSeconds: 60, eventsFound: 1 }))
      .toEqual(['No events were found.', 'timing noise pooled over 3 event(s)', 'scanned 0.000 s to 60.000 s; 1 event found']);
    expect(surveyLogRunNotes({ warnings: [], scannedFromSeconds: 1.5, scannedToSeconds: 2, eventsFound: 2 })).toEqual(['scanned 1.500 s to 2.000 s; 2 events found']);
  });

  it('surveyLogColumns() ends with the user\'s label and note', () => {
    for (const dimensions of [2, 3] as const) {
      const columns = surveyLogColumns(dimensions);
      expect(columns.slice(-2)).toEqual(['label', 'note']);
      expect(columns.indexOf('warnings')).toBeLessThan(columns.indexOf('label'));
    }
  });
});
