import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { isAbsolute, join } from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import type { RecentProject } from '../../../core/contract';
import { CURRENT_PROJECT_SCHEMA_VERSION, emptyProjectDocument, serializeProjectDocument } from '../../../core/project';
import type { DialogAdapter } from '../../../main/electron/dialogs';
import { createHostServices, DEMO_ARRAY_FILE_NAME, DEMO_PROJECT_FILE_NAME, DEMO_RECORDING_FILE_NAME } from '../../../main/electron/hostServices';
import { createRecordingHandles } from '../../../main/electron/recordingHandles';
import { createUserFileGrants } from '../../../main/electron/userFileGrants';
import { createRecentProjectsStore, createRecoveryStore, RECOVERY_FILE_NAME } from '../../../main/project';

const wavPath = join(__dirname, '../../fixtures/audio/sox-2ch-16bit-plain.wav');

/** Dialogs that answer from queues (null = the user cancelled) and record what they were asked. */
function fakeDialogs(open: (string | null)[] = [], save: (string | null)[] = []) {
  const asked: { kind: 'open' | 'save'; title: string; defaultPath?: string; extensions: string[] }[] = [];
  const dialogs: DialogAdapter = {
    chooseFileToOpen: async ({ title, filters }) => {
      asked.push({ kind: 'open', title, extensions: filters.flatMap((filter) => filter.extensions) });
      return open.shift() ?? null;
    },
    chooseFileToSave: async ({ title, defaultPath, filters }) => {
      asked.push({ kind: 'save', title, defaultPath, extensions: filters.flatMap((filter) => filter.extensions) });
      return save.shift() ?? null;
    },
  };
  return { dialogs, asked };
}

/** Dialog answers are absolute paths, or names inside the test's temporary folder, or null (cancelled). */
function setUp(open: (string | null)[] = [], save: (string | null)[] = []) {
  const folder = mkdtempSync(join(tmpdir(), 'whence-host-'));
  const inFolder = (answer: string | null) => (answer === null || isAbsolute(answer) ? answer : join(folder, answer));
  const userData = join(folder, 'userData');
  const demoFolder = join(folder, 'demo');
  const { dialogs, asked } = fakeDialogs(open.map(inFolder), save.map(inFolder));
  const recentChanges: RecentProject[][] = [];
  let id = 0;
  const grants = createUserFileGrants();
  const recordings = createRecordingHandles({ newHandleId: () => `recording-${++id}` });
  const recent = createRecentProjectsStore(join(userData, 'recent-projects.json'));
  const services = createHostServices({
    dialogs,
    recordings,
    recovery: createRecoveryStore(join(userData, 'recovery'), () => new Date('2024-05-14T22:00:00Z')),
    recent,
    grants,
    demoFolder,
    onRecentProjectsChanged: (projects) => recentChanges.push(projects),
  });
  return { folder, userData, demoFolder, services, asked, recentChanges, grants, recordings, recent };
}

describe('createHostServices(): recordings and array tables', () => {
  it('opens a recording chosen in the dialog and reads its bytes; a cancelled dialog gives null', async () => {
    const { services, asked } = setUp([wavPath, null]);
    const handle = await services.openRecordingDialog();
    expect(handle).toMatchObject({ handleId: 'recording-1', name: 'sox-2ch-16bit-plain.wav', path: wavPath });
    expect(asked[0]).toMatchObject({ kind: 'open', title: 'Open recording' });
    expect(asked[0]!.extensions).toEqual(expect.arrayContaining(['wav', 'rf64']));
    expect(Buffer.from(await services.readRecordingBytes(handle!.handleId, 8, 4)).toString('latin1')).toBe('WAVE');
    await services.closeRecording(handle!.handleId);
    await expect(services.readRecordingBytes(handle!.handleId, 0, 4)).rejects.toMatchObject({ code: 'recording-not-open' });
    expect(await services.openRecordingDialog()).toBeNull();
  });

  it('opens a dropped recording by path, but refuses a path that is not a recording', async () => {
    const { services, grants } = setUp();
    await grants.grant(wavPath); // what the preload's drop message does (droppedFileGrants.ts)
    await expect(services.openRecordingPath(wavPath)).resolves.toMatchObject({ path: wavPath });
    await expect(services.openRecordingPath('/etc/passwd')).rejects.toMatchObject({ code: 'path-refused' });
    await expect(services.openRecordingPath('relative/a.wav')).rejects.toMatchObject({ code: 'path-refused' });
  });

  it('reads an array table by dialog or by path, and says when it is not there', async () => {
    const { services, folder, grants } = setUp();
    const csv = join(folder, 'array.csv');
    writeFileSync(csv, 'channel,x_m,y_m\n1,0,0\n2,50,0\n');
    await grants.grant(csv);
    await grants.grant(join(folder, 'gone.csv'));
    expect(await services.openArrayPath(csv)).toEqual({ name: 'array.csv', path: csv, text: 'channel,x_m,y_m\n1,0,0\n2,50,0\n' });
    const withDialog = setUp([csv]);
    expect((await withDialog.services.openArrayDialog())?.text).toContain('50,0');
    await expect(services.openArrayPath(join(folder, 'gone.csv'))).rejects.toThrow(/Could not open the array table .*gone\.csv: there is no file/);
  });
});

