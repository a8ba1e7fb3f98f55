// The files the page may have main read by path: only those the user chose this session (an Open dialog, a drop on the
// window, a project the user opened naming its recording, the recent list), compared by resolved and real path.
import { realpath } from 'node:fs/promises';
import { resolve } from 'node:path';
import { WhenceError } from '../../core/errors';

export interface UserFileGrants {
  /** Record a file the user chose (its resolved path, and its real path when it exists). */
  grant(path: string): Promise<void>;
  /** The path, unchanged, when it (or the file it links to) was granted; else WhenceError 'path-not-chosen'. */
  require(path: string): Promise<string>;
  isGranted(path: string): Promise<boolean>;
}

export interface UserFileGrantsOptions {
  realpath?: (path: string) => Promise<string>;
  /** Most paths kept (oldest forgotten first); a session rarely needs more than a few dozen. */
  maxGrants?: number;
}

export const MAX_USER_FILE_GRANTS = 1000;

export function createUserFileGrants(options: UserFileGrantsOptions = {}): UserFileGrants {
  const toReal = options.realpath ?? realpath;
  const maxGrants = options.maxGrants ?? MAX_USER_FILE_GRANTS;
  const granted = new Set<string>();

  const add = (key: string): void => {
    granted.delete(key);
    granted.add(key);
    while (granted.size > maxGrants) granted.delete(granted.values().next().value as string);
  };
  const realOrUndefined = (path: string): Promise<string | undefined> => toReal(path).then((real) => real, () => undefined);

  async function isGranted(path: string): Promise<boolean> {
    if (path.includes('\0')) return false;
    if (granted.has(resolve(path))) return true;
    const real = await realOrUndefined(path);
    return real !== undefined && granted.has(real);
  }

  return {
    async grant(path) {
      if (path === '' || path.includes('\0')) return;
      add(resolve(path));
      const real = await realOrUndefined(path);
      if (real !== undefined) add(real);
    },
    isGranted,
    async require(path) {
      if (await isGranted(path)) return path;
      throw new WhenceError('path-not-chosen',
        `Whence reads only files you chose: ${path.replace(/\0/g, '')} was not chosen in an Open dialog, dropped on the window or named by a project you opened. Open it with File > Open, or drop it on the window.`);
    },
  };
}
