import { describe, expect, it } from 'vitest';
import type { WavInfo } from '../../../core/audio';
import { emptyProjectDocument, type ProjectDocument } from '../../../core/project';
import { redoEdit, undoEdit, recordEdit, snapshotOf, EDIT_HISTORY_LIMIT, EMPTY_HISTORY } from '../../../renderer/state/editHistory';
import { initialWorkspace, NEW_PROJECT_NAME, workspaceReducer, type WorkspaceAction, type WorkspaceState } from '../../../renderer/state/workspace';
import { locatedEvent, squareArray } from '../fixlog/locatedFixtures';

// Expected values: the behaviour this project specifies for the workspace (what is kept, reset, undone); no outside reference.
const info = { channelCount: 4, sampleRateHz: 48_000, frameCount: 480_000, durationSeconds: 10, warnings: [] } as unknown as WavInfo;
const demoDocument: ProjectDocument = {
  ...emptyProjectDocument('Pond demo'),
  array: { microphones: squareArray, origin: { latitudeDegrees: 52, longitudeDegrees: 0.1, heightMeters: 10 } },
  medium: { medium: 'air', temperatureCelsius: 14, relativeHumidityPercent: 85, pressureKilopascals: 100.9, temperatureSigmaKelvin: 1 },
  settings: { dimensions: 2, sourceUpMeters: 0.3, confidence: 0.95, weighting: 'phat', bandHz: 'automatic' },
  recording: { name: 'demo.wav', sizeBytes: 5000, channelCount: 4, sampleRateHz: 48_000, frameCount: 480_000 },
};
const events = [locatedEvent(squareArray, [100, 150, 1.5], 0, 2, 1), locatedEvent(squareArray, [20, 35, 1.5], 1, 2, 4)];

function run(state: WorkspaceState, ...actions: WorkspaceAction[]): WorkspaceState {
  return actions.reduce(workspaceReducer, state);
}

function demoWithLog(): WorkspaceState {
  return run(initialWorkspace(emptyProjectDocument('x')),
    { type: 'document/replace', document: demoDocument, path: undefined, dirty: false, fromDemo: true },
    { type: 'recording/opened', name: 'demo.wav', sizeBytes: 5000, info, contentHash: '00000000000000aa' },
    { type: 'events/replace', events },
    { type: 'fixes/log-events', indices: [0, 1] });
}

describe('workspaceReducer() and the fix log', () => {
  it('reopening the project\'s own recording completes its identity without marking the project changed', () => {
    const state = run(initialWorkspace(emptyProjectDocument('x')), { type: 'document/replace', document: demoDocument, path: undefined, dirty: false, fromDemo: true }, { type: 'recording/opened', name: 'demo.wav', sizeBytes: 5000, info, contentHash: '00000000000000aa' });
    expect(state.dirty).toBe(false);
    expect(state.document.recording).toMatchObject({ name: 'demo.wav', contentHash: '00000000000000aa' });
  });

  it('logs each event once, naming its recording, with its quality figures and the array\'s origin', () => {
    const state = run(demoWithLog(), { type: 'fixes/log-events', indices: [0] });
    expect(state.document.fixes).toHaveLength(2);
    expect(state.document.fixes.map((fix) => fix.recording)).toEqual([{ name: 'demo.wav', sizeBytes: 5000, contentHash: '00000000000000aa' }, { name: 'demo.wav', sizeBytes: 5000, contentHash: '00000000000000aa' }]);
    expect(state.document.fixes[0]!.quality?.gdop).toBeGreaterThan(0);
    expect(state.document.fixes[0]!.origin).toEqual(demoDocument.array.origin);
  });

  it('logs the same event number of a second recording as a new fix, and keeps the first recording\'s fixes as they were', () => {
    const before = demoWithLog();
    const second = run(before,
      { type: 'conditions/reset', leaveDemo: true },
      { type: 'recording/opened', name: 'mine.wav', sizeBytes: 9000, info, contentHash: '00000000000000bb' },
      { type: 'array/set', array: { microphones: squareArray, origin: { latitudeDegrees: 40, longitudeDegrees: -3, heightMeters: 600 } } },
      { type: 'events/replace', events },
      { type: 'fixes/log-events', indices: [0, 1] });
    expect(second.document.fixes.map((fix) => [fix.recording.name, fix.eventIndex])).toEqual([['demo.wav', 0], ['demo.wav', 1], ['mine.wav', 0], ['mine.wav', 1]]);
    expect(second.document.fixes.slice(0, 2)).toEqual(before.document.fixes);
    expect(second.document.fixes[2]!.origin).toEqual({ latitudeDegrees: 40, longitudeDegrees: -3, heightMeters: 600 });
    expect(new Set(second.document.fixes.map((fix) => fix.id)).size).toBe(4);
  });

  it('fixes/remove takes out only the fixes named, as one edit that Undo brings back', () => {
    const logged = demoWithLog();
    const [first, second] = logged.document.fixes;
    const removed = run(logged, { type: 'fixes/remove', ids: new Set([first!.id]) });
    expect(removed.document.fixes).toEqual([second]);
    expect(run(removed, { type: 'edit/undo' }).document.fixes).toEqual(logged.document.fixes);
  });
});

