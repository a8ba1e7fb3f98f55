import { beforeAll, describe, expect, it } from 'vitest';
import type { WavInfo } from '../../../core/audio';
import type { DeploymentClockReport, DeploymentLayout } from '../../../core/deployment';
import { emptyProjectDocument, type ArrayMicrophone, type ProjectDocument } from '../../../core/project';
import { locateContext, locateReadiness } from '../../../renderer/state/derive';
import { deploymentTableQuestion, reopenRecordingHint, staleFixesQuestion } from '../../../renderer/state/questions';
import { initialWorkspace, workspaceReducer, type WorkspaceAction, type WorkspaceState } from '../../../renderer/state/workspace';
import { fixtureLayout } from '../deployment/layoutFixture';

// Expected values: the behaviour this project specifies for a deployment in the workspace (channels by label as
// `whence locate --deployment` matches them, clocks in use, stale events dropped); the fixture deployment is invented.
let layout: DeploymentLayout;
beforeAll(async () => { layout = await fixtureLayout(); });

const info = { channelCount: 2, sampleRateHz: 1000, frameCount: 3000, durationSeconds: 3, warnings: [], startTime: { isoLocal: '2026-05-14T05:00:00.000' } } as unknown as WavInfo;
const report = { kind: 'calibration', tableName: 'calibration.csv', recorders: [], sounds: [], lines: [], headJson: {}, headLines: ['clock time base: x'], warnings: [] } as DeploymentClockReport;
const speed = { speedMetersPerSecond: 343, speedSigmaMetersPerSecond: 0.5, description: 'air', reference: 'fixed' };

function documentWith(labels: string[]): ProjectDocument {
  // the array's channel column is only distinct numbers for a deployment: here deliberately not the table's order
  const microphones: ArrayMicrophone[] = labels.map((label, i) => ({ label, channel: 9 - i, eastMeters: 10 * i, northMeters: 7 * (i % 2), upMeters: 1, surveySigmaMeters: 0.05 }));
  return { ...emptyProjectDocument('test'), array: { microphones } };
}

function run(state: WorkspaceState, ...actions: WorkspaceAction[]): WorkspaceState {
  return actions.reduce(workspaceReducer, state);
}

describe('locateContext() and locateReadiness() on a deployment', () => {
  it('map each array microphone to the deployment channel of its label, whatever its channel column says', () => {
    expect(locateContext(documentWith(['MB', 'MA']), speed, layout).channelIndexOfMicrophone).toEqual([1, 0]);
    const ready = locateReadiness(documentWith(['MB', 'MA', 'MA2']), { name: 'deployment.csv', info, deployment: layout });
    expect('problems' in ready && ready.problems.join(' ')).toMatch(/^The array's microphone 'MA2' is on no recorder of deployment\.csv\. The deployment table's microphone column must use the array table's labels\./);
  });

  it('ask for a third microphone before the labels', () => {
    const ready = locateReadiness(documentWith(['MB', 'MA']), { name: 'deployment.csv', info, deployment: layout });
    expect('problems' in ready && ready.problems.join(' ')).toMatch(/^The array has 2 microphones; a position fix needs at least 3/);
  });
});

describe('workspaceReducer() with a deployment', () => {
  const opened: WorkspaceAction = { type: 'recording/opened', name: 'deployment.csv', sizeBytes: 4330, info, contentHash: '00000000000000bb', deployment: undefined as unknown as DeploymentLayout };

  it('keeps the layout with the open recording, reads it through the files\' own clocks and names it by its table in the project', () => {
    const state = run(initialWorkspace(emptyProjectDocument('x')), { ...opened, deployment: layout } as WorkspaceAction);
    expect(state.recording?.deployment?.recorders.map((r) => r.name)).toEqual(['A', 'B']);
    expect(state.clocks).toEqual({ kind: 'files' });
    expect(state.document.recording).toMatchObject({ name: 'deployment.csv', sizeBytes: 4330, contentHash: '00000000000000bb', startTimeIso: '2026-05-14T05:00:00.000' });
  });

  it('drops the events and the overview found through the old clocks when the clocks change, and ignores clocks without a deployment', () => {
    const withEvents = { ...run(initialWorkspace(emptyProjectDocument('x')), { ...opened, deployment: layout } as WorkspaceAction), events: [{} as never], selectedEventIndex: 0 };
    const fitted = run(withEvents, { type: 'clocks/set', clocks: { kind: 'fitted', report } });
    expect(fitted.clocks).toEqual({ kind: 'fitted', report });
    expect(fitted.events).toEqual([]);
    expect(fitted.selectedEventIndex).toBeUndefined();
    expect(fitted.envelope).toBeUndefined();
    const plain = initialWorkspace(emptyProjectDocument('x'));
    expect(run(plain, { type: 'clocks/set', clocks: { kind: 'fitted', report } })).toBe(plain);
    // opening the deployment again starts from the files' own clocks (the worker's new deployment is read so)
    expect(run(fitted, { ...opened, deployment: layout } as WorkspaceAction).clocks).toEqual({ kind: 'files' });
  });
});

describe('questions and hints for deployments', () => {
  it('deploymentTableQuestion() offers each table (the first as the default) and Cancel', () => {
    const question = deploymentTableQuestion(['may.csv', 'june/deployment.csv'], 'The folder season');
    expect(question.text).toMatch(/^The folder season holds 2 deployment tables/);
    expect(question.choices.map((choice) => [choice.id, choice.primary === true])).toEqual([['table:may.csv', true], ['table:june/deployment.csv', false], ['cancel', false]]);
    expect(question.cancelId).toBe('cancel');
  });

  it('staleFixesQuestion() names the clocks before and now, offers removal first and keeps them on Escape', () => {
    const question = staleFixesQuestion(3, 'deployment.csv', 'the files\' own clocks', 'the clocks fitted from calibration.csv');
    expect(question.text).toMatch(/3 fixes of deployment\.csv located with the files' own clocks\. The deployment is now read through the clocks fitted from calibration\.csv, which moves/);
    expect(question.choices.map((choice) => choice.id)).toEqual(['remove', 'keep']);
    expect(question.cancelId).toBe('keep');
  });

  it('reopenRecordingHint() asks for the deployment again for a project made on one (named by its .csv table), else for the recording', () => {
    expect(reopenRecordingHint({ name: 'deployment.csv' })).toMatch(/^Open its deployment deployment\.csv again \(Open deployment…/);
    expect(reopenRecordingHint({ name: 'dawn.wav' })).toBe('Open its recording dawn.wav again to locate again.');
    expect(reopenRecordingHint(undefined)).toBe('Open a recording (or a deployment) to locate.');
  });
});
