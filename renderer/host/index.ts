// Which host the page runs in: the Electron shell (preload object present) or a plain browser.
import { HOST_GLOBAL_NAME, type HostApi } from '../../core/contract';
import { createDesktopHost } from './desktopHost';
import { createWebHost } from './webHost';
import type { Host } from './host';

export type { Host, OpenedRecording, TextInput } from './host';

export function detectHost(): Host {
  const candidate = (window as unknown as Record<string, unknown>)[HOST_GLOBAL_NAME];
  return typeof candidate === 'object' && candidate !== null ? createDesktopHost(candidate as HostApi) : createWebHost();
}