describe('workspaceReducer() and conditions', () => {
  it('conditions/reset after the demo resets the name, the medium, the settings and the array, and keeps the log', () => {
    const before = demoWithLog();
    const state = run(before, { type: 'conditions/reset', leaveDemo: true });
    const fresh = emptyProjectDocument(NEW_PROJECT_NAME);
    expect(state.document.name).toBe(NEW_PROJECT_NAME);
    expect(state.document.medium).toEqual(fresh.medium);
    expect(state.document.settings).toEqual(fresh.settings);
    expect(state.document.settings.sourceUpMeters).toBeUndefined();
    expect(state.document.array.microphones).toEqual([]);
    expect(state.document.fixes).toEqual(before.document.fixes);
    expect(state.fromDemo).toBe(false);
  });

  it('conditions/reset of one\'s own project keeps its name and array', () => {
    const own = run(demoWithLog(), { type: 'project/saved', path: '/p.whence' }, { type: 'conditions/reset', leaveDemo: false });
    expect(own.document.name).toBe('Pond demo');
    expect(own.document.array.microphones).toHaveLength(4);
    expect(own.document.medium).toEqual(emptyProjectDocument('y').medium);
  });

  it('document/replace drops the located events and a recording the new project does not name', () => {
    const state = run(demoWithLog(), { type: 'document/replace', document: emptyProjectDocument('other'), path: '/o.whence', dirty: false });
    expect(state.events).toEqual([]);
    expect(state.selectedEventIndex).toBeUndefined();
    expect(state.recording).toBeUndefined();
    expect(state.history).toEqual(EMPTY_HISTORY);
  });
});

describe('undo and redo', () => {
  it('undoes and redoes logging and a fix log edit, in order', () => {
    const logged = demoWithLog();
    const edited = run(logged, { type: 'fix/update', id: logged.document.fixes[0]!.id, patch: { label: 'owl' } });
    const undone = run(edited, { type: 'edit/undo' });
    expect(undone.document.fixes).toEqual(logged.document.fixes);
    expect(run(undone, { type: 'edit/undo' }).document.fixes).toEqual([]);
    const redone = run(undone, { type: 'edit/undo' }, { type: 'edit/redo' }, { type: 'edit/redo' });
    expect(redone.document.fixes[0]!.label).toBe('owl');
    expect(run(redone, { type: 'edit/redo' })).toBe(redone);
  });

  it('undoes an array edit without touching the log, and a new edit clears redo', () => {
    const logged = demoWithLog();
    const moved = run(logged, { type: 'array/set', array: { ...logged.document.array, microphones: squareArray.slice(0, 3) } });
    const undone = run(moved, { type: 'edit/undo' });
    expect(undone.document.array).toBe(logged.document.array);
    expect(undone.document.fixes).toBe(logged.document.fixes);
    expect(undone.history.redo).toHaveLength(1);
    expect(run(undone, { type: 'fix/update', id: logged.document.fixes[0]!.id, patch: { note: 'n' } }).history.redo).toEqual([]);
  });

  it('keeps at most EDIT_HISTORY_LIMIT steps, dropping the oldest', () => {
    const document = emptyProjectDocument('x');
    let history = EMPTY_HISTORY;
    for (let i = 0; i < EDIT_HISTORY_LIMIT + 5; i++) history = recordEdit(history, snapshotOf(document, 'fixes', `edit ${i}`));
    expect(history.undo).toHaveLength(EDIT_HISTORY_LIMIT);
    expect(history.undo[0]!.label).toBe('edit 5');
    expect(undoEdit(document, EMPTY_HISTORY)).toBeUndefined();
    expect(redoEdit(document, EMPTY_HISTORY)).toBeUndefined();
  });
});