describe('createHostServices(): projects', () => {
  it('asks where to save a new project, adds .whence, remembers it, and saves there next time without asking', async () => {
    const { services, folder, asked, recentChanges } = setUp([], ['Pond survey']);
    const document = emptyProjectDocument('Pond: night 1');
    const first = await services.saveProject({ document });
    const path = join(folder, 'Pond survey.whence');
    expect(first).toEqual({ path });
    expect(asked).toEqual([{ kind: 'save', title: 'Save project', defaultPath: 'Pond- night 1.whence', extensions: ['whence'] }]);
    expect(recentChanges.at(-1)!.map((project) => project.path)).toEqual([path]);
    const second = await services.saveProject({ document: { ...document, name: 'renamed' }, path });
    expect(second).toEqual({ path, backupPath: `${path}.bak` });
    expect(asked).toHaveLength(1);
    expect(JSON.parse(readFileSync(path, 'utf8')).name).toBe('renamed');
  });

  it('asks before writing to a path it was not given by the user (a path from the page alone)', async () => {
    const { services, folder, asked } = setUp([], [null]);
    const elsewhere = join(folder, 'elsewhere.whence');
    expect(await services.saveProject({ document: emptyProjectDocument('x'), path: elsewhere })).toBeNull();
    expect(asked).toEqual([expect.objectContaining({ kind: 'save', defaultPath: elsewhere })]);
    expect(existsSync(elsewhere)).toBe(false);
  });

  it('Save as always asks, even for a known path', async () => {
    const { services, folder, asked, grants } = setUp([], [null, null]);
    const path = join(folder, 'known.whence');
    writeFileSync(path, serializeProjectDocument(emptyProjectDocument('known')));
    await grants.grant(path);
    await services.openProjectPath(path);
    expect(await services.saveProject({ document: emptyProjectDocument('known'), path, saveAs: true })).toBeNull();
    expect(asked).toHaveLength(1);
  });

  it('returns a failed save as { error } saying why, and keeps the old file', async () => {
    const { services, folder } = setUp([], ['notes.txt/p.whence']);
    writeFileSync(join(folder, 'notes.txt'), 'notes');
    const result = await services.saveProject({ document: emptyProjectDocument('x') });
    expect(result).toEqual({ error: expect.stringMatching(/Could not save the project to .*part of the path is a file/) });
    expect(readFileSync(join(folder, 'notes.txt'), 'utf8')).toBe('notes');
  });

  it('opens a project by path (a recent one) and lists it as recent', async () => {
    const { services, folder, recent } = setUp();
    const path = join(folder, 'hedge.whence');
    writeFileSync(path, serializeProjectDocument(emptyProjectDocument('Hedgerow')));
    await recent.add(path, 'Hedgerow');
    const opened = await services.openProjectPath(path);
    expect(opened).toMatchObject({ path, fromSchemaVersion: CURRENT_PROJECT_SCHEMA_VERSION, migrationSteps: [], document: { name: 'Hedgerow' } });
    expect((await services.listRecentProjects()).map((project) => [project.path, project.name])).toEqual([[path, 'Hedgerow']]);
    await expect(services.openProjectPath(join(folder, 'a.wav'))).rejects.toMatchObject({ code: 'path-refused' });
  });

  it('refuses a corrupt project with its file name and does not list it as recent', async () => {
    const { services, folder, grants } = setUp();
    const path = join(folder, 'broken.whence');
    writeFileSync(path, '{"schemaVersion": 1, "name": "bro');
    await grants.grant(path);
    await expect(services.openProjectPath(path)).rejects.toThrow(/broken\.whence could not be read/);
    expect(await services.listRecentProjects()).toEqual([]);
  });

  it('keeps unsaved work in the recovery copy until the user restores or discards it, and drops it once that work is saved', async () => {
    const { services, userData } = setUp([], ['p.whence']);
    const document = emptyProjectDocument('unsaved');
    await services.writeRecoveryCopy(document, '/old/place.whence');
    const offered = { document: { name: 'unsaved' }, projectPath: '/old/place.whence', savedAtIso: '2024-05-14T22:00:00.000Z' };
    expect(await services.takeRecoveryCopy()).toMatchObject(offered);
    // Reading it is not choosing: a second crash before the user chose offers the same copy again (issue 10, item 9).
    expect(await services.takeRecoveryCopy()).toMatchObject(offered);
    await services.discardRecoveryCopy();
    expect(await services.takeRecoveryCopy()).toBeNull();
    await services.writeRecoveryCopy(document);
    await services.saveProject({ document });
    expect(existsSync(join(userData, 'recovery', RECOVERY_FILE_NAME))).toBe(false);
    await services.writeRecoveryCopy(document);
    await services.discardRecoveryCopy();
    expect(await services.takeRecoveryCopy()).toBeNull();
  });
});

