import { describe, expect, it, vi } from 'vitest';
import { IPC_CHANNELS, IPC_EVENTS, MENU_COMMANDS, type HostApi, type MenuCommand } from '../../../core/contract';
import { emptyProjectDocument } from '../../../core/project';
import { createHostApi, parseMenuCommand, type IpcRendererLike } from '../../../main/electron/hostBridge';
import { DROPPED_FILE_CHANNEL } from '../../../main/electron/droppedFileChannel';
import { unwrapReply } from '../../../main/electron/ipcReply';

type Listener = (event: unknown, ...args: unknown[]) => void;

function fakeIpcRenderer(reply: (channel: string, args: unknown[]) => unknown = () => ({ ok: true, value: 'answer' }), grantAnswer: unknown = true) {
  const listeners = new Map<string, Set<Listener>>();
  const invoke = vi.fn(async (channel: string, ...args: unknown[]) => reply(channel, args));
  const sendSync = vi.fn((_channel: string, ..._args: unknown[]) => grantAnswer);
  const ipc: IpcRendererLike = {
    invoke,
    sendSync,
    on: (channel, listener) => listeners.set(channel, (listeners.get(channel) ?? new Set()).add(listener)),
    removeListener: (channel, listener) => listeners.get(channel)?.delete(listener),
  };
  const emit = (channel: string, payload: unknown) => listeners.get(channel)?.forEach((listener) => listener({ sender: 'the IPC event' }, payload));
  return { ipc, invoke, sendSync, emit, listeners };
}

const info = { appVersion: '0.1.0', platform: 'linux' };
const webUtils = { getPathForFile: (file: never) => (file as { path: string }).path };

