import { describe, expect, it } from 'vitest';
import { MENU_COMMANDS, type MenuCommand } from '../../../core/contract';
import { runMenuCommand, type MenuTarget } from '../../../renderer/state/menuCommands';

// Expected values: the action each menu command names in core/contract's MENU_COMMANDS (the app's own wiring, no outside source).

/** A controller that records which of its methods each command called, and with what. */
function recordingTarget(): { target: MenuTarget; calls: string[] } {
  const calls: string[] = [];
  const call = (name: string) => (...args: unknown[]) => { calls.push([name, ...args.map(String)].join(' ')); return Promise.resolve(); };
  const target: MenuTarget = {
    openRecording: call('openRecording'), showDeploymentDialog: (open) => { calls.push(`showDeploymentDialog ${open}`); }, openArray: call('openArray'), openProject: call('openProject'),
    saveProject: call('saveProject'), exportLog: call('exportLog'), openDemo: call('openDemo'), newProject: call('newProject'),
  };
  return { target, calls };
}

// Expected values: the behaviour this project specifies (each menu command does what its toolbar button does).
describe('runMenuCommand()', () => {
  it('shows the Open deployment dialog for Open deployment…, as the toolbar\'s button does', () => {
    const { target, calls } = recordingTarget();
    expect(runMenuCommand({ command: 'open-deployment' }, target)).toBe(true);
    expect(calls).toEqual(['showDeploymentDialog true']);
  });

  it('acts on the file commands with the toolbar\'s calls and leaves Help\'s to the main process', () => {
    const expected: Record<string, string> = {
      'new-project': 'newProject', 'open-recording': 'openRecording', 'open-array': 'openArray', 'open-project': 'openProject',
      'save-project': 'saveProject false', 'save-project-as': 'saveProject true', 'export-log': 'exportLog csv', 'open-demo': 'openDemo',
    };
    for (const command of MENU_COMMANDS) {
      const { target, calls } = recordingTarget();
      const acted = runMenuCommand({ command } as MenuCommand, target);
      if (command === 'open-deployment') continue;
      expect(acted, command).toBe(expected[command] !== undefined);
      expect(calls, command).toEqual(expected[command] === undefined ? [] : [expected[command]]);
    }
  });
});
