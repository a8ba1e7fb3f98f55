import { describe, expect, it } from 'vitest';
import { locatedVerdict } from '../../../core/pipeline';
import { emptyProjectDocument, validateProjectDocument } from '../../../core/project';
import { fixLogEntryFromLocated, minPeakRatio } from '../../../renderer/fixlog/entryFromLocated';
import { locatedEvent, squareArray, startTime } from './locatedFixtures';

describe('fixLogEntryFromLocated()', () => {
  // Expected values: the fixes of invented events (./locatedFixtures, delays from geometry r/c, common practice) copied through; the entry layout is this project's schema.
  it('fixLogEntryFromLocated() keeps the fix, its clock time and the warnings in an entry the project schema accepts', () => {
    // Seed 4: residuals that pass the chi-square test (seed 2 draws p = 0.008, one of the 1 % an honest test flags 'inconsistent').
    const event = locatedEvent(squareArray, [20, 35, 1.5], 1, 2, 4);
    const entry = fixLogEntryFromLocated(event, { id: 'a', verdict: locatedVerdict(event, { microphones: squareArray }), recordingStartTime: startTime, sampleRateHz: 48_000, label: 'wren' });
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
    const entry = fixLogEntryFromLocated(unbounded, { id: 'b', verdict: locatedVerdict(unbounded, { microphones: squareArray }) });
    expect(entry.ellipse).toBeUndefined();
    expect(entry.accepted).toBe(false);
    expect(entry.localTime).toBeUndefined();
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
