// The host inside the Electron shell: every call goes through the preload's typed object (core/contract HostApi).
import type { HostApi, RecordingHandle } from '../../core/contract';
import type { Host, OpenedRecording } from './host';

function proxiedRecording(api: HostApi, handle: RecordingHandle): OpenedRecording {
  return {
    name: handle.name,
    sizeBytes: handle.sizeBytes,
    path: handle.path,
    workerSource: { kind: 'proxy', name: handle.name, sizeBytes: handle.sizeBytes },
    byteReader: (offsetBytes, lengthBytes) => api.readRecordingBytes(handle.handleId, offsetBytes, lengthBytes),
    close: () => api.closeRecording(handle.handleId),
  };
}

function pathOf(api: HostApi, file: File): string {
  const path = api.getPathForFile(file);
  if (path === null) throw new Error(`${file.name} has no path on disk; open it with File > Open instead.`);
  return path;
}

export function createDesktopHost(api: HostApi): Host {
  return {
    kind: 'desktop',
    description: `desktop ${api.appVersion}`,
    async openRecording() {
      const handle = await api.openRecordingDialog();
      return handle === null ? null : proxiedRecording(api, handle);
    },
    async openRecordingFile(file) {
      return proxiedRecording(api, await api.openRecordingPath(pathOf(api, file)));
    },
    openArrayFile: () => api.openArrayDialog(),
    readTextFile: (file) => api.openArrayPath(pathOf(api, file)),
    async openProject() {
      const opened = await api.openProjectDialog();
      if (opened === null) return null;
      const note = opened.migrationSteps.length > 0 ? `Updated from project version ${opened.fromSchemaVersion}: ${opened.migrationSteps.join('; ')}. Save to keep the update.` : undefined;
      return note === undefined ? { document: opened.document, path: opened.path } : { document: opened.document, path: opened.path, note };
    },
    async saveProject(document, path, saveAs) {
      const request = path === undefined ? { document, saveAs } : { document, path, saveAs };
      const result = await api.saveProject(request);
      if (result === null) return null;
      if ('error' in result) throw new Error(result.error);
      return { path: result.path, message: `Saved ${result.path}${result.backupPath ? ` (previous version kept as ${result.backupPath})` : ''}.` };
    },
    async exportText(suggestedName, text, kind) {
      const result = await api.exportText({ suggestedName, text, kind });
      if (result === null) return null;
      if ('error' in result) throw new Error(result.error);
      return result.path;
    },
    async openDemo() {
      const demo = await api.openDemo();
      return { recording: proxiedRecording(api, demo.recording), array: demo.array, project: demo.project };
    },
    writeRecoveryCopy: (document, path) => api.writeRecoveryCopy(document, path),
    takeRecoveryCopy: async () => {
      const copy = await api.takeRecoveryCopy();
      if (copy === null) return null;
      return copy.projectPath === undefined ? { document: copy.document, savedAtIso: copy.savedAtIso } : { document: copy.document, savedAtIso: copy.savedAtIso, path: copy.projectPath };
    },
    discardRecoveryCopy: () => api.discardRecoveryCopy(),
    onMenuCommand: (listener) => api.onMenuCommand(listener),
  };
}
