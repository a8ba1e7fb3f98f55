import { describe, expect, it } from 'vitest';
import { locatedVerdict } from '../../../core/pipeline';
import { emptyProjectDocument, validateProjectDocument } from '../../../core/project';
import { fixLogEntryFromLocated, minPeakRatio } from '../../../renderer/fixlog/entryFromLocated';
import { fixLogToRecords } from '../../../renderer/fixlog/fixLogRecords';
import { locatedEvent, siteRecording, squareArray, startTime, surveyContext } from './locatedFixtures';

describe('fixLogEntryFromLocated()', () => {
  // Expected values: the fixes of invented events (./locatedFixtures, delays from geometry r/c, common practice) copied through; the entry layout is this project's schema.
  it('fixLogEntryFromLocated() keeps the fix, its clock time and the warnings in an entry the project schema accepts', () => {
    // Seed 4: residuals that pass the chi-square test (seed 2 draws p = 0.008, one of the 1 % an honest test flags 'inconsistent').
    const event = locatedEvent(squareArray, [20, 35, 1.5], 1, 2, 4);
    const entry = fixLogEntryFromLocated(event, { id: 'a', recording: siteRecording, verdict: locatedVerdict(event, { microphones: squareArray }), recordingStartTime: startTime, sampleRateHz: 48_000, label: 'wren' });
    expect(entry).toMatchObject({ id: 'a', eventIndex: 1, status: 'ok', accepted: true, label: 'wren', note: '' });
    expect(entry.eastMeters).toBeCloseTo(event.solve.fix!.eastMeters, 12);
    expect(entry.ellipse).toEqual(event.solve.fix!.ellipse);
    expect(entry.warnings).toEqual([...event.warnings, ...event.solve.warnings]);
    // 04:12:00.000 plus the first arrival (about 17.4 s) on the recorder's clock.
    expect(entry.localTime).toMatch(/^2024-05-18T04:12:17\.\d{3}$/);
    const document = { ...emptyProjectDocument('t'), fixes: [entry] };
    expect(() => validateProjectDocument(document)).not.toThrow();
  });

  it('fixLogEntryFromLocated() leaves out an unbounded ellipse, which a project file cannot hold, and rejects a failed fix by default', () => {
    const event = locatedEvent(squareArray, [20, 35, 1.5], 1, 2, 2);
    const fix = event.solve.fix!;
    const unbounded = { ...event, solve: { status: 'ill-conditioned' as const, warnings: [], fix: { ...fix, ellipse: { ...fix.ellipse, semiMajorMeters: Number.POSITIVE_INFINITY } } } };
    const entry = fixLogEntryFromLocated(unbounded, { id: 'b', recording: siteRecording, verdict: locatedVerdict(unbounded, { microphones: squareArray }) });
    expect(entry.ellipse).toBeUndefined();
    expect(entry.accepted).toBe(false);
    expect(entry.localTime).toBeUndefined();
    expect(() => validateProjectDocument({ ...emptyProjectDocument('t'), fixes: [entry] })).not.toThrow();
  });
});

describe('fixLogEntryFromLocated() and an ambiguous fix', () => {
  it('fixLogEntryFromLocated() keeps the other solution of an ambiguous fix, and the log written from the entry alone has it', () => {
    const event = locatedEvent(squareArray, [20, 35, 1.5], 1, 2, 4);
    const fix = event.solve.fix!;
    // An invented mirror position: the entry must carry whatever the solver gave.
    const ambiguous = { ...event, solve: { ...event.solve, status: 'ambiguous' as const, fix: { ...fix, alternative: { eastMeters: 20.25, northMeters: -35.5, upMeters: 1.5 } } } };
    const entry = fixLogEntryFromLocated(ambiguous, { id: 'm', recording: siteRecording, verdict: locatedVerdict(ambiguous, { microphones: squareArray }) });
    expect(entry.verdict).toEqual({ grade: 'doubtful', reason: 'Two spots fit equally: check the other one.' });
    expect(entry.alternative).toEqual({ eastMeters: 20.25, northMeters: -35.5, upMeters: 1.5 });
    const [record] = fixLogToRecords([entry], surveyContext(squareArray, 2, false));
    expect([record!.alternative_x_m, record!.alternative_y_m]).toEqual([20.25, -35.5]);
    expect(() => validateProjectDocument({ ...emptyProjectDocument('t'), fixes: [entry] })).not.toThrow();
  });
});

describe('minPeakRatio()', () => {
  // Expected values: the definition this project specifies (smallest ratio over pairs); no outside reference.
  it('minPeakRatio() is the smallest peak-to-second ratio of the pairs', () => {
    const event = locatedEvent(squareArray, [20, 35, 1.5], 1, 2, 2);
    expect(minPeakRatio(event)).toBe(Math.min(...event.pairs.map((p) => p.peakToSecondRatio)));
    expect(minPeakRatio({ ...event, pairs: [] })).toBeUndefined();
  });
});
