import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { migrateProjectData, readProjectText, sameRecording, serializeProjectDocument, UNKNOWN_RECORDING_NAME } from '../../../core/project';

const v2Text = readFileSync(join(__dirname, '../../fixtures/projects/v2/field-survey.whence'), 'utf8');
const v3Text = readFileSync(join(__dirname, '../../fixtures/projects/v3/field-survey.whence'), 'utf8');

// Expected values: those written in the frozen fixtures (test/fixtures/projects/v2 and v3) and the behaviour this project specifies.
describe('project migration from version 2 to 3', () => {
  it('names the project\'s recording (name and size) on every fix of a version-2 file', () => {
    const result = readProjectText(v2Text, 'v2.whence');
    expect(result.document.schemaVersion).toBe(3);
    expect(result.migrationSteps).toEqual([expect.stringMatching(/each logged fix names its recording/)]);
    expect(result.document.fixes.map((fix) => fix.recording)).toEqual(Array.from({ length: 4 }, () => ({ name: 'HEDGE_0003.WAV', sizeBytes: 1382400044 })));
    // Fixes logged with version 2 kept no quality figures and no origin: they are not invented.
    expect(result.document.fixes.every((fix) => fix.quality === undefined && fix.origin === undefined)).toBe(true);
  });

  it('gives fixes of a version-2 file without a recording a name no real recording matches (size 0)', () => {
    const data = JSON.parse(v2Text) as Record<string, unknown>;
    delete data.recording;
    const { data: migrated } = migrateProjectData(data, 'v2.whence');
    const fixes = migrated.fixes as Array<{ recording: { name: string; sizeBytes: number } }>;
    expect(fixes.map((fix) => fix.recording)).toEqual(Array.from({ length: 4 }, () => ({ name: UNKNOWN_RECORDING_NAME, sizeBytes: 0 })));
    expect(readProjectText(JSON.stringify(data), 'v2.whence').document.fixes[0]!.recording.sizeBytes).toBe(0);
  });

  it('never changes its input', () => {
    const data = JSON.parse(v2Text) as Record<string, unknown>;
    const copy = JSON.parse(v2Text) as unknown;
    migrateProjectData(data, 'v2.whence');
    expect(data).toEqual(copy);
  });
});

describe('the frozen version-3 fixture', () => {
  it('reads without migration, each fix with its own recording, quality figures and origin', () => {
    const result = readProjectText(v3Text, 'v3.whence');
    expect(result.fromSchemaVersion).toBe(3);
    expect(result.migrationSteps).toEqual([]);
    const [first, , third] = result.document.fixes;
    expect(first!.recording).toEqual({ name: 'HEDGE_0004.WAV', sizeBytes: 1382400044, startTimeIso: '2024-05-14T22:00:00.000', contentHash: '0c3f9a71e8b24d56' });
    expect(first!.quality).toMatchObject({ minPeakRatio: 3.41, gdop: 1.27, chiSquare: 0.84, chiSquareDof: 1 });
    expect(first!.origin).toEqual({ latitudeDegrees: 52.2053, longitudeDegrees: 0.1218, heightMeters: 12 });
    // Same event number, other night: two different fixes.
    expect([first!.eventIndex, third!.eventIndex]).toEqual([0, 0]);
    expect(sameRecording(first!.recording, third!.recording)).toBe(false);
    expect(result.document.recording).toMatchObject({ name: 'HEDGE_0005.WAV', contentHash: '5be1c0a9d2f34e71' });
  });

  it('writes back what it read', () => {
    const document = readProjectText(v3Text, 'v3.whence').document;
    expect(readProjectText(serializeProjectDocument(document), 'again.whence').document).toEqual({ ...document, writtenBy: expect.any(String) as string });
  });

  it('refuses a fix without its recording, and a content hash that is not 16 hex digits, naming the field', () => {
    const data = JSON.parse(v3Text) as { fixes: Array<Record<string, unknown>> };
    delete data.fixes[1]!.recording;
    expect(() => readProjectText(JSON.stringify(data), 'odd.whence')).toThrow(/fixes\[1\]\.recording/);
    const hashed = JSON.parse(v3Text) as { fixes: Array<{ recording: { contentHash: string } }> };
    hashed.fixes[0]!.recording.contentHash = 'XYZ';
    expect(() => readProjectText(JSON.stringify(hashed), 'odd.whence')).toThrow(/fixes\[0\]\.recording\.contentHash/);
  });
});

describe('sameRecording()', () => {
  const night4 = { name: 'HEDGE_0004.WAV', sizeBytes: 1000, contentHash: '0c3f9a71e8b24d56' };
  it('matches by content hash and size when both have a hash, so a renamed file is still the same recording', () => {
    expect(sameRecording(night4, { ...night4, name: 'renamed.wav' })).toBe(true);
    expect(sameRecording(night4, { ...night4, contentHash: '0c3f9a71e8b24d57' })).toBe(false);
    expect(sameRecording(night4, { ...night4, sizeBytes: 1001 })).toBe(false);
  });

  it('falls back to name and size (and start time when both have one) when a hash is missing', () => {
    const old = { name: 'HEDGE_0004.WAV', sizeBytes: 1000 };
    expect(sameRecording(old, night4)).toBe(true);
    expect(sameRecording(old, { ...night4, name: 'HEDGE_0005.WAV' })).toBe(false);
    expect(sameRecording({ ...old, startTimeIso: '2024-05-14T22:00:00.000' }, { ...old, startTimeIso: '2024-05-15T22:00:00.000' })).toBe(false);
  });
});
