import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { WhenceError } from '../../../core/errors';
import { DEFAULT_LOCATE_SETTINGS } from '../../../core/pipeline';
import {
  emptyProjectDocument,
  formatFieldPath,
  parseProjectDocument,
  readProjectText,
  serializeProjectDocument,
  type ProjectDocument,
} from '../../../core/project';
import { WHENCE_VERSION } from '../../../core/version';

const fixturePath = join(__dirname, '../../fixtures/projects/v1/field-survey.whence');
const fixtureText = readFileSync(fixturePath, 'utf8');

function withoutWrittenBy(document: ProjectDocument): Omit<ProjectDocument, 'writtenBy'> {
  const { writtenBy: _ignored, ...rest } = document;
  return rest;
}

function thrown(action: () => unknown): WhenceError {
  try {
    action();
  } catch (error) {
    expect(error).toBeInstanceOf(WhenceError);
    return error as WhenceError;
  }
  throw new Error('expected a WhenceError, nothing was thrown');
}

// The fixture as loosely typed JSON, to be damaged on purpose.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type LooseJson = Record<string, any>;

function edited(change: (data: LooseJson) => void): string {
  const data = JSON.parse(fixtureText) as LooseJson;
  change(data);
  return JSON.stringify(data);
}

describe('parseProjectDocument()', () => {
  it('reads the frozen version-1 fixture with every part of the document', () => {
    const document = parseProjectDocument(fixtureText, 'field-survey.whence');
    // Expected values are those written in the fixture (test/fixtures/projects/v1/field-survey.whence).
    // Migrated on load to version 3.
    expect(document.schemaVersion).toBe(3);
    expect(document.name).toBe('Hedgerow survey, night 3');
    expect(document.array.microphones.map((m) => m.channel)).toEqual([1, 2, 3, 4]);
    expect(document.array.microphones[1]).toEqual({ channel: 2, label: 'NE post', eastMeters: 50, northMeters: 50, upMeters: 1.5, surveySigmaMeters: 0.05 });
    expect(document.array.origin).toEqual({ latitudeDegrees: 52.2053, longitudeDegrees: 0.1218, heightMeters: 12 });
    expect(document.medium).toEqual({ medium: 'air', temperatureCelsius: 11.5, relativeHumidityPercent: 82, pressureKilopascals: 101.1, model: 'cramer', temperatureSigmaKelvin: 1 });
    expect(document.settings).toEqual({ dimensions: 2, sourceUpMeters: 2, confidence: 0.95, weighting: 'phat', bandHz: { lowHz: 300, highHz: 4000 }, detectionThresholdDb: 12, minChannels: 3 });
    expect(document.recording).toMatchObject({ name: 'HEDGE_0003.WAV', sizeBytes: 1382400044, channelCount: 4, sampleRateHz: 48000, frameCount: 172800000 });
    expect(document.fixes.map((fix) => [fix.id, fix.status, fix.accepted])).toEqual([['fix-1', 'ok', true], ['fix-2', 'ambiguous', false], ['fix-3', 'insufficient', false]]);
    expect(document.fixes[0]!.ellipse).toEqual({ semiMajorMeters: 3.38, semiMinorMeters: 0.64, majorAxisDegreesFromEast: 58.1, confidence: 0.95 });
    expect(document.fixes[2]!.eastMeters).toBeUndefined();
    expect(document.view).toEqual({ centerEastMeters: 40, centerNorthMeters: 60, metersPerPixel: 0.5 });
  });

  it('migrates the frozen version-1 fixture step by step, judging its fixes from their status alone', () => {
    const result = readProjectText(fixtureText, 'field-survey.whence');
    expect(result.fromSchemaVersion).toBe(1);
    expect(result.migrationSteps).toHaveLength(2);
    expect(result.migrationSteps[0]).toMatch(/verdict/);
    expect(result.migrationSteps[1]).toMatch(/names its recording/);
    expect(result.document.fixes.map((fix) => fix.verdict)).toEqual([
      { grade: 'doubtful', reason: 'Logged before verdicts: locate it again to judge it.' },
      { grade: 'doubtful', reason: 'Two spots fit equally: check the other one.' },
      { grade: 'unusable', reason: 'Too few usable time differences to place it.' },
    ]);
  });

  it('reads the frozen version-2 fixture, with verdicts and the inconsistent status, in one migration step', () => {
    const result = readProjectText(readFileSync(join(__dirname, '../../fixtures/projects/v2/field-survey.whence'), 'utf8'), 'v2.whence');
    // Expected values are those written in the fixture (test/fixtures/projects/v2/field-survey.whence).
    expect(result.fromSchemaVersion).toBe(2);
    expect(result.migrationSteps).toHaveLength(1);
    expect(result.document.fixes.map((fix) => [fix.status, fix.verdict.grade])).toEqual([['ok', 'firm'], ['ambiguous', 'doubtful'], ['insufficient', 'unusable'], ['inconsistent', 'unusable']]);
    expect(result.document.fixes[3]!.verdict.reason).toBe('The microphones disagree: no single spot fits.');
  });

  it('refuses a logged fix without a verdict or with a grade of its own, naming the field', () => {
    const v2 = readFileSync(join(__dirname, '../../fixtures/projects/v2/field-survey.whence'), 'utf8');
    const data = JSON.parse(v2) as LooseJson;
    data.fixes[1].verdict.grade = 'maybe';
    const error = thrown(() => parseProjectDocument(JSON.stringify(data), 'odd.whence'));
    expect(error.code).toBe('project-invalid');
    expect(error.message).toContain('fixes[1].verdict.grade');
  });

  it('accepts a file that starts with a UTF-8 byte-order mark', () => {
    expect(parseProjectDocument(`\ufeff${fixtureText}`, 'bom.whence').name).toBe('Hedgerow survey, night 3');
  });

  it('refuses every truncation of a project with project-corrupt naming the file, without any other kind of error', () => {
    const end = fixtureText.lastIndexOf('}');
    for (let length = 0; length < end; length += 37) {
      const error = thrown(() => parseProjectDocument(fixtureText.slice(0, length), 'night3.whence'));
      expect(error.code).toBe('project-corrupt');
      expect(error.message).toContain('night3.whence');
      expect(error.message).toMatch(/backup/);
    }
  });

  it('refuses a file from a newer Whence with project-too-new, saying to update Whence', () => {
    const error = thrown(() => parseProjectDocument(edited((data) => { data.schemaVersion = 4; data.writtenBy = 'Whence 9.0.0'; }), 'future.whence'));
    expect(error.code).toBe('project-too-new');
    expect(error.message).toContain('future.whence');
    expect(error.message).toContain('Update Whence');
    expect(error.message).toContain('Whence 9.0.0');
    expect(error.message).toContain(WHENCE_VERSION);
  });

  it('refuses a missing or non-numeric schemaVersion with project-invalid', () => {
    for (const version of [undefined, '1', null, 1.5, true]) {
      const error = thrown(() => parseProjectDocument(edited((data) => { data.schemaVersion = version; }), 'odd.whence'));
      expect(error.code).toBe('project-invalid');
      expect(error.message).toContain('odd.whence');
      expect(error.message).toContain('schemaVersion');
    }
  });

  it('refuses JSON that is not an object with project-invalid', () => {
    for (const text of ['[]', 'null', '42', '"project"']) {
      expect(thrown(() => parseProjectDocument(text, 'x.whence')).code).toBe('project-invalid');
    }
  });

  it('names the first bad field path of an invalid document', () => {
    const error = thrown(() => parseProjectDocument(edited((data) => { data.array.microphones[2].eastMeters = 'fifty'; }), 'bad.whence'));
    expect(error.code).toBe('project-invalid');
    expect(error.message).toContain('bad.whence');
    expect(error.message).toContain('array.microphones[2].eastMeters');
  });

  it('says which field is missing', () => {
    const error = thrown(() => parseProjectDocument(edited((data) => { delete data.fixes[0].accepted; }), 'bad.whence'));
    expect(error.message).toContain('fixes[0].accepted');
    expect(error.message).toContain('missing');
  });

  it('refuses two microphones on one channel, naming the second', () => {
    const error = thrown(() => parseProjectDocument(edited((data) => { data.array.microphones[3].channel = 1; }), 'dup.whence'));
    expect(error.message).toContain('array.microphones[3].channel');
    expect(error.message).toContain('channel 1');
  });

  it('refuses a position with only some of its coordinates', () => {
    const error = thrown(() => parseProjectDocument(edited((data) => { delete data.fixes[0].upMeters; }), 'p.whence'));
    expect(error.message).toContain('fixes[0].eastMeters');
  });

  it('refuses two fixes with one id, a covariance that is not 2x2 or 3x3, and a band upside down', () => {
    expect(thrown(() => parseProjectDocument(edited((data) => { data.fixes[1].id = 'fix-1'; }), 'a.whence')).message).toContain('fixes[1].id');
    expect(thrown(() => parseProjectDocument(edited((data) => { data.fixes[0].covarianceMeters2 = [[1, 0, 0], [0, 1, 0]]; }), 'a.whence')).message).toContain('fixes[0].covarianceMeters2');
    expect(thrown(() => parseProjectDocument(edited((data) => { data.settings.bandHz = { lowHz: 4000, highHz: 300 }; }), 'a.whence')).message).toContain('settings.bandHz');
  });

  it('accepts a fixed speed of sound with its sigma and refuses a medium it does not know', () => {
    const fixed = parseProjectDocument(edited((data) => { data.medium = { medium: 'fixed-speed', speedMetersPerSecond: 1500, speedSigmaMetersPerSecond: 3 }; }), 'f.whence');
    expect(fixed.medium).toEqual({ medium: 'fixed-speed', speedMetersPerSecond: 1500, speedSigmaMetersPerSecond: 3 });
    const error = thrown(() => parseProjectDocument(edited((data) => { data.medium = { medium: 'oil', temperatureCelsius: 20, temperatureSigmaKelvin: 1 }; }), 'f.whence'));
    expect(error.code).toBe('project-invalid');
    expect(error.message).toContain('medium.medium');
  });

  it('never fails with anything but a WhenceError of a project code on arbitrary text (seeded)', () => {
    fc.assert(
      fc.property(fc.oneof(fc.string(), fc.json(), fc.constantFrom(fixtureText.slice(0, 500), '{"schemaVersion":1}')), (text) => {
        try {
          parseProjectDocument(text, 'fuzz.whence');
        } catch (error) {
          return error instanceof WhenceError && ['project-corrupt', 'project-invalid', 'project-too-new'].includes(error.code);
        }
        return true;
      }),
      { seed: 20240514, numRuns: 500 },
    );
  });
});

