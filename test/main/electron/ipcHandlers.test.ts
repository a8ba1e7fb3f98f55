import { describe, expect, it, vi } from 'vitest';
import { IPC_CHANNELS, MAX_RECORDING_READ_BYTES, type HostRequestMethod } from '../../../core/contract';
import { WhenceError } from '../../../core/errors';
import { CURRENT_PROJECT_SCHEMA_VERSION, emptyProjectDocument } from '../../../core/project';
import { registerIpcHandlers } from '../../../main/electron/ipcHandlers';
import { isTrustedSender } from '../../../main/electron/senderCheck';
import { fakeRegistry, fakeServices, PAGE_URL, senderEvent, WINDOW_ID } from './fakes';

function setUp() {
  const registry = fakeRegistry();
  const services = fakeServices();
  const log = vi.fn();
  registerIpcHandlers(registry, services, { isTrustedSender: (event) => isTrustedSender(event, { webContentsId: () => WINDOW_ID, pageUrl: PAGE_URL }), log });
  const call = (method: HostRequestMethod, args: unknown[], event = senderEvent()) => registry.handlers.get(IPC_CHANNELS[method])!(event, ...args);
  return { registry, services, log, call };
}

describe('registerIpcHandlers()', () => {
  // Expected values: the IPC contract this project specifies; checking the sender of every message follows the Electron security checklist, common practice.
  it('registers exactly one handler per host request channel', () => {
    const { registry } = setUp();
    expect(registry.registrations.sort()).toEqual(Object.values(IPC_CHANNELS).sort());
    expect(new Set(registry.registrations).size).toBe(registry.registrations.length);
  });

  it('answers a good call from our page with the service result', async () => {
    const { call, services } = setUp();
    expect(await call('openRecordingPath', ['/data/a.wav'])).toEqual({ ok: true, value: { handleId: 'recording-1', name: 'a.wav', path: '/data/a.wav', sizeBytes: 1000 } });
    expect(services.openRecordingPath).toHaveBeenCalledWith('/data/a.wav');
    const reply = await call('readRecordingBytes', ['recording-1', 44, 16]);
    expect(reply).toMatchObject({ ok: true });
    expect((reply as { value: Uint8Array }).value).toEqual(new Uint8Array(16).fill(7));
    const document = emptyProjectDocument('Pond');
    expect(await call('saveProject', [{ document, path: '/data/p.whence' }])).toEqual({ ok: true, value: { path: '/data/p.whence' } });
    expect(services.saveProject).toHaveBeenCalledWith({ document, path: '/data/p.whence' });
    expect(await call('writeRecoveryCopy', [document])).toEqual({ ok: true, value: undefined });
    expect(await call('listRecentProjects', [])).toEqual({ ok: true, value: [] });
  });

  it('refuses every request from a wrong sender without calling the service', async () => {
    const { call, services, log } = setUp();
    const strangers = [senderEvent({ id: WINDOW_ID + 1 }), senderEvent({ subFrame: true }), senderEvent({ url: 'https://example.org/' }), { sender: { id: WINDOW_ID }, senderFrame: null }];
    for (const event of strangers) {
      for (const method of Object.keys(IPC_CHANNELS) as HostRequestMethod[]) {
        const reply = await call(method, [], event);
        expect(reply).toMatchObject({ ok: false, code: 'ipc-sender-refused' });
      }
    }
    for (const service of Object.values(services)) expect(service).not.toHaveBeenCalled();
    expect(log).toHaveBeenCalled();
  });

  it('refuses bad arguments with a message naming the bad one, without calling the service', async () => {
    const { call, services } = setUp();
    const cases: [HostRequestMethod, unknown[], RegExp][] = [
      ['openRecordingPath', [42], /openRecordingPath.*argument 1: .*expected string/],
      ['openRecordingPath', [], /openRecordingPath.*the arguments/],
      ['openRecordingPath', ['/a.wav', 'extra'], /openRecordingPath.*the arguments/],
      ['openProjectPath', ['/a\0.whence'], /NUL/],
      ['readRecordingBytes', ['recording-1', -1, 10], /argument 2/],
      ['readRecordingBytes', ['recording-1', 0, MAX_RECORDING_READ_BYTES + 1], /argument 3.*256 MiB/],
      ['readRecordingBytes', ['recording-1', 0.5, 10], /argument 2/],
      ['saveProject', [{ document: { ...emptyProjectDocument('x'), schemaVersion: CURRENT_PROJECT_SCHEMA_VERSION + 1 } }], /argument 1 \(document\.schemaVersion\)/],
      ['saveProject', [{ document: emptyProjectDocument('x'), sneaky: true }], /argument 1: Unrecognized key: "sneaky"/],
      ['exportText', [{ suggestedName: 'f.csv', text: 'a', kind: 'exe' }], /argument 1 \(kind\)/],
      ['openDemo', ['please'], /openDemo.*the arguments/],
    ];
    for (const [method, args, message] of cases) {
      const reply = await call(method, args);
      expect(reply, `${method}(${JSON.stringify(args)})`).toMatchObject({ ok: false, code: 'ipc-bad-arguments' });
      expect((reply as { message: string }).message).toMatch(message);
    }
    for (const service of Object.values(services)) expect(service).not.toHaveBeenCalled();
  });

  it('passes a deliberate error on with its code and message', async () => {
    const { call, services } = setUp();
    services.openProjectPath.mockRejectedValueOnce(new WhenceError('project-too-new', 'p.whence was saved by a newer Whence. Update Whence to open it.'));
    expect(await call('openProjectPath', ['/data/p.whence'])).toEqual({ ok: false, code: 'project-too-new', message: 'p.whence was saved by a newer Whence. Update Whence to open it.' });
  });

  it('turns an unexpected fault into internal-error, logged, without crashing', async () => {
    const { call, services, log } = setUp();
    services.listRecentProjects.mockRejectedValueOnce(new TypeError('x is undefined'));
    const reply = await call('listRecentProjects', []);
    expect(reply).toMatchObject({ ok: false, code: 'internal-error' });
    expect((reply as { message: string }).message).toMatch(/unexpected problem.*x is undefined/);
    expect(log).toHaveBeenCalledWith(expect.stringContaining('listRecentProjects'));
  });
});
