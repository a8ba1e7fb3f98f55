import { describe, expect, it } from 'vitest';
import { readCsv } from '../../../core/csv';
import { locatedEventRecord, surveyLogColumns } from '../../../core/export';
import { locatedVerdict, type LocatedEvent } from '../../../core/pipeline';
import type { ArrayMicrophone, FixLogEntry } from '../../../core/project';
import { fixLogEntryFromLocated } from '../../../renderer/fixlog/entryFromLocated';
import { COLUMNS_NEEDING_LOCATED_EVENT, fixLogExportText, fixLogToRecords, type FixLogContext } from '../../../renderer/fixlog/fixLogRecords';
import { locatedEvent, siteRecording, squareArray, startTime, surveyContext, tallArray } from './locatedFixtures';

function entriesOf(events: LocatedEvent[], microphones: ArrayMicrophone[] = squareArray): FixLogEntry[] {
  return events.map((event, i) => fixLogEntryFromLocated(event, { id: `fix-${i + 1}`, recording: siteRecording, verdict: locatedVerdict(event, { microphones }), recordingStartTime: startTime, sampleRateHz: 48_000 }));
}

const events2d = [locatedEvent(squareArray, [100, 150, 1.5], 0, 2, 1), locatedEvent(squareArray, [20, 35, 1.5], 1, 2, 2), locatedEvent(squareArray, [-30, 10, 1.5], 2, 2, 3)];
const events3d = [locatedEvent(tallArray, [20, 30, 4], 0, 3, 4), locatedEvent(tallArray, [35, 10, 2], 1, 3, 5)];

describe('fixLogToRecords()', () => {
  // Expected values: locatedEventRecord() from core/export on the same invented events (self-consistency with the command line's log).
  it('fixLogToRecords() writes exactly the command line\'s record when the located event is at hand (plus label and note)', () => {
    const context: FixLogContext = { ...surveyContext(squareArray, 2, true), located: new Map(events2d.map((event, i) => [`fix-${i + 1}`, event])) };
    const entries = entriesOf(events2d).map((entry, i) => (i === 1 ? { ...entry, label: ' wren ', note: 'song start' } : entry));
    const records = fixLogToRecords(entries, context);
    records.forEach((record, i) => {
      const expected = locatedEventRecord(events2d[i]!, context);
      if (i === 1) expect(record).toEqual({ ...expected, label: 'wren', note: 'song start' });
      else expect(record).toEqual(expected);
    });
  });

  for (const [dimensions, array, events] of [[2, squareArray, events2d], [3, tallArray, events3d]] as const) {
    it(`fixLogToRecords() rebuilds every column of a saved ${dimensions}-D entry with the same value as locatedEventRecord, quality figures included`, () => {
      const context = surveyContext(array, dimensions, true);
      const records = fixLogToRecords(entriesOf(events, array), context);
      records.forEach((record, i) => {
        const expected = locatedEventRecord(events[i]!, context);
        expect(events[i]!.solve.fix).toBeDefined();
        // An empty text and a missing value are the same empty CSV cell.
        const cell = (value: unknown) => (value === '' ? undefined : value);
        for (const column of surveyLogColumns(dimensions)) expect(cell(record[column]), column).toEqual(cell(expected[column]));
        for (const column of ['gdop', 'chi_square', 'min_peak_ratio']) expect(typeof record[column], column).toBe('number');
      });
    });
  }

  it('fixLogToRecords() writes an entry without a position as the command line writes a failed fix', () => {
    const failed = locatedEvent(squareArray, [10, 10, 1.5], 3, 2, 9);
    const noFix: LocatedEvent = { ...failed, solve: { status: 'insufficient', warnings: ['No usable time differences for this event.'] }, emissionTimeSeconds: undefined };
    const context = surveyContext(squareArray, 2, false);
    const [record] = fixLogToRecords(entriesOf([noFix]), context);
    const expected = locatedEventRecord(noFix, context);
    for (const column of surveyLogColumns(2)) {
      if (!(COLUMNS_NEEDING_LOCATED_EVENT as readonly string[]).includes(column)) expect(record![column], column).toEqual(expected[column]);
    }
    expect(record!.x_m).toBeUndefined();
    expect(record!.status).toBe('insufficient');
  });

  it('fixLogToRecords() takes the entry\'s clock time when the context has no recording start time', () => {
    const context = { ...surveyContext(squareArray, 2, false), recordingStartTime: undefined };
    const [record] = fixLogToRecords([{ ...entriesOf(events2d)[0]!, localTime: '2024-05-18T04:12:10.400' }], context);
    expect(record!.local_time).toBe('2024-05-18T04:12:10.400');
  });
});