describe('createHostApi()', () => {
  // Expected values: the IPC contract this project specifies (core/contract); exposing no generic send follows the Electron security checklist, common practice.
  it('exposes exactly the contract: one method per message and no generic send', () => {
    const api = createHostApi(fakeIpcRenderer().ipc, webUtils, info);
    const expected = [...Object.keys(IPC_CHANNELS), 'kind', 'appVersion', 'platform', 'getPathForFile', 'onMenuCommand'].sort();
    expect(Object.keys(api).sort()).toEqual(expected);
    expect(Object.keys(api).some((key) => /^(send|invoke|on)$/.test(key))).toBe(false);
    expect(api).toMatchObject({ kind: 'electron', appVersion: '0.1.0', platform: 'linux' });
  });

  it('sends each request on its own channel with exactly its declared arguments', async () => {
    const { ipc, invoke } = fakeIpcRenderer();
    const api = createHostApi(ipc, webUtils, info);
    const document = emptyProjectDocument('p');
    const calls: [() => Promise<unknown>, string, unknown[]][] = [
      [() => api.openRecordingDialog(), IPC_CHANNELS.openRecordingDialog, []],
      [() => (api.openRecordingDialog as (...args: unknown[]) => Promise<unknown>)('smuggled'), IPC_CHANNELS.openRecordingDialog, []],
      [() => api.openRecordingPath('/a.wav'), IPC_CHANNELS.openRecordingPath, ['/a.wav']],
      [() => api.readRecordingBytes('h', 44, 1024), IPC_CHANNELS.readRecordingBytes, ['h', 44, 1024]],
      [() => api.closeRecording('h'), IPC_CHANNELS.closeRecording, ['h']],
      [() => api.openArrayDialog(), IPC_CHANNELS.openArrayDialog, []],
      [() => api.openArrayPath('/a.csv'), IPC_CHANNELS.openArrayPath, ['/a.csv']],
      [() => api.openProjectDialog(), IPC_CHANNELS.openProjectDialog, []],
      [() => api.openProjectPath('/p.whence'), IPC_CHANNELS.openProjectPath, ['/p.whence']],
      [() => api.saveProject({ document, saveAs: true }), IPC_CHANNELS.saveProject, [{ document, saveAs: true }]],
      [() => api.exportText({ suggestedName: 'f.csv', text: 'x', kind: 'csv' }), IPC_CHANNELS.exportText, [{ suggestedName: 'f.csv', text: 'x', kind: 'csv' }]],
      [() => api.listRecentProjects(), IPC_CHANNELS.listRecentProjects, []],
      [() => api.writeRecoveryCopy(document), IPC_CHANNELS.writeRecoveryCopy, [document]],
      [() => api.writeRecoveryCopy(document, '/p.whence'), IPC_CHANNELS.writeRecoveryCopy, [document, '/p.whence']],
      [() => api.takeRecoveryCopy(), IPC_CHANNELS.takeRecoveryCopy, []],
      [() => api.discardRecoveryCopy(), IPC_CHANNELS.discardRecoveryCopy, []],
      [() => api.openDemo(), IPC_CHANNELS.openDemo, []],
    ];
    for (const [call, channel, args] of calls) {
      invoke.mockClear();
      expect(await call()).toBe('answer');
      expect(invoke).toHaveBeenCalledExactlyOnceWith(channel, ...args);
    }
  });

  it('rejects with the message main gave when a request fails', async () => {
    const { ipc } = fakeIpcRenderer(() => ({ ok: false, code: 'demo-missing', message: 'The demo files are missing. Run `npm run demo`.' }));
    await expect(createHostApi(ipc, webUtils, info).openDemo()).rejects.toThrow('The demo files are missing. Run `npm run demo`.');
  });

  it('onMenuCommand() forwards only well-formed commands, never the IPC event, and unsubscribes', () => {
    const { ipc, emit, listeners } = fakeIpcRenderer();
    const api = createHostApi(ipc, webUtils, info);
    const received: unknown[][] = [];
    const unsubscribe = api.onMenuCommand((...args: unknown[]) => received.push(args));
    emit(IPC_EVENTS.menuCommand, { command: 'save-project' });
    emit(IPC_EVENTS.menuCommand, { command: 'open-recent-project', path: '/p.whence' });
    emit(IPC_EVENTS.menuCommand, { command: 'format-disk' });
    emit(IPC_EVENTS.menuCommand, 'save-project');
    expect(received).toEqual([[{ command: 'save-project' }], [{ command: 'open-recent-project', path: '/p.whence' }]]);
    unsubscribe();
    expect(listeners.get(IPC_EVENTS.menuCommand)?.size).toBe(0);
    emit(IPC_EVENTS.menuCommand, { command: 'save-project' });
    expect(received).toHaveLength(2);
  });

  it('getPathForFile() gives the dropped file path, or null when the File has none', () => {
    const { ipc, sendSync } = fakeIpcRenderer();
    const api: HostApi = createHostApi(ipc, webUtils, info);
    expect(api.getPathForFile({ name: 'a.wav', size: 1, path: '/data/a.wav' } as never)).toBe('/data/a.wav');
    expect(api.getPathForFile({ name: 'made.wav', size: 1, path: '' } as never)).toBeNull();
    // The dropped file is granted to main (droppedFileGrants.ts) before the page can ask to open it; a File the page
    // made itself has no path and grants nothing.
    expect(sendSync.mock.calls).toEqual([[DROPPED_FILE_CHANNEL, '/data/a.wav']]);
    const throwing = createHostApi(fakeIpcRenderer().ipc, { getPathForFile: () => { throw new TypeError('not a File'); } }, info);
    expect(throwing.getPathForFile({ name: 'x', size: 0 })).toBeNull();
  });

  it('getPathForFile() gives null when main refuses the dropped-file grant, so the page never holds an ungranted path', () => {
    const api: HostApi = createHostApi(fakeIpcRenderer(undefined, false).ipc, webUtils, info);
    expect(api.getPathForFile({ name: 'a.wav', size: 1, path: '/data/a.wav' } as never)).toBeNull();
  });
});

describe('parseMenuCommand()', () => {
  it('accepts every menu command and refuses anything else', () => {
    for (const command of MENU_COMMANDS) expect(parseMenuCommand({ command })).toEqual({ command });
    const refused: unknown[] = [null, 'open-project', { command: 'open-recent-project' }, { command: 'open-recent-project', path: 3 }, { command: 'toString' }];
    for (const payload of refused) expect(parseMenuCommand(payload)).toBeUndefined();
    const recent: MenuCommand = { command: 'open-recent-project', path: '/p.whence' };
    expect(parseMenuCommand({ ...recent, extra: 1 })).toEqual(recent);
  });
});

describe('unwrapReply()', () => {
  it('returns the value of a success and throws the message of a failure or of a malformed reply', () => {
    expect(unwrapReply({ ok: true, value: 5 }, 'm')).toBe(5);
    expect(() => unwrapReply({ ok: false, code: 'c', message: 'what to do' }, 'm')).toThrow('what to do');
    expect(() => unwrapReply(undefined, 'openDemo')).toThrow(/unexpected answer to openDemo/);
  });
});