describe('createHostServices(): exports and the demo', () => {
  it('exports text through the save dialog, adding the extension of its kind', async () => {
    const { services, folder, asked } = setUp([], ['night3-fixes']);
    const result = await services.exportText({ suggestedName: '../night3 fixes.csv', text: 'event,x_m\n1,2\n', kind: 'csv' });
    expect(result).toEqual({ path: join(folder, 'night3-fixes.csv') });
    expect(readFileSync(join(folder, 'night3-fixes.csv'), 'utf8')).toBe('event,x_m\n1,2\n');
    expect(asked[0]).toMatchObject({ kind: 'save', defaultPath: 'night3 fixes.csv', extensions: ['csv'] });
    const cancelled = setUp([], [null]);
    expect(await cancelled.services.exportText({ suggestedName: 'f.geojson', text: '{}', kind: 'geojson' })).toBeNull();
  });

  it('says to run npm run demo when the demo files are missing', async () => {
    const { services, demoFolder } = setUp();
    await expect(services.openDemo()).rejects.toMatchObject({ code: 'demo-missing' });
    await expect(services.openDemo()).rejects.toThrow(demoFolder);
    await expect(services.openDemo()).rejects.toThrow(/Run `npm run demo`/);
  });

  it('opens the demo recording and reads the demo array table when they are there', async () => {
    const { services, demoFolder } = setUp();
    mkdirSync(demoFolder);
    copyFileSync(wavPath, join(demoFolder, DEMO_RECORDING_FILE_NAME));
    writeFileSync(join(demoFolder, DEMO_ARRAY_FILE_NAME), 'channel,x_m,y_m\n1,0,0\n');
    writeFileSync(join(demoFolder, DEMO_PROJECT_FILE_NAME), '{"schemaVersion":1}');
    const demo = await services.openDemo();
    expect(demo.recording).toMatchObject({ name: DEMO_RECORDING_FILE_NAME, path: join(demoFolder, DEMO_RECORDING_FILE_NAME) });
    expect(demo.array).toEqual({ name: DEMO_ARRAY_FILE_NAME, path: join(demoFolder, DEMO_ARRAY_FILE_NAME), text: 'channel,x_m,y_m\n1,0,0\n' });
    expect(demo.project.text).toBe('{"schemaVersion":1}');
    expect(Buffer.from(await services.readRecordingBytes(demo.recording.handleId, 0, 4)).toString('latin1')).toBe('RIFF');
  });

  it('does not fail a save when the recent list cannot be written', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'whence-host-'));
    writeFileSync(join(folder, 'blocker'), 'a file where the data folder should be');
    const log = vi.fn();
    const services = createHostServices({
      dialogs: fakeDialogs([], [join(folder, 'p.whence')]).dialogs,
      recordings: createRecordingHandles(),
      recovery: createRecoveryStore(join(folder, 'blocker', 'recovery')),
      recent: createRecentProjectsStore(join(folder, 'blocker', 'recent.json')),
      demoFolder: folder,
      log,
    });
    expect(await services.saveProject({ document: emptyProjectDocument('x') })).toEqual({ path: join(folder, 'p.whence') });
    expect(log).toHaveBeenCalledWith(expect.stringContaining('recent-projects list could not be updated'));
  });
});