describe('fixLogExportText()', () => {
  // Expected values: the log layout this project specifies, read back with core/csv (RFC 4180); GeoJSON FeatureCollection (RFC 7946); messages are this project's.
  const entries = entriesOf(events2d).map((entry, i) => ({ ...entry, accepted: i !== 1, label: i === 2 ? 'dog?' : '', note: i === 2 ? 'far away' : '' }));

  it('fixLogExportText() writes only the accepted fixes as the survey-log CSV with the columns of whence locate', () => {
    const result = fixLogExportText('csv', entries, surveyContext(squareArray, 2, true));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const table = readCsv(result.text, 'log.csv');
    expect(table.header).toEqual(surveyLogColumns(2));
    expect(table.rows.map((row) => row.cells.slice(0, 2))).toEqual([['site.wav', '1'], ['site.wav', '3']]);
    // Labels and notes are columns (empty from the command line), never extra head lines (issue 10, defect 6).
    expect(table.rows.map((row) => [row.cells[table.header.indexOf('label')], row.cells[table.header.indexOf('note')]])).toEqual([['', ''], ['dog?', 'far away']]);
    expect(result.text).not.toContain('# note:');
  });

  it('fixLogExportText() heads the log with the run notes whence locate writes, and only for fixes of that run\'s recording', () => {
    const runNotes = ['timing noise pooled over 3 event(s)', 'scanned 0.000 s to 60.000 s; 3 events found'];
    const context = { ...surveyContext(squareArray, 2, true), runNotes };
    const result = fixLogExportText('csv', entries, context);
    expect(result.ok && result.text.split('\n').filter((line) => line.startsWith('# note:'))).toEqual(runNotes.map((note) => `# note: ${note}`));
    const other = fixLogExportText('csv', entries.map((entry) => ({ ...entry, recording: { ...entry.recording, name: 'other.wav' } })), context);
    // Fixes of another recording: not this run's notes, but one saying the head describes the project now, not their session.
    const otherNotes = other.ok ? other.text.split('\n').filter((line) => line.startsWith('# note:')) : [];
    expect(otherNotes).toHaveLength(1);
    expect(otherNotes[0]).toContain('fixes of other.wav were located in earlier sessions');
  });

  it('fixLogExportText() writes GeoJSON points and ellipses of the accepted fixes, and asks for an origin without one', () => {
    const result = fixLogExportText('geojson', entries, surveyContext(squareArray, 2, true));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const collection = JSON.parse(result.text) as { type: string; features: Array<{ geometry: { type: string }; properties: Record<string, unknown> }> };
    expect(collection.type).toBe('FeatureCollection');
    const fixes = collection.features.filter((f) => f.properties.feature === 'fix');
    expect(fixes.map((f) => f.properties.event)).toEqual(['1', '3']);
    expect(fixes[1]!.properties.label).toBe('dog?');
    expect(collection.features.filter((f) => f.properties.feature === 'uncertainty-ellipse')).toHaveLength(2);
    expect(collection.features.filter((f) => f.properties.feature === 'microphone')).toHaveLength(4);
    const noOrigin = fixLogExportText('geojson', entries, surveyContext(squareArray, 2, false));
    expect(noOrigin.ok).toBe(false);
    expect(!noOrigin.ok && noOrigin.message).toContain('origin');
  });

  it('fixLogExportText() refuses to write an empty log', () => {
    const none = fixLogExportText('csv', entries.map((entry) => ({ ...entry, accepted: false })), surveyContext(squareArray, 2, true));
    expect(none).toEqual({ ok: false, message: 'No accepted fixes to export: tick the fixes to keep.' });
  });
});
