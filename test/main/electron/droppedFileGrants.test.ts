import { describe, expect, it } from 'vitest';
import { DROPPED_FILE_CHANNEL, registerDroppedFileGrants, type SyncIpcEvent } from '../../../main/electron/droppedFileGrants';
import { isTrustedSender, type IpcSenderEvent } from '../../../main/electron/senderCheck';
import { createUserFileGrants } from '../../../main/electron/userFileGrants';
import { PAGE_URL, senderEvent, WINDOW_ID } from './fakes';

// Expected behaviour: the Electron security checklist (validate the sender of every IPC message); no outside values.
function setUp() {
  const listeners = new Map<string, (event: SyncIpcEvent, ...args: unknown[]) => void>();
  const grants = createUserFileGrants({ realpath: async (path) => path });
  const logged: string[] = [];
  registerDroppedFileGrants({ on: (channel, listener) => listeners.set(channel, listener) }, grants, {
    isTrustedSender: (event: IpcSenderEvent) => isTrustedSender(event, { webContentsId: () => WINDOW_ID, pageUrl: PAGE_URL }),
    log: (message) => logged.push(message),
  });
  const send = (event: IpcSenderEvent, ...args: unknown[]): unknown => {
    const syncEvent = { ...event, returnValue: undefined as unknown };
    listeners.get(DROPPED_FILE_CHANNEL)!(syncEvent, ...args);
    return syncEvent.returnValue;
  };
  return { grants, send, logged, listeners };
}

describe('registerDroppedFileGrants()', () => {
  it('listens on the one dropped-file channel and grants an absolute path from our page, answering true at once', async () => {
    const { grants, send, listeners } = setUp();
    expect([...listeners.keys()]).toEqual([DROPPED_FILE_CHANNEL]);
    expect(send(senderEvent(), '/data/night/HEDGE_0003.WAV')).toBe(true);
    expect(await grants.isGranted('/data/night/HEDGE_0003.WAV')).toBe(true);
  });

  it('refuses, answering false and granting nothing, a sender other than our page (another window, a sub-frame, a file: page)', async () => {
    const { grants, send, logged } = setUp();
    for (const event of [senderEvent({ id: WINDOW_ID + 1 }), senderEvent({ subFrame: true }), senderEvent({ url: 'file:///tmp/evil/index.html' })]) {
      expect(send(event, '/data/a.wav')).toBe(false);
    }
    expect(await grants.isGranted('/data/a.wav')).toBe(false);
    expect(logged.every((line) => line.includes("not from Whence's own page"))).toBe(true);
  });

  it('refuses a relative path, an empty one, one with a NUL, a non-string, or more than one argument', async () => {
    const { grants, send } = setUp();
    const bad: unknown[][] = [['data/a.wav'], [''], ['/data/a.wav\0'], [42], [['/data/a.wav']], ['/data/a.wav', '/etc/passwd'], [], ['/'.repeat(5000)]];
    for (const args of bad) expect(send(senderEvent(), ...args)).toBe(false);
    expect(await grants.isGranted('/data/a.wav')).toBe(false);
    expect(await grants.isGranted('/etc/passwd')).toBe(false);
  });
});
