// The object the preload exposes to the page: one method per IPC message (never a generic send), menu commands
// through one subscription, dropped files' paths (granted to main as they are asked for). Injected ipcRenderer/webUtils.
import { IPC_CHANNELS, IPC_EVENTS, MENU_COMMANDS, type DroppedFile, type HostApi, type HostRequestMethod, type MenuCommand } from '../../core/contract';
import { DROPPED_FILE_CHANNEL } from './droppedFileChannel';
import { unwrapReply } from './ipcReply';

/** The part of Electron's ipcRenderer used here. */
export interface IpcRendererLike {
  invoke(channel: string, ...args: unknown[]): Promise<unknown>;
  sendSync(channel: string, ...args: unknown[]): unknown;
  on(channel: string, listener: (event: unknown, ...args: unknown[]) => void): unknown;
  removeListener(channel: string, listener: (event: unknown, ...args: unknown[]) => void): unknown;
}

/** The part of Electron's webUtils used here. */
export interface WebUtilsLike {
  getPathForFile(file: never): string;
}

/** A menu command from main, or undefined when the payload is not one (it is then ignored). */
export function parseMenuCommand(payload: unknown): MenuCommand | undefined {
  if (typeof payload !== 'object' || payload === null) return undefined;
  const { command, path } = payload as { command?: unknown; path?: unknown };
  if (command === 'open-recent-project') return typeof path === 'string' && path !== '' ? { command, path } : undefined;
  return (MENU_COMMANDS as readonly unknown[]).includes(command) ? { command: command as MenuCommand['command'] } as MenuCommand : undefined;
}

export function createHostApi(ipc: IpcRendererLike, webUtils: WebUtilsLike, info: { appVersion: string; platform: string }): HostApi {
  // Each method forwards exactly its declared arguments, whatever the page passed.
  const request = <K extends HostRequestMethod>(method: K, ...args: unknown[]): ReturnType<HostApi[K]> =>
    ipc.invoke(IPC_CHANNELS[method], ...args).then((reply) => unwrapReply(reply, method)) as ReturnType<HostApi[K]>;

  return {
    kind: 'electron',
    appVersion: info.appVersion,
    platform: info.platform,
    openRecordingDialog: () => request('openRecordingDialog'),
    openRecordingPath: (path) => request('openRecordingPath', path),
    readRecordingBytes: (handleId, offsetBytes, lengthBytes) => request('readRecordingBytes', handleId, offsetBytes, lengthBytes),
    closeRecording: (handleId) => request('closeRecording', handleId),
    openArrayDialog: () => request('openArrayDialog'),
    openArrayPath: (path) => request('openArrayPath', path),
    openProjectDialog: () => request('openProjectDialog'),
    openProjectPath: (path) => request('openProjectPath', path),
    saveProject: (saveRequest) => request('saveProject', saveRequest),
    exportText: (exportRequest) => request('exportText', exportRequest),
    listRecentProjects: () => request('listRecentProjects'),
    writeRecoveryCopy: (document, projectPath) => (projectPath === undefined ? request('writeRecoveryCopy', document) : request('writeRecoveryCopy', document, projectPath)),
    takeRecoveryCopy: () => request('takeRecoveryCopy'),
    discardRecoveryCopy: () => request('discardRecoveryCopy'),
    openDemo: () => request('openDemo'),
    getPathForFile(file: DroppedFile): string | null {
      try {
        const path = webUtils.getPathForFile(file as never);
        if (typeof path !== 'string' || path === '') return null;
        // Main reads by path only files the user chose: a File with a path on disk is one the user dropped.
        return ipc.sendSync(DROPPED_FILE_CHANNEL, path) === true ? path : null;
      } catch {
        return null;
      }
    },
    onMenuCommand(listener) {
      // The IPC event object never reaches the page (it would expose ipcRenderer): only a checked command does.
      const forward = (_event: unknown, payload: unknown): void => {
        const command = parseMenuCommand(payload);
        if (command !== undefined) listener(command);
      };
      ipc.on(IPC_EVENTS.menuCommand, forward);
      return () => {
        ipc.removeListener(IPC_EVENTS.menuCommand, forward);
      };
    },
  };
}
