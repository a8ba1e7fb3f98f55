// Which host the page runs in: the Electron shell (preload object present) or a plain browser.
import { HOST_GLOBAL_NAME, type HostApi } from '../../core/contract';

export function detectHost(): HostApi | undefined {
  const candidate = (window as unknown as Record<string, unknown>)[HOST_GLOBAL_NAME];
  return typeof candidate === 'object' && candidate !== null ? (candidate as HostApi) : undefined;
}
