// Test doubles for the Electron-facing adapters: an IPC registry that records handlers, host services, events.
import { vi } from 'vitest';
import type { HostRequestMethod } from '../../../core/contract';
import { emptyProjectDocument } from '../../../core/project';
import { APP_INDEX_URL } from '../../../main/electron/appProtocol';
import type { HostServices } from '../../../main/electron/hostServices';
import type { IpcHandleRegistry, IpcListener } from '../../../main/electron/ipcHandlers';
import type { IpcSenderEvent } from '../../../main/electron/senderCheck';

export const PAGE_URL = APP_INDEX_URL;
export const WINDOW_ID = 3;

export function senderEvent(overrides: { id?: number; url?: string; subFrame?: boolean } = {}): IpcSenderEvent {
  return { sender: { id: overrides.id ?? WINDOW_ID }, senderFrame: { url: overrides.url ?? PAGE_URL, parent: overrides.subFrame ? {} : null } };
}

export function fakeRegistry(): IpcHandleRegistry & { handlers: Map<string, IpcListener>; registrations: string[] } {
  const handlers = new Map<string, IpcListener>();
  const registrations: string[] = [];
  return {
    handlers,
    registrations,
    handle(channel, listener) {
      registrations.push(channel);
      handlers.set(channel, listener);
    },
  };
}

export function fakeServices(): { [K in HostRequestMethod]: ReturnType<typeof vi.fn> } & HostServices {
  const handle = { handleId: 'recording-1', name: 'a.wav', path: '/data/a.wav', sizeBytes: 1000 };
  const services = {
    openRecordingDialog: vi.fn(async () => handle),
    openRecordingPath: vi.fn(async () => handle),
    readRecordingBytes: vi.fn(async (_id: string, _offset: number, length: number) => new Uint8Array(length).fill(7)),
    closeRecording: vi.fn(async () => undefined),
    openArrayDialog: vi.fn(async () => null),
    openArrayPath: vi.fn(async (path: string) => ({ name: 'array.csv', path, text: 'channel,x_m,y_m\n1,0,0\n' })),
    openProjectDialog: vi.fn(async () => null),
    openProjectPath: vi.fn(async (path: string) => ({ path, document: emptyProjectDocument('p'), fromSchemaVersion: 1, migrationSteps: [] })),
    saveProject: vi.fn(async () => ({ path: '/data/p.whence' })),
    exportText: vi.fn(async () => ({ path: '/data/fixes.csv' })),
    listRecentProjects: vi.fn(async () => []),
    writeRecoveryCopy: vi.fn(async () => undefined),
    takeRecoveryCopy: vi.fn(async () => null),
    discardRecoveryCopy: vi.fn(async () => undefined),
    openDemo: vi.fn(async () => ({ recording: handle, array: { name: 'demo-array.csv', path: '/demo/demo-array.csv', text: '' } })),
  };
  return services as unknown as { [K in HostRequestMethod]: ReturnType<typeof vi.fn> } & HostServices;
}
