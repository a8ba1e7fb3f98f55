import { describe, expect, it } from 'vitest';
import { readCsv } from '../../../core/csv';
import { locatedEventRecord } from '../../../core/export';
import { locatedVerdict, type LocatedEvent } from '../../../core/pipeline';
import type { FixLogEntry, RecordingIdentity } from '../../../core/project';
import { fixLogEntryFromLocated } from '../../../renderer/fixlog/entryFromLocated';
import { fixLogExportText, fixLogToRecords, type FixLogContext } from '../../../renderer/fixlog/fixLogRecords';
import { locatedByEntryId, loggedEventIndices } from '../../../renderer/fixlog/loggedEvents';
import { locatedEvent, siteRecording, squareArray, surveyContext } from './locatedFixtures';

// Two recordings whose events share numbers (each recording counts from event 1): the log must keep them apart.
const pondRecording: RecordingIdentity = { name: 'pond.wav', sizeBytes: 7_654_321, contentHash: 'fedcba9876543210' };
const pondOrigin = { latitudeDegrees: 51.5, longitudeDegrees: -1.25, heightMeters: 80 };
const siteEvents = [locatedEvent(squareArray, [100, 150, 1.5], 0, 2, 1), locatedEvent(squareArray, [20, 35, 1.5], 1, 2, 4)];
const pondEvents = [locatedEvent(squareArray, [-30, 10, 1.5], 0, 2, 3), locatedEvent(squareArray, [60, -20, 1.5], 1, 2, 5)];

function entry(event: LocatedEvent, id: string, recording: RecordingIdentity, origin?: typeof pondOrigin): FixLogEntry {
  return fixLogEntryFromLocated(event, { id, recording, verdict: locatedVerdict(event, { microphones: squareArray }), ...(origin !== undefined ? { origin } : {}), accepted: true });
}

const log = [entry(siteEvents[0]!, 's1', siteRecording), entry(siteEvents[1]!, 's2', siteRecording), entry(pondEvents[0]!, 'p1', pondRecording, pondOrigin)];

// Expected values: the invented events above (delays from geometry r/c, common practice) and this project's rules for the log.
describe('loggedEventIndices() and locatedByEntryId()', () => {
  it('loggedEventIndices() marks only the open recording\'s events that are in the log, never by event number alone', () => {
    expect([...loggedEventIndices(log, pondRecording, pondEvents)]).toEqual([0]);
    expect([...loggedEventIndices(log, siteRecording, siteEvents)]).toEqual([0, 1]);
    expect([...loggedEventIndices(log, undefined, pondEvents)]).toEqual([]);
  });

  it('loggedEventIndices() does not take another recording\'s event at the same number and time for a logged one', () => {
    // Two takes of one scene (same events, same times): only the content hash tells them apart.
    const retake: RecordingIdentity = { ...siteRecording, contentHash: '0123456789abcdee' };
    expect([...loggedEventIndices(log, retake, siteEvents)]).toEqual([]);
    expect([...locatedByEntryId(log, retake, siteEvents).keys()]).toEqual([]);
  });

  it('loggedEventIndices() does not take an event at another time for a logged one of the same number', () => {
    const moved = { ...pondEvents[0]!, firstArrivalSeconds: pondEvents[0]!.firstArrivalSeconds + 0.5 };
    expect([...loggedEventIndices(log, pondRecording, [moved])]).toEqual([]);
  });

  it('locatedByEntryId() pairs each entry with its own recording\'s event only', () => {
    const located = locatedByEntryId(log, pondRecording, pondEvents);
    expect([...located.keys()]).toEqual(['p1']);
    expect(located.get('p1')).toBe(pondEvents[0]);
  });
});

describe('fixLogToRecords() with fixes of two recordings', () => {
  it('keeps each row\'s own quality figures, recording name and latitude/longitude while another recording is open', () => {
    const context: FixLogContext = { ...surveyContext(squareArray, 2, false), recordingName: pondRecording.name, located: locatedByEntryId(log, pondRecording, pondEvents) };
    const records = fixLogToRecords(log, context);
    expect(records.map((record) => [record.recording, record.event])).toEqual([['site.wav', '1'], ['site.wav', '2'], ['pond.wav', '1']]);
    // Each row is its own event's, as the command line writes that event (site rows from their entries, the pond row from its event).
    const expected = [locatedEventRecord(siteEvents[0]!, { ...context, recordingName: 'site.wav' }), locatedEventRecord(siteEvents[1]!, { ...context, recordingName: 'site.wav' })];
    for (const column of ['gdop', 'chi_square', 'min_peak_ratio', 'x_m', 'y_m']) {
      expect(records[0]![column], column).toEqual(expected[0]![column]);
      expect(records[1]![column], column).toEqual(expected[1]![column]);
    }
    expect(records[0]!.gdop).not.toEqual(records[2]!.gdop);
    // The site fixes were logged without an origin and none is in use: no position on the globe; the pond fix has its own.
    expect(records[0]!.lat).toBeUndefined();
    expect(records[2]!.lat).toBeCloseTo(51.5, 2);
  });

  it('fixLogExportText() names each row\'s recording in the CSV and in every GeoJSON feature, and lists both in the head', () => {
    const context: FixLogContext = { ...surveyContext(squareArray, 2, true), recordingName: pondRecording.name, located: locatedByEntryId(log, pondRecording, pondEvents) };
    const csv = fixLogExportText('csv', log, context);
    expect(csv.ok).toBe(true);
    if (!csv.ok) return;
    const table = readCsv(csv.text, 'log.csv');
    expect(table.header[0]).toBe('recording');
    expect(table.rows.map((row) => row.cells.slice(0, 2))).toEqual([['site.wav', '1'], ['site.wav', '2'], ['pond.wav', '1']]);
    expect(csv.text).toContain('# recording: site.wav; pond.wav');
    // The head's microphone, medium and settings lines are the open project's: a mixed log says so, naming the other recording
    // (a reader reproducing the site.wav rows must not take the pond's array for theirs; this project's rule for the log).
    const headNotes = csv.text.split('\n').filter((line) => line.startsWith('# note:'));
    expect(headNotes).toHaveLength(1);
    expect(headNotes[0]).toMatch(/^# note: fixes of site\.wav were located in earlier sessions: the microphone, medium and settings lines above are the project's now \(for pond\.wav\)/);
    const pondOnly = fixLogExportText('csv', log.filter((entry) => entry.recording.name === pondRecording.name), context);
    expect(pondOnly.ok && pondOnly.text.includes('earlier sessions')).toBe(false);
    const geo = fixLogExportText('geojson', log, context);
    if (!geo.ok) throw new Error(geo.message);
    const features = (JSON.parse(geo.text) as { features: Array<{ geometry: { coordinates: unknown }; properties: Record<string, unknown> }> }).features;
    const fixes = features.filter((feature) => feature.properties.feature === 'fix');
    expect(fixes.map((feature) => [feature.properties.recording, feature.properties.event])).toEqual([['site.wav', '1'], ['site.wav', '2'], ['pond.wav', '1']]);
    // The pond fix sits about its own origin (51.5 N, 1.25 W), not about the origin in use (55 N, 5 E).
    const [lon, lat] = fixes[2]!.geometry.coordinates as [number, number];
    expect(lat).toBeCloseTo(51.5, 2);
    expect(lon).toBeCloseTo(-1.25, 2);
    const ellipses = features.filter((feature) => feature.properties.feature === 'uncertainty-ellipse');
    expect(ellipses.map((feature) => feature.properties.recording)).toEqual(['site.wav', 'site.wav', 'pond.wav']);
  });
});