describe('createHostServices(): the page reads only files the user chose', () => {
  // Expected behaviour: the Electron security checklist (limit what the renderer can reach through IPC); no outside values.
  it('refuses a recording, array table or project the user never chose, without opening it, and says how to open it', async () => {
    const { services, folder, recordings } = setUp();
    const csv = join(folder, 'array.csv');
    const project = join(folder, 'other.whence');
    writeFileSync(csv, 'channel,x_m,y_m\n1,0,0\n');
    writeFileSync(project, serializeProjectDocument(emptyProjectDocument('other')));
    for (const call of [() => services.openRecordingPath(wavPath), () => services.openArrayPath(csv), () => services.openProjectPath(project)]) {
      await expect(call()).rejects.toMatchObject({ code: 'path-not-chosen', message: expect.stringMatching(/reads only files you chose: .* File > Open, or drop it on the window/) });
    }
    expect(recordings.openCount()).toBe(0);
    expect(await services.listRecentProjects()).toEqual([]);
  });

  it('lets the page open again by path a file chosen in an Open dialog (after a reload, say)', async () => {
    const { services, folder } = setUp([wavPath, 'array.csv']);
    writeFileSync(join(folder, 'array.csv'), 'channel,x_m,y_m\n1,0,0\n');
    await services.openRecordingDialog();
    await services.openArrayDialog();
    await expect(services.openRecordingPath(wavPath)).resolves.toMatchObject({ path: wavPath });
    await expect(services.openArrayPath(join(folder, 'array.csv'))).resolves.toMatchObject({ name: 'array.csv' });
    await expect(services.openArrayPath(join(folder, 'sub', '..', 'array.csv'))).resolves.toMatchObject({ name: 'array.csv' });
  });

  it('grants the recording a project names when the user opens that project, and nothing else in its folder', async () => {
    const { folder } = setUp();
    const recordingPath = join(folder, 'night.wav');
    copyFileSync(wavPath, recordingPath);
    copyFileSync(wavPath, join(folder, 'other.wav'));
    const document = { ...emptyProjectDocument('night'), recording: { path: recordingPath, name: 'night.wav', sizeBytes: 1, channelCount: 2, sampleRateHz: 8000, frameCount: 1 } };
    const projectPath = join(folder, 'night.whence');
    writeFileSync(projectPath, serializeProjectDocument(document));
    const chooser = setUp([projectPath]);
    await expect(chooser.services.openRecordingPath(recordingPath)).rejects.toMatchObject({ code: 'path-not-chosen' });
    await chooser.services.openProjectDialog();
    await expect(chooser.services.openRecordingPath(recordingPath)).resolves.toMatchObject({ name: 'night.wav' });
    await expect(chooser.services.openRecordingPath(join(folder, 'other.wav'))).rejects.toMatchObject({ code: 'path-not-chosen' });
  });

  it('lets a saved project be opened again by path', async () => {
    const { services, folder } = setUp([], ['kept']);
    await services.saveProject({ document: emptyProjectDocument('kept') });
    await expect(services.openProjectPath(join(folder, 'kept.whence'))).resolves.toMatchObject({ document: { name: 'kept' } });
  });
});
