import { describe, expect, it } from 'vitest';
import { isTrustedSender, type IpcSenderEvent } from '../../../main/electron/senderCheck';

const pageUrl = 'whence-app://app/index.html';
const trusted = { webContentsId: () => 7, pageUrl };
const event = (overrides: Partial<{ id: number; url: string; parent: unknown; frame: null }> = {}): IpcSenderEvent => ({
  sender: { id: overrides.id ?? 7 },
  senderFrame: overrides.frame === null ? null : { url: overrides.url ?? pageUrl, parent: 'parent' in overrides ? overrides.parent : null },
});

// The checks follow Electron's security checklist, "Validate the sender of all IPC messages" (common practice).
describe('isTrustedSender()', () => {
  it('accepts our window main frame showing our page', () => {
    expect(isTrustedSender(event(), trusted)).toBe(true);
    expect(isTrustedSender(event({ url: `${pageUrl}#/fixes` }), trusted)).toBe(true);
  });

  it('refuses another window, a sub-frame, another page, a vanished frame, or any sender when there is no window', () => {
    expect(isTrustedSender(event({ id: 8 }), trusted)).toBe(false);
    expect(isTrustedSender(event({ parent: { url: pageUrl } }), trusted)).toBe(false);
    expect(isTrustedSender(event({ url: 'https://example.org/' }), trusted)).toBe(false);
    expect(isTrustedSender(event({ url: 'file:///tmp/evil/index.html' }), trusted)).toBe(false);
    // The page is no longer a file: page (appProtocol.ts): the old address of the same page is not trusted either.
    expect(isTrustedSender(event({ url: 'file:///opt/whence/dist-web/index.html' }), trusted)).toBe(false);
    expect(isTrustedSender(event({ url: 'whence-app://other/index.html' }), trusted)).toBe(false);
    expect(isTrustedSender(event({ frame: null }), trusted)).toBe(false);
    expect(isTrustedSender(event(), { webContentsId: () => undefined, pageUrl })).toBe(false);
  });
});
