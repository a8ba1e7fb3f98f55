// Every IPC message's sender is checked: it must come from our window's main frame showing our own whence-app: page.
// Follows the Electron security checklist ("Validate the sender of all IPC messages").
import { isAllowedPageUrl } from './security';

/** The parts of Electron's IpcMainInvokeEvent the check reads. */
export interface IpcSenderEvent {
  sender: { id: number };
  senderFrame: { url: string; parent: unknown } | null;
}

export interface TrustedPage {
  /** The id of our window's web contents (undefined while there is no window). */
  webContentsId(): number | undefined;
  /** The whence-app: URL of the renderer's index.html (appProtocol.ts). */
  pageUrl: string;
}

export function isTrustedSender(event: IpcSenderEvent, trusted: TrustedPage): boolean {
  const frame = event.senderFrame;
  if (frame === null || frame === undefined) return false;
  if (frame.parent !== null) return false;
  const id = trusted.webContentsId();
  if (id === undefined || event.sender.id !== id) return false;
  return isAllowedPageUrl(frame.url, trusted.pageUrl);
}
