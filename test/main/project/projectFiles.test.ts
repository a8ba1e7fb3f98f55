import { chmodSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { emptyProjectDocument, parseProjectDocument, serializeProjectDocument, type ProjectDocument } from '../../../core/project';
import { loadProjectFile, projectBackupPath, saveProjectFile, withProjectExtension } from '../../../main/project';

const fixtureText = readFileSync(join(__dirname, '../../fixtures/projects/v1/field-survey.whence'), 'utf8');
const fixture = (): ProjectDocument => parseProjectDocument(fixtureText, 'field-survey.whence');
const tempFolder = (): string => mkdtempSync(join(tmpdir(), 'whence-project-'));
const runsAsRoot = typeof process.getuid === 'function' && process.getuid() === 0;

describe('saveProjectFile()', () => {
  // Expected values: the behaviour this project specifies (file names, backups, codes, messages); no outside reference.
  it('writes a project that loadProjectFile() reads back, and leaves no temporary file', async () => {
    const folder = tempFolder();
    const path = join(folder, 'survey.whence');
    const saved = await saveProjectFile(path, fixture());
    expect(saved).toEqual({ path });
    const opened = await loadProjectFile(path);
    expect(opened.document.fixes).toEqual(fixture().fixes);
    expect(opened.fromSchemaVersion).toBe(3);
    expect(readdirSync(folder)).toEqual(['survey.whence']);
  });

  it('keeps the previous file as NAME.whence.bak when it saves over it', async () => {
    const folder = tempFolder();
    const path = join(folder, 'survey.whence');
    await saveProjectFile(path, emptyProjectDocument('first'));
    const firstText = readFileSync(path, 'utf8');
    const saved = await saveProjectFile(path, emptyProjectDocument('second'));
    expect(saved).toEqual({ path, backupPath: `${path}.bak` });
    expect(readFileSync(`${path}.bak`, 'utf8')).toBe(firstText);
    expect(JSON.parse(readFileSync(path, 'utf8')).name).toBe('second');
    expect(readdirSync(folder).sort()).toEqual(['survey.whence', 'survey.whence.bak']);
  });

  it('fails with project-save-failed saying why when the folder is really a file, and writes nothing', async () => {
    const folder = tempFolder();
    writeFileSync(join(folder, 'notes.txt'), 'field notes');
    const path = join(folder, 'notes.txt', 'survey.whence');
    await expect(saveProjectFile(path, fixture())).rejects.toMatchObject({ code: 'project-save-failed' });
    await expect(saveProjectFile(path, fixture())).rejects.toThrow(/part of the path is a file, not a folder.*Save as/);
    expect(readFileSync(join(folder, 'notes.txt'), 'utf8')).toBe('field notes');
    expect(readdirSync(folder)).toEqual(['notes.txt']);
  });

  it('fails without touching the old file when the backup cannot be written', async () => {
    const folder = tempFolder();
    const path = join(folder, 'survey.whence');
    await saveProjectFile(path, emptyProjectDocument('precious'));
    const before = readFileSync(path, 'utf8');
    mkdirSync(`${path}.bak`); // a folder where the backup would go: the backup write fails
    writeFileSync(join(`${path}.bak`, 'x'), 'x');
    await expect(saveProjectFile(path, emptyProjectDocument('new'))).rejects.toThrow(/backup of the previous file \(survey\.whence\.bak\) could not be written.*Your work is still open/);
    expect(readFileSync(path, 'utf8')).toBe(before);
    expect(readdirSync(folder).sort()).toEqual(['survey.whence', 'survey.whence.bak']);
  });

  it.skipIf(runsAsRoot)('fails in a read-only folder with the reason, and the old file stays intact', async () => {
    const folder = tempFolder();
    const path = join(folder, 'survey.whence');
    await saveProjectFile(path, emptyProjectDocument('precious'));
    const before = readFileSync(path, 'utf8');
    chmodSync(folder, 0o555);
    try {
      await expect(saveProjectFile(path, emptyProjectDocument('new'))).rejects.toThrow(/Could not save the project to .*permission denied/);
      expect(readFileSync(path, 'utf8')).toBe(before);
    } finally {
      chmodSync(folder, 0o755);
    }
  });

  it('refuses a document that could not be read again (project-invalid) before touching the disk', async () => {
    const folder = tempFolder();
    const path = join(folder, 'survey.whence');
    writeFileSync(path, 'old contents');
    const document = fixture();
    document.array.microphones[0]!.northMeters = Number.POSITIVE_INFINITY;
    await expect(saveProjectFile(path, document)).rejects.toMatchObject({ code: 'project-invalid' });
    expect(readFileSync(path, 'utf8')).toBe('old contents');
    expect(readdirSync(folder)).toEqual(['survey.whence']);
  });
});

describe('loadProjectFile()', () => {
  it('refuses a truncated file with project-corrupt and the file name', async () => {
    const folder = tempFolder();
    const path = join(folder, 'half.whence');
    writeFileSync(path, fixtureText.slice(0, fixtureText.length / 2));
    await expect(loadProjectFile(path)).rejects.toMatchObject({ code: 'project-corrupt' });
    await expect(loadProjectFile(path)).rejects.toThrow(/half\.whence/);
  });

  it('says when there is no file or when the path is a folder', async () => {
    const folder = tempFolder();
    await expect(loadProjectFile(join(folder, 'gone.whence'))).rejects.toThrow(/Could not open the project .*gone\.whence: there is no file/);
    await expect(loadProjectFile(folder)).rejects.toMatchObject({ code: 'project-open-failed' });
  });

  it('opens a backup like a project', async () => {
    const folder = tempFolder();
    const path = join(folder, 'survey.whence');
    await saveProjectFile(path, emptyProjectDocument('one'));
    await saveProjectFile(path, emptyProjectDocument('two'));
    expect((await loadProjectFile(projectBackupPath(path))).document.name).toBe('one');
    expect(serializeProjectDocument((await loadProjectFile(path)).document)).toContain('"name": "two"');
  });
});

describe('withProjectExtension()', () => {
  it('adds .whence only when it is missing', () => {
    expect(withProjectExtension('/data/survey')).toBe('/data/survey.whence');
    expect(withProjectExtension('/data/survey.whence')).toBe('/data/survey.whence');
    expect(withProjectExtension('/data/SURVEY.WHENCE')).toBe('/data/SURVEY.WHENCE');
  });
});