describe('serializeProjectDocument()', () => {
  it('writes text that reads back to the same document, for the fixture and for a new project', () => {
    for (const document of [parseProjectDocument(fixtureText, 'f.whence'), emptyProjectDocument('New survey')]) {
      const again = parseProjectDocument(serializeProjectDocument(document), 'again.whence');
      expect(withoutWrittenBy(again)).toEqual(withoutWrittenBy(document));
    }
  });

  it('puts schemaVersion first and stamps the Whence that wrote it', () => {
    const text = serializeProjectDocument(emptyProjectDocument('x'));
    expect(text.startsWith('{\n  "schemaVersion": 3,\n  "name": "x",\n')).toBe(true);
    expect(JSON.parse(text).writtenBy).toBe(`Whence ${WHENCE_VERSION}`);
    expect(text.endsWith('}\n')).toBe(true);
  });

  it('refuses a document that would not load again (a NaN position), naming the field', () => {
    const document = parseProjectDocument(fixtureText, 'f.whence');
    document.fixes[0]!.eastMeters = Number.NaN;
    const error = thrown(() => serializeProjectDocument(document));
    expect(error.code).toBe('project-invalid');
    expect(error.message).toContain('fixes[0].eastMeters');
  });
});

describe('emptyProjectDocument()', () => {
  it('is a valid version-3 document with the locate defaults and an automatic band', () => {
    const document = emptyProjectDocument('Pond');
    expect(document).toMatchObject({ schemaVersion: 3, name: 'Pond', array: { microphones: [] }, fixes: [] });
    // The defaults of core/pipeline's DEFAULT_LOCATE_SETTINGS, so a new project locates as the command line does.
    expect(document.settings).toMatchObject({ confidence: DEFAULT_LOCATE_SETTINGS.confidence, weighting: DEFAULT_LOCATE_SETTINGS.weighting, dimensions: DEFAULT_LOCATE_SETTINGS.dimensions, bandHz: 'automatic' });
    expect(() => serializeProjectDocument(document)).not.toThrow();
  });
});

describe('formatFieldPath()', () => {
  it('joins keys with dots and indices in brackets', () => {
    expect(formatFieldPath(['array', 'microphones', 2, 'eastMeters'])).toBe('array.microphones[2].eastMeters');
    expect(formatFieldPath([0, 'document'])).toBe('[0].document');
    expect(formatFieldPath([])).toBe('');
  });
});
