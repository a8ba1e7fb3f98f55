// Registers one ipcMain.handle per host request: sender check, zod validation of the arguments, the service call,
// and a typed reply. The registry is injected (ipcMain in main.ts, a fake in tests).
import { IPC_CHANNELS, type HostRequestMethod } from '../../core/contract';
import { isWhenceError } from '../../core/errors';
import { firstIssueText, formatFieldPath } from '../../core/project';
import { IPC_ARGUMENTS } from './ipcArguments';
import { failureReply, okReply, type IpcReply } from './ipcReply';
import type { HostServices } from './hostServices';
import type { IpcSenderEvent } from './senderCheck';

export type IpcListener = (event: IpcSenderEvent, ...args: unknown[]) => Promise<IpcReply<unknown>>;

/** The part of Electron's ipcMain used here. */
export interface IpcHandleRegistry {
  handle(channel: string, listener: IpcListener): void;
}

export interface IpcHandlerOptions {
  isTrustedSender: (event: IpcSenderEvent) => boolean;
  /** Refused senders and unexpected faults, for the log. */
  log?: (message: string) => void;
}

const METHODS = Object.keys(IPC_CHANNELS) as HostRequestMethod[];

/** "argument 1 (document.name)" for the path [0, 'document', 'name']; "the arguments" for the list itself. */
export function describeArgumentPath(path: readonly PropertyKey[]): string {
  const [index, ...rest] = path;
  if (typeof index !== 'number') return 'the arguments';
  return rest.length === 0 ? `argument ${index + 1}` : `argument ${index + 1} (${formatFieldPath(rest)})`;
}

export function registerIpcHandlers(registry: IpcHandleRegistry, services: HostServices, options: IpcHandlerOptions): void {
  const log = options.log ?? (() => undefined);
  for (const method of METHODS) {
    const schema = IPC_ARGUMENTS[method];
    const service = services[method] as (...args: unknown[]) => Promise<unknown>;
    registry.handle(IPC_CHANNELS[method], async (event, ...args) => {
      if (!options.isTrustedSender(event)) {
        log(`Refused ${method} from a sender that is not Whence's own page (${event.senderFrame?.url ?? 'no frame'}).`);
        return failureReply('ipc-sender-refused', `${method} was refused: the request did not come from Whence's own window.`);
      }
      const parsed = schema.safeParse(args);
      if (!parsed.success) {
        return failureReply('ipc-bad-arguments', `${method} was refused because its arguments are wrong (${firstIssueText(parsed.error, describeArgumentPath)}). This is a fault in Whence; please report it.`);
      }
      try {
        return okReply(await service(...(parsed.data as unknown[])));
      } catch (error) {
        if (isWhenceError(error)) return failureReply(error.code, error.message);
        const text = error instanceof Error ? error.message : String(error);
        log(`Unexpected fault in ${method}: ${error instanceof Error && error.stack ? error.stack : text}`);
        return failureReply('internal-error', `Whence hit an unexpected problem (${method}: ${text}). Your work is still open; try again, and report this if it happens again.`);
      }
    });
  }
}
