// A dropped file's path reaches main from the preload (never from the page's own code) on one synchronous message, so
// the file is granted (userFileGrants.ts) before the page asks to open it; the sender is checked like every request.
import { isAbsolute } from 'node:path';
import { DROPPED_FILE_CHANNEL } from './droppedFileChannel';
import type { IpcSenderEvent } from './senderCheck';
import type { UserFileGrants } from './userFileGrants';

export { DROPPED_FILE_CHANNEL };

export type SyncIpcEvent = IpcSenderEvent & { returnValue: unknown };

/** The part of Electron's ipcMain used here. */
export interface IpcOnRegistry {
  on(channel: string, listener: (event: SyncIpcEvent, ...args: unknown[]) => void): unknown;
}

const MAX_PATH_CHARS = 4096;

export function registerDroppedFileGrants(registry: IpcOnRegistry, grants: UserFileGrants, options: { isTrustedSender: (event: IpcSenderEvent) => boolean; log?: (message: string) => void }): void {
  const log = options.log ?? (() => undefined);
  registry.on(DROPPED_FILE_CHANNEL, (event, ...args) => {
    const [path] = args;
    const wellFormed = args.length === 1 && typeof path === 'string' && path !== '' && path.length <= MAX_PATH_CHARS && !path.includes('\0') && isAbsolute(path);
    if (!options.isTrustedSender(event) || !wellFormed) {
      log(`Refused a dropped-file grant (${options.isTrustedSender(event) ? 'not one absolute path' : "not from Whence's own page"}).`);
      event.returnValue = false;
      return;
    }
    // The resolved path is recorded before grant() first awaits, so a request that follows this message finds it.
    void grants.grant(path).catch((error: unknown) => log(`A dropped file could not be granted: ${String(error)}`));
    event.returnValue = true;
  });
}
